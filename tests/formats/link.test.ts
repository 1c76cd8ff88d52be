// Share-link codec: base64url against RFC 4648 and Node's encoder, link size of the demo, curve inclusion,
// exact curve data, clear messages for broken or future links, and refusal of a compression bomb.
import { Buffer } from "node:buffer";
import { deflateSync, inflateSync } from "fflate";
import { describe, expect, it } from "vitest";
import { linkPayload } from "./link-parts";
import {
  LINK_MAX_CHARS,
  LINK_MAX_DECODED_BYTES,
  base64UrlDecode,
  base64UrlEncode,
  decodeLink,
  defaultProject,
  encodeLink,
  encodeLinkAuto,
  inflateWithCap,
  newCurve,
  projectsEqual,
} from "../../src/data/index";
import type { Project } from "../../src/project/types";

const bytes = (s: string) => new TextEncoder().encode(s);

describe("base64url", () => {
  // RFC 4648 §10 test vectors (base64 of "", "f", "fo", …, "foobar"), without the "=" padding (§5, §3.2).
  it.each([
    ["", ""],
    ["f", "Zg"],
    ["fo", "Zm8"],
    ["foo", "Zm9v"],
    ["foob", "Zm9vYg"],
    ["fooba", "Zm9vYmE"],
    ["foobar", "Zm9vYmFy"],
  ])("RFC 4648 vector %j → %j", (plain, encoded) => {
    expect(base64UrlEncode(bytes(plain))).toBe(encoded);
    expect(Array.from(base64UrlDecode(encoded) ?? [])).toEqual(Array.from(bytes(plain)));
  });

  it("agrees with Node's base64url encoder on random bytes of every length up to 300", () => {
    let seed = 1;
    for (let n = 0; n <= 300; n++) {
      const b = new Uint8Array(n);
      for (let i = 0; i < n; i++) b[i] = (seed = (seed * 1103515245 + 12345) >>> 0) >>> 24;
      const ours = base64UrlEncode(b);
      expect(ours).toBe(Buffer.from(b).toString("base64url"));
      expect(Array.from(base64UrlDecode(ours) ?? [])).toEqual(Array.from(b));
    }
  });

  it("refuses foreign characters and impossible lengths", () => {
    expect(base64UrlDecode("Zm9v!")).toBeNull();
    expect(base64UrlDecode("Zm9vY")).toBeNull();
    expect(base64UrlDecode("Zm9vä")).toBeNull();
  });
});

describe("encodeLink / decodeLink", () => {
  it("the demo state's link without curve data is at most 300 characters", () => {
    const link = encodeLink(defaultProject(), { includeCurves: false });
    expect(link.length).toBeLessThanOrEqual(300);
    expect(link).toMatch(/^v3\.[A-Za-z0-9_-]+\.[A-Za-z0-9_-]{6}$/);
  });

  it("the payload is raw DEFLATE of UTF-8 JSON with short keys (readable by any inflater)", () => {
    const link = encodeLink(defaultProject(), { includeCurves: false });
    const json = new TextDecoder().decode(inflateSync(Buffer.from(linkPayload(link), "base64url")));
    const compact = JSON.parse(json) as Record<string, unknown>;
    expect(Object.keys(compact).sort()).toEqual(["f", "m", "n", "o"]);
    // The demo's figure differs from the frozen v1 base only in its legend: "auto" is newer than the base "bottom-right".
    expect(compact.f).toEqual({ l: "auto" });
    expect(compact.o).toBe(4);
  });

  it("with curves, decodes to exactly the project it came from", () => {
    const p = defaultProject();
    const r = decodeLink(encodeLink(p));
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(projectsEqual(r.project, p)).toBe(true);
      expect(r.omittedCurveCount).toBe(0);
      expect(r.repairs).toEqual([]);
    }
  });

  it("keeps curve data bit-exact, whatever the number of digits", () => {
    const values = [
      Math.PI * 1e-14,
      0.1 + 0.2,
      5e-324,
      1.7976931348623157e308,
      2 ** -1074,
      1 - 2 ** -53,
      123456789012345e-20,
      1e-6,
      1.5e-6,
      2e-6,
      3e-6,
    ];
    const p: Project = {
      ...defaultProject(),
      curves: [newCurve({ id: "x", massEv: Float64Array.from(values), gInvGeV: Float64Array.from(values).reverse() })],
    };
    const r = decodeLink(encodeLink(p));
    expect(r.ok && projectsEqual(r.project, p)).toBe(true);
  });

  it("without curves, carries name, constants, figure and models only", () => {
    const p = defaultProject();
    p.figure = { ...p.figure, title: "changed", massRangeEv: [2e-6, 3e-4] };
    p.physics = { ...p.physics, ref: "custom", custom: { ...p.physics.custom, cGamma: 1.95 } };
    const r = decodeLink(encodeLink(p, { includeCurves: false }));
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.project.curves).toEqual([]);
      expect(r.omittedCurveCount).toBe(p.curves.length);
      expect(projectsEqual({ ...r.project, curves: p.curves }, p)).toBe(true);
    }
  });

  it("accepts a leading '#', a whole URL, and line breaks inserted by mail clients", () => {
    const p = defaultProject();
    const link = encodeLink(p, { includeCurves: false });
    const wrapped = link.replace(/(.{60})/g, "$1\n  ");
    for (const form of [`#${link}`, `https://example.org/axband/#${link}`, wrapped]) {
      const r = decodeLink(form);
      expect(r.ok && r.project.models.length).toBe(3);
    }
  });
});

describe("encodeLinkAuto", () => {
  it("includes the demo's curves within LINK_MAX_CHARS", () => {
    const a = encodeLinkAuto(defaultProject());
    expect(a.includedCurves).toBe(true);
    expect(a.omittedCurves).toEqual([]);
    expect(a.fragment.length).toBeLessThanOrEqual(LINK_MAX_CHARS);
  });

  it("leaves curves out when the link would be too long, and names them", () => {
    const p = defaultProject();
    const a = encodeLinkAuto(p, { maxChars: 1000 });
    expect(a.includedCurves).toBe(false);
    expect(a.omittedCurves).toEqual(p.curves.map((c) => c.label));
    expect(a.fragment).toBe(encodeLink(p, { includeCurves: false }));
  });

  it("random full-precision data of 2000 points does not fit the default limit", () => {
    let s = 7;
    const rnd = () => (s = (s * 16807) % 2147483647) / 2147483647;
    const m = Float64Array.from({ length: 2000 }, () => 1e-6 * (1 + rnd()));
    const p: Project = { ...defaultProject(), curves: [newCurve({ id: "big", label: "Big", massEv: m, gInvGeV: m })] };
    const a = encodeLinkAuto(p);
    expect(a.includedCurves).toBe(false);
    expect(a.omittedCurves).toEqual(["Big"]);
  });
});

describe("decodeLink refuses broken links with a clear message", () => {
  const good = encodeLink(defaultProject(), { includeCurves: false });

  it.each([
    ["", /empty/],
    ["#", /empty/],
    ["hello", /not an axband project link/],
    ["v1.", /damaged/],
    ["v1.Zm9v!!", /characters that do not belong/],
    ["v1.AAAAA", /damaged \(it looks cut off/],
    ["v1.AAAA", /damaged \(its compressed data/],
    [`v7.${good.slice(3)}`, /newer version of axband \(format v7\)/],
    [`v0.${good.slice(3)}`, /damaged \(unknown format v0\)/],
    [good.slice(0, good.length - 20), /damaged/],
  ])("%j", (fragment, message) => {
    const r = decodeLink(fragment);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(message);
  });

  const pack = (b: Uint8Array) => `v1.${Buffer.from(deflateSync(b, { level: 9 })).toString("base64url")}`;

  it.each([
    ["not json", /not valid project data\)/],
    ["[1,2]", /not an object/],
    ['{"m":5}', /models are not a list/],
    ['{"f":"big"}', /the figure is not an object/],
    ['{"c":[{"i":"x","m":{"e":[0],"d":[1.5]}}]}', /not an integer/],
    ['{"c":[{"i":"x","m":{"e":[0,0],"d":[1]}}]}', /neither a list of numbers nor/],
  ])("valid compression of %j", (json, message) => {
    const r = decodeLink(pack(bytes(json)));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(message);
  });

  it("valid compression of bytes that are not UTF-8", () => {
    const r = decodeLink(pack(Uint8Array.of(0x7b, 0xff, 0xfe, 0x7d)));
    expect(!r.ok && r.error).toMatch(/not text/);
  });

  it("valid JSON with unrepairable models: opened, the models left out and named in the repairs", () => {
    const r = decodeLink(pack(bytes('{"m":[{"i":"a","a":"8/3"},{"i":"b","a":"x","l":"Bad"}]}')));
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.project.models.map((m) => m.id)).toEqual(["a"]);
      expect(r.repairs).toHaveLength(1);
      expect(r.repairs[0]).toContain('"Bad"');
    }
  });
});

/**
 * A raw DEFLATE stream (RFC 1951 §3.2.6, one block with the fixed Huffman codes) that inflates to `n`
 * zero bytes: a literal 0, then (length 258, distance 1) copies. Each copy is 13 bits (code 285 = 8 bits,
 * distance code 0 = 5 bits), so ~200 MB of output needs only ~1.3 MB of input.
 */
function zeroBomb(n: number): Uint8Array {
  const copies = Math.floor((n - 1) / 258);
  const rest = n - 1 - copies * 258;
  const out = new Uint8Array(Math.ceil((3 + 8 + copies * 13 + rest * 8 + 7) / 8) + 1);
  let bit = 0;
  const put = (b: number) => {
    if (b) out[bit >> 3] |= 1 << (bit & 7);
    bit++;
  };
  // Header bits go least significant first; Huffman codes most significant first (RFC 1951 §3.1.1).
  const code = (value: number, len: number) => {
    for (let i = len - 1; i >= 0; i--) put((value >> i) & 1);
  };
  put(1); // BFINAL
  put(1); // BTYPE = 01 (fixed Huffman), low bit first
  put(0);
  code(0b00110000, 8); // literal 0
  for (let i = 0; i < copies; i++) {
    code(0b11000101, 8); // length code 285 = 258
    code(0, 5); // distance code 0 = 1
  }
  for (let i = 0; i < rest; i++) code(0b00110000, 8);
  code(0, 7); // end of block (256)
  return out.subarray(0, (bit + 7) >> 3);
}

describe("compression bomb", () => {
  it("the hand-made stream is valid DEFLATE (checked with fflate on a small size)", () => {
    const small = inflateSync(zeroBomb(100_000));
    expect(small.length).toBe(100_000);
    expect(small.every((b) => b === 0)).toBe(true);
  });

  it("200 MB of zeros is refused with a message, after unpacking little more than the cap", () => {
    const bomb = zeroBomb(200 * 1024 * 1024);
    const inflated = inflateWithCap(bomb);
    expect(inflated.ok).toBe(false);
    if (!inflated.ok) {
      expect(inflated.reason).toBe("too-big");
      // Fed in 1 KiB steps, DEFLATE cannot overshoot the cap by more than ~1032 × 1 KiB.
      expect(inflated.inflatedBytes).toBeLessThanOrEqual(LINK_MAX_DECODED_BYTES + 1032 * 1024 + 65536);
    }
    const r = decodeLink(`v1.${Buffer.from(bomb).toString("base64url")}`);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toContain(`more than ${LINK_MAX_DECODED_BYTES / 1048576} MB`);
  });

  it("a cap smaller than the content refuses; a cap above it accepts the same bytes", () => {
    const data = deflateSync(new Uint8Array(300_000).fill(7), { level: 9 });
    const small = inflateWithCap(data, 100_000);
    expect(!small.ok && small.reason).toBe("too-big");
    const big = inflateWithCap(data, 1_000_000);
    expect(big.ok && big.bytes.length).toBe(300_000);
  });
});

describe("large links", () => {
  it("a link unpacking to more than the fast path's buffer (256 kB) still decodes exactly", () => {
    let s = 3;
    const rnd = () => (s = (s * 48271) % 2147483647) / 2147483647;
    const m = Float64Array.from({ length: 20_000 }, () => 1e-6 * (1 + rnd()));
    const g = Float64Array.from({ length: 20_000 }, () => 1e-14 * (1 + rnd()));
    const p: Project = { ...defaultProject(), curves: [newCurve({ id: "big", massEv: m, gInvGeV: g })] };
    const link = encodeLink(p);
    const json = inflateSync(Buffer.from(linkPayload(link), "base64url"));
    expect(json.length).toBeGreaterThan(256 * 1024);
    const r = decodeLink(link);
    expect(r.ok && projectsEqual(r.project, p)).toBe(true);
  });
});
