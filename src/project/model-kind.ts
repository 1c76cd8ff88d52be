// The four kinds of model (line, interval, between lines, model set) and the rules that keep a model's kind,
// E/N range and members consistent; shared by the defaults, the v1 → v2 migration and the restore step.
import { rationalValue } from "./rational-text";
import type { ModelKind, ModelMember } from "./types";

/** The kind a model of format v1 had: one E/N when both ends have the same value, else every E/N in between. */
export function kindOfRange(eOverNMin: string, eOverNMax: string): "line" | "interval" {
  return rationalValue(eOverNMin) === rationalValue(eOverNMax) ? "line" : "interval";
}

/**
 * Members sorted by value, members of equal value merged into one (counts added; the domain-wall number kept
 * only when they agree). Members whose E/N is not a number are left out.
 */
function normaliseMembers(members: readonly ModelMember[]): ModelMember[] {
  const withValue = members
    .map((m) => ({ m, v: rationalValue(m.eOverN) }))
    .filter((x) => !Number.isNaN(x.v))
    .sort((a, b) => a.v - b.v);
  const out: ModelMember[] = [];
  let lastValue = Number.NaN;
  for (const { m, v } of withValue) {
    const prev = out.at(-1);
    if (prev && v === lastValue) {
      prev.count += m.count;
      if (prev.nDW !== m.nDW) delete prev.nDW;
      continue;
    }
    out.push(m.nDW === undefined ? { eOverN: m.eOverN, count: m.count } : { ...m });
    lastValue = v;
  }
  return out;
}

/** What {@link settleModelKind} makes of a model's kind fields. */
type SettledKind =
  | { ok: true; kind: ModelKind; eOverNMin: string; eOverNMax: string; members: ModelMember[]; notes: string[] }
  | { ok: false; error: string };

/**
 * A consistent kind, E/N range and member list from what a file, link or caller gave. Rules: a missing kind is
 * "set" when there are members, else line or interval by the ends (as in format v1); "between" and "set" take
 * their range from their members ("between" counts each value once); "line" and "interval" carry no members;
 * a line has max = min; reversed ends are swapped. Each change a reader should hear of is a note.
 */
export function settleModelKind(input: {
  kind?: ModelKind;
  eOverNMin?: string;
  eOverNMax?: string;
  members?: readonly ModelMember[];
}): SettledKind {
  const notes: string[] = [];
  let members = normaliseMembers(input.members ?? []);
  if (input.members && members.length < input.members.length && input.kind !== "line" && input.kind !== "interval")
    notes.push("members of equal E/N were merged");
  let kind = input.kind ?? (members.length > 0 ? "set" : undefined);
  if ((kind === "between" || kind === "set") && members.length === 0) {
    if (input.eOverNMin === undefined) return { ok: false, error: "E/N is missing (no value and no members)" };
    notes.push(`kind "${kind}" has no members; drawn as a line or interval of its E/N range`);
    kind = undefined;
  }
  if (kind === "between" || kind === "set") {
    if (kind === "between") members = members.map((m) => ({ ...m, count: 1 }));
    const lo = members[0].eOverN;
    const hi = members[members.length - 1].eOverN;
    const given = [input.eOverNMin, input.eOverNMax ?? input.eOverNMin];
    if (
      given[0] !== undefined &&
      (rationalValue(given[0]) !== rationalValue(lo) || rationalValue(given[1] ?? "") !== rationalValue(hi))
    )
      notes.push(`the E/N range was set from the members (${lo} to ${hi})`);
    return { ok: true, kind, eOverNMin: lo, eOverNMax: hi, members, notes };
  }
  if (input.eOverNMin === undefined) return { ok: false, error: "E/N is missing" };
  if (members.length > 0) notes.push(`a ${kind ?? "line or interval"} has no members; they were dropped`);
  let [min, max] = [input.eOverNMin, input.eOverNMax ?? input.eOverNMin];
  if (rationalValue(max) < rationalValue(min)) {
    notes.push("the ends were swapped");
    [min, max] = [max, min];
  }
  const settled = kind ?? kindOfRange(min, max);
  if (settled === "line" && rationalValue(max) !== rationalValue(min)) {
    notes.push(`a line has one E/N; ${max} was dropped`);
    max = min;
  }
  return { ok: true, kind: settled, eOverNMin: min, eOverNMax: max, members: [], notes };
}
