// One labelled drop-down (the `ax-field` label around a <select>), shared by the import step, the curves
// panel and the overlap filters so the markup and its accessible name are built in one place.

export interface Choice {
  value: string | number;
  label: string;
}

export function ChoiceField(props: {
  label: string;
  /** Accessible name when it should differ from the visible label. */
  ariaLabel?: string;
  testId?: string;
  value: string | number;
  choices: readonly Choice[];
  onChange: (value: string) => void;
}) {
  return (
    <label className="ax-field">
      <span>{props.label}</span>
      <select
        aria-label={props.ariaLabel}
        data-testid={props.testId}
        value={props.value}
        onChange={(e) => props.onChange(e.target.value)}
      >
        {props.choices.map((c) => (
          <option key={`${c.value}|${c.label}`} value={c.value}>
            {c.label}
          </option>
        ))}
      </select>
    </label>
  );
}
