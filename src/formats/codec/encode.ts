// Encoding of the project codec (share links, SVG embedding, autosave): encodeLink and its limits. Apart from
// decoding, which validates with the schema, so writers that only encode (the command line's SVG) skip zod.
import type { Project } from "../../project/types";
import { base64Length, base64UrlEncode } from "./base64url";
import { OverLimit, Packer, levelFor } from "./deflate";
import { CHECKSUM_CHARS, LINK_FORMATS, LINK_FORMAT_VERSION, linkChecksum } from "./formats";
import { JsonWriter } from "./json-writer";

/** Longest fragment {@link encodeLinkAuto} produces with curves: links of this size survive chat and e-mail. */
export const LINK_MAX_CHARS = 8000;
export interface EncodeLinkOpts {
  /** Put curves (metadata and data) into the link. @default true */
  includeCurves?: boolean;
}

/**
 * The share-link fragment, or null as soon as it is certain to be longer than `maxChars` characters (the
 * packing stops there, so a project of millions of points is turned down after about `maxChars` worth of
 * work). When it fits, the fragment equals {@link encodeLink}'s.
 * @param maxChars longest acceptable fragment, "v3." and the checksum included.
 */
export function encodeLinkWithin(project: Project, maxChars: number, opts: EncodeLinkOpts = {}): string | null {
  const prefix = `v${LINK_FORMAT_VERSION}.`;
  const format = LINK_FORMATS[LINK_FORMAT_VERSION];
  const tail = format.checked ? 1 + CHECKSUM_CHARS : 0;
  // Most packed bytes whose base64url text still fits: ceil(4n/3) ≤ maxChars − prefix − checksum.
  const room = maxChars - prefix.length - tail;
  const maxOutBytes = room < 0 ? -1 : Math.floor((room * 3) / 4);
  const includeCurves = opts.includeCurves ?? true;
  const values = includeCurves ? project.curves.reduce((n, c) => n + c.massEv.length + c.gInvGeV.length, 0) : 0;
  const packer = new Packer(levelFor(values), maxOutBytes);
  try {
    const writer = new JsonWriter((chunk) => packer.push(chunk));
    writer.value(format.layout.toCompact(project, includeCurves));
    writer.end();
    const packed = packer.finish();
    if (prefix.length + base64Length(packed.length) + tail > maxChars) return null;
    const text = prefix + base64UrlEncode(packed);
    return format.checked ? `${text}.${linkChecksum(text)}` : text;
  } catch (e) {
    if (e instanceof OverLimit) return null;
    throw e;
  }
}

/**
 * The share-link fragment (without "#") for a project: "v3." + base64url(raw DEFLATE of the compact JSON;
 * level 9 up to 131,072 curve values, 6 up to 524,288, 1 above) + "." + its checksum (./formats.ts). With
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
