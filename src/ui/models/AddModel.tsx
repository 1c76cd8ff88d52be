// The typed-E/N field: one value adds a line, an interval ("5/3..44/3") a band, lines ("5/3 | 44/3") the band
// between them; bad input gets a message next to the field and adds nothing.
import { useId, useState, type FormEvent } from "react";
import { parseEOverN } from "../../physics/eovern-parse";
import { useAxband } from "../store";
import { EOVERN_HINT, kindFieldsOf } from "./model-kind-text";

export function AddModel() {
  const addModel = useAxband((s) => s.addModel);
  const [text, setText] = useState("");
  const [error, setError] = useState<string | null>(null);
  const inputId = useId();
  const errorId = useId();
  const hintId = useId();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const r = parseEOverN(text);
    if (!r.ok) {
      setError(r.error);
      return;
    }
    addModel({
      ...kindFieldsOf(r),
      label: `E/N = ${r.lines ? r.lines.join(" | ") : text.trim().replace(/\s+/g, " ")}`,
      source: { kind: "typed" },
    });
    setText("");
    setError(null);
  };

  return (
    <form className="add-model" onSubmit={submit} noValidate>
      <label htmlFor={inputId} className="field-label">
        E/N value, interval or lines
      </label>
      <div className="inline-row">
        <input
          id={inputId}
          data-testid="model-eovern"
          type="text"
          inputMode="text"
          autoComplete="off"
          spellCheck={false}
          placeholder="8/3   5/3..44/3   5/3 | 44/3"
          value={text}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${errorId} ${hintId}` : hintId}
          onChange={(e) => {
            setText(e.target.value);
            if (error) setError(null);
          }}
        />
        <button type="submit" data-testid="add-model" className="primary">
          Add model
        </button>
      </div>
      <p id={hintId} className="field-hint" data-testid="model-eovern-hint">
        {EOVERN_HINT}
      </p>
      {error ? (
        <p id={errorId} className="field-error" data-testid="model-eovern-error">
          {error}
        </p>
      ) : null}
    </form>
  );
}
