// The project's ways out and in that need no menu: the share link's address, saving NAME.axband.json, and
// links typed or pasted into the address bar of an open page (hashchange).
import { useEffect } from "react";
import { decodeLink, projectFileName, projectToFile } from "../../data";
import { useAxband } from "../store";
import { downloadText } from "../export/download";

/** The page address with a fragment (the share link). */
export function linkUrl(
  fragment: string,
  loc: Pick<Location, "origin" | "pathname" | "search"> = window.location,
): string {
  return `${loc.origin}${loc.pathname}${loc.search}#${fragment}`;
}

/** Saves the current project as NAME.axband.json; returns the file name. */
export function saveProjectFile(): string {
  const project = useAxband.getState().project;
  const name = projectFileName(project);
  downloadText(name, projectToFile(project), "application/json");
  return name;
}

/** Opens project links typed or pasted into the address bar while the page is open. */
export function useHashLinks() {
  useEffect(() => {
    const onHash = () => {
      const fragment = window.location.hash.replace(/^#/, "");
      if (!fragment) return;
      const { replaceProject, pushMessage } = useAxband.getState();
      const r = decodeLink(fragment);
      if (r.ok) replaceProject(r.project, "Opened the project from the link. Undo returns to your previous project.");
      else pushMessage("alert", `This link could not be opened: ${r.error} Your project is unchanged.`);
      history.replaceState(null, "", window.location.pathname + window.location.search);
    };
    window.addEventListener("hashchange", onHash);
    return () => window.removeEventListener("hashchange", onHash);
  }, []);
}
