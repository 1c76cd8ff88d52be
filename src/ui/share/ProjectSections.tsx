// The two sections of the Project menu: the share link last made (with the curves it had to leave out), and
// the project file (name, save, open).
import type { RefObject } from "react";
import type { AutoLink } from "../../data";
import { useAxband } from "../store";
import { saveProjectFileAndTell } from "./project-actions";

export interface MadeLink {
  url: string;
  auto: AutoLink;
}

export function ShareSection({ link, field }: { link: MadeLink | null; field: RefObject<HTMLInputElement | null> }) {
  const curveCount = useAxband((s) => s.project.curves.length);
  if (!link)
    return (
      <section>
        <h3>Share link</h3>
        <p className="ax-hint">
          &ldquo;Copy link&rdquo; puts the whole project into a link (nothing is uploaded: it all sits in the part after
          #).
        </p>
      </section>
    );
  return (
    <section>
      <h3>Share link</h3>
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
            Left out of the link (too much data): <b>{link.auto.omittedCurves.join(", ")}</b>. The link keeps the
            models, the figure and the constants.
          </p>
          <button type="button" onClick={() => saveProjectFileAndTell(" with every curve")}>
            Save the project file instead
          </button>
        </div>
      ) : (
        <p className="ax-hint">Opens this exact figure{curveCount > 0 ? ", curves included" : ""}.</p>
      )}
    </section>
  );
}

export function ProjectFileSection({ onOpened }: { onOpened: () => void }) {
  const pushMessage = useAxband((s) => s.pushMessage);
  const replaceProject = useAxband((s) => s.replaceProject);
  return (
    <section>
      <h3>Project file</h3>
      <ProjectNameField />
      <div className="ax-export-row">
        <button type="button" data-testid="save-project" onClick={() => saveProjectFileAndTell()}>
          Save project
        </button>
        <label className="ax-button-like ax-button-plain">
          Open project…
          <input
            className="visually-hidden"
            type="file"
            data-testid="open-project"
            accept=".axband.json,.json,.svg,.pdf,application/json,image/svg+xml,application/pdf"
            onChange={(e) => {
              const file = e.currentTarget.files?.[0];
              e.currentTarget.value = "";
              if (!file) return;
              void import("./open-project").then(async ({ openProjectFile }) => {
                const r = await openProjectFile(file);
                if (r.ok) {
                  replaceProject(r.project, r.message);
                  onOpened();
                } else pushMessage("alert", r.error);
              });
            }}
          />
        </label>
      </div>
      <p className="ax-hint">
        A project file holds everything, curve data included. An SVG or PDF exported by axband opens as well.
      </p>
    </section>
  );
}

/** The project's name (it names every file saved or exported); typing coalesces into one undo step. */
export function ProjectNameField() {
  const name = useAxband((s) => s.project.name);
  const commit = useAxband((s) => s.commit);
  return (
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
  );
}
