// The project codec used by share links, SVG embedding and autosave: encodeLink / decodeLink and their limits.
// Decoding never throws: it caps the unpacked size, validates through the shared restore step and explains failures.
export { base64UrlDecode, base64UrlEncode } from "./base64url";
export { LINK_MAX_DECODED_BYTES, inflateWithCap, type InflateResult } from "./deflate";
export { decodeEmbeddedProject, decodeLink, type DecodeLinkResult } from "./decode";
export { LINK_FORMAT_VERSION } from "./formats";
export {
  LINK_MAX_CHARS,
  encodeLink,
  encodeLinkAuto,
  encodeLinkWithin,
  type AutoLink,
  type EncodeLinkOpts,
} from "./encode";
