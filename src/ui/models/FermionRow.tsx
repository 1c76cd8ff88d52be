// One row of the anomaly calculator's fermion table: name, colour, electroweak charges, chirality, PQ charge,
// copies; each text field marks itself invalid when the calculator names it in an error.
import { useState } from "react";
import type { AnomalyFieldError } from "../../physics/anomaly";
import { COLOUR_NAMES, parseColour } from "../../physics/su3";
import { parseBeta } from "../../physics/beta";
import { toFractionString } from "../../physics/rational";
import { colourDisplay } from "../format";
import { hasError, type FermionDraft } from "./calculator-state";

type Edit = (patch: Partial<FermionDraft>) => void;
type TextKey = "name" | "dim" | "y" | "x" | "beta" | "charges" | "pq" | "copies";

/** The one text field of the table: its value is row[field], and the error field it answers to is errorField. */
export function DraftInput(props: {
  row: FermionDraft;
  field: TextKey;
  label: string;
  edit: Edit;
  invalid?: boolean;
  className?: string;
  title?: string;
  placeholder?: string;
}) {
  const { row, field, label, edit, invalid, className, title, placeholder } = props;
  return (
    <input
      type="text"
      className={className}
      aria-label={label}
      title={title}
      placeholder={placeholder}
      value={row[field]}
      aria-invalid={invalid || undefined}
      onChange={(e) => edit({ [field]: e.target.value })}
    />
  );
}

function colourOptionLabel(name: string): string {
  const p = parseColour(name);
  return p.ok ? `${colourDisplay(name)}  (${p.irrep.p},${p.irrep.q})` : name;
}

/** b = β/√3, the rational the calculator uses, shown only as a detail of the β field. */
function derivedB(beta: string): string {
  const r = parseBeta(beta);
  return r.ok ? ` (b = β/√3 = ${toFractionString(r.b)})` : "";
}

export function ColourCell({
  row,
  edit,
  invalid,
  label,
}: {
  row: FermionDraft;
  edit: Edit;
  invalid: boolean;
  label: string;
}) {
  const named = COLOUR_NAMES.includes(row.colour);
  const [other, setOther] = useState(!named);
  return (
    <span className="colour-cell">
      <select
        aria-label={`Colour representation of ${label}`}
        value={other ? "other" : row.colour}
        aria-invalid={invalid && !other ? true : undefined}
        onChange={(e) => {
          if (e.target.value === "other") {
            setOther(true);
            const c = parseColour(row.colour);
            edit({ colour: c.ok ? `(${c.irrep.p},${c.irrep.q})` : row.colour });
          } else {
            setOther(false);
            edit({ colour: e.target.value });
          }
        }}
      >
        {COLOUR_NAMES.map((n) => (
          <option key={n} value={n}>
            {colourOptionLabel(n)}
          </option>
        ))}
        <option value="other">Dynkin (p,q)…</option>
      </select>
      {other ? (
        <input
          type="text"
          className="narrow"
          aria-label={`Dynkin labels (p,q) of ${label}`}
          value={row.colour}
          aria-invalid={invalid ? true : undefined}
          onChange={(e) => edit({ colour: e.target.value })}
        />
      ) : null}
    </span>
  );
}

interface EwFieldsProps {
  row: FermionDraft;
  label: string;
  edit: Edit;
  bad: (field: string) => boolean;
}

/** SU(2)×U(1): the SU(2) dimension and the hypercharge. */
function SmFields({ row, label, edit, bad }: EwFieldsProps) {
  const field = { row, edit };
  return (
    <>
      <DraftInput
        {...field}
        field="dim"
        className="tiny"
        label={`SU(2) dimension of ${label}`}
        title="SU(2)_L dimension"
        placeholder="dim"
        invalid={bad("ew.dim")}
      />
      <DraftInput
        {...field}
        field="y"
        className="narrow"
        label={`Hypercharge Y of ${label}`}
        title="Hypercharge Y (Q = T₃ + Y)"
        placeholder="Y"
        invalid={bad("ew.y")}
      />
    </>
  );
}

/** SU(3)_L × U(1)_X: the representation, X, and β where the representation is not a singlet. */
function Su3lFields({ row, label, edit, bad }: EwFieldsProps) {
  const field = { row, edit };
  return (
    <>
      <select
        aria-label={`SU(3)_L representation of ${label}`}
        value={row.rep}
        onChange={(e) => edit({ rep: e.target.value as FermionDraft["rep"] })}
      >
        <option value="1">1</option>
        <option value="3">3</option>
        <option value="3bar">3̅</option>
      </select>
      <DraftInput
        {...field}
        field="x"
        className="narrow"
        label={`U(1)_X charge of ${label}`}
        title="U(1)_X charge X (Q = T₃ + βT₈ + X)"
        invalid={bad("ew.x")}
      />
      {row.rep === "1" ? null : (
        <DraftInput
          {...field}
          field="beta"
          className="narrow"
          label={`β of ${label}`}
          title={`β as in Q = T₃ + βT₈ + X, e.g. -1/√3, −√3, 1/sqrt(3)${derivedB(row.beta)}`}
          placeholder="β"
          invalid={bad("ew.b")}
        />
      )}
    </>
  );
}

/** The electroweak cell: its kind, then the fields that kind needs. */
export function ElectroweakCell(props: EwFieldsProps) {
  const { row, label, edit, bad } = props;
  return (
    <td className="ew-cell">
      <select
        aria-label={`Electroweak kind of ${label}`}
        value={row.ewKind}
        onChange={(e) => edit({ ewKind: e.target.value as FermionDraft["ewKind"] })}
      >
        <option value="sm">SU(2)×U(1)</option>
        <option value="su3l">SU(3)_L</option>
        <option value="explicit">charges</option>
      </select>
      {row.ewKind === "sm" ? (
        <SmFields {...props} />
      ) : row.ewKind === "su3l" ? (
        <Su3lFields {...props} />
      ) : (
        <DraftInput
          row={row}
          edit={edit}
          field="charges"
          label={`Electric charges of ${label}`}
          title="Component charges, e.g. 2/3, -1/3"
          invalid={bad("ew.charges")}
        />
      )}
    </td>
  );
}

export function FermionRow(props: {
  row: FermionDraft;
  index: number;
  errors: AnomalyFieldError[];
  edit: Edit;
  remove: () => void;
}) {
  const { row, index: i, errors, edit, remove } = props;
  const label = row.name.trim() || `fermion ${i + 1}`;
  const bad = (field: string) => hasError(errors, i, field);
  const field = { row, edit };
  return (
    <tr data-fermion-row={i}>
      <td>
        <DraftInput {...field} field="name" className="narrow" label={`Name of fermion ${i + 1}`} />
      </td>
      <td>
        <ColourCell row={row} label={label} invalid={bad("colour")} edit={edit} />
      </td>
      <ElectroweakCell row={row} label={label} edit={edit} bad={bad} />
      <td>
        <select
          aria-label={`Chirality of ${label}`}
          value={row.chirality}
          onChange={(e) => edit({ chirality: e.target.value as "L" | "R" })}
        >
          <option value="L">L</option>
          <option value="R">R</option>
        </select>
      </td>
      <td>
        <DraftInput {...field} field="pq" className="narrow" label={`PQ charge of ${label}`} invalid={bad("pq")} />
      </td>
      <td>
        <DraftInput {...field} field="copies" className="tiny" label={`Copies of ${label}`} invalid={bad("copies")} />
      </td>
      <td>
        <button type="button" className="icon danger" aria-label={`Remove ${label}`} onClick={remove}>
          ✕
        </button>
      </td>
    </tr>
  );
}
