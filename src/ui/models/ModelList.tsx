// The list of models: per row label, E/N, colour, line style, visibility, theory spread, order and removal, a
// model set's drawing, and a note when a band's coupling cancels (g = 0).
import { useCallback, useId, useState } from "react";
import { useShallow } from "zustand/react/shallow";
import { parseEOverN } from "../../physics/eovern-parse";
import { modelShape, shapeCancels, shapeNormalizedRange } from "../../plot/model-shape";
import { constantsOf } from "../../plot/physics-settings";
import type { LineStyle, Model, SetDraw } from "../../project/types";
import { selectModelIds, selectPhysics, useAxband, type AxbandState } from "../store";
import { useCalculatorRequest } from "./calculator-draft";
import { minus } from "../format";
import { OrderButtons } from "../layout/OrderButtons";
import { EOVERN_HINT, eOverNText, kindFieldsOf } from "./model-kind-text";

const LINE_STYLES: { value: LineStyle; label: string }[] = [
  { value: "solid", label: "solid" },
  { value: "dashed", label: "dashed" },
  { value: "dotted", label: "dotted" },
  { value: "dashdot", label: "dash-dot" },
];

const KIND_TEXT: Record<Model["kind"], string> = {
  line: "value (model line)",
  interval: "interval (every E/N in it)",
  between: "lines (the region between them)",
  set: "model set",
};

const SET_DRAWS: { value: SetDraw; label: string }[] = [
  { value: "lines", label: "lines" },
  { value: "extremes", label: "between extremes" },
  { value: "central", label: "central share" },
];

function sourceText(m: Model): string {
  if (m.source.kind === "catalogue") return `from the catalogue (${m.source.catalogueId})`;
  if (m.source.kind === "calculator") return "from the anomaly calculator";
  if (m.source.kind === "ensemble") return "from a heavy-quark ensemble";
  if (m.source.kind === "scan") return "from a charge scan";
  return "typed";
}

function EOverNField({ model }: { model: Model }) {
  const updateModel = useAxband((s) => s.updateModel);
  const [draft, setDraft] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const errorId = useId();
  const apply = () => {
    if (draft === null) return;
    const r = parseEOverN(draft);
    if (!r.ok) {
      setError(r.error);
      return;
    }
    setError(null);
    setDraft(null);
    const fields = kindFieldsOf(r);
    if (eOverNText(fields) !== eOverNText(model) || fields.kind !== model.kind) updateModel(model.id, fields);
  };
  return (
    <span className="model-eovern-edit">
      <input
        type="text"
        aria-label={`E/N of ${model.label}`}
        title={`E/N ${KIND_TEXT[model.kind]}, ${sourceText(model)}. ${EOVERN_HINT}`}
        value={draft ?? eOverNText(model)}
        spellCheck={false}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errorId : undefined}
        onChange={(e) => setDraft(e.target.value)}
        onBlur={apply}
        onKeyDown={(e) => {
          if (e.key === "Enter") apply();
          if (e.key === "Escape") {
            setDraft(null);
            setError(null);
          }
        }}
      />
      {error ? (
        <span id={errorId} className="field-error">
          {error} (kept {minus(eOverNText(model))})
        </span>
      ) : null}
    </span>
  );
}

/** A model set: how many models, and how it is drawn (its lines, between its extremes, or a central share). */
function SetField({ model }: { model: Model }) {
  const updateModel = useAxband((s) => s.updateModel);
  const total = model.members.reduce((n, m) => n + m.count, 0);
  const [shareDraft, setShareDraft] = useState<string | null>(null);
  return (
    <span className="set-draw" data-testid="set-draw">
      <span className="set-size" title={`E/N from ${model.eOverNMin} to ${model.eOverNMax}, ${sourceText(model)}`}>
        {total} models, {model.members.length} E/N values
      </span>
      <select
        aria-label={`Drawing of ${model.label}`}
        value={model.setDraw}
        onChange={(e) => updateModel(model.id, { setDraw: e.target.value as SetDraw })}
      >
        {SET_DRAWS.map((d) => (
          <option key={d.value} value={d.value}>
            {d.label}
          </option>
        ))}
      </select>
      {model.setDraw === "central" ? (
        <input
          type="number"
          min={1}
          max={100}
          step={1}
          className="narrow"
          aria-label={`Share of the models in the central band of ${model.label}, in per cent`}
          value={shareDraft ?? String(Math.round(model.setShare * 1000) / 10)}
          onChange={(e) => {
            // The text stays as typed while it is half-entered; a valid share goes to the model at once.
            setShareDraft(e.target.value);
            const pc = Number(e.target.value);
            if (e.target.value.trim() !== "" && Number.isFinite(pc) && pc > 0 && pc <= 100)
              updateModel(model.id, { setShare: pc / 100 }, { coalesceKey: `model:${model.id}:share` });
          }}
          onBlur={() => setShareDraft(null)}
        />
      ) : null}
    </span>
  );
}

function SpreadField({ model }: { model: Model }) {
  const updateModel = useAxband((s) => s.updateModel);
  const preset = [0, 1, 2].includes(model.sigmas) ? String(model.sigmas) : "custom";
  const [custom, setCustom] = useState(preset === "custom");
  const shown = custom ? "custom" : preset;
  return (
    <span className="spread">
      <select
        aria-label={`Theory spread of ${model.label}`}
        value={shown}
        onChange={(e) => {
          if (e.target.value === "custom") setCustom(true);
          else {
            setCustom(false);
            updateModel(model.id, { sigmas: Number(e.target.value) });
          }
        }}
      >
        <option value="0">no spread</option>
        <option value="1">± 1σ</option>
        <option value="2">± 2σ</option>
        <option value="custom">± kσ…</option>
      </select>
      {shown === "custom" ? (
        <input
          type="number"
          min={0}
          max={10}
          step={0.5}
          className="narrow"
          aria-label={`k for the theory spread of ${model.label}`}
          value={model.sigmas}
          onChange={(e) => {
            const k = Number(e.target.value);
            if (Number.isFinite(k) && k >= 0 && k <= 10)
              updateModel(model.id, { sigmas: k }, { coalesceKey: `model:${model.id}:sigmas` });
          }}
        />
      ) : null}
    </span>
  );
}

/** Whether the drawn band of a model reaches g = 0. */
function useCancels(model: Model | undefined): boolean {
  const physics = useAxband(selectPhysics);
  if (!model) return false;
  const constants = constantsOf(physics);
  const shape = modelShape(model, constants);
  // An interval holding c_γ cancels; lines (between, set) reach g = 0 only where one of them does.
  return (
    shape !== null &&
    shape.kind === "interval" &&
    (shapeCancels(shape, constants) || shapeNormalizedRange(shape, constants, model.sigmas)[0] === 0)
  );
}

/** Reopen in the calculator (its own models only), move up and down, remove. */
function RowButtons({ model, index, count }: { model: Model; index: number; count: number }) {
  const requestEdit = useCalculatorRequest((s) => s.requestEdit);
  const { removeModel, moveModel } = useAxband(
    useShallow((s: AxbandState) => ({ removeModel: s.removeModel, moveModel: s.moveModel })),
  );
  return (
    <span className="row-buttons">
      {model.source.kind === "calculator" ? (
        <button
          type="button"
          className="icon"
          aria-label={`Edit ${model.label} in the anomaly calculator`}
          title="Reopen in the anomaly calculator"
          onClick={() => requestEdit(model)}
        >
          ✎
        </button>
      ) : null}
      <OrderButtons
        label={model.label}
        index={index}
        count={count}
        move={(d) => moveModel(model.id, d)}
        remove={() => removeModel(model.id)}
      />
    </span>
  );
}

function LineStyleField({ model }: { model: Model }) {
  const updateModel = useAxband((s) => s.updateModel);
  return (
    <select
      aria-label={`Line style of ${model.label}`}
      value={model.lineStyle}
      onChange={(e) => updateModel(model.id, { lineStyle: e.target.value as LineStyle })}
    >
      {LINE_STYLES.map((s) => (
        <option key={s.value} value={s.value}>
          {s.label}
        </option>
      ))}
    </select>
  );
}

function ModelRow({ id, index, count }: { id: string; index: number; count: number }) {
  const model = useAxband(useCallback((s: AxbandState) => s.project.models.find((m) => m.id === id), [id]));
  const updateModel = useAxband((s) => s.updateModel);
  const cancels = useCancels(model);
  if (!model) return null;
  return (
    <li
      className={`model-row${model.visible ? "" : " hidden-model"}`}
      data-model-id={model.id}
      data-model-kind={model.kind}
    >
      <div className="model-row-main">
        <input
          type="color"
          className="swatch"
          aria-label={`Colour of ${model.label}`}
          value={/^#[0-9a-f]{6}$/i.test(model.colour) ? model.colour : "#1f4e8c"}
          onChange={(e) =>
            updateModel(model.id, { colour: e.target.value }, { coalesceKey: `model:${model.id}:colour` })
          }
        />
        <input
          type="text"
          className="model-label"
          aria-label="Model label"
          title={model.label}
          value={model.label}
          onChange={(e) => updateModel(model.id, { label: e.target.value }, { coalesceKey: `model:${model.id}:label` })}
        />
        <label className="check" title="Show on the figure">
          <input
            type="checkbox"
            checked={model.visible}
            onChange={(e) => updateModel(model.id, { visible: e.target.checked })}
          />
          <span className="visually-hidden">Show {model.label}</span>
        </label>
        <RowButtons model={model} index={index} count={count} />
      </div>
      <div className="model-row-detail">
        {model.kind === "set" ? <SetField model={model} /> : <EOverNField model={model} />}
        <LineStyleField model={model} />
        <SpreadField model={model} />
      </div>
      {cancels ? (
        <p
          className="model-note"
          data-testid="cancellation-note"
          title="The E/N interval contains c_γ, so g_aγγ cancels inside the band and no finite limit excludes all of it"
        >
          reaches g = 0 (cancellation)
        </p>
      ) : null}
    </li>
  );
}

export function ModelList() {
  const ids = useAxband(useShallow(selectModelIds));
  if (ids.length === 0)
    return (
      <p className="empty">
        No models yet: type an E/N above, pick one from the catalogue, or build one in the anomaly calculator.
      </p>
    );
  return (
    <ul className="model-list" aria-label="Models">
      {ids.map((id, i) => (
        <ModelRow key={id} id={id} index={i} count={ids.length} />
      ))}
    </ul>
  );
}
