// The sources panel: the references behind the figure (constants, formulas, catalogue models, curve citations)
// with details, fields filled from memory marked as such, and a BibTeX export (references.bib).
import { useMemo } from "react";
import { projectSources, sourcesToBibtex, type SourceEntry } from "../../data";
import { useAxband } from "../store";
import { downloadText } from "../export/download";
import { copyText } from "../share/clipboard";
import "../curves/curves.css";
import "../overlap/overlap.css";
import "./sources.css";

const KIND_TITLE: Record<SourceEntry["kind"], string> = {
  constants: "Constants and formulas",
  "custom-constants": "Your own constants",
  models: "Models",
  curve: "Curves (citations typed at import)",
};

const FIELD_ORDER = [
  "author",
  "title",
  "journal",
  "volume",
  "number",
  "pages",
  "year",
  "eprint",
  "doi",
  "url",
  "note",
  "howpublished",
];

function fieldsInOrder(e: SourceEntry): [string, string][] {
  const names = Object.keys(e.fields);
  const ordered = [...FIELD_ORDER.filter((n) => names.includes(n)), ...names.filter((n) => !FIELD_ORDER.includes(n))];
  return ordered.map((n) => [n, e.fields[n]]);
}

function Entry({ e }: { e: SourceEntry }) {
  return (
    <li className="ax-source" data-testid="source-entry" data-source-key={e.key}>
      <p className="ax-source-text">{e.text}</p>
      {e.usedFor.length > 0 ? <p className="ax-hint">Used for: {e.usedFor.join("; ")}</p> : null}
      {e.fromMemory.length > 0 ? (
        <p className="ax-source-memory" data-testid="source-from-memory">
          From memory, not yet checked against the paper: {e.fromMemory.join(", ")}
        </p>
      ) : null}
      <details>
        <summary>
          Details ({e.entryType}, key {e.key})
        </summary>
        <dl className="ax-source-fields">
          {fieldsInOrder(e).map(([name, value]) => (
            <div key={name} className={e.fromMemory.includes(name) ? "ax-memory-field" : undefined}>
              <dt>{name}</dt>
              <dd>
                {value}
                {e.fromMemory.includes(name) ? <span className="ax-memory-tag"> (from memory)</span> : null}
              </dd>
            </div>
          ))}
        </dl>
        {e.bibtex ? <pre className="ax-source-bibtex">{e.bibtex}</pre> : null}
      </details>
    </li>
  );
}

export function SourcesPanel() {
  const models = useAxband((s) => s.project.models);
  const curves = useAxband((s) => s.project.curves);
  const physics = useAxband((s) => s.project.physics);
  const pushMessage = useAxband((s) => s.pushMessage);
  const entries = useMemo(() => {
    const p = useAxband.getState().project;
    return projectSources({ ...p, models, curves, physics });
  }, [models, curves, physics]);
  const groups = (Object.keys(KIND_TITLE) as SourceEntry["kind"][])
    .map((k) => ({ kind: k, items: entries.filter((e) => e.kind === k) }))
    .filter((g) => g.items.length > 0);
  const uncited = curves.filter((c) => c.visible && c.citation.trim() === "");

  return (
    <section className="ax-panel ax-sources" aria-labelledby="ax-sources-title">
      <div className="ax-overlap-head">
        <h2 id="ax-sources-title">Sources</h2>
        <span className="ax-hint">{entries.length} references</span>
        <span className="ax-overlap-export">
          <button
            type="button"
            data-testid="sources-bibtex"
            disabled={entries.length === 0}
            onClick={() => downloadText("references.bib", sourcesToBibtex(entries), "application/x-bibtex")}
          >
            BibTeX
          </button>
          <button
            type="button"
            disabled={entries.length === 0}
            onClick={() =>
              void copyText(sourcesToBibtex(entries)).then((ok) =>
                pushMessage(
                  ok ? "status" : "alert",
                  ok
                    ? "BibTeX copied to the clipboard."
                    : "The browser gave no clipboard access; use the BibTeX download instead.",
                ),
              )
            }
          >
            Copy BibTeX
          </button>
        </span>
      </div>
      {groups.map((g) => (
        <div key={g.kind} className="ax-source-group">
          <h3>{KIND_TITLE[g.kind]}</h3>
          <ul className="ax-source-list">
            {g.items.map((e) => (
              <Entry key={e.key} e={e} />
            ))}
          </ul>
        </div>
      ))}
      {uncited.length > 0 ? (
        <p className="ax-source-missing" data-testid="sources-uncited">
          No citation yet for: {uncited.map((c) => c.label).join(", ")}. Add the publication the data came from (curve
          list → label and citation) before you show the figure.
        </p>
      ) : null}
    </section>
  );
}
