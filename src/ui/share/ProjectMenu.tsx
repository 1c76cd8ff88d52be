// Project actions in the header: copy a share link (the project in the URL fragment; curves included while
// the link stays short enough, otherwise the user is told which were left out and offered the project
// file), save and open `NAME.axband.json` project files (an exported SVG opens too), and links pasted into
// the address bar of an open page (hashchange).
import { useCallback, useEffect, useRef, useState } from "react";
import { decodeLink, encodeLinkAuto, projectFileName, projectToFile, type AutoLink } from "../../data";
import { useAxband } from "../store";
import { downloadText } from "../export/download";
import { Popover } from "../export/Popover";
import { copyText } from "./clipboard";
import { openProjectFile } from "./open-project";
import "../curves/curves.css";
import "../export/export.css";
import "../importer/importer.css";
import "./share.css";

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
function useHashLinks() {
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

export function ProjectMenu() {
  const pushMessage = useAxband((s) => s.pushMessage);
  const replaceProject = useAxband((s) => s.replaceProject);
  const commit = useAxband((s) => s.commit);
  const name = useAxband((s) => s.project.name);
  const [open, setOpen] = useState(false);
  const [link, setLink] = useState<{ url: string; auto: AutoLink } | null>(null);
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
    const left = auto.omittedCurves.length;
    const leftOut =
      left > 0
        ? ` It leaves out ${left === 1 ? "the curve" : `${left} curves`} (too much data for a link): ${auto.omittedCurves.join(", ")}. Save the project file to share ${left === 1 ? "it" : "them"}.`
        : "";
    if (copied)
      pushMessage("status", `Link copied to the clipboard (${url.length.toLocaleString("en")} characters).${leftOut}`);
    else {
      field.current?.select();
      pushMessage(
        "status",
        `Link ready: it is selected in the Project menu, copy it with Ctrl+C (the browser gave no clipboard access).${leftOut}`,
      );
    }
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
        <section>
          <h3>Share link</h3>
          {link ? (
            <>
              <input
                ref={field}
                className="ax-link-field"
                type="text"
                readOnly
                aria-label="Share link"
                data-testid="share-link-field"
                value={link.url}
                onFocus={(e) => e.currentTarget.select()}
              />
              {link.auto.omittedCurves.length > 0 ? (
                <div className="ax-link-omitted" data-testid="share-omitted">
                  <p>
                    Left out of the link (too much data): <b>{link.auto.omittedCurves.join(", ")}</b>. The link keeps
                    the models, the figure and the constants.
                  </p>
                  <button
                    type="button"
                    onClick={() => pushMessage("status", `Saved ${saveProjectFile()} with every curve.`)}
                  >
                    Save the project file instead
                  </button>
                </div>
              ) : (
                <p className="ax-hint">
                  Opens this exact figure{project.curves.length > 0 ? ", curves included" : ""}.
                </p>
              )}
            </>
          ) : (
            <p className="ax-hint">
              &ldquo;Copy link&rdquo; puts the whole project into a link (nothing is uploaded: it all sits in the part
              after #).
            </p>
          )}
        </section>
        <section>
          <h3>Project file</h3>
          <label className="ax-field">
            <span>Name</span>
            <input
              type="text"
              aria-label="Project name"
              value={name}
              onChange={(e) => {
                const v = e.target.value;
                commit((p) => ({ ...p, name: v }), { coalesceKey: "project:name" });
              }}
            />
          </label>
          <div className="ax-export-row">
            <button
              type="button"
              data-testid="save-project"
              onClick={() => pushMessage("status", `Saved ${saveProjectFile()}.`)}
            >
              Save project
            </button>
            <label className="ax-button-like ax-button-plain">
              Open project…
              <input
                className="visually-hidden"
                type="file"
                data-testid="open-project"
                accept=".axband.json,.json,.svg,application/json,image/svg+xml"
                onChange={(e) => {
                  const file = e.currentTarget.files?.[0];
                  e.currentTarget.value = "";
                  if (!file) return;
                  void openProjectFile(file).then((r) => {
                    if (r.ok) {
                      replaceProject(r.project, r.message);
                      setOpen(false);
                    } else pushMessage("alert", r.error);
                  });
                }}
              />
            </label>
          </div>
          <p className="ax-hint">
            A project file holds everything, curve data included. An SVG exported by axband opens as well.
          </p>
        </section>
      </Popover>
    </span>
  );
}
