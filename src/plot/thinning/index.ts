// Public face of the thinning: curves prepared once per data array, turned into at most a few points per
// device pixel for each frame (pixels.ts), culled and clipped, and written as path data.
export {
  prepareCurve,
  installPrepared,
  cachedPrepared,
  viewArrays,
  type PreparedCurve,
  type ViewArrays,
} from "./prepared";
export { buildPyramid, type Pyramid } from "./pyramid";
export { thinColumns, pixelColumn, type ColumnParams } from "./columns";
export { dpImportance, simplifyIndices } from "./douglas-peucker";
export { thinRunsLog } from "./runs";
export { clipToRect, CULL_MARGIN_PX, type Polyline, type Rect } from "./clip";
export { curvePixels, type PixelParams } from "./pixels";
export { pathData, pathDataCompact } from "./path-data";
