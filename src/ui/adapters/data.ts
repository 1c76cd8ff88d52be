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

/** Project without curve data as text for localStorage (temporary: replaced by src/data serializeForStorage). */
export function serializeForStorage(project: Project): string {
  return JSON.stringify({ ...project, curves: project.curves.map((c) => ({ ...c, massEv: undefined, gInvGeV: undefined })) });
}

/** Inverse of {@link serializeForStorage} with the curve arrays put back (temporary, minimal checks). */
export function deserializeFromStorage(
  text: string,
  curveData: ReadonlyMap<string, { massEv: Float64Array; gInvGeV: Float64Array }>,
): { ok: true; project: Project; missingCurves: string[] } | { ok: false; error: string } {
  try {
    const raw = JSON.parse(text) as Project;
    if (!raw || raw.version !== PROJECT_VERSION || !Array.isArray(raw.models) || !Array.isArray(raw.curves)) {
      return { ok: false, error: "the saved project is not in a format this version understands" };
    }
    const missingCurves: string[] = [];
    const curves = raw.curves.flatMap((c) => {
      const d = curveData.get(c.id);
      if (!d) {
        missingCurves.push(c.label);
        return [];
      }
      return [{ ...c, massEv: d.massEv, gInvGeV: d.gInvGeV }];
    });
    return { ok: true, project: { ...raw, curves }, missingCurves };
  } catch {
    return { ok: false, error: "the saved project could not be read" };
  }
}

/** Decode a link fragment (temporary: links cannot be opened until src/data/link lands). */
export function decodeLink(_fragment: string): { ok: true; project: Project } | { ok: false; error: string } {
  return { ok: false, error: "opening links is not available in this build yet" };
}
