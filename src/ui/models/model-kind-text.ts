// E/N of a model as the E/N fields show and read it, per kind: "8/3" (line), "5/3..44/3" (interval),
// "5/3 | 44/3" (between lines), and the model fields a parsed entry stands for.
import type { EOverNParse } from "../../physics/eovern-parse";
import type { Model } from "../../project/types";

/** The hint under the E/N fields: the three typed forms and what each draws. */
export const EOVERN_HINT =
  "8/3: one line · 5/3..44/3: every E/N in the interval (reaches g = 0 where it holds c_γ) · 5/3 | 44/3 (or 5/3 | 2 | 44/3): the region between those lines";

/** E/N of a model as text: "8/3" for a line, "5/3..44/3" for an interval, "5/3 | 44/3" between lines. */
export function eOverNText(
  m: Pick<Model, "eOverNMin" | "eOverNMax"> & Partial<Pick<Model, "kind" | "members">>,
): string {
  if ((m.kind === "between" || m.kind === "set") && m.members && m.members.length > 0)
    return m.members.map((x) => x.eOverN).join(" | ");
  return m.eOverNMin === m.eOverNMax ? m.eOverNMin : `${m.eOverNMin}..${m.eOverNMax}`;
}

/** The kind, E/N range and members a parsed E/N entry gives a model. */
export function kindFieldsOf(
  r: Extract<EOverNParse, { ok: true }>,
): Pick<Model, "kind" | "eOverNMin" | "eOverNMax" | "members"> {
  if (r.lines)
    return {
      kind: "between",
      eOverNMin: r.min,
      eOverNMax: r.max,
      members: r.lines.map((e) => ({ eOverN: e, count: 1 })),
    };
  return { kind: r.isBand ? "interval" : "line", eOverNMin: r.min, eOverNMax: r.max, members: [] };
}
