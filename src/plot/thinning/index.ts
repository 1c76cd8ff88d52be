// Public face of the thinning: curves prepared once per data array (analysis/prepared-curve.ts), turned into at
// most a few points per device pixel for each frame (pixels.ts), culled and clipped, and written as path data.
export { prepareCurve, installPrepared, cachedPrepared, type PreparedCurve } from "../../analysis/prepared-curve";
export { viewArrays, viewsOf, type ViewArrays } from "./prepared";
export { buildPyramid } from "./pyramid";
export { thinColumns, pixelColumn } from "./columns";
export { dpImportance, simplifyIndices } from "./douglas-peucker";
export { thinRunsLog } from "./runs";
export { clipToRect, type Polyline, type Rect } from "./clip";
export { curvePixels, type PixelParams } from "./pixels";
export { pathData, pathDataCompact } from "./path-data";
