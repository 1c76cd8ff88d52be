// Share links: the project in the URL fragment as "v1." + base64url(deflate-raw(JSON of a compact form)).
// Decoding never throws: it caps the unpacked size, validates through the shared restore step and explains failures.
//
// Link format v1 (frozen; a later format gets a new prefix, and v1 links keep decoding with this code):
//   fragment = "v1." + base64url without padding (RFC 4648 §5) of raw DEFLATE (RFC 1951, written by fflate at
//              level 9 for link-sized payloads, lower for large ones; any level reads the same) of the UTF-8
//              JSON of the compact object below.
//   compact  = { n: name, p: physics, f: figure, m: [model…], c: [curve…], o: number of curves left out }
//   Every object uses the one- or two-letter keys of the tables below; a key is omitted when its value equals
//   the v1 base value (frozen here, independent of today's defaults): name "Untitled", the 2019 constants,
//   the default figure, a model's auto label "E/N = a" / "E/N = a..b", max E/N = min E/N, the i-th colour of
//   the v1 palettes, and so on.
//   Curve data (massEv, gInvGeV): either a JSON number array, or, when every value has at most 15 significant
//   digits (data typed or digitised with few digits), the "decimal delta" form { e: [...], d: [...] } where
//   value i = M_i × 10^(E_i) with M_i = d_0 + … + d_i and E_i = e_0 + … + e_i (all M_i with the same number of
//   digits, so sorted data give small steps that compress about twice as well as the plain numbers). Both forms
//   are exact: the digits are those of JavaScript's shortest round-trip decimal, and every value is checked
//   to read back to the same double before the form is used. (The encoder writes the JSON bytes directly and
//   finds the digits by exact scaling, with toExponential only as a fallback; the text is the same as the first
//   string-based encoder's, which tests/formats/link-large.test.ts keeps as its reference.)
//   Without curves ("c" absent), a link carries name, constants, figure and models only; "o" says how many
//   curves the sender had.
//
// Link format v2 (frozen): v1 plus four model keys: "t" kind (base: "line" when min and max E/N are the same
// text, else "interval"), "e" members as [E/N, count] or [E/N, count, N_DW] lists (base: none), "d" set
// drawing (base "extremes"), "h" set share (base 0.68). Everything else as in v1; v1 links decode through the
// v1 → v2 migration.
import { Deflate, Inflate, deflateSync, inflateSync } from "fflate";
import { parseJsonSafely, projectsEqual, restoreProject } from "../project/schema";
import {
  CURVE_STATE,
  FIGURE_STATE,
  MODEL_STATE,
  PHYSICS_STATE,
  PROJECT_STATE,
  goesTo,
  type Persistence,
  type PersistTarget,
} from "../project/state-table";
import type { Project } from "../project/types";
import { PROJECT_VERSION } from "../project/types";

/** Longest fragment {@link encodeLinkAuto} produces with curves: links of this size survive chat and e-mail. */
export const LINK_MAX_CHARS = 8000;
/** Most bytes a link may unpack to; anything larger is refused before it is fully unpacked (50 MB). */
export const LINK_MAX_DECODED_BYTES = 50 * 1024 * 1024;
/** Link format this build writes ("v1." prefix). Equal to the project schema version. */
export const LINK_FORMAT_VERSION: number = PROJECT_VERSION;

// ----------------------------------------------------------------------------------------------------- base64url

const B64 = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_";
const B64_INDEX = (() => {
  const t = new Int16Array(128).fill(-1);
  for (let i = 0; i < 64; i++) t[B64.charCodeAt(i)] = i;
  // Standard base64 letters too, in case a tool rewrote the link.
  t["+".charCodeAt(0)] = 62;
  t["/".charCodeAt(0)] = 63;
  return t;
})();

const B64_CODES = Uint8Array.from(B64, (c) => c.charCodeAt(0));
const ASCII = new TextDecoder();

/** base64url without padding (RFC 4648 §5). Written as ASCII bytes and turned into a string once. */
export function base64UrlEncode(bytes: Uint8Array): string {
  const n = bytes.length;
  const full = n - (n % 3);
  const out = new Uint8Array(Math.ceil((n * 4) / 3));
  let o = 0;
  for (let i = 0; i < full; i += 3) {
    const v = (bytes[i] << 16) | (bytes[i + 1] << 8) | bytes[i + 2];
    out[o] = B64_CODES[v >> 18];
    out[o + 1] = B64_CODES[(v >> 12) & 63];
    out[o + 2] = B64_CODES[(v >> 6) & 63];
    out[o + 3] = B64_CODES[v & 63];
    o += 4;
  }
  if (n - full === 1) {
    const v = bytes[full] << 16;
    out[o++] = B64_CODES[v >> 18];
    out[o++] = B64_CODES[(v >> 12) & 63];
  } else if (n - full === 2) {
    const v = (bytes[full] << 16) | (bytes[full + 1] << 8);
    out[o++] = B64_CODES[v >> 18];
    out[o++] = B64_CODES[(v >> 12) & 63];
    out[o++] = B64_CODES[(v >> 6) & 63];
  }
  return ASCII.decode(out.subarray(0, o));
}

/** Length of the base64url text (no padding) of `n` bytes. */
function base64Length(n: number): number {
  return Math.ceil((n * 4) / 3);
}

/** Bytes of a base64url (or base64) string without padding; null when a character or the length is invalid. */
export function base64UrlDecode(text: string): Uint8Array | null {
  let n = text.length;
  while (n > 0 && text.charCodeAt(n - 1) === 61) n--;
  if (n % 4 === 1) return null;
  const out = new Uint8Array(Math.floor((n * 3) / 4));
  const idx = B64_INDEX;
  const full = n - (n % 4);
  let o = 0;
  for (let i = 0; i < full; i += 4) {
    const c0 = text.charCodeAt(i);
    const c1 = text.charCodeAt(i + 1);
    const c2 = text.charCodeAt(i + 2);
    const c3 = text.charCodeAt(i + 3);
    if ((c0 | c1 | c2 | c3) > 127) return null;
    const a = idx[c0];
    const b = idx[c1];
    const c = idx[c2];
    const d = idx[c3];
    if ((a | b | c | d) < 0) return null;
    const v = (a << 18) | (b << 12) | (c << 6) | d;
    out[o] = v >> 16;
    out[o + 1] = (v >> 8) & 255;
    out[o + 2] = v & 255;
    o += 3;
  }
  const left = n - full;
  if (left > 0) {
    let v = 0;
    for (let j = 0; j < 4; j++) {
      let x = 0;
      if (j < left) {
        const code = text.charCodeAt(full + j);
        x = code < 128 ? idx[code] : -1;
        if (x < 0) return null;
      }
      v = (v << 6) | x;
    }
    out[o] = (v >> 16) & 255;
    if (left > 2) out[o + 1] = (v >> 8) & 255;
  }
  return out;
}

// -------------------------------------------------------------------------------------------------- compact form

type Rec = Record<string, unknown>;

interface Field {
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
interface Codec {
  fields: Field[];
  table: { readonly [key: string]: Persistence };
}

// Frozen v1 base values: copies of the defaults when format v1 was defined. Never edit; a new format gets new ones.
const V1_MODEL_COLOURS = ["#117A8B", "#1F4E8C", "#2A9D8F", "#4062BB", "#0B5563", "#5B8DB8"];
const V1_CURVE_COLOURS = ["#D55E00", "#CC79A7", "#E69F00", "#009E73", "#000000", "#56B4E9", "#0072B2", "#F0E442"];
const V1_RHO = 0.45;

const str = (x: unknown) => (typeof x === "string" ? x : "");
const always = { link: "always", file: true, storage: "meta" } as const satisfies Persistence;

/** Thrown inside decoding for a compact object of the wrong shape; turned into a message by decodeLink. */
class ShapeError extends Error {}

// Largest digit count whose integers stay exact in a double (10¹⁵ < 2⁵³ ≈ 9.007·10¹⁵).
const MAX_DELTA_DIGITS = 15;
// 10⁰ … 10²², each exact as a double (5²² < 2⁵³), parsed rather than computed so that no pow() rounding creeps in.
const POW10: readonly number[] = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));
const MAX_EXACT_POW = 22;

/**
 * Curve data on their way into the compact object: the JSON writer turns them straight into bytes (decimal
 * delta form or number list), so millions of values never become intermediate JS arrays or strings.
 */
class NumberColumn {
  constructor(readonly values: Float64Array) {}
}

function encodeNumbers(v: unknown): unknown {
  return new NumberColumn(v instanceof Float64Array ? v : Float64Array.from(v as ArrayLike<number>));
}

/**
 * round(|x| · 10^s) for |s| ≤ 22, NaN otherwise. When |x| has at most 15 significant digits and s puts them
 * left of the point, the one rounding of the product or quotient is too small to move the result off the
 * integer (relative error ≤ 2⁻⁵² on integers below 10¹⁵, i.e. < 0.25).
 */
function scaledRound(ax: number, s: number): number {
  if (s >= 0) return s <= MAX_EXACT_POW ? Math.round(ax * POW10[s]) : NaN;
  return s >= -MAX_EXACT_POW ? Math.round(ax / POW10[-s]) : NaN;
}

/**
 * The decimal delta form's integers of a column: value i = m[i] × 10^ex[i] with every m[i] of the same digit
 * count W (the largest shortest-round-trip digit count of the column, padded with zeros), or null when a
 * value needs more than 15 digits or is not finite. The result is exactly that of the first (string-based)
 * v1 encoder: for W ≤ 15 only one W-digit decimal reads back to a given double (their spacing, ≥ 10⁻¹⁵
 * relative, is wider than a double's rounding interval, ≤ 2⁻⁵² relative), so whichever way it is found it
 * is the same. Most values take the fast path: scale by an exact power of ten, round, and check the way back
 * with one exactly rounded operation (an exact integer below 2⁵³ times or over an exact power of ten is
 * correctly rounded, as a decimal-to-double parse is: Clinger, "How to read floating point numbers
 * accurately", PLDI 1990). The rest go through toExponential(), the shortest round-trip digits.
 */
function deltaForm(a: Float64Array): { m: Float64Array; ex: Int32Array } | null {
  const n = a.length;
  const m = new Float64Array(n);
  const ex = new Int32Array(n);
  let w = 0;
  for (let i = 0; i < n; i++) {
    const x = a[i];
    if (w > 0) {
      if (x === 0) {
        m[i] = 0;
        ex[i] = 1 - w;
        continue;
      }
      const ax = x < 0 ? -x : x;
      let s = w - 1 - Math.floor(Math.log10(ax));
      let mm = scaledRound(ax, s);
      // log10 may land one decade off next to a power of ten: move s by one so that mm has w digits.
      if (mm >= POW10[w]) mm = scaledRound(ax, --s);
      else if (mm < POW10[w - 1]) mm = scaledRound(ax, ++s);
      if (mm >= POW10[w - 1] && mm < POW10[w] && (s >= 0 ? mm / POW10[s] : mm * POW10[-s]) === ax) {
        m[i] = x < 0 ? -mm : mm;
        ex[i] = -s;
        continue;
      }
    }
    // Slow path: the shortest digits of x from toExponential() ("-1.2345e-7"); non-finite values have no "e".
    const t = x.toExponential();
    const eAt = t.indexOf("e");
    if (eAt < 0) return null;
    const neg = t.charCodeAt(0) === 45;
    const dot = t.indexOf(".");
    const digits = dot < 0 ? t.slice(neg ? 1 : 0, eAt) : t.slice(neg ? 1 : 0, dot) + t.slice(dot + 1, eAt);
    const k = digits.length;
    if (k > MAX_DELTA_DIGITS) return null;
    if (k > w) {
      // A wider value: pad everything written so far to the new width (exact: integers stay below 10¹⁵).
      const up = POW10[k - w];
      for (let j = 0; j < i; j++) {
        m[j] *= up;
        ex[j] -= k - w;
      }
      w = k;
    }
    const mm = Number(digits) * POW10[w - k];
    const e = Number(t.slice(eAt + 1)) - (w - 1);
    const signed = neg ? -mm : mm;
    if (Number(`${signed}e${e}`) !== x) return null;
    m[i] = signed;
    ex[i] = e;
  }
  return { m, ex };
}

/** m × 10^e as the double nearest to it: one exactly rounded operation when 10^|e| is exact, else a parse. */
function fromDecimal(m: number, e: number): number {
  if (e >= 0 && e <= MAX_EXACT_POW) return m * POW10[e];
  if (e < 0 && e >= -MAX_EXACT_POW) return m / POW10[-e];
  return Number(`${m}e${e}`);
}

/** Inverse of {@link encodeNumbers}; a number array passes through (the schema checks its values). */
function decodeNumbers(v: unknown): unknown {
  if (Array.isArray(v)) return v;
  if (!isRec(v) || !Array.isArray(v.e) || !Array.isArray(v.d) || v.e.length !== v.d.length) {
    throw new ShapeError("curve data are neither a list of numbers nor a decimal delta list");
  }
  const e = v.e as unknown[];
  const d = v.d as unknown[];
  const out = new Float64Array(e.length);
  let m = 0;
  let ex = 0;
  for (let i = 0; i < e.length; i++) {
    const de = e[i];
    const dd = d[i];
    if (!Number.isSafeInteger(de) || !Number.isSafeInteger(dd))
      throw new ShapeError("curve data contain a step that is not an integer");
    m += dd as number;
    ex += de as number;
    if (!Number.isSafeInteger(m) || Math.abs(ex) > 400) throw new ShapeError("curve data contain a value out of range");
    out[i] = fromDecimal(m, ex);
  }
  return out;
}

const PHYSICS_V1: Codec = {
  table: PHYSICS_STATE,
  fields: [
    { full: "ref", short: "r", base: () => "2019" },
    {
      full: "custom",
      short: "c",
      sub: {
        table: { cGamma: always, cGammaSigma: always, kMuEv: always, kMuEvSigma: always, label: always },
        fields: [
          { full: "cGamma", short: "g", base: () => 1.92 },
          { full: "cGammaSigma", short: "s", base: () => 0.04 },
          { full: "kMuEv", short: "k", base: () => 5.691 },
          { full: "kMuEvSigma", short: "e", base: () => 0.051 },
          { full: "label", short: "l", base: () => "custom" },
        ],
      },
    },
  ],
};

const FIGURE_V1: Codec = {
  table: FIGURE_STATE,
  fields: [
    { full: "preset", short: "p", base: () => "slide" },
    { full: "customWidthMm", short: "w", base: () => 160 },
    { full: "customHeightMm", short: "h", base: () => 90 },
    { full: "massRangeEv", short: "x", base: () => [1e-7, 1e-2] },
    { full: "yView", short: "v", base: () => "coupling" },
    {
      full: "yRange",
      short: "y",
      base: (f) => (f.yView === "normalized" ? [1e-2, 1e2] : f.yView === "g-gamma" ? [5e-3, 50] : [1e-17, 1e-9]),
    },
    { full: "topAxis", short: "t", base: () => "fa" },
    { full: "grid", short: "g", base: () => true },
    { full: "legend", short: "l", base: () => "bottom-right" },
    { full: "fontPt", short: "s", base: () => 12 },
    { full: "title", short: "n", base: () => "" },
  ],
};

const MODEL_V1: Codec = {
  table: MODEL_STATE,
  fields: [
    { full: "id", short: "i" },
    { full: "eOverNMin", short: "a" },
    { full: "eOverNMax", short: "b", base: (m) => m.eOverNMin },
    {
      full: "label",
      short: "l",
      base: (m) =>
        str(m.eOverNMin) === str(m.eOverNMax)
          ? `E/N = ${str(m.eOverNMin)}`
          : `E/N = ${str(m.eOverNMin)}..${str(m.eOverNMax)}`,
    },
    { full: "source", short: "s", base: () => ({ kind: "typed" }) },
    { full: "colour", short: "c", base: (_m, i) => V1_MODEL_COLOURS[i % V1_MODEL_COLOURS.length] },
    { full: "lineStyle", short: "y", base: () => "solid" },
    { full: "fillOpacity", short: "o", base: () => 0.25 },
    { full: "visible", short: "v", base: () => true },
    { full: "sigmas", short: "k", base: () => 0 },
  ],
};

/** Members as short lists ([E/N, count] or [E/N, count, N_DW]); anything else passes to the schema, which reports it. */
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
  table: MODEL_STATE,
  fields: [
    ...MODEL_V1.fields,
    { full: "kind", short: "t", base: (m) => (str(m.eOverNMin) === str(m.eOverNMax) ? "line" : "interval") },
    { full: "members", short: "e", base: () => [], enc: encodeMembers, dec: decodeMembers },
    { full: "setDraw", short: "d", base: () => "extremes" },
    { full: "setShare", short: "h", base: () => 0.68 },
  ],
};

const CURVE_V1: Codec = {
  table: CURVE_STATE,
  fields: [
    { full: "id", short: "i" },
    { full: "label", short: "l", base: () => "Curve" },
    { full: "role", short: "r", base: () => "exclusion" },
    { full: "massEv", short: "m", enc: encodeNumbers, dec: decodeNumbers },
    { full: "gInvGeV", short: "g", enc: encodeNumbers, dec: decodeNumbers },
    { full: "keepOrder", short: "k", base: () => false },
    { full: "colour", short: "c", base: (_c, i) => V1_CURVE_COLOURS[i % V1_CURVE_COLOURS.length] },
    { full: "lineStyle", short: "y", base: (c) => (c.role === "projection" ? "dashed" : "solid") },
    { full: "fillOpacity", short: "o", base: () => 0.3 },
    { full: "visible", short: "v", base: () => true },
    {
      full: "rescale",
      short: "s",
      sub: {
        table: { rhoAssumed: always, rhoShown: always, fraction: always },
        fields: [
          { full: "rhoAssumed", short: "a", base: () => V1_RHO },
          { full: "rhoShown", short: "s", base: () => V1_RHO },
          { full: "fraction", short: "f", base: () => 1 },
        ],
      },
    },
    { full: "citation", short: "t", base: () => "" },
    { full: "fileName", short: "f", base: () => "" },
  ],
};

function isRec(x: unknown): x is Rec {
  return typeof x === "object" && x !== null && !Array.isArray(x);
}

function encodeWith(codec: Codec, item: Rec, index: number, target: PersistTarget): Rec {
  const out: Rec = {};
  for (const f of codec.fields) {
    const rule = codec.table[f.full];
    if (rule && !goesTo(rule, target)) continue;
    const v = item[f.full];
    if (f.sub) {
      const enc = encodeWith(f.sub, isRec(v) ? v : {}, index, target);
      if (Object.keys(enc).length > 0) out[f.short] = enc;
      continue;
    }
    if (f.base && projectsEqual(v, f.base(item, index))) continue;
    out[f.short] = f.enc ? f.enc(v) : v;
  }
  return out;
}

function decodeWith(codec: Codec, compact: unknown, index: number, what: string): Rec {
  if (compact !== undefined && !isRec(compact)) throw new ShapeError(`${what} is not an object`);
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

function toCompact(project: Project, includeCurves: boolean): Rec {
  const target: PersistTarget = { kind: "link", includeCurves };
  const out: Rec = {};
  if (goesTo(PROJECT_STATE.name, target) && project.name !== "Untitled") out.n = project.name;
  if (goesTo(PROJECT_STATE.physics, target)) {
    const p = encodeWith(PHYSICS_V1, project.physics as unknown as Rec, 0, target);
    if (Object.keys(p).length > 0) out.p = p;
  }
  if (goesTo(PROJECT_STATE.figure, target)) {
    const f = encodeWith(FIGURE_V1, project.figure as unknown as Rec, 0, target);
    if (Object.keys(f).length > 0) out.f = f;
  }
  if (goesTo(PROJECT_STATE.models, target) && project.models.length > 0) {
    out.m = project.models.map((m, i) => encodeWith(MODEL_V2, m as unknown as Rec, i, target));
  }
  if (goesTo(PROJECT_STATE.curves, target)) {
    if (project.curves.length > 0)
      out.c = project.curves.map((c, i) => encodeWith(CURVE_V1, c as unknown as Rec, i, target));
  } else if (project.curves.length > 0) {
    out.o = project.curves.length;
  }
  return out;
}

function fromCompact(compact: unknown, version: 1 | 2): { project: Rec; omitted: number } {
  if (!isRec(compact)) throw new ShapeError("the content is not an object");
  const list = (key: string, what: string): unknown[] => {
    const v = Object.hasOwn(compact, key) ? compact[key] : [];
    if (!Array.isArray(v)) throw new ShapeError(`the ${what} are not a list`);
    return v;
  };
  const models = list("m", "models");
  const curves = list("c", "curves");
  const omitted = Object.hasOwn(compact, "o") ? compact.o : 0;
  const modelCodec = version === 1 ? MODEL_V1 : MODEL_V2;
  return {
    project: {
      version,
      name: Object.hasOwn(compact, "n") ? compact.n : "Untitled",
      physics: decodeWith(PHYSICS_V1, compact.p, 0, "the constants"),
      figure: decodeWith(FIGURE_V1, compact.f, 0, "the figure"),
      models: models.map((m, i) => decodeWith(modelCodec, m, i, `model ${i + 1}`)),
      curves: curves.map((c, i) => decodeWith(CURVE_V1, c, i, `curve ${i + 1}`)),
    },
    omitted: typeof omitted === "number" && Number.isInteger(omitted) && omitted >= 0 ? omitted : 0,
  };
}

/** Decoders of every link format ever written, by version: compact JSON → project object of that schema version. */
const LINK_DECODERS: Readonly<Record<number, (compact: unknown) => { project: Rec; omitted: number }>> = {
  1: (c) => fromCompact(c, 1),
  2: (c) => fromCompact(c, 2),
};

// ------------------------------------------------------------------------------------------------------ encoding

// The compact JSON goes out in chunks of about this size (the deflater takes them as they come).
const CHUNK_BYTES = 1 << 20;
// DEFLATE level by payload size, counted in curve values (known before anything is written, so the choice is
// the same wherever the project is encoded): level 9, packed in one go, up to 131,072 values (about 1 MB of
// JSON for data of 7 digits), which covers every link-sized payload; streamed at level 6 up to 524,288 values;
// streamed at level 1 above, where fflate's higher levels would spend seconds per million points for a few per
// cent of size (measured on 2·10⁶ invented 7-digit points: 28 MB of JSON packs to 6.7 MB at level 1 in ~1 s,
// to 6.2 MB at level 6 in ~5 s).
const LEVEL9_MAX_VALUES = 1 << 17;
const LEVEL6_MAX_VALUES = 1 << 19;

/** DEFLATE level for a link carrying `values` curve numbers (see above). */
function levelFor(values: number): 9 | 6 | 1 {
  return values <= LEVEL9_MAX_VALUES ? 9 : values <= LEVEL6_MAX_VALUES ? 6 : 1;
}

/** Thrown while packing once the link is certain to exceed the caller's length limit. */
class OverLimit extends Error {}

/**
 * Packs the compact JSON as it is written: at level 9 it is held and packed in one go at the end; at lower
 * levels (large payloads) it streams through the deflater, and with a byte limit packing stops as soon as
 * the packed output passes it, so a project far too large costs about the limit's worth of work.
 */
class Packer {
  private raw: Uint8Array[] = [];
  private rawBytes = 0;
  private out: Uint8Array[] = [];
  private outBytes = 0;
  private readonly deflater: Deflate | undefined;

  constructor(
    private readonly level: 9 | 6 | 1,
    private readonly maxOutBytes: number,
  ) {
    if (level !== 9) {
      this.deflater = new Deflate({ level }, (data) => {
        this.out.push(data);
        this.outBytes += data.length;
      });
    }
  }

  push(chunk: Uint8Array): void {
    if (this.deflater) {
      this.deflater.push(chunk);
      if (this.outBytes > this.maxOutBytes) throw new OverLimit();
      return;
    }
    this.raw.push(chunk);
    this.rawBytes += chunk.length;
  }

  finish(): Uint8Array {
    if (this.deflater) this.deflater.push(new Uint8Array(0), true);
    const packed = this.deflater
      ? concatBytes(this.out, this.outBytes)
      : deflateSync(concatBytes(this.raw, this.rawBytes), { level: this.level });
    if (packed.length > this.maxOutBytes) throw new OverLimit();
    return packed;
  }
}

function concatBytes(parts: readonly Uint8Array[], total: number): Uint8Array {
  if (parts.length === 1 && parts[0].length === total) return parts[0];
  const all = new Uint8Array(total);
  let o = 0;
  for (const p of parts) {
    all.set(p, o);
    o += p.length;
  }
  return all;
}

const UTF8 = new TextEncoder();

function isPlainObject(v: unknown): v is Rec {
  if (typeof v !== "object" || v === null) return false;
  const proto = Object.getPrototypeOf(v) as unknown;
  return proto === Object.prototype || proto === null;
}

/**
 * Writes the compact object as UTF-8 JSON, byte for byte what JSON.stringify gives for it (with each
 * NumberColumn in its link form), in chunks handed to `emit`. Numbers of curve data are written as ASCII
 * digits straight into the buffer: no string per value, no array of millions of numbers.
 */
class JsonWriter {
  private buf = new Uint8Array(64 * 1024);
  private pos = 0;

  constructor(private readonly emit: (chunk: Uint8Array) => void) {}

  /** Makes room for `n` more bytes: grows the buffer up to CHUNK_BYTES, then hands full chunks on. */
  private room(n: number): void {
    if (this.pos + n <= this.buf.length) return;
    if (this.buf.length >= CHUNK_BYTES) {
      this.emit(this.buf.subarray(0, this.pos));
      this.buf = new Uint8Array(Math.max(CHUNK_BYTES, n));
      this.pos = 0;
      return;
    }
    const grown = new Uint8Array(Math.max(Math.min(this.buf.length * 2, CHUNK_BYTES), this.pos + n));
    grown.set(this.buf.subarray(0, this.pos));
    this.buf = grown;
  }

  end(): void {
    if (this.pos > 0) this.emit(this.buf.subarray(0, this.pos));
    this.pos = 0;
  }

  private byte(b: number): void {
    this.room(1);
    this.buf[this.pos++] = b;
  }

  private text(s: string): void {
    this.room(s.length * 3);
    this.pos += UTF8.encodeInto(s, this.buf.subarray(this.pos)).written;
  }

  /** ASCII text (digits, signs, exponents): one byte per character. */
  private ascii(s: string): void {
    this.room(s.length);
    const b = this.buf;
    let p = this.pos;
    for (let i = 0; i < s.length; i++) b[p++] = s.charCodeAt(i);
    this.pos = p;
  }

  /** An integer-valued double below 2⁵³ in magnitude, as JSON.stringify writes it (−0 as "0"). */
  private int(v: number): void {
    this.room(17);
    const b = this.buf;
    let p = this.pos;
    if (v < 0) {
      b[p++] = 45;
      v = -v;
    }
    if (v >= 1e8) {
      // Two parts of at most 8 digits each in int32 range; the split is exact for integers (v < 2⁵³).
      let hi = Math.floor(v / 1e8);
      let lo = v - hi * 1e8;
      if (lo >= 1e8) {
        hi += 1;
        lo -= 1e8;
      } else if (lo < 0) {
        hi -= 1;
        lo += 1e8;
      }
      p = writeDigits(b, p, hi, 0);
      p = writeDigits(b, p, lo, 8);
    } else p = writeDigits(b, p, v, 0);
    this.pos = p;
  }

  value(v: unknown): void {
    if (v instanceof NumberColumn) this.column(v.values);
    else if (Array.isArray(v)) {
      this.byte(91);
      for (let i = 0; i < v.length; i++) {
        if (i > 0) this.byte(44);
        const item: unknown = v[i];
        // As JSON.stringify: holes, undefined and functions in arrays become null.
        if (item === undefined || typeof item === "function" || typeof item === "symbol") this.ascii("null");
        else this.value(item);
      }
      this.byte(93);
    } else if (isPlainObject(v)) {
      this.byte(123);
      let first = true;
      for (const key of Object.keys(v)) {
        const item = v[key];
        if (item === undefined || typeof item === "function" || typeof item === "symbol") continue;
        if (!first) this.byte(44);
        first = false;
        this.text(JSON.stringify(key));
        this.byte(58);
        this.value(item);
      }
      this.byte(125);
    } else this.text(JSON.stringify(v) ?? "null");
  }

  /** Curve data: the decimal delta form {"e":[…],"d":[…]} when exact and at least 4 values, else a number list. */
  private column(a: Float64Array): void {
    const delta = a.length >= 4 ? deltaForm(a) : null;
    if (delta) {
      const { m, ex } = delta;
      this.ascii('{"e":[');
      for (let i = 0; i < ex.length; i++) {
        if (i > 0) this.byte(44);
        this.int(i === 0 ? ex[0] : ex[i] - ex[i - 1]);
      }
      this.ascii('],"d":[');
      for (let i = 0; i < m.length; i++) {
        if (i > 0) this.byte(44);
        this.int(i === 0 ? m[0] : m[i] - m[i - 1]);
      }
      this.ascii("]}");
      return;
    }
    this.byte(91);
    for (let i = 0; i < a.length; i++) {
      if (i > 0) this.byte(44);
      const x = a[i];
      // String(x) is JSON's number form for finite x (ECMA-262 Number::toString); JSON writes null otherwise.
      this.ascii(Number.isFinite(x) ? String(x) : "null");
    }
    this.byte(93);
  }
}

/** Writes the digits of a non-negative integer v < 2³¹ at p, left-padded with zeros to `width`; returns the new end. */
function writeDigits(b: Uint8Array, p: number, v: number, width: number): number {
  let len = 1;
  while (len < 10 && v >= POW10[len]) len++;
  if (len < width) len = width;
  let q = v | 0;
  for (let j = p + len - 1; j >= p; j--) {
    const t = (q / 10) | 0;
    b[j] = 48 + q - t * 10;
    q = t;
  }
  return p + len;
}

export interface EncodeLinkOpts {
  /** Put curves (metadata and data) into the link. @default true */
  includeCurves?: boolean;
}

/**
 * The share-link fragment, or null as soon as it is certain to be longer than `maxChars` characters (the
 * packing stops there, so a project of millions of points is turned down after about `maxChars` worth of
 * work). When it fits, the fragment equals {@link encodeLink}'s.
 * @param maxChars longest acceptable fragment, "v1." included.
 */
export function encodeLinkWithin(project: Project, maxChars: number, opts: EncodeLinkOpts = {}): string | null {
  const prefix = `v${LINK_FORMAT_VERSION}.`;
  // Most packed bytes whose base64url text still fits: ceil(4n/3) ≤ maxChars − prefix.
  const room = maxChars - prefix.length;
  const maxOutBytes = room < 0 ? -1 : Math.floor((room * 3) / 4);
  const includeCurves = opts.includeCurves ?? true;
  const values = includeCurves ? project.curves.reduce((n, c) => n + c.massEv.length + c.gInvGeV.length, 0) : 0;
  const packer = new Packer(levelFor(values), maxOutBytes);
  try {
    const writer = new JsonWriter((chunk) => packer.push(chunk));
    writer.value(toCompact(project, includeCurves));
    writer.end();
    const packed = packer.finish();
    if (prefix.length + base64Length(packed.length) > maxChars) return null;
    return prefix + base64UrlEncode(packed);
  } catch (e) {
    if (e instanceof OverLimit) return null;
    throw e;
  }
}

/**
 * The share-link fragment (without "#") for a project: "v1." + base64url(raw DEFLATE of the compact JSON;
 * level 9 up to 131,072 curve values, 6 up to 524,288, 1 above). With
 * `includeCurves: false` the link carries name, constants, figure and models only. Linear in the number of
 * curve points (about 1 s per million points on a busy 2-core machine).
 */
export function encodeLink(project: Project, opts: EncodeLinkOpts = {}): string {
  // Infinity never stops the packing, so the result is never null.
  return encodeLinkWithin(project, Infinity, opts) as string;
}

export interface AutoLink {
  fragment: string;
  /** Whether the curves are in the link (true also when the project has none). */
  includedCurves: boolean;
  /** Labels of the curves left out (empty when they are included). */
  omittedCurves: string[];
}

/**
 * A share link with curves when it stays within `maxChars`, else without them (and the labels of the curves
 * left out, so the UI can offer the project file instead). A project far over the limit is turned down after
 * about `maxChars` worth of packing, not after encoding all of its data.
 * @param opts.maxChars longest acceptable fragment. @default LINK_MAX_CHARS (8000)
 */
export function encodeLinkAuto(project: Project, opts: { maxChars?: number } = {}): AutoLink {
  const maxChars = opts.maxChars ?? LINK_MAX_CHARS;
  if (project.curves.length === 0)
    return { fragment: encodeLink(project, { includeCurves: false }), includedCurves: true, omittedCurves: [] };
  const full = encodeLinkWithin(project, maxChars, { includeCurves: true });
  if (full !== null) return { fragment: full, includedCurves: true, omittedCurves: [] };
  return {
    fragment: encodeLink(project, { includeCurves: false }),
    includedCurves: false,
    omittedCurves: project.curves.map((c) => c.label),
  };
}

// ------------------------------------------------------------------------------------------------------ decoding

export type DecodeLinkResult =
  | {
      ok: true;
      project: Project;
      /** Curves the sender had but left out of the link (0 when the link has all of them). */
      omittedCurveCount: number;
      /** What the restore step repaired or left out (empty for a link axband wrote). */
      repairs: string[];
    }
  | { ok: false; error: string };

class TooBig extends Error {}

const SCRATCH_BYTES = 256 * 1024;
let scratch: Uint8Array | undefined;

/** Outcome of {@link inflateWithCap}: the bytes, or why not (with how many bytes were unpacked before stopping). */
export type InflateResult =
  { ok: true; bytes: Uint8Array } | { ok: false; reason: "too-big" | "damaged"; inflatedBytes: number };

/**
 * Inflate raw DEFLATE, stopping as soon as the output passes `capBytes`. DEFLATE expands at most ~1032× per
 * input byte, and the input is fed in steps of at most (room left under the cap) / 1032 bytes, never below
 * 1 KiB, so at most ~1 MiB is unpacked past the cap.
 * @param capBytes most output bytes accepted. @default LINK_MAX_DECODED_BYTES
 */
export function inflateWithCap(data: Uint8Array, capBytes: number = LINK_MAX_DECODED_BYTES): InflateResult {
  if (data.length === 0) return { ok: false, reason: "damaged", inflatedBytes: 0 };
  // Most links unpack to a few kB: inflate into a reused buffer, which spares fflate's per-call growth buffers
  // (≥ 128 kB each). fflate stops writing at the end of a given buffer, so a result that fills it completely
  // may be cut off: then inflate again with the streaming path below, which has no such limit but the cap.
  if (data.length < SCRATCH_BYTES / 2 && SCRATCH_BYTES <= capBytes) {
    scratch ??= new Uint8Array(SCRATCH_BYTES);
    let out: Uint8Array;
    try {
      out = inflateSync(data, { out: scratch });
    } catch {
      return { ok: false, reason: "damaged", inflatedBytes: 0 };
    }
    if (out.length < SCRATCH_BYTES) return { ok: true, bytes: out === scratch ? out.slice() : out };
  }
  const chunks: Uint8Array[] = [];
  let total = 0;
  const inflater = new Inflate((chunk) => {
    total += chunk.length;
    if (total > capBytes) throw new TooBig();
    chunks.push(chunk);
  });
  try {
    for (let i = 0; i < data.length;) {
      // No step can unpack to more than the room left under the cap (≤ 1032 bytes per input byte), except at
      // the 1 KiB floor near the cap; larger steps far from it spare fflate's per-push window copies.
      const step = Math.max(1024, Math.min(1 << 20, Math.floor((capBytes - total) / 1032)));
      const end = Math.min(data.length, i + step);
      inflater.push(data.subarray(i, end), end >= data.length);
      i = end;
    }
  } catch (e) {
    return { ok: false, reason: e instanceof TooBig ? "too-big" : "damaged", inflatedBytes: total };
  }
  const out = new Uint8Array(total);
  let o = 0;
  for (const c of chunks) {
    out.set(c, o);
    o += c.length;
  }
  return { ok: true, bytes: out };
}

const damaged = (why: string) => ({
  ok: false as const,
  error: `This link is damaged (${why}). Check that it was copied completely.`,
});

/**
 * Decode a share-link fragment (with or without the leading "#"; a whole URL works too). Never throws:
 * a malformed, truncated, altered, oversized or future-version link gives `{ ok: false, error }` with a
 * message for the user. Unpacking stops past LINK_MAX_DECODED_BYTES, so compression bombs are refused cheaply.
 */
export function decodeLink(fragment: string): DecodeLinkResult {
  try {
    if (typeof fragment !== "string") return { ok: false, error: "This link is empty: it carries no project." };
    const hash = fragment.indexOf("#");
    // Mail clients wrap long lines: whitespace inside a link is never part of it.
    const text = (hash >= 0 ? fragment.slice(hash + 1) : fragment).replace(/\s+/g, "");
    if (text === "") return { ok: false, error: "This link is empty: it carries no project." };
    const m = /^v(\d{1,6})\.(.*)$/s.exec(text);
    if (!m)
      return { ok: false, error: 'This is not an axband project link (its part after "#" should start with "v1.").' };
    const version = Number(m[1]);
    if (version > LINK_FORMAT_VERSION) {
      return {
        ok: false,
        error: `This link was made by a newer version of axband (format v${version}); this version reads links up to format v${LINK_FORMAT_VERSION}. Reload the page to get the newest axband, or ask the sender for a project file.`,
      };
    }
    const decoder = Object.hasOwn(LINK_DECODERS, version) ? LINK_DECODERS[version] : undefined;
    if (!decoder) return damaged(`unknown format v${version}`);
    // base64 carries 6 bits a character; more characters than the cap can only be a bomb or garbage.
    if (m[2].length > (LINK_MAX_DECODED_BYTES / 3) * 4 + 4) {
      return {
        ok: false,
        error: `This link is too large: it would unpack to more than ${LINK_MAX_DECODED_BYTES / 1048576} MB, so it was not opened.`,
      };
    }
    const bytes = base64UrlDecode(m[2]);
    if (!bytes)
      return damaged(
        /[^A-Za-z0-9\-_+/=]/.test(m[2])
          ? "it contains characters that do not belong in an axband link"
          : "it looks cut off",
      );
    const inflated = inflateWithCap(bytes, LINK_MAX_DECODED_BYTES);
    if (!inflated.ok && inflated.reason === "too-big") {
      return {
        ok: false,
        error: `This link is too large: it would unpack to more than ${LINK_MAX_DECODED_BYTES / 1048576} MB, so it was not opened.`,
      };
    }
    if (!inflated.ok) return damaged("its compressed data is cut off or altered");
    let json: string;
    try {
      json = new TextDecoder("utf-8", { fatal: true }).decode(inflated.bytes);
    } catch {
      return damaged("its content is not text");
    }
    let compact: unknown;
    try {
      compact = parseJsonSafely(json);
    } catch {
      return damaged("its content is not valid project data");
    }
    let expanded: { project: Rec; omitted: number };
    try {
      expanded = decoder(compact);
    } catch (e) {
      if (e instanceof ShapeError) return damaged(`its content is not valid project data: ${e.message}`);
      throw e;
    }
    const restored = restoreProject(expanded.project);
    if (!restored.ok) return damaged(restored.error);
    return { ok: true, project: restored.project, omittedCurveCount: expanded.omitted, repairs: restored.repairs };
  } catch (e) {
    return damaged(`it could not be read: ${e instanceof Error ? e.message : String(e)}`);
  }
}
