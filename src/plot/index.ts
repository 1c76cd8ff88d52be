// Public face of the plot core (pure, no DOM): scene building, SVG writing, layout presets, scales and the
// decimation functions, for the app's renderer, the export and the command-line renderer.
export type * from "./scene-types";
export { buildScene, FONT_FAMILY, type BuildSceneOpts } from "./scene";
export {
  writeSvg,
  escapeXml,
  fmt,
  nodeAttributes,
  textPlacement,
  textSpans,
  isSafePathData,
  type WriteSvgOpts,
  type SvgAttribute,
} from "./svg";
export {
  PRESETS,
  presetOf,
  fontsFor,
  computeLayout,
  PX_PER_IN,
  PX_PER_MM,
  CUSTOM_MM_LIMITS,
  type Preset,
  type Fonts,
  type Layout,
  type PlotRect,
} from "./layout";
export {
  massToX,
  xToMass,
  yToPx,
  pxToY,
  massScale,
  yScale,
  gToView,
  viewToG,
  viewTransform,
  logAffine,
  sanitizeDomain,
  type LogAffine,
} from "./scales";
export {
  logTicks,
  faTicks,
  faDomain,
  frequencyTicks,
  frequencyDomain,
  frequencyUnit,
  decadeLabelStep,
  type LogTick,
  type LogTickOpts,
  type FrequencyUnit,
} from "./ticks";
export { axisTicks, yTitle, MASS_TITLE, FA_TITLE, frequencyTitle, type AxisTicks } from "./axes";
export { constantsOf, physicsOptsOf, eOverNValue, rescaleFactor, isRescaled, rescaleNote } from "./physics-settings";
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
  CULL_MARGIN_PX,
  clipToRect,
  curvePixels,
  pathData,
  type PreparedCurve,
  type Pyramid,
  type ColumnParams,
  type Polyline,
  type PixelParams,
  type Rect,
} from "./thinning/index";
export { curveGeometry, drawsSorted, preparedOf, type CurveGeometry } from "./curves";
export { modelGeometry, type ModelGeometry } from "./models";
export { placeRuns, runsWidthPx, stringWidthPx, runsText, truncateRuns, type PlacedRun } from "./text";
export { powerOfTenRuns, scientificRuns, safeColour, dashFor, MINUS } from "./format";
