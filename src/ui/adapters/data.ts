// TEMPORARY adapter: stands in for src/data (defaults, factories) until those modules land; each export is
// replaced by the real import from src/data as soon as it exists. Not a finished implementation.
import { PROJECT_VERSION, type Model, type Project } from "../../data/types";

const MODEL_COLOURS = ["#1f6f8b", "#2a9d8f", "#3a5ba0", "#177e89", "#5e60ce"];

/** Next model colour: the first of a teal/blue family not used yet. */
export function nextModelColour(models: readonly Model[]): string {
  const used = new Set(models.map((m) => m.colour));
  return MODEL_COLOURS.find((c) => !used.has(c)) ?? MODEL_COLOURS[models.length % MODEL_COLOURS.length];
}

let counter = 0;
function freshId(prefix: string): string {
  counter += 1;
  return `${prefix}-${Date.now().toString(36)}-${counter}`;
}

/** A model with defaults for everything not given. */
export function newModel(partial: Partial<Model> & { eOverNMin: string }, existing: readonly Model[] = []): Model {
  const eOverNMax = partial.eOverNMax ?? partial.eOverNMin;
  return {
    id: partial.id ?? freshId("model"),
    label: partial.label ?? (eOverNMax === partial.eOverNMin ? `E/N = ${partial.eOverNMin}` : `E/N = ${partial.eOverNMin}..${eOverNMax}`),
    eOverNMin: partial.eOverNMin,
    eOverNMax,
    source: partial.source ?? { kind: "typed" },
    colour: partial.colour ?? nextModelColour(existing),
    lineStyle: partial.lineStyle ?? "solid",
    fillOpacity: partial.fillOpacity ?? 0.25,
    visible: partial.visible ?? true,
    sigmas: partial.sigmas ?? 0,
  };
}

/** The start state (temporary: no demo curves until src/data/demo lands). */
export function defaultProject(): Project {
  return {
    version: PROJECT_VERSION,
    name: "Untitled",
    physics: { ref: "2019", custom: { cGamma: 1.92, cGammaSigma: 0.04, kMuEv: 5.691, kMuEvSigma: 0.051, label: "" } },
    models: [newModel({ id: "model-ksvz", eOverNMin: "0" }), newModel({ id: "model-dfsz", eOverNMin: "8/3" })],
    curves: [],
    figure: {
      preset: "slide",
      customWidthMm: 160,
      customHeightMm: 90,
      massRangeEv: [1e-7, 1e-1],
      yRange: [1e-17, 1e-9],
      yView: "coupling",
      topAxis: "none",
      grid: true,
      legend: "top-left",
      fontPt: 10,
      title: "",
    },
  };
}
