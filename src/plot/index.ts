// Public face of the plot core (pure, no DOM): scene building, SVG writing, layout presets, scales and the
// thinning functions, for the tests and the benches (the app imports the modules themselves).
export type * from "./scene-types";
export { buildScene } from "./scene";
export { writeSvg, escapeXml, isSafePathData } from "./svg";
export { PRESETS, presetOf } from "./layout";
export { massToX, xToMass, yToPx, pxToY, massScale, yScale } from "./scales";
export { logTicks, frequencyUnit, decadeLabelStep, type LogTick } from "./ticks";
export { constantsOf } from "./physics-settings";
export {
  prepareCurve,
  viewArrays,
  buildPyramid,
  thinColumns,
  pixelColumn,
  dpImportance,
  simplifyIndices,
  thinRunsLog,
  pathDataCompact,
  clipToRect,
  curvePixels,
  pathData,
  type PixelParams,
} from "./thinning/index";
export { runsWidthPx } from "./text";
