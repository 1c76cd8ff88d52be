// Types of the axband store: the project (plain, saved data), its undo history, and transient UI state.
// Split by slice so each slice creator states exactly what it adds.
import type { StateCreator } from "zustand";
import type { Curve, Figure, Model, PhysicsSettings, Project } from "../../project/types";

/** Options of one project change. */
export interface CommitOpts {
  /**
   * Steps with the same key that follow each other within {@link COALESCE_MS} become one undo step
   * (zoom/pan: "view"; typing in one field: e.g. "model:ID:label").
   */
  coalesceKey?: string;
}

/** Most undo steps kept. */
export const HISTORY_LIMIT = 100;
/** Window in ms within which steps with the same coalesce key merge into one undo step. */
export const COALESCE_MS = 500;

export interface Message {
  id: string;
  /** "alert" for problems (role="alert"), "status" for good news (role="status"). */
  kind: "alert" | "status";
  text: string;
}

/** A mass interval (eV) to emphasise on the plot (e.g. a clicked overlap-table row); the shape buildScene takes. */
export interface Highlight {
  massMinEv: number;
  massMaxEv: number;
  modelId?: string;
  curveId?: string;
  /** Several intervals (eV) inside [massMinEv, massMaxEv] to mark instead of the whole span (an overlap row's). */
  intervalsEv?: [number, number][];
}

/** The point under the pointer, in data units (eV, units of the y view). */
export interface HoverPoint {
  massEv: number;
  y: number;
}

/** Another tab saved newer work: autosave waits for the user's choice (`choice` is set by the buttons). */
export interface TabConflict {
  /** When the other tab saved, ms since 1970. */
  savedAt: number;
  choice: "load" | "keep" | null;
}

export interface UiState {
  messages: Message[];
  tabConflict: TabConflict | null;
  highlight: Highlight | null;
  hover: HoverPoint | null;
}

export interface HistorySlice {
  project: Project;
  history: { past: Project[]; future: Project[] };
  /** The one way to change the project: applies the updater and records an undo step. */
  commit: (updater: (p: Project) => Project, opts?: CommitOpts) => void;
  undo: () => void;
  redo: () => void;
  canUndo: () => boolean;
  canRedo: () => boolean;
  /** Replace the whole project (link or file open); undoable; an optional status message. */
  replaceProject: (project: Project, message?: string) => void;
  /** Start over from this project with an empty history (app start, tests). Not undoable. */
  resetProject: (project: Project) => void;
}

/** A new model: E/N is required, everything else gets defaults. */
export type ModelDraft = Partial<Omit<Model, "eOverNMin">> & { eOverNMin: string };

export interface ModelsSlice {
  /** Adds a model and returns its id. */
  addModel: (draft: ModelDraft) => string;
  updateModel: (id: string, patch: Partial<Omit<Model, "id">>, opts?: CommitOpts) => void;
  removeModel: (id: string) => void;
  /** Moves a model up (delta < 0) or down in the list (and legend). */
  moveModel: (id: string, delta: number) => void;
}

export interface CurvesSlice {
  addCurves: (curves: Curve[]) => void;
  updateCurve: (id: string, patch: Partial<Omit<Curve, "id">>, opts?: CommitOpts) => void;
  removeCurve: (id: string) => void;
  moveCurve: (id: string, delta: number) => void;
}

/** A patch of the constants; `custom` may be given in part. */
export type PhysicsPatch = Partial<Omit<PhysicsSettings, "custom">> & { custom?: Partial<PhysicsSettings["custom"]> };

export interface FigureSlice {
  setFigure: (patch: Partial<Figure>, opts?: CommitOpts) => void;
  /** Sets the visible ranges (eV; y-view units). Coalesces with other view steps (key "view"). */
  setView: (massRangeEv: [number, number], yRange: [number, number]) => void;
  /** Back to the default ranges of the current y view. */
  resetView: () => void;
  setPhysics: (patch: PhysicsPatch, opts?: CommitOpts) => void;
}

export interface UiSlice {
  ui: UiState;
  /** Shows a message; returns its id. */
  pushMessage: (kind: Message["kind"], text: string) => string;
  dismissMessage: (id: string) => void;
  /** Set by autosave when another tab saved newer work; cleared when the choice has been carried out. */
  setTabConflict: (c: TabConflict | null) => void;
  /** The user's answer to a tab conflict: load the other tab's work, or keep this tab's and save it. */
  chooseTabConflict: (choice: "load" | "keep") => void;
  setHighlight: (h: Highlight | null) => void;
  setHover: (h: HoverPoint | null) => void;
}

/** A big curve's arrays whose drawing preparation is being built off the main thread (see preparation.ts). */
export interface PreparingCurve {
  massEv: Float64Array;
  gInvGeV: Float64Array;
  /** The drawing order prepared (drawsSorted of the curve). */
  sorted: boolean;
}

export interface PreparationSlice {
  /** Curves the figure leaves out until their preparation is in the plot cache; replaced whole on change. */
  preparing: readonly PreparingCurve[];
}

export type AxbandState = HistorySlice & ModelsSlice & CurvesSlice & FigureSlice & UiSlice & PreparationSlice;

/** Middleware applied once to the combined store. */
export type AxbandMiddleware = [["zustand/subscribeWithSelector", never]];

export type SliceCreator<T> = StateCreator<AxbandState, AxbandMiddleware, [], T>;
