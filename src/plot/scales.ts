// Log-log scales of a figure: D3 log scales built from the serialisable ScaleConfig, the pure helpers the UI
// uses for hit-testing (mass ↔ x, y ↔ px), and the y views (g_aγγ, |E/N − c_γ|, |g_γ|).
import { scaleLog, type ScaleLogarithmic } from "d3-scale";
import { ALPHA, type AxionConstants } from "../physics/constants";
import type { YView } from "../project/types";
import type { Scene, ScaleConfig } from "./scene-types";

type SceneLike = Pick<Scene, "plot" | "scales">;

/** D3 log scale of the mass axis: massDomainEv → [plot.x, plot.x + plot.w]. */
export function massScale(scene: SceneLike): ScaleLogarithmic<number, number> {
  const { plot, scales } = scene;
  return scaleLog()
    .domain(scales.massDomainEv)
    .range([plot.x, plot.x + plot.w]);
}

/** D3 log scale of the y axis (units of the y view): yDomain → [plot.y + plot.h, plot.y] (up is larger). */
export function yScale(scene: SceneLike): ScaleLogarithmic<number, number> {
  const { plot, scales } = scene;
  return scaleLog()
    .domain(scales.yDomain)
    .range([plot.y + plot.h, plot.y]);
}

/** x in scene px of a mass in eV. */
export function massToX(scene: SceneLike, massEv: number): number {
  return massScale(scene)(massEv);
}

/** Mass in eV at x (scene px). */
export function xToMass(scene: SceneLike, xPx: number): number {
  return massScale(scene).invert(xPx);
}

/** y in scene px of a value in the units of the scene's y view. */
export function yToPx(scene: SceneLike, y: number): number {
  return yScale(scene)(y);
}

/** Value in the units of the y view at y (scene px). */
export function pxToY(scene: SceneLike, yPx: number): number {
  return yScale(scene).invert(yPx);
}

/**
 * log10 of the factor that turns g_aγγ (GeV⁻¹) at mass m into the y view's quantity, without the mass part:
 * view(m, g) = g · m^slope · 10^offset. normalized: |E/N − c_γ| = 2π f_a g/α with f_a = K·10⁶/m, so slope −1
 * and offset log10(2πK·10⁶/α); g-gamma is half of that.
 */
export function viewTransform(view: YView, c: AxionConstants): { slope: number; log10Factor: number } {
  if (view === "coupling") return { slope: 0, log10Factor: 0 };
  const f = Math.log10((2 * Math.PI * c.kMuEv * 1e6) / ALPHA);
  return { slope: -1, log10Factor: view === "g-gamma" ? f - Math.log10(2) : f };
}

/** The y view's quantity for a coupling g_aγγ (GeV⁻¹) at a mass (eV). */
export function gToView(view: YView, massEv: number, gInvGeV: number, c: AxionConstants): number {
  const t = viewTransform(view, c);
  return gInvGeV * massEv ** t.slope * 10 ** t.log10Factor;
}

/** g_aγγ (GeV⁻¹) for a y-view value at a mass (eV); the inverse of {@link gToView}. */
export function viewToG(view: YView, massEv: number, y: number, c: AxionConstants): number {
  const t = viewTransform(view, c);
  return y / (massEv ** t.slope * 10 ** t.log10Factor);
}

/**
 * The same mapping as the D3 scales as two affine maps in log10 space (x = ax + bx·log10 m,
 * y = ay + by·log10 v), for hot loops that must not call a scale per point.
 */
export interface LogAffine {
  ax: number;
  bx: number;
  ay: number;
  by: number;
}

/** Affine log10 maps of a scale config over a plot rectangle. */
export function logAffine(scales: ScaleConfig, plot: Scene["plot"]): LogAffine {
  const [m0, m1] = scales.massDomainEv;
  const [y0, y1] = scales.yDomain;
  const lm0 = Math.log10(m0);
  const ly0 = Math.log10(y0);
  const bx = plot.w / (Math.log10(m1) - lm0);
  const by = -plot.h / (Math.log10(y1) - ly0);
  return { ax: plot.x - bx * lm0, bx, ay: plot.y + plot.h - by * ly0, by };
}

/** A usable log domain: both ends positive and finite, ascending, at least a tiny span; else the fallback. */
export function sanitizeDomain(
  d: readonly number[] | undefined,
  fallback: readonly [number, number],
): [number, number] {
  if (!d || d.length < 2) return [fallback[0], fallback[1]];
  let [a, b] = [Number(d[0]), Number(d[1])];
  if (!(a > 0 && b > 0 && Number.isFinite(a) && Number.isFinite(b))) return [fallback[0], fallback[1]];
  if (a > b) [a, b] = [b, a];
  // Below ~1e-9 relative the log scale degenerates; widen a zero-width range symmetrically.
  if (b / a < 1 + 1e-9) {
    a /= 1.01;
    b *= 1.01;
  }
  return [a, b];
}
