// The project codec used by share links, SVG embedding and autosave: encodeLink / decodeLink and their limits.
// Decoding never throws: it caps the unpacked size, validates through the shared restore step and explains failures.
import { parseJsonSafely } from "../../project/json";
import { restoreProject } from "../../project/restore";
import type { Project } from "../../project/types";
import { PROJECT_VERSION } from "../../project/types";
import { base64Length, base64UrlDecode, base64UrlEncode } from "./base64url";
import { ShapeError, type CompactLayout, type Rec } from "./compact";
import { LINK_MAX_DECODED_BYTES, OverLimit, Packer, inflateWithCap, levelFor } from "./deflate";
import { JsonWriter } from "./json-writer";
import { COMPACT_V1 } from "./v1";
import { COMPACT_V2 } from "./v2";

export { base64UrlDecode, base64UrlEncode } from "./base64url";
export { LINK_MAX_DECODED_BYTES, inflateWithCap, type InflateResult } from "./deflate";

/** Longest fragment {@link encodeLinkAuto} produces with curves: links of this size survive chat and e-mail. */
export const LINK_MAX_CHARS = 8000;
/** Link format this build writes ("v2." prefix). Equal to the project schema version. */
export const LINK_FORMAT_VERSION: number = PROJECT_VERSION;

/**
 * Compact layout of every link format ever written, by version (the written one included). A format is frozen
 * once written: a change gets a new version here, and old links keep decoding with their own entry.
 *   fragment = "v<version>." + base64url without padding (RFC 4648 §5) of raw DEFLATE (RFC 1951; any level
 *              reads the same) of the UTF-8 JSON of the version's compact object (see ./v1.ts, ./v2.ts).
 */
const LINK_LAYOUTS: Readonly<Record<number, CompactLayout>> = {
  1: COMPACT_V1,
  2: COMPACT_V2,
};

export interface EncodeLinkOpts {
  /** Put curves (metadata and data) into the link. @default true */
  includeCurves?: boolean;
}

/**
 * The share-link fragment, or null as soon as it is certain to be longer than `maxChars` characters (the
 * packing stops there, so a project of millions of points is turned down after about `maxChars` worth of
 * work). When it fits, the fragment equals {@link encodeLink}'s.
 * @param maxChars longest acceptable fragment, "v2." included.
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
    writer.value(LINK_LAYOUTS[LINK_FORMAT_VERSION].toCompact(project, includeCurves));
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
 * The share-link fragment (without "#") for a project: "v2." + base64url(raw DEFLATE of the compact JSON;
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

type Refusal = { ok: false; error: string };

const damaged = (why: string): Refusal => ({
  ok: false,
  error: `This link is damaged (${why}). Check that it was copied completely.`,
});

const tooLarge = (): Refusal => ({
  ok: false,
  error: `This link is too large: it would unpack to more than ${LINK_MAX_DECODED_BYTES / 1048576} MB, so it was not opened.`,
});

/** The version and payload text of a fragment, or why it is not an axband link this build reads. */
function readEnvelope(fragment: string): { ok: true; version: number; payload: string } | Refusal {
  if (typeof fragment !== "string") return { ok: false, error: "This link is empty: it carries no project." };
  const hash = fragment.indexOf("#");
  // Mail clients wrap long lines: whitespace inside a link is never part of it.
  const text = (hash >= 0 ? fragment.slice(hash + 1) : fragment).replace(/\s+/g, "");
  if (text === "") return { ok: false, error: "This link is empty: it carries no project." };
  const m = /^v(\d{1,6})\.(.*)$/s.exec(text);
  if (!m)
    return { ok: false, error: 'This is not an axband project link (its part after "#" should start with "v2.").' };
  const version = Number(m[1]);
  if (version > LINK_FORMAT_VERSION) {
    return {
      ok: false,
      error: `This link was made by a newer version of axband (format v${version}); this version reads links up to format v${LINK_FORMAT_VERSION}. Reload the page to get the newest axband, or ask the sender for a project file.`,
    };
  }
  if (!Object.hasOwn(LINK_LAYOUTS, version)) return damaged(`unknown format v${version}`);
  // base64 carries 6 bits a character; more characters than the cap can only be a bomb or garbage.
  if (m[2].length > (LINK_MAX_DECODED_BYTES / 3) * 4 + 4) return tooLarge();
  return { ok: true, version, payload: m[2] };
}

/** The parsed JSON inside a payload (base64url of raw DEFLATE of UTF-8 JSON), or why it cannot be read. */
function unpackPayload(payload: string): { ok: true; compact: unknown } | Refusal {
  const bytes = base64UrlDecode(payload);
  if (!bytes)
    return damaged(
      /[^A-Za-z0-9\-_+/=]/.test(payload)
        ? "it contains characters that do not belong in an axband link"
        : "it looks cut off",
    );
  const inflated = inflateWithCap(bytes, LINK_MAX_DECODED_BYTES);
  if (!inflated.ok)
    return inflated.reason === "too-big" ? tooLarge() : damaged("its compressed data is cut off or altered");
  let json: string;
  try {
    json = new TextDecoder("utf-8", { fatal: true }).decode(inflated.bytes);
  } catch {
    return damaged("its content is not text");
  }
  try {
    return { ok: true, compact: parseJsonSafely(json) };
  } catch {
    return damaged("its content is not valid project data");
  }
}

/**
 * Decode a share-link fragment (with or without the leading "#"; a whole URL works too). Never throws:
 * a malformed, truncated, altered, oversized or future-version link gives `{ ok: false, error }` with a
 * message for the user. Unpacking stops past LINK_MAX_DECODED_BYTES, so compression bombs are refused cheaply.
 */
export function decodeLink(fragment: string): DecodeLinkResult {
  try {
    const envelope = readEnvelope(fragment);
    if (!envelope.ok) return envelope;
    const unpacked = unpackPayload(envelope.payload);
    if (!unpacked.ok) return unpacked;
    let expanded: { project: Rec; omitted: number };
    try {
      expanded = LINK_LAYOUTS[envelope.version].fromCompact(unpacked.compact);
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
