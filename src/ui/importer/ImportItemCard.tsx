// One source in the import step: its first rows, what was detected (delimiter, header, units, points), the
// settings to change, and the notes on rows that are unreadable or cannot be drawn.
import type { CurveRole } from "../../project/types";
import { delimiterName } from "../../data";
import { DELIMITERS, formatBytes, rejectionLines, type ImportItem, type ImportSettings } from "./import-items";
import { COUPLING_UNIT_OPTIONS, MASS_UNIT_OPTIONS } from "./unit-options";
import { ChoiceField } from "../layout/ChoiceField";
import { UnitFields } from "./UnitFields";
import { ROLES } from "../curves/roles";

type Result = NonNullable<ImportItem["result"]>;
type Change = (p: Partial<ImportSettings>) => void;

function unitNote(source: string | undefined): string {
  return source === "header" ? " (from the header)" : source === "default" ? " (assumed)" : "";
}

function Preview({ item }: { item: ImportItem }) {
  const r = item.result;
  const s = item.settings;
  const header = r?.header ?? null;
  const preview = r ? r.preview.slice(0, 6) : [];
  if (preview.length === 0 && !header) return null;
  return (
    <table className="ax-preview" aria-label={`First rows of ${item.fileName}`}>
      <tbody>
        {header && r?.headerRow ? (
          <tr className="ax-preview-header">
            <th scope="row">{r.headerRow}</th>
            {header.slice(0, 6).map((c, i) => (
              <td key={i}>{c}</td>
            ))}
          </tr>
        ) : null}
        {preview.map((row) => (
          <tr key={row.row} className={row.problem ? "ax-preview-bad" : undefined} title={row.problem ?? undefined}>
            <th scope="row">{row.row}</th>
            {row.fields.slice(0, 6).map((c, i) => (
              <td
                key={i}
                className={i + 1 === s.massColumn || i + 1 === s.couplingColumn ? "ax-preview-used" : undefined}
              >
                {c}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function Detected({ r, s }: { r: Result; s: ImportSettings }) {
  const header = r.header;
  return (
    <p className="ax-import-detected" data-testid="import-detected">
      Delimiter: <b>{delimiterName(r.delimiter)}</b>
      {s.delimiter === "auto" ? " (detected)" : " (chosen)"}
      {r.decimalComma ? ", decimal comma" : ""} · Header: {header ? <b>{header.join(" | ")}</b> : "none"} · Mass:{" "}
      <b>{MASS_UNIT_OPTIONS.find((u) => u.value === r.massUnit)?.label ?? r.massUnit}</b>
      {unitNote(r.massUnitSource)} · Coupling:{" "}
      <b>{COUPLING_UNIT_OPTIONS.find((u) => u.value === r.couplingUnit)?.label ?? r.couplingUnit}</b>
      {unitNote(r.couplingUnitSource)} · <b>{r.massEv.length.toLocaleString("en")}</b> points
    </p>
  );
}

/** Delimiter, units (with the model line's E/N) and log10 columns. */
function ReadingSettings({ r, s, onChange }: { r: Result; s: ImportSettings; onChange: Change }) {
  return (
    <div className="ax-import-settings">
      <ChoiceField
        label="Delimiter"
        value={s.delimiter}
        choices={DELIMITERS}
        onChange={(v) => onChange({ delimiter: v })}
      />
      <UnitFields
        units={{
          massUnit: s.massUnit ?? r.massUnit,
          couplingUnit: s.couplingUnit ?? r.couplingUnit,
          eOverN: s.modelEOverN,
        }}
        onChange={({ eOverN, ...units }) => onChange(eOverN === undefined ? units : { ...units, modelEOverN: eOverN })}
        ariaLabels={{ eOverN: "E/N of the model line" }}
      />
      <label className="ax-check">
        <input type="checkbox" checked={s.log10Mass} onChange={(e) => onChange({ log10Mass: e.target.checked })} />
        mass as log10
      </label>
      <label className="ax-check">
        <input
          type="checkbox"
          checked={s.log10Coupling}
          onChange={(e) => onChange({ log10Coupling: e.target.checked })}
        />
        coupling as log10
      </label>
    </div>
  );
}

function ColumnSettings({ r, s, onChange }: { r: Result; s: ImportSettings; onChange: Change }) {
  const columns = Math.max(2, r.columnCount ?? 2);
  if (columns <= 2) return null;
  const columnChoices = Array.from({ length: columns }, (_, i) => ({
    value: i + 1,
    label: `column ${i + 1}${r.header?.[i] ? ` · ${r.header[i]}` : ""}`,
  }));
  return (
    <div className="ax-import-settings">
      <ChoiceField
        label="Mass from"
        value={s.massColumn ?? r.massColumn}
        choices={columnChoices}
        onChange={(v) => onChange({ massColumn: Number(v) })}
      />
      <ChoiceField
        label="Coupling from"
        value={s.couplingColumn ?? r.couplingColumn}
        choices={columnChoices}
        onChange={(v) => onChange({ couplingColumn: Number(v) })}
      />
    </div>
  );
}

/** Label, role, order and citation of the curve to be. */
function CurveSettings({ s, onChange }: { s: ImportSettings; onChange: Change }) {
  return (
    <>
      <div className="ax-import-settings">
        <label className="ax-field">
          <span>Label</span>
          <input type="text" aria-label="Label" value={s.label} onChange={(e) => onChange({ label: e.target.value })} />
        </label>
        <ChoiceField
          label="Role"
          ariaLabel="Role"
          value={s.role}
          choices={ROLES}
          onChange={(v) => onChange({ role: v as CurveRole })}
        />
        <label className="ax-check" title="Regions always keep the file order (the contour is closed in that order).">
          <input
            type="checkbox"
            checked={!s.keepOrder}
            disabled={s.role === "region"}
            onChange={(e) => onChange({ keepOrder: !e.target.checked })}
          />
          sort by mass
        </label>
      </div>
      <label className="ax-field ax-citation">
        <span>Citation</span>
        <textarea
          rows={2}
          aria-label="Citation"
          placeholder="Publication the data came from: free text or a BibTeX entry"
          value={s.citation}
          onChange={(e) => onChange({ citation: e.target.value })}
        />
      </label>
    </>
  );
}

/** The first point read, other parser warnings, values ≤ 0 and unreadable rows. */
function Diagnostics({ item }: { item: ImportItem }) {
  const r = item.result;
  if (!r) return null;
  const rej = rejectionLines(item.fileName, r);
  // The parser's own sentences about delimiter, units, unreadable rows and values ≤ 0 are shown in the step's
  // own words; any other warning (e.g. a guess it made) is passed on as it is.
  const notes = r.messages.filter(
    (m) => m.level === "warning" && !/cannot be read|could not be read|≤ 0|<= 0/.test(m.text),
  );
  return (
    <>
      {r.massEv.length > 0 ? (
        <p className="ax-hint" data-testid="import-first-point">
          First point read: m_a = {r.massEv[0].toExponential(3)} eV, g_aγγ = {r.gInvGeV[0].toExponential(3)} GeV⁻¹
        </p>
      ) : null}
      {notes.length > 0 ? (
        <ul className="ax-import-notes">
          {notes.map((m, i) => (
            <li key={i} className={m.level === "warning" ? "ax-import-warn" : "ax-hint"}>
              {m.text}
            </li>
          ))}
        </ul>
      ) : null}
      {r.nonPositive > 0 ? (
        <p className="ax-import-warn" data-testid="import-nonpositive">
          {r.nonPositive.toLocaleString("en")} row{r.nonPositive === 1 ? " has" : "s have"} a value ≤ 0: kept in the
          data, but not drawn on the log axes
          {r.nonPositiveRows.length > 0
            ? ` (rows ${r.nonPositiveRows.slice(0, 5).join(", ")}${r.nonPositive > 5 ? ", …" : ""})`
            : ""}
          .
        </p>
      ) : null}
      {rej.lines.length > 0 ? (
        <div className="ax-import-rejected" data-testid="import-rejected">
          <p>
            {r.rejectedCount.toLocaleString("en")} row{r.rejectedCount === 1 ? "" : "s"} could not be read. Import skips{" "}
            {r.rejectedCount === 1 ? "it" : "them"}; Cancel imports nothing.
          </p>
          <pre>{rej.lines.join("\n") + (rej.more > 0 ? `\n… and ${rej.more.toLocaleString("en")} more` : "")}</pre>
        </div>
      ) : null}
    </>
  );
}

export function ImportItemCard({
  item,
  onChange,
  onRemove,
}: {
  item: ImportItem;
  onChange: Change;
  onRemove: () => void;
}) {
  const s = item.settings;
  const r = item.result;
  const canEdit = r !== null && !(r.fatal && r.fatal.code !== "single-column" && r.fatal.code !== "no-data");
  return (
    <article className="ax-import-item" data-testid="import-item" aria-label={`Import ${item.fileName}`}>
      <header className="ax-import-item-head">
        <strong>{item.fileName}</strong>
        <span className="ax-hint">{formatBytes(item.sizeBytes)}</span>
        {item.status === "parsing" ? (
          <span className="ax-hint">reading… {Math.round(item.progress * 100)} %</span>
        ) : null}
        <button
          type="button"
          className="icon danger ax-small"
          aria-label={`Leave out ${item.fileName}`}
          onClick={onRemove}
        >
          ×
        </button>
      </header>
      {item.problem ? (
        <p className="ax-import-problem" role="alert">
          {item.problem}
        </p>
      ) : null}
      <Preview item={item} />
      {r && canEdit ? (
        <>
          <Detected r={r} s={s} />
          <ReadingSettings r={r} s={s} onChange={onChange} />
          <ColumnSettings r={r} s={s} onChange={onChange} />
          <CurveSettings s={s} onChange={onChange} />
        </>
      ) : null}
      <Diagnostics item={item} />
    </article>
  );
}
