// Share links: the project in the URL fragment as "v1." + base64url(deflate-raw(JSON of a compact form)).
// Decoding never throws: it caps the unpacked size, validates through the shared restore step and explains failures.
//
// Link format v1 (frozen; a later format gets a new prefix, and v1 links keep decoding with this code):
//   fragment = "v1." + base64url without padding (RFC 4648 §5) of raw DEFLATE (RFC 1951, fflate level 9)
//              of the UTF-8 JSON of the compact object below.
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
//   to read back to the same double before the form is used.
//   Without curves ("c" absent), a link carries name, constants, figure and models only; "o" says how many
//   curves the sender had.
import { Inflate, deflateSync, inflateSync } from "fflate";
import { parseJsonSafely, projectsEqual, restoreProject } from "./schema";
import { CURVE_STATE, FIGURE_STATE, MODEL_STATE, PHYSICS_STATE, PROJECT_STATE, goesTo, type Persistence, type PersistTarget } from "./state-table";
import type { Project } from "./types";
import { PROJECT_VERSION } from "./types";

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

/** base64url without padding (RFC 4648 §5). */
export function base64UrlEncode(bytes: Uint8Array): string {
  const parts: string[] = [];
  let s = "";
  for (let i = 0; i < bytes.length; i += 3) {
    const n = (bytes[i] << 16) | ((bytes[i + 1] ?? 0) << 8) | (bytes[i + 2] ?? 0);
    const left = bytes.length - i;
    s += B64[(n >> 18) & 63] + B64[(n >> 12) & 63] + (left > 1 ? B64[(n >> 6) & 63] : "") + (left > 2 ? B64[n & 63] : "");
    if (s.length > 8192) {
      parts.push(s);
      s = "";
    }
  }
  parts.push(s);
  return parts.join("");
}

/** Bytes of a base64url (or base64) string without padding; null when a character or the length is invalid. */
export function base64UrlDecode(text: string): Uint8Array | null {
  const t = text.replace(/=+$/, "");
  if (t.length % 4 === 1) return null;
  const out = new Uint8Array(Math.floor((t.length * 3) / 4));
  let o = 0;
  for (let i = 0; i < t.length; i += 4) {
    let n = 0;
    const len = Math.min(4, t.length - i);
    for (let j = 0; j < 4; j++) {
      let v = 0;
      if (j < len) {
        const code = t.charCodeAt(i + j);
        v = code < 128 ? B64_INDEX[code] : -1;
        if (v < 0) return null;
      }
      n = (n << 6) | v;
    }
    out[o++] = (n >> 16) & 255;
    if (len > 2) out[o++] = (n >> 8) & 255;
    if (len > 3) out[o++] = n & 255;
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

/** Curve data for the link: the decimal delta form when exact and applicable, else a plain number array. */
function encodeNumbers(v: unknown): unknown {
  const a = v instanceof Float64Array ? v : Float64Array.from(v as ArrayLike<number>);
  const plain = Array.from(a);
  if (a.length < 4) return plain;
  const digits: string[] = new Array(a.length);
  const exps = new Int32Array(a.length);
  let width = 1;
  for (let i = 0; i < a.length; i++) {
    // toExponential() without an argument gives the shortest digits that read back to the same double.
    const [mant, exp] = a[i].toExponential().split("e");
    const [whole, frac = ""] = mant.replace("-", "").split(".");
    digits[i] = whole + frac;
    exps[i] = Number(exp) - frac.length;
    width = Math.max(width, digits[i].length);
    if (width > MAX_DELTA_DIGITS) return plain;
  }
  const e: number[] = new Array(a.length);
  const d: number[] = new Array(a.length);
  let prevM = 0;
  let prevE = 0;
  for (let i = 0; i < a.length; i++) {
    const pad = width - digits[i].length;
    const m = Number(digits[i] + "0".repeat(pad)) * (a[i] < 0 ? -1 : 1);
    const ex = exps[i] - pad;
    if (Number(`${m}e${ex}`) !== a[i]) return plain;
    d[i] = m - prevM;
    e[i] = ex - prevE;
    prevM = m;
    prevE = ex;
  }
  return { e, d };
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
    if (!Number.isSafeInteger(de) || !Number.isSafeInteger(dd)) throw new ShapeError("curve data contain a step that is not an integer");
    m += dd as number;
    ex += de as number;
    if (!Number.isSafeInteger(m) || Math.abs(ex) > 400) throw new ShapeError("curve data contain a value out of range");
    out[i] = Number(`${m}e${ex}`);
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
      base: (m) => (str(m.eOverNMin) === str(m.eOverNMax) ? `E/N = ${str(m.eOverNMin)}` : `E/N = ${str(m.eOverNMin)}..${str(m.eOverNMax)}`),
    },
    { full: "source", short: "s", base: () => ({ kind: "typed" }) },
    { full: "colour", short: "c", base: (_m, i) => V1_MODEL_COLOURS[i % V1_MODEL_COLOURS.length] },
    { full: "lineStyle", short: "y", base: () => "solid" },
    { full: "fillOpacity", short: "o", base: () => 0.25 },
    { full: "visible", short: "v", base: () => true },
    { full: "sigmas", short: "k", base: () => 0 },
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
    out.m = project.models.map((m, i) => encodeWith(MODEL_V1, m as unknown as Rec, i, target));
  }
  if (goesTo(PROJECT_STATE.curves, target)) {
    if (project.curves.length > 0) out.c = project.curves.map((c, i) => encodeWith(CURVE_V1, c as unknown as Rec, i, target));
  } else if (project.curves.length > 0) {
    out.o = project.curves.length;
  }
  return out;
}

function fromCompactV1(compact: unknown): { project: Rec; omitted: number } {
  if (!isRec(compact)) throw new ShapeError("the content is not an object");
  const list = (key: string, what: string): unknown[] => {
    const v = Object.hasOwn(compact, key) ? compact[key] : [];
    if (!Array.isArray(v)) throw new ShapeError(`the ${what} are not a list`);
    return v;
  };
  const models = list("m", "models");
  const curves = list("c", "curves");
  const omitted = Object.hasOwn(compact, "o") ? compact.o : 0;
  return {
    project: {
      version: 1,
      name: Object.hasOwn(compact, "n") ? compact.n : "Untitled",
      physics: decodeWith(PHYSICS_V1, compact.p, 0, "the constants"),
      figure: decodeWith(FIGURE_V1, compact.f, 0, "the figure"),
      models: models.map((m, i) => decodeWith(MODEL_V1, m, i, `model ${i + 1}`)),
      curves: curves.map((c, i) => decodeWith(CURVE_V1, c, i, `curve ${i + 1}`)),
    },
    omitted: typeof omitted === "number" && Number.isInteger(omitted) && omitted >= 0 ? omitted : 0,
  };
}

/** Decoders of every link format ever written, by version: compact JSON → project object of that schema version. */
const LINK_DECODERS: Readonly<Record<number, (compact: unknown) => { project: Rec; omitted: number }>> = {
  1: fromCompactV1,
};

// ------------------------------------------------------------------------------------------------------ encoding

export interface EncodeLinkOpts {
  /** Put curves (metadata and data) into the link. @default true */
  includeCurves?: boolean;
}

/**
 * The share-link fragment (without "#") for a project: "v1." + base64url(deflate-raw level 9 of the compact
 * JSON). With `includeCurves: false` the link carries name, constants, figure and models only.
 */
export function encodeLink(project: Project, opts: EncodeLinkOpts = {}): string {
  const includeCurves = opts.includeCurves ?? true;
  const json = JSON.stringify(toCompact(project, includeCurves));
  const packed = deflateSync(new TextEncoder().encode(json), { level: 9 });
  return `v${LINK_FORMAT_VERSION}.${base64UrlEncode(packed)}`;
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
 * left out, so the UI can offer the project file instead).
 * @param opts.maxChars longest acceptable fragment. @default LINK_MAX_CHARS (8000)
 */
export function encodeLinkAuto(project: Project, opts: { maxChars?: number } = {}): AutoLink {
  const maxChars = opts.maxChars ?? LINK_MAX_CHARS;
  if (project.curves.length === 0) return { fragment: encodeLink(project, { includeCurves: false }), includedCurves: true, omittedCurves: [] };
  const full = encodeLink(project, { includeCurves: true });
  if (full.length <= maxChars) return { fragment: full, includedCurves: true, omittedCurves: [] };
  return { fragment: encodeLink(project, { includeCurves: false }), includedCurves: false, omittedCurves: project.curves.map((c) => c.label) };
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
export type InflateResult = { ok: true; bytes: Uint8Array } | { ok: false; reason: "too-big" | "damaged"; inflatedBytes: number };

/**
 * Inflate raw DEFLATE, stopping as soon as the output passes `capBytes`: the input is fed in 1 KiB steps, and
 * DEFLATE expands at most ~1032× per input byte, so at most ~1 MiB is unpacked past the cap.
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
  const STEP = 1024;
  try {
    for (let i = 0; i < data.length; i += STEP) inflater.push(data.subarray(i, i + STEP), i + STEP >= data.length);
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

const damaged = (why: string) => ({ ok: false as const, error: `This link is damaged (${why}). Check that it was copied completely.` });

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
    if (!m) return { ok: false, error: 'This is not an axband project link (its part after "#" should start with "v1.").' };
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
      return { ok: false, error: `This link is too large: it would unpack to more than ${LINK_MAX_DECODED_BYTES / 1048576} MB, so it was not opened.` };
    }
    const bytes = base64UrlDecode(m[2]);
    if (!bytes) return damaged(/[^A-Za-z0-9\-_+/=]/.test(m[2]) ? "it contains characters that do not belong in an axband link" : "it looks cut off");
    const inflated = inflateWithCap(bytes, LINK_MAX_DECODED_BYTES);
    if (!inflated.ok && inflated.reason === "too-big") {
      return { ok: false, error: `This link is too large: it would unpack to more than ${LINK_MAX_DECODED_BYTES / 1048576} MB, so it was not opened.` };
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
