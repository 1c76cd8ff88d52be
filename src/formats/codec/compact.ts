// Compact form of link formats: a table of fields per object (long name, short key, base value left out) and
// the generic encode/decode through such tables; each link version defines its own frozen tables.
import { isPlainObject, projectsEqual } from "../../project/json";
import { PROJECT_LIMITS } from "../../project/limits";
import { goesTo, type Persistence, type PersistTarget } from "../../project/state-table";
import type { Project } from "../../project/types";

export type Rec = Record<string, unknown>;

export interface Field {
  full: string;
  short: string;
  /** Value omitted from the link; computed from the item (encoding) or the fields decoded so far (decoding). */
  base?: (item: Rec, index: number) => unknown;
  /** Nested object with its own keys. */
  sub?: Codec;
  /** Custom link form of the value (and its inverse, which throws ShapeError on malformed input). */
  enc?: (v: unknown) => unknown;
  dec?: (v: unknown) => unknown;
}
export interface Codec {
  fields: Field[];
  table: { readonly [key: string]: Persistence };
}

/** One compact layout: a project as its compact object (writing), and a compact object as a project object of the
 * schema version the layout belongs to (reading; throws ShapeError on a malformed object). */
export interface CompactLayout {
  toCompact(project: Project, includeCurves: boolean): Rec;
  fromCompact(compact: unknown): { project: Rec; omitted: number };
}

export const always = { link: "always", file: true, storage: "meta" } as const satisfies Persistence;

/** Thrown inside decoding for a compact object of the wrong shape; turned into a message by decodeLink. */
export class ShapeError extends Error {}

/** Thrown inside decoding for more models or curves than a project may hold, before they are expanded. */
export class TooMany extends Error {
  constructor(
    readonly count: number,
    readonly what: "models" | "curves",
  ) {
    super(`${count} ${what}`);
  }
}

/** The list under `key` of a compact object (absent: empty), refused when it is not a list or is too long. */
export function listOf(compact: Rec, key: string, what: "models" | "curves"): unknown[] {
  const v = Object.hasOwn(compact, key) ? compact[key] : [];
  if (!Array.isArray(v)) throw new ShapeError(`the ${what} are not a list`);
  if (v.length > PROJECT_LIMITS[what]) throw new TooMany(v.length, what);
  return v;
}

export function encodeWith(codec: Codec, item: Rec, index: number, target: PersistTarget): Rec {
  const out: Rec = {};
  for (const f of codec.fields) {
    const rule = codec.table[f.full];
    if (rule && !goesTo(rule, target)) continue;
    const v = item[f.full];
    if (f.sub) {
      const enc = encodeWith(f.sub, isPlainObject(v) ? v : {}, index, target);
      if (Object.keys(enc).length > 0) out[f.short] = enc;
      continue;
    }
    if (f.base && projectsEqual(v, f.base(item, index))) continue;
    out[f.short] = f.enc ? f.enc(v) : v;
  }
  return out;
}

export function decodeWith(codec: Codec, compact: unknown, index: number, what: string): Rec {
  if (compact !== undefined && !isPlainObject(compact)) throw new ShapeError(`${what} is not an object`);
  const c = compact ?? {};
  const out: Rec = {};
  for (const f of codec.fields) {
    const has = Object.hasOwn(c, f.short);
    if (f.sub) {
      out[f.full] = decodeWith(f.sub, has ? c[f.short] : undefined, index, `${what} ${f.full}`);
    } else if (has) {
      out[f.full] = f.dec ? f.dec(c[f.short]) : c[f.short];
    } else if (f.base) {
      // Bases are fresh values per call (arrays, objects), so decoded projects never share them.
      out[f.full] = f.base(out, index);
    }
  }
  return out;
}
