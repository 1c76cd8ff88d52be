// Reading a link (or a project embedded in a figure) back: envelope, checksum, unpacking, compact layout and the
// shared restore step. Never throws; every refusal is worded for where the text came from.
import { PROJECT_LIMITS } from "../../project/schema";
import { parseJsonSafely } from "../../project/json";
import { restoreProject } from "../../project/restore";
import type { Project } from "../../project/types";
import { base64UrlDecode } from "./base64url";
import { ShapeError, TooMany, type Rec } from "./compact";
import { LINK_MAX_DECODED_BYTES, inflateWithCap } from "./deflate";
import { CHECKSUM_CHARS, LINK_FORMATS, LINK_FORMAT_VERSION, linkChecksum } from "./formats";

export type DecodeLinkResult =
  | {
      ok: true;
      project: Project;
      /** Curves the sender had but left out of the link (0 when the link has all of them). */
      omittedCurveCount: number;
      /** What the restore step repaired or left out (empty for a link axband wrote). */
      repairs: string[];
      /** Whether the link carried a checksum that matched; false for formats older than v3, which have none. */
      verified: boolean;
    }
  | { ok: false; error: string };

/** Why a text was refused, before it is worded for a link or for a file. */
type Refusal =
  | { ok: false; kind: "empty" | "not-axband" | "too-large" }
  | { ok: false; kind: "newer"; version: number }
  | { ok: false; kind: "damaged"; why: string }
  | { ok: false; kind: "too-many"; count: number; what: "models" | "curves" };

const damaged = (why: string): Refusal => ({ ok: false, kind: "damaged", why });
const MB = LINK_MAX_DECODED_BYTES / 1048576;

/** A refusal as the sentences shown for a share link. */
function linkWording(r: Refusal): string {
  switch (r.kind) {
    case "empty":
      return "This link is empty: it carries no project.";
    case "not-axband":
      return `This is not an axband project link (its part after "#" should start with "v${LINK_FORMAT_VERSION}.").`;
    case "newer":
      return `This link was made by a newer version of axband (format v${r.version}); this version reads links up to format v${LINK_FORMAT_VERSION}. Reload the page to get the newest axband, or ask the sender for a project file.`;
    case "too-large":
      return `This link is too large: it would unpack to more than ${MB} MB, so it was not opened.`;
    case "too-many":
      return `This link was not opened: it holds ${r.count.toLocaleString("en")} ${r.what}, and axband opens at most ${PROJECT_LIMITS[r.what]} ${r.what} in one project.`;
    case "damaged":
      return `This link is damaged (${r.why}). Check that it was copied completely.`;
  }
}

/** A refusal as a clause about a project embedded in a file ("the project embedded in x.svg " + clause). */
function fileWording(r: Refusal): string {
  switch (r.kind) {
    case "empty":
      return "is empty";
    case "not-axband":
      return "is not in axband's format";
    case "newer":
      return `was written by a newer version of axband (format v${r.version}; this version reads formats up to v${LINK_FORMAT_VERSION}): reload axband to get the newest version`;
    case "too-large":
      return `would unpack to more than ${MB} MB, so it was not opened`;
    case "too-many":
      return `holds ${r.count.toLocaleString("en")} ${r.what}, and axband opens at most ${PROJECT_LIMITS[r.what]} ${r.what} in one project`;
    case "damaged":
      return `is damaged (${r.why})`;
  }
}

/** The version and payload text of a fragment, or why it is not an axband link this build reads. */
function readEnvelope(fragment: string): { ok: true; version: number; payload: string } | Refusal {
  if (typeof fragment !== "string") return { ok: false, kind: "empty" };
  const hash = fragment.indexOf("#");
  // Mail clients wrap long lines: whitespace inside a link is never part of it.
  const text = (hash >= 0 ? fragment.slice(hash + 1) : fragment).replace(/\s+/g, "");
  if (text === "") return { ok: false, kind: "empty" };
  const m = /^v(\d{1,6})\.(.*)$/s.exec(text);
  if (!m) return { ok: false, kind: "not-axband" };
  const version = Number(m[1]);
  if (version > LINK_FORMAT_VERSION) return { ok: false, kind: "newer", version };
  if (!Object.hasOwn(LINK_FORMATS, version)) return damaged(`unknown format v${version}`);
  // base64 carries 6 bits a character; more characters than the cap can only be a bomb or garbage.
  if (m[2].length > (LINK_MAX_DECODED_BYTES / 3) * 4 + 4 + CHECKSUM_CHARS) return { ok: false, kind: "too-large" };
  if (!LINK_FORMATS[version].checked) return { ok: true, version, payload: m[2] };
  // Checked formats: "<payload>.<checksum>", base64url letters only (no padding, no standard base64 letters,
  // so that no character has a second spelling), the checksum over "v<version>." and the payload as written.
  const at = m[2].lastIndexOf(".");
  if (/[^A-Za-z0-9\-_.]/.test(m[2])) return damaged("it contains characters that do not belong in it");
  if (at < 0 || m[2].length - at - 1 !== CHECKSUM_CHARS || m[2].indexOf(".") !== at)
    return damaged("it looks cut off: its checksum is missing");
  const payload = m[2].slice(0, at);
  if (linkChecksum(`v${m[1]}.${payload}`) !== m[2].slice(at + 1))
    return damaged("its checksum does not match its content: it was changed or cut off on the way");
  return { ok: true, version, payload };
}

/** The parsed JSON inside a payload (base64url of raw DEFLATE of UTF-8 JSON), or why it cannot be read. */
function unpackPayload(payload: string): { ok: true; compact: unknown } | Refusal {
  const bytes = base64UrlDecode(payload);
  if (!bytes)
    return damaged(
      /[^A-Za-z0-9\-_+/=]/.test(payload) ? "it contains characters that do not belong in it" : "it looks cut off",
    );
  const inflated = inflateWithCap(bytes, LINK_MAX_DECODED_BYTES);
  if (!inflated.ok)
    return inflated.reason === "too-big"
      ? { ok: false, kind: "too-large" }
      : damaged("its compressed data is cut off or altered");
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

type Decoded = Extract<DecodeLinkResult, { ok: true }> | Refusal;

function decode(fragment: string): Decoded {
  const envelope = readEnvelope(fragment);
  if (!envelope.ok) return envelope;
  const unpacked = unpackPayload(envelope.payload);
  if (!unpacked.ok) return unpacked;
  let expanded: { project: Rec; omitted: number };
  try {
    expanded = LINK_FORMATS[envelope.version].layout.fromCompact(unpacked.compact);
  } catch (e) {
    if (e instanceof TooMany) return { ok: false, kind: "too-many", count: e.count, what: e.what };
    if (e instanceof ShapeError) return damaged(`its content is not valid project data: ${e.message}`);
    throw e;
  }
  const restored = restoreProject(expanded.project);
  if (!restored.ok) return damaged(restored.error);
  return {
    ok: true,
    project: restored.project,
    omittedCurveCount: expanded.omitted,
    repairs: restored.repairs,
    verified: LINK_FORMATS[envelope.version].checked,
  };
}

function decodeWorded(text: string, word: (r: Refusal) => string): DecodeLinkResult {
  try {
    const r = decode(text);
    return r.ok ? r : { ok: false, error: word(r) };
  } catch (e) {
    return { ok: false, error: word(damaged(`it could not be read: ${e instanceof Error ? e.message : String(e)}`)) };
  }
}

/**
 * Decode a share-link fragment (with or without the leading "#"; a whole URL works too). Never throws:
 * a malformed, truncated, altered, oversized or future-version link gives `{ ok: false, error }` with a
 * message for the user. Unpacking stops past LINK_MAX_DECODED_BYTES, so compression bombs are refused cheaply.
 */
export function decodeLink(fragment: string): DecodeLinkResult {
  return decodeWorded(fragment, linkWording);
}

/**
 * Decode the link text of a project embedded in a file (an exported SVG). As {@link decodeLink}, but a refusal
 * is a clause to follow "the project embedded in <file> " (no capital, no full stop), worded for a file.
 */
export function decodeEmbeddedProject(text: string): DecodeLinkResult {
  return decodeWorded(text, fileWording);
}
