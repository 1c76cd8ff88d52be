// What a model draws, whatever its kind: one line, a continuous E/N interval, a band between discrete lines
// (between lines, a set between its extremes or its central share), or a set's lines, with E/N as numbers.
import { centralBand, linesRange, normalizedLinesRange, normalizedRange, type AxionConstants } from "../physics/index";
import type { Model } from "../project/types";
import { eOverNValue } from "./physics-settings";

export type ModelShape =
  | { kind: "line"; value: number }
  | { kind: "interval"; lo: number; hi: number }
  /** The band between the lines of `values` (each widened outward by the spread). */
  | { kind: "lines-band"; values: number[] }
  /** Each value drawn as its own line (a model set drawn as lines). */
  | { kind: "lines"; values: number[] };

type ShapeInput = Pick<Model, "eOverNMin" | "eOverNMax"> &
  Partial<Pick<Model, "kind" | "members" | "setDraw" | "setShare">>;

function memberValues(m: ShapeInput): number[] | null {
  const values = (m.members ?? []).map((x) => eOverNValue(x.eOverN));
  return values.length > 0 && values.every(Number.isFinite) ? values : null;
}

/**
 * The shape of a model; null when its E/N does not read as numbers. A model without a kind (older in-memory
 * state) is a line when both ends are equal and an interval otherwise; "between" or "set" without members
 * falls back to that as well.
 */
export function modelShape(m: ShapeInput, c: AxionConstants): ModelShape | null {
  if (m.kind === "between" || m.kind === "set") {
    const values = memberValues(m);
    if (values) {
      if (m.kind === "between" || m.setDraw === "extremes" || m.setDraw === undefined)
        return { kind: "lines-band", values };
      if (m.setDraw === "lines") return { kind: "lines", values };
      const members = (m.members ?? []).map((x, i) => ({ eOverN: values[i], count: x.count }));
      const band = centralBand(members, m.setShare ?? 0.68, { constants: c });
      return band ? { kind: "lines-band", values: band.values } : null;
    }
  }
  const a0 = eOverNValue(m.eOverNMin);
  const b0 = eOverNValue(m.eOverNMax ?? m.eOverNMin);
  if (!Number.isFinite(a0) || !Number.isFinite(b0)) return null;
  const [lo, hi] = a0 <= b0 ? [a0, b0] : [b0, a0];
  return m.kind === "line" || lo === hi ? { kind: "line", value: lo } : { kind: "interval", lo, hi };
}

/** |E/N − c_γ| range [min, max] of a shape with k σ spread in c_γ (for "lines": over all its lines). */
export function shapeNormalizedRange(s: ModelShape, c: AxionConstants, sigmas: number): [number, number] {
  if (s.kind === "line") return normalizedLinesRange([s.value], c, sigmas);
  if (s.kind === "interval") return normalizedRange(s.lo, s.hi, c, sigmas);
  return normalizedLinesRange(s.values, c, sigmas);
}

/** Whether the shape reaches g = 0 at the central c_γ (a line at c_γ, an interval holding it). */
export function shapeCancels(s: ModelShape, c: AxionConstants): boolean {
  if (s.kind === "interval") return normalizedRange(s.lo, s.hi, c, 0)[0] === 0;
  const values = s.kind === "line" ? [s.value] : s.values;
  return linesRange(values, c.cGamma, c.cGamma)[0] === 0;
}
