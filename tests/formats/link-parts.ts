// Test helper: the payload of a link: "v1." + base64url payload, or from format v3 on the same + "." + a
// 6-character checksum.
import { expect } from "vitest";

/** The base64url payload of a link (raw DEFLATE of the compact JSON), after checking the link's shape. */
export function linkPayload(link: string): string {
  const m = /^v(\d+)\.([A-Za-z0-9_-]+)(?:\.([A-Za-z0-9_-]{6}))?$/.exec(link);
  expect(m, `not an axband link: ${link.slice(0, 40)}`).not.toBeNull();
  if (!m) return "";
  expect(m[3] !== undefined, `checksum present in a v${m[1]} link`).toBe(Number(m[1]) >= 3);
  return m[2];
}
