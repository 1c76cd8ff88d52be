// Project actions in the header: copy a share link (curves included while the link stays short enough, else the
// user is told and offered the project file), and the Project menu (ProjectSections.tsx).
import { useCallback, useEffect, useRef, useState } from "react";
import type { AutoLink } from "../../data";
import { useAxband } from "../store";
import { Popover } from "../export/Popover";
import { copyText } from "./clipboard";
import { linkUrl, useHashLinks } from "./project-actions";
import { ProjectFileSection, ShareSection, type MadeLink } from "./ProjectSections";
import "../curves/curves.css";
import "../export/export.css";
import "../importer/importer.css";
import "./share.css";

/** The status line after a link is made: where it went, and which curves it left out. */
function shareMessage(url: string, auto: AutoLink, copied: boolean): string {
  const left = auto.omittedCurves.length;
  const leftOut =
    left > 0
      ? ` It leaves out ${left === 1 ? "the curve" : `${left} curves`} (too much data for a link): ${auto.omittedCurves.join(", ")}. Save the project file to share ${left === 1 ? "it" : "them"}.`
      : "";
  if (copied) return `Link copied to the clipboard (${url.length.toLocaleString("en")} characters).${leftOut}`;
  return `Link ready: it is selected in the Project menu, copy it with Ctrl+C (the browser gave no clipboard access).${leftOut}`;
}

export function ProjectMenu() {
  const pushMessage = useAxband((s) => s.pushMessage);
  const [open, setOpen] = useState(false);
  const [link, setLink] = useState<MadeLink | null>(null);
  const field = useRef<HTMLInputElement>(null);
  useHashLinks();

  // A link describes the project at the moment it was made; drop it when the project changes.
  const project = useAxband((s) => s.project);
  const madeFor = useRef(project);
  useEffect(() => {
    if (madeFor.current !== project) setLink(null);
  }, [project]);

  useEffect(() => {
    if (open && link) field.current?.select();
  }, [open, link]);

  const share = useCallback(async () => {
    const p = useAxband.getState().project;
    let auto: AutoLink;
    try {
      const { encodeLinkAuto } = await import("../../formats/codec");
      auto = encodeLinkAuto(p);
    } catch (e) {
      pushMessage("alert", `The link could not be made: ${e instanceof Error ? e.message : String(e)}.`);
      return;
    }
    const url = linkUrl(auto.fragment);
    madeFor.current = p;
    setLink({ url, auto });
    setOpen(true);
    const copied = await copyText(url);
    if (!copied) field.current?.select();
    pushMessage("status", shareMessage(url, auto, copied));
  }, [pushMessage]);

  return (
    <span className="ax-header-group ax-panel ax-project">
      <button
        type="button"
        data-testid="share-link"
        title="Copy a link that reopens this exact figure"
        onClick={() => void share()}
      >
        Copy link
      </button>
      <Popover label="Project ▾" ariaLabel="Project menu" open={open} onOpenChange={setOpen} testId="project-menu">
        <ShareSection link={link} field={field} />
        <ProjectFileSection onOpened={() => setOpen(false)} />
      </Popover>
    </span>
  );
}
