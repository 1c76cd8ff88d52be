// Makes every figure the schema accepts drawable before any writer sees it: a custom size outside the drawn
// limits and text too large for the plot to fit are named in a note (or refused), never passed on silently.
import type { Project } from "../project/types";
import { buildScene } from "../plot/scene";
import { presetOf } from "../plot/layout";
import { CUSTOM_MM_LIMITS } from "../project/limits";
import { InputError } from "./inputs";

/** Font sizes the figure accepts, pt (as the project schema). */
const FONT_PT_LIMITS: readonly [number, number] = [4, 72];

/** Whether the plot area of the figure lies inside it (resvg aborts the process on some that do not). */
function plotFits(project: Project): boolean {
  const s = buildScene(project);
  const { x, y, w, h } = s.plot;
  return x >= 0 && y >= 0 && w > 0 && h > 0 && x + w <= s.widthPx && y + h <= s.heightPx;
}

/** What the figure itself changed to fit (a long title wrapped or shrunk), as notes. */
function sceneNotes(project: Project): string[] {
  return (buildScene(project).notes ?? []).map((n) => `figure: ${n}`);
}

/**
 * The project to draw and notes on what was changed for it: a custom size outside the drawn limits is noted
 * (the plot core clamps it), and a text size that pushes the plot off the figure is lowered to the largest
 * whole pt that fits; what the figure changes itself (a long title) is noted too. Throws InputError when no text
 * size fits.
 */
export function fitFigure(project: Project): { project: Project; notes: string[] } {
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
  if (plotFits(light)) return { project, notes: [...notes, ...sceneNotes(light)] };
  const drawn = presetOf(f);
  const size = `${drawn.widthMm} × ${drawn.heightMm} mm`;
  for (let pt = Math.min(FONT_PT_LIMITS[1], Math.floor(f.fontPt)); pt >= FONT_PT_LIMITS[0]; pt--) {
    if (!plotFits(withFont(pt))) continue;
    notes.push(
      `figure: ${f.fontPt} pt text leaves no room for the plot in ${size}; drawn with ${pt} pt text (set the text size or the figure size in the app to choose)`,
    );
    return { project: { ...project, figure: { ...f, fontPt: pt } }, notes: [...notes, ...sceneNotes(withFont(pt))] };
  }
  throw new InputError(
    `figure: ${size} leaves no room for the plot even with ${FONT_PT_LIMITS[0]} pt text; choose a larger size (--preset custom --width-mm W --height-mm H)`,
  );
}
