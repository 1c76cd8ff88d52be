// Link format v2's compact object (frozen): v1's, with four more model keys for the model kinds of schema
// version 2 (line, interval, between lines, model set); v1 links read through the v1 → v2 migration instead.
import { ShapeError, type Codec, type CompactLayout, type Rec } from "./compact";
import { CODECS_V1, layoutWith } from "./v1";

// Link format v2 (frozen): as v1 (./v1.ts), and each model adds
//   "t" kind (base: "line" when min and max E/N are the same text, else "interval", which is what v1 drew),
//   "e" members as [E/N, count] or [E/N, count, N_DW] lists (base: none),
//   "d" set drawing (base "extremes"), "h" set share (base 0.68).

const str = (x: unknown) => (typeof x === "string" ? x : "");

/** Members as short lists; anything but a list passes to the schema, which reports it. */
function encodeMembers(v: unknown): unknown {
  if (!Array.isArray(v)) return v;
  return v.map((m: Rec) => (m.nDW === undefined ? [m.eOverN, m.count] : [m.eOverN, m.count, m.nDW]));
}

function decodeMembers(v: unknown): unknown {
  if (!Array.isArray(v)) throw new ShapeError("the members of a model are not a list");
  return v.map((m) => {
    if (!Array.isArray(m) || m.length < 2 || m.length > 3) throw new ShapeError("a model member is not [E/N, count]");
    return m.length === 3 ? { eOverN: m[0], count: m[1], nDW: m[2] } : { eOverN: m[0], count: m[1] };
  });
}

const MODEL_V2: Codec = {
  table: CODECS_V1.model.table,
  fields: [
    ...CODECS_V1.model.fields,
    { full: "kind", short: "t", base: (m) => (str(m.eOverNMin) === str(m.eOverNMax) ? "line" : "interval") },
    { full: "members", short: "e", base: () => [], enc: encodeMembers, dec: decodeMembers },
    { full: "setDraw", short: "d", base: () => "extremes" },
    { full: "setShare", short: "h", base: () => 0.68 },
  ],
};

/** The v2 compact layout. */
export const COMPACT_V2: CompactLayout = layoutWith({ ...CODECS_V1, model: MODEL_V2 }, 2);
