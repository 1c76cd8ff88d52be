// The project's ways out and in that need no menu: the share link's address, saving NAME.axband.json, and
// links typed or pasted into the address bar of an open page (hashchange). The codec loads when first used.
import { useEffect } from "react";
import { useAxband } from "../store";
import { UNVERIFIED_LINK_NOTE, linkRefusedNote, repairsNote } from "../store/open-notes";
import { downloadText } from "../export/download";
import { fileBaseName } from "../export/file-base-name";

/** The page address with a fragment (the share link). */
export function linkUrl(
  fragment: string,
  loc: Pick<Location, "origin" | "pathname" | "search"> = window.location,
): string {
  return `${loc.origin}${loc.pathname}${loc.search}#${fragment}`;
}

/** Saves the current project as NAME.axband.json; returns the file name. */
export async function saveProjectFile(): Promise<string> {
  const { projectFileName, projectToFile } = await import("../../formats/project-file");
  const project = useAxband.getState().project;
  const name = projectFileName({ name: fileBaseName(project, "project") });
  downloadText(name, projectToFile(project), "application/json");
  return name;
}

/** Opens project links typed or pasted into the address bar while the page is open. */
export function useHashLinks() {
  useEffect(() => {
    const onHash = async () => {
      const fragment = window.location.hash.replace(/^#/, "");
      if (!fragment) return;
      const { decodeLink } = await import("../../formats/codec");
      const { replaceProject, pushMessage } = useAxband.getState();
      const r = decodeLink(fragment);
      if (r.ok)
        replaceProject(
          r.project,
          `Opened the project from the link. Undo returns to your previous project.${repairsNote(r.repairs, "The link")}${r.verified ? "" : UNVERIFIED_LINK_NOTE}`,
        );
      else pushMessage("alert", linkRefusedNote(r.error));
      history.replaceState(null, "", window.location.pathname + window.location.search);
    };
    const listener = () => void onHash();
    window.addEventListener("hashchange", listener);
    return () => window.removeEventListener("hashchange", listener);
  }, []);
}

/** Saves the project file and says so (with `detail` after the name, e.g. " with every curve"). */
export function saveProjectFileAndTell(detail = ""): void {
  const { pushMessage } = useAxband.getState();
  saveProjectFile().then(
    (name) => pushMessage("status", `Saved ${name}${detail}.`),
    (e: unknown) =>
      pushMessage("alert", `The project file was not saved: ${e instanceof Error ? e.message : String(e)}.`),
  );
}
