// The scene: a plain, serialisable description of one figure (layers of paths, rects and text) that both
// the on-screen renderer (SceneSvg, scene-dom.ts) and the SVG string writer (export, CLI) draw without further logic.

/** One run of text; math labels are sequences of runs with real sub/superscripts. */
export interface TextRun {
  text: string;
  shift?: "sub" | "sup";
  italic?: boolean;
}

export interface PathNode {
  kind: "path";
  /**
   * SVG path data in scene pixels, numbers rounded to 2 decimals. Curves use the compact form (an absolute
   * M, then relative l/h/v moves, fractions without a leading zero); everything else absolute M/L/H/V/Z.
   */
  d: string;
  /**
   * The path data as path-writer.ts returned it (only command letters, digits, signs, dots and spaces by
   * construction), set by the plot core: while `d` is this same string the SVG writers take it without
   * rescanning every curve per frame; a `d` changed afterwards is checked like any other.
   */
  writtenD?: string;
  stroke?: string;
  strokeWidth?: number;
  strokeOpacity?: number;
  /** SVG stroke-dasharray, e.g. "4 2". */
  dash?: string;
  fill?: string;
  fillOpacity?: number;
  /** Readable id (becomes the element id in the SVG), e.g. "curve-3". */
  id?: string;
  /** Extra data-* attributes for tests and hit-testing (keys without the "data-" prefix). */
  data?: Record<string, string>;
}

export interface RectNode {
  kind: "rect";
  x: number;
  y: number;
  w: number;
  h: number;
  fill?: string;
  fillOpacity?: number;
  stroke?: string;
  strokeWidth?: number;
  id?: string;
  data?: Record<string, string>;
}

export interface TextNode {
  kind: "text";
  x: number;
  y: number;
  runs: TextRun[];
  /** Font size in scene pixels. */
  sizePx: number;
  anchor: "start" | "middle" | "end";
  /** Vertical alignment of (x, y): the baseline itself, or the middle / top of the text. */
  baseline: "alphabetic" | "middle" | "hanging";
  /** Rotation in degrees about (x, y). */
  rotate?: number;
  fill?: string;
  weight?: "normal" | "bold";
  id?: string;
  data?: Record<string, string>;
}

export type SceneNode = PathNode | RectNode | TextNode;

export type LayerId = "background" | "grid" | "curves" | "models" | "highlight" | "axes" | "legend";

export interface SceneLayer {
  id: LayerId;
  /** Clip the layer to the plot area. */
  clip: boolean;
  nodes: SceneNode[];
  /** Group-level data-* attributes (the legend layer carries data-testid="legend"). */
  data?: Record<string, string>;
}

/** Serialisable description of the log-log mapping, enough to rebuild the scales anywhere. */
export interface ScaleConfig {
  /** Visible mass range in eV, mapped to [plot.x, plot.x + plot.w]. */
  massDomainEv: [number, number];
  /** Visible y range (units of the y view), mapped bottom-to-top to [plot.y + plot.h, plot.y]. */
  yDomain: [number, number];
  /** What the y axis shows: g_aγγ in GeV⁻¹, |E/N − c_γ| or |g_γ| (absent means "coupling"). */
  yView?: "coupling" | "normalized" | "g-gamma";
}

export interface Scene {
  /** Scene size in CSS pixels at 96 per inch; the SVG viewBox. */
  widthPx: number;
  heightPx: number;
  /** Physical size for export, e.g. "8.6cm" (absent for on-screen-only scenes). */
  widthPhysical?: string;
  heightPhysical?: string;
  /** The plot area inside the axes, in scene pixels. */
  plot: { x: number; y: number; w: number; h: number };
  scales: ScaleConfig;
  fontFamily: string;
  layers: SceneLayer[];
  /** Where an "auto" legend was put (a corner, outside right or below); absent for a fixed place or no legend. */
  autoLegendPlace?: "top-left" | "top-right" | "bottom-left" | "bottom-right" | "outside-right" | "below";
  /**
   * Full texts of the legend entries that had to be cut with "…" to fit (a word wider than the legend's room,
   * or more lines than the figure has height for); absent when every entry is shown in full.
   */
  shortenedLegendEntries?: string[];
  /** The legend's text size in pt when it had to be set smaller than chosen to fit (below or above the plot). */
  legendReducedToPt?: number;
  /** What the figure changed to fit (a long title wrapped or shrunk): the app shows them, the CLI prints them. */
  notes?: string[];
  /**
   * With the legend "on-plot": where each curve's and model's label went (scene px) and whether the user placed
   * it, for the app's drag handles; absent otherwise.
   */
  directLabels?: {
    kind: "curve" | "model";
    id: string;
    text: string;
    box: PlotArea;
    pinned: boolean;
    /** The box centre as [mass eV, g_aγγ GeV⁻¹], and which wrapping of the text was used. */
    at: [number, number];
    variant: number;
  }[];
}

type PlotArea = { x: number; y: number; w: number; h: number };
