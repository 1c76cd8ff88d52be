// Which part of the project goes where: for every key of Project, Model, Curve and Figure, whether it is written
// into share links, project files and browser storage (the link, file and storage writers read this table).
import type { Curve, Figure, Model, PhysicsSettings, Project } from "./types";

/**
 * In a link: "always"; "with-curves" only when the link includes curves (curve data can be large);
 * "never". The schema version always travels as the link's "vN." prefix.
 */
export type LinkRule = "always" | "with-curves" | "never";
/** In browser storage: with the rest ("meta"), in a separate record per curve ("separate", for big arrays), or not at all. */
export type StorageRule = "meta" | "separate" | "never";

export interface Persistence {
  link: LinkRule;
  file: boolean;
  storage: StorageRule;
}

const everywhere: Persistence = { link: "always", file: true, storage: "meta" };

// Typed as complete records, so adding a key to types.ts without deciding its fate here is a type error.
export const PROJECT_STATE: { readonly [K in keyof Project]-?: Persistence } = {
  version: everywhere,
  name: everywhere,
  physics: everywhere,
  models: everywhere,
  // Curves (metadata and data) make a link long: only when the link has room.
  curves: { link: "with-curves", file: true, storage: "meta" },
  figure: everywhere,
};

export const PHYSICS_STATE: { readonly [K in keyof PhysicsSettings]-?: Persistence } = {
  ref: everywhere,
  // Kept even while a published reference is selected, so switching back to "custom" restores the values.
  custom: everywhere,
};

export const MODEL_STATE: { readonly [K in keyof Model]-?: Persistence } = {
  id: everywhere,
  label: everywhere,
  kind: everywhere,
  eOverNMin: everywhere,
  eOverNMax: everywhere,
  members: everywhere,
  setDraw: everywhere,
  setShare: everywhere,
  // The calculator's field content lets a receiver re-open and edit the model, not only see its line.
  source: everywhere,
  colour: everywhere,
  lineStyle: everywhere,
  fillOpacity: everywhere,
  visible: everywhere,
  sigmas: everywhere,
  // A dragged direct label is part of the figure the sender saw.
  labelAt: everywhere,
};

const curveMeta: Persistence = { link: "with-curves", file: true, storage: "meta" };
// Data arrays go to storage as separate records: the UI may keep them where big binary values fit (IndexedDB).
const curveData: Persistence = { link: "with-curves", file: true, storage: "separate" };

export const CURVE_STATE: { readonly [K in keyof Curve]-?: Persistence } = {
  id: curveMeta,
  label: curveMeta,
  role: curveMeta,
  massEv: curveData,
  gInvGeV: curveData,
  keepOrder: curveMeta,
  colour: curveMeta,
  lineStyle: curveMeta,
  fillOpacity: curveMeta,
  exclusionMark: curveMeta,
  visible: curveMeta,
  rescale: curveMeta,
  citation: curveMeta,
  fileName: curveMeta,
  labelAt: curveMeta,
};

export const FIGURE_STATE: { readonly [K in keyof Figure]-?: Persistence } = {
  preset: everywhere,
  customWidthMm: everywhere,
  customHeightMm: everywhere,
  // The last zoom is part of the figure: a link restores exactly the view the sender had.
  massRangeEv: everywhere,
  yRange: everywhere,
  yView: everywhere,
  topAxis: everywhere,
  grid: everywhere,
  legend: everywhere,
  legendScale: everywhere,
  fontPt: everywhere,
  font: everywhere,
  title: everywhere,
  massUnit: everywhere,
  frequencyUnit: everywhere,
  ticks: everywhere,
};

/** Where a writer puts state. */
export type PersistTarget =
  { kind: "link"; includeCurves: boolean } | { kind: "file" } | { kind: "storage-meta" } | { kind: "storage-separate" };

/** Whether a key with this rule goes to `target`. */
export function goesTo(rule: Persistence, target: PersistTarget): boolean {
  switch (target.kind) {
    case "link":
      return rule.link === "always" || (rule.link === "with-curves" && target.includeCurves);
    case "file":
      return rule.file;
    case "storage-meta":
      return rule.storage === "meta";
    case "storage-separate":
      return rule.storage === "separate";
  }
}

/** Keys of `table` that go to `target`, in the table's order. */
export function keysFor<K extends string>(table: { readonly [P in K]: Persistence }, target: PersistTarget): K[] {
  return (Object.keys(table) as K[]).filter((k) => goesTo(table[k], target));
}
