// Path data of a thinned polyline: absolute for short shapes, compact (relative moves) for long curves.
import { absolutePath, compactPath } from "../path-writer";
import type { Polyline } from "./clip";

/** Path data "M x y L x y …" with absolute coordinates rounded to 2 decimals, closed with Z for polygons. */
export function pathData(poly: Polyline, extra = ""): string {
  return poly.n === 0 ? "" : absolutePath(poly.xs, poly.ys, poly.n, poly.closed, extra);
}

/**
 * Compact path data for long curves: an absolute "M" then relative moves between the positions rounded to
 * 0.01 px ("l dx dy", or "h dx" / "v dy" when one coordinate repeats), so every vertex lands exactly on its
 * rounded absolute position (no drift) in about half the characters; repeated vertices are dropped.
 * @param extra path data appended before the closing Z (absolute commands).
 */
export function pathDataCompact(poly: Polyline, extra = ""): string {
  return poly.n === 0 ? "" : compactPath(poly.xs, poly.ys, poly.n, poly.closed, extra);
}
