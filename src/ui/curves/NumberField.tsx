// A number input that lets the user type freely and hands on only valid values (so "0." or an empty field
// while typing never reaches the project), with an inline note when the text is not accepted.
import { useEffect, useId, useState } from "react";

export interface NumberFieldProps {
  label: string;
  value: number;
  /** Accepts a parsed number or returns a reason why not. */
  validate?: (n: number) => string | null;
  onCommit: (n: number) => void;
  step?: string;
  unit?: string;
  testId?: string;
}

export function NumberField({ label, value, validate, onCommit, step = "any", unit, testId }: NumberFieldProps) {
  const id = useId();
  const [text, setText] = useState(String(value));
  const [problem, setProblem] = useState<string | null>(null);
  // Follow outside changes (undo, another control) unless the field already shows that number.
  useEffect(() => {
    setText((t) => (Number(t) === value ? t : String(value)));
    setProblem(null);
  }, [value]);
  return (
    <span className="ax-field">
      <label htmlFor={id}>{label}</label>
      <input
        id={id}
        type="number"
        inputMode="decimal"
        step={step}
        value={text}
        data-testid={testId}
        aria-invalid={problem ? true : undefined}
        onChange={(e) => {
          const t = e.target.value;
          setText(t);
          const n = Number(t);
          const why = t.trim() === "" || !Number.isFinite(n) ? "Enter a number." : (validate?.(n) ?? null);
          setProblem(why);
          if (!why && n !== value) onCommit(n);
        }}
      />
      {unit ? <span className="ax-unit">{unit}</span> : null}
      {problem ? <span className="ax-field-problem">{problem}</span> : null}
    </span>
  );
}
