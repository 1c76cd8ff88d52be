// The Figure settings section: size preset, typed axis ranges, y view, axis units, top axis, ticks, grid,
// legend place and text size, font and title.
import { useId, useState } from "react";
import type {
  AxisMassUnit,
  Figure,
  FigureFont,
  FrequencyUnitSetting,
  LegendPlace,
  SizePreset,
  TickSides,
  TopAxis,
  YView,
} from "../../project/types";
import { checkRange, massRangeText, parseMassText, rangeText, type ParsedValue } from "../../formats/axis-range";
import { AXIS_MASS_UNITS, FREQUENCY_AXIS_UNITS, massUnitInfo } from "../../physics/units";
import { CUSTOM_MM_LIMITS, LEGEND_SCALE_LIMITS } from "../../project/limits";
import { useShallow } from "zustand/react/shallow";
import { useAxband, type AxbandState } from "../store";
import { LabelPositions } from "./LabelPositions";

const PRESETS: { value: SizePreset; label: string }[] = [
  { value: "slide", label: "Slide 16:9" },
  { value: "single-column", label: "Single column (8.6 cm)" },
  { value: "double-column", label: "Double column (17.8 cm)" },
  { value: "custom", label: "Custom" },
];
const Y_VIEWS: { value: YView; label: string }[] = [
  { value: "coupling", label: "g_aγγ [GeV⁻¹]" },
  { value: "normalized", label: "|E/N − c_γ| (normalized)" },
  { value: "g-gamma", label: "|g_γ| = |E/N − c_γ|/2" },
];
// Computer Modern Unicode, LaTeX's default look, so a figure's text matches the paper's.
const FONTS: { value: FigureFont; label: string }[] = [
  { value: "sans", label: "Computer Modern Sans" },
  { value: "serif", label: "Computer Modern Serif" },
];
const TOP_AXES: { value: TopAxis; label: string }[] = [
  { value: "none", label: "none" },
  { value: "fa", label: "f_a [GeV]" },
  { value: "frequency", label: "frequency ν [Hz…THz]" },
];
const MASS_UNITS: { value: AxisMassUnit; label: string }[] = AXIS_MASS_UNITS.map((u) => ({
  value: u,
  label: massUnitInfo(u).label,
}));
const FREQUENCY_UNITS: { value: FrequencyUnitSetting; label: string }[] = [
  { value: "auto", label: "automatic (suits the range)" },
  ...FREQUENCY_AXIS_UNITS.map((u) => ({ value: u, label: u })),
];
const TICKS: { value: TickSides; label: string }[] = [
  { value: "out", label: "outside, left and bottom" },
  { value: "all", label: "outside, all four sides" },
];
const LEGEND: { value: LegendPlace; label: string }[] = [
  // A free inner corner, else outside right or below (src/plot/legend-place.ts).
  { value: "auto", label: "best corner (automatic)" },
  { value: "top-left", label: "top left" },
  { value: "top-right", label: "top right" },
  { value: "bottom-left", label: "bottom left" },
  { value: "bottom-right", label: "bottom right" },
  { value: "outside-right", label: "outside right" },
  { value: "below", label: "below the plot" },
  { value: "above", label: "above the plot" },
  // Each label beside its own line (src/plot/direct-labels.ts).
  { value: "on-plot", label: "on the plot (labels by their lines)" },
  { value: "hidden", label: "hidden" },
];

function RangeFields({
  label,
  unit,
  range,
  onApply,
  testid,
  parse,
  show = rangeText,
}: {
  label: string;
  unit: string;
  range: [number, number];
  onApply: (r: [number, number]) => void;
  testid: string;
  /** Reads a typed end (a bare number, or one with a unit). @default a plain number */
  parse?: (text: string) => ParsedValue;
  /** Writes a range end in the field's unit. */
  show?: (v: number) => string;
}) {
  const [draft, setDraft] = useState<[string, string] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const errId = useId();
  const shown: [string, string] = draft ?? [show(range[0]), show(range[1])];
  const apply = (d: [string, string] | null) => {
    if (!d) return;
    const r = checkRange(d[0], d[1], label, parse);
    if (!r.ok) {
      setError(r.error);
      return;
    }
    setError(null);
    setDraft(null);
    if (r.range[0] !== range[0] || r.range[1] !== range[1]) onApply(r.range);
  };
  const field = (i: 0 | 1, name: string) => (
    <input
      type="text"
      inputMode="decimal"
      className="range-input"
      data-testid={`${testid}-${name}`}
      aria-label={`${label} ${name}${unit ? ` (${unit})` : ""}`}
      value={shown[i]}
      aria-invalid={error ? true : undefined}
      aria-describedby={error ? errId : undefined}
      onChange={(e) => {
        const next: [string, string] = [...shown];
        next[i] = e.target.value;
        setDraft(next);
      }}
      onBlur={() => apply(draft)}
      onKeyDown={(e) => {
        if (e.key === "Enter") apply(draft);
        if (e.key === "Escape") {
          setDraft(null);
          setError(null);
        }
      }}
    />
  );
  return (
    <div className="range-fields">
      <span className="field-label">
        {label}
        {unit ? ` [${unit}]` : ""}
      </span>
      <div className="inline-row">
        {field(0, "min")}
        <span aria-hidden="true">to</span>
        {field(1, "max")}
      </div>
      {error ? (
        <p id={errId} className="field-error">
          {error}; kept {show(range[0])} to {show(range[1])}.
        </p>
      ) : null}
    </div>
  );
}

function Select<T extends string>({
  label,
  value,
  options,
  onChange,
  testId,
}: {
  label: string;
  value: T;
  options: { value: T; label: string }[];
  onChange: (v: T) => void;
  testId?: string;
}) {
  return (
    <label className="setting">
      <span className="field-label">{label}</span>
      <select value={value} data-testid={testId} onChange={(e) => onChange(e.target.value as T)}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}

function NumberSetting({
  label,
  value,
  min,
  max,
  step,
  onChange,
  testId,
}: {
  label: string;
  value: number;
  min: number;
  max: number;
  step: number;
  onChange: (v: number) => void;
  testId?: string;
}) {
  const [draft, setDraft] = useState<string | null>(null);
  return (
    <label className="setting">
      <span className="field-label">{label}</span>
      <input
        type="number"
        min={min}
        max={max}
        step={step}
        className="narrow"
        data-testid={testId}
        value={draft ?? String(value)}
        onChange={(e) => {
          setDraft(e.target.value);
          const v = Number(e.target.value);
          if (e.target.value !== "" && Number.isFinite(v) && v >= min && v <= max) onChange(v);
        }}
        onBlur={() => setDraft(null)}
      />
    </label>
  );
}

/** The typed axis ranges: the only part of the settings that follows zoom and pan. */
function ViewRanges() {
  const { massRangeEv, yRange, yView, massUnit } = useAxband(
    useShallow((s: AxbandState) => ({
      massRangeEv: s.project.figure.massRangeEv,
      yRange: s.project.figure.yRange,
      yView: s.project.figure.yView,
      massUnit: s.project.figure.massUnit,
    })),
  );
  const setView = useAxband((s) => s.setView);
  const resetView = useAxband((s) => s.resetView);
  const yLabel = yView === "coupling" ? "g_aγγ" : yView === "normalized" ? "|E/N − c_γ|" : "|g_γ|";
  return (
    <>
      <RangeFields
        label="m_a"
        unit={massUnitInfo(massUnit).label}
        testid="range-mass"
        range={massRangeEv}
        parse={(t) => parseMassText(t, massUnit)}
        show={(v) => massRangeText(v, massUnit)}
        onApply={(r) => setView(r, useAxband.getState().project.figure.yRange)}
      />
      <RangeFields
        label={yLabel}
        unit={yView === "coupling" ? "GeV⁻¹" : ""}
        testid="range-y"
        range={yRange}
        onApply={(r) => setView(useAxband.getState().project.figure.massRangeEv, r)}
      />
      <button type="button" onClick={resetView}>
        Reset view
      </button>
    </>
  );
}

type FigureSansView = Omit<Figure, "massRangeEv" | "yRange">;
/** Props of a group of figure settings: the figure (less its ranges) and the setter (with a coalescing key). */
interface GroupProps {
  figure: FigureSansView;
  set: (patch: Partial<Figure>, key?: string) => void;
}

/** The figure settings chosen from a list. */
type ChoiceKey = "preset" | "yView" | "massUnit" | "topAxis" | "frequencyUnit" | "ticks" | "legend" | "font";
const CHOICES: {
  [K in ChoiceKey]: { label: string; options: { value: FigureSansView[K]; label: string }[]; testId?: string };
} = {
  preset: { label: "Size", options: PRESETS },
  yView: { label: "y axis", options: Y_VIEWS },
  massUnit: { label: "Mass unit", options: MASS_UNITS, testId: "figure-mass-unit" },
  topAxis: { label: "Top axis", options: TOP_AXES },
  frequencyUnit: { label: "Frequency unit", options: FREQUENCY_UNITS, testId: "figure-frequency-unit" },
  ticks: { label: "Ticks", options: TICKS, testId: "figure-ticks" },
  legend: { label: "Legend", options: LEGEND, testId: "legend-place" },
  font: { label: "Font", options: FONTS, testId: "figure-font" },
};

/** One figure setting chosen from a list, with its label, options and test id from CHOICES. */
function Choice<K extends ChoiceKey>({ field, figure, set }: GroupProps & { field: K }) {
  const { label, options, testId } = CHOICES[field];
  const onChange = (v: FigureSansView[K]) => set({ [field]: v } as Partial<Figure>);
  return <Select label={label} value={figure[field]} options={options} testId={testId} onChange={onChange} />;
}

/** The size preset, and the width and height of a custom size. */
function SizeSettings(g: GroupProps) {
  const { figure, set } = g;
  return (
    <>
      <Choice field="preset" {...g} />
      {figure.preset === "custom" ? (
        <div className="inline-row">
          <NumberSetting
            label="Width (mm)"
            value={figure.customWidthMm}
            min={CUSTOM_MM_LIMITS[0]}
            max={CUSTOM_MM_LIMITS[1]}
            step={1}
            onChange={(v) => set({ customWidthMm: v }, "figure:width")}
          />
          <NumberSetting
            label="Height (mm)"
            value={figure.customHeightMm}
            min={CUSTOM_MM_LIMITS[0]}
            max={CUSTOM_MM_LIMITS[1]}
            step={1}
            onChange={(v) => set({ customHeightMm: v }, "figure:height")}
          />
        </div>
      ) : null}
    </>
  );
}

/** The axes: typed ranges, y view, mass unit, top axis (with its frequency unit) and ticks. */
function AxesSettings(g: GroupProps) {
  const { figure } = g;
  return (
    <>
      <ViewRanges />
      <Choice field="yView" {...g} />
      <Choice field="massUnit" {...g} />
      <Choice field="topAxis" {...g} />
      {figure.topAxis === "frequency" ? <Choice field="frequencyUnit" {...g} /> : null}
      <Choice field="ticks" {...g} />
    </>
  );
}

/** The legend's place and text size. */
function LegendSettings(g: GroupProps) {
  const { figure, set } = g;
  return (
    <>
      <Choice field="legend" {...g} />
      {figure.legend === "on-plot" ? <LabelPositions /> : null}
      <NumberSetting
        label="Legend text (× default)"
        value={figure.legendScale}
        min={LEGEND_SCALE_LIMITS[0]}
        max={LEGEND_SCALE_LIMITS[1]}
        step={0.05}
        testId="legend-scale"
        onChange={(v) => set({ legendScale: v }, "figure:legend-scale")}
      />
    </>
  );
}

/** The font family and size (beside them, in the same row, the grid switch). */
function FontSettings(g: GroupProps) {
  const { figure, set } = g;
  return (
    <>
      <Choice field="font" {...g} />
      <div className="inline-row">
        <NumberSetting
          label="Font (pt)"
          value={figure.fontPt}
          min={5}
          max={36}
          step={0.5}
          onChange={(v) => set({ fontPt: v }, "figure:font")}
        />
        <label className="check setting">
          <input type="checkbox" checked={figure.grid} onChange={(e) => set({ grid: e.target.checked })} />
          Grid
        </label>
      </div>
    </>
  );
}

export function FigureSettings() {
  // Every figure field except the ranges, so zoom and pan do not re-render this panel.
  const figure: FigureSansView = useAxband(
    useShallow((s: AxbandState) => {
      const { massRangeEv: _m, yRange: _y, ...rest } = s.project.figure;
      return rest;
    }),
  );
  const setFigure = useAxband((s) => s.setFigure);
  const set = (patch: Partial<Figure>, key?: string) => setFigure(patch, key ? { coalesceKey: key } : undefined);
  const g: GroupProps = { figure, set };
  return (
    <div className="figure-settings">
      <SizeSettings {...g} />
      <AxesSettings {...g} />
      <LegendSettings {...g} />
      <FontSettings {...g} />
      <label className="setting">
        <span className="field-label">Title</span>
        <input
          type="text"
          value={figure.title}
          placeholder="(none)"
          onChange={(e) => set({ title: e.target.value }, "figure:title")}
        />
      </label>
    </div>
  );
}
