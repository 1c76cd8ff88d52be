// Makes every figure the schema accepts drawable before any writer sees it: a custom size outside the drawn
// limits and text too large for the plot to fit are named in a note (or refused), never passed on silently.
import type { Project } from "../project/types";
import type { Scene } from "../plot/scene-types";
import { buildScene } from "../plot/scene";
import { shortenedLegendNote } from "../plot/legend";
import { exportScene } from "../formats/figure-file";
import { presetOf } from "../plot/layout";
import { CUSTOM_MM_LIMITS } from "../project/limits";
import { InputError } from "./read-input";

/** Font sizes the figure accepts, pt (as the project schema). */
const FONT_PT_LIMITS: readonly [number, number] = [4, 72];

/** Whether the plot area of the figure lies inside it (resvg aborts the process on some that do not). */
function plotFits(project: Project): boolean {
  const s = buildScene(project);
  const { x, y, w, h } = s.plot;
  return x >= 0 && y >= 0 && w > 0 && h > 0 && x + w <= s.widthPx && y + h <= s.heightPx;
}

/** The figure to draw, what was changed for it, and its export scene (built once: the SVG is written from it). */
export interface FittedFigure {
  project: Project;
  notes: string[];
  /** The scene the SVG export draws (exportScene of `project`, with its data). */
  scene: Scene;
}

/**
 * The export scene of the project as drawn, and notes on what the figure changed itself: a long title wrapped
 * or shrunk, legend entries shortened or legend text reduced. From the scene with the data, as the auto legend
 * place (and so what the legend must shorten) depends on where the curves run.
 */
function withScene(project: Project, notes: string[]): FittedFigure {
  const scene = exportScene(project);
  const legendNote = shortenedLegendNote(scene);
  const sceneNotes = (scene.notes ?? []).map((n) => `figure: ${n}`);
  return { project, scene, notes: [...notes, ...sceneNotes, ...(legendNote ? [legendNote] : [])] };
}

/**
 * The project to draw, notes on what was changed for it, and its export scene: a custom size outside the drawn
 * limits is noted (the plot core clamps it), and a text size that pushes the plot off the figure is lowered to
 * the largest whole pt that fits; what the figure changes itself (a long title, the legend) is noted too.
 * Throws InputError when no text size fits.
 */
export function fitFigure(project: Project): FittedFigure {
  const f = project.figure;
  const notes: string[] = [];
  const [minMm, maxMm] = CUSTOM_MM_LIMITS;
  const clampMm = (v: number) => Math.min(maxMm, Math.max(minMm, v));
  const widthMm = clampMm(f.customWidthMm);
  const heightMm = clampMm(f.customHeightMm);
  if (f.preset === "custom" && (widthMm !== f.customWidthMm || heightMm !== f.customHeightMm))
    notes.push(
      `figure: custom size ${f.customWidthMm} × ${f.customHeightMm} mm is drawn at ${widthMm} × ${heightMm} mm (custom sizes are ${minMm}–${maxMm} mm)`,
    );
  // Layout depends on labels and sizes, not on the data: test fits on a copy without points (fast for big curves).
  const light: Project = {
    ...project,
    curves: project.curves.map((c) => ({ ...c, massEv: new Float64Array(0), gInvGeV: new Float64Array(0) })),
  };
  const withFont = (pt: number): Project => ({ ...light, figure: { ...light.figure, fontPt: pt } });
  if (plotFits(light)) return withScene(project, notes);
  const drawn = presetOf(f);
  const size = `${drawn.widthMm} × ${drawn.heightMm} mm`;
  for (let pt = Math.min(FONT_PT_LIMITS[1], Math.floor(f.fontPt)); pt >= FONT_PT_LIMITS[0]; pt--) {
    if (!plotFits(withFont(pt))) continue;
    notes.push(
      `figure: ${f.fontPt} pt text leaves no room for the plot in ${size}; drawn with ${pt} pt text (set the text size or the figure size in the app to choose)`,
    );
    return withScene({ ...project, figure: { ...f, fontPt: pt } }, notes);
  }
  throw new InputError(
    `figure: ${size} leaves no room for the plot even with ${FONT_PT_LIMITS[0]} pt text; choose a larger size (--preset custom --width-mm W --height-mm H)`,
  );
}
