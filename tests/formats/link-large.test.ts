// The link encoder for large projects: it writes exactly the v1 compact JSON of the first (string-based)
// encoder (kept below as the reference), packs at a level chosen by size into raw DEFLATE that any inflater
// reads, stops early under a length limit, and the decoder's fast decimal path equals a correctly rounded parse.
import { Buffer } from "node:buffer";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { deflateRawSync, inflateRawSync } from "node:zlib";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { linkPayload } from "./link-parts";
import {
  base64UrlDecode,
  base64UrlEncode,
  decodeLink,
  defaultProject,
  encodeLink,
  encodeLinkAuto,
  encodeLinkWithin,
  inflateWithCap,
  newCurve,
  projectsEqual,
} from "../../src/data/index";
import type { Project } from "../../src/project/types";

/**
 * The v1 encoder's curve-data form as first written (commit b4879bf, string based and slow): the reference
 * the fast encoder must match value for value. Copied, not imported, so that it cannot change with the code.
 */
function referenceNumbers(a: Float64Array): unknown {
  const plain = Array.from(a);
  if (a.length < 4) return plain;
  const digits: string[] = new Array<string>(a.length);
  const exps = new Int32Array(a.length);
  let width = 1;
  for (let i = 0; i < a.length; i++) {
    const [mant, exp] = a[i].toExponential().split("e");
    const [whole, frac = ""] = mant.replace("-", "").split(".");
    digits[i] = whole + frac;
    exps[i] = Number(exp) - frac.length;
    width = Math.max(width, digits[i].length);
    if (width > 15) return plain;
  }
  const e: number[] = new Array<number>(a.length);
  const d: number[] = new Array<number>(a.length);
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

/** The compact JSON text inside a link, unpacked with Node's zlib (an independent RFC 1951 inflater). */
function compactText(link: string): string {
  return inflateRawSync(Buffer.from(linkPayload(link), "base64url"), { maxOutputLength: 200 * 1024 * 1024 }).toString(
    "utf8",
  );
}

// Built once: the property runs below make hundreds of projects, and building the demo's curves is most of each.
const DEMO = defaultProject();

function oneCurve(massEv: Float64Array, gInvGeV: Float64Array = massEv.slice().reverse()): Project {
  return { ...DEMO, curves: [newCurve({ id: "c", label: "Invented", massEv, gInvGeV })] };
}

/** xorshift32 (Marsaglia, J. Stat. Softw. 8 (2003) 14) for large reproducible data. */
function rng(seed: number) {
  let x = seed >>> 0 || 1;
  return () => {
    x ^= x << 13;
    x >>>= 0;
    x ^= x >>> 17;
    x ^= x << 5;
    x >>>= 0;
    return x / 4294967296;
  };
}

/** n invented points with `digits` significant digits: sorted masses around 1 μeV, couplings around 1e-13. */
function fewDigitCurve(n: number, digits: number, seed = 1): { m: Float64Array; g: Float64Array } {
  const r = rng(seed);
  const m = new Float64Array(n);
  const g = new Float64Array(n);
  const q = 10 ** (digits - 1);
  for (let i = 0; i < n; i++) {
    m[i] = Number((1e-6 * (1 + (9 * i) / n)).toPrecision(digits));
    g[i] = Math.round(q * (1 + 9 * r())) / q / 1e13;
    g[i] = Number(g[i].toPrecision(digits));
  }
  return { m, g };
}

// Values of every kind the encoder must handle: few digits at any exponent (the fast path covers |e| ≤ 22,
// the rest takes the slow one), full precision, zeros, negatives, subnormals and the largest doubles.
const fewDigits = fc
  .tuple(fc.integer({ min: 1, max: 999_999_999 }), fc.integer({ min: -330, max: 300 }), fc.boolean())
  .map(([m, e, neg]) => (neg ? -1 : 1) * Number(`${m}e${e}`))
  .filter((x) => Number.isFinite(x));
const anyValue = fc.oneof(
  { weight: 6, arbitrary: fewDigits },
  { weight: 2, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) },
  {
    weight: 1,
    arbitrary: fc.constantFrom(
      0,
      -0,
      5e-324,
      -5e-324,
      1.7976931348623157e308,
      2 ** -1022,
      9.999999999999999e22,
      1e23,
      1e-22,
      1e22,
      123456789012345,
      0.1,
      0.2,
    ),
  },
);

describe("the v1 compact JSON is unchanged", () => {
  it("curve data are written exactly as the first v1 encoder wrote them (random columns of every kind)", () => {
    fc.assert(
      fc.property(
        fc.array(anyValue, { maxLength: 60 }),
        fc.array(fewDigits.map(Math.abs), { minLength: 4, maxLength: 60 }),
        (mixed, few) => {
          for (const values of [mixed, few]) {
            const a = Float64Array.from(values);
            const text = compactText(encodeLink(oneCurve(a, a)));
            const ref = JSON.stringify(referenceNumbers(a));
            expect(text).toContain(`"m":${ref},"g":${ref}`);
          }
        },
      ),
      { numRuns: 400 },
    );
  });

  it("values that widen the digit count midway re-pad the earlier ones as the reference does", () => {
    const a = Float64Array.of(1e-6, 2e-6, 3e-6, 1.5e-6, 1.25e-6, 1.125e-6, 0, 1.0625e-6, 1.234567891234e-6, 4e-6);
    expect(compactText(encodeLink(oneCurve(a, a)))).toContain(`"m":${JSON.stringify(referenceNumbers(a))}`);
  });

  it("a golden link re-encodes to the same compact JSON (the demo byte for byte, curves and all)", () => {
    const dir = join(import.meta.dirname, "..", "project", "golden", "v1");
    for (const name of ["demo", "kitchen"]) {
      const golden = readFileSync(join(dir, `${name}.link.txt`), "utf8").trim();
      const r = decodeLink(golden);
      if (!r.ok) throw new Error(r.error);
      const again = encodeLink(r.project);
      expect(JSON.parse(compactText(again))).toEqual(JSON.parse(compactText(golden)));
      // Format v3 writes the same payload as v1 for models without kinds (the checksum is added after it).
      if (name === "demo") expect(linkPayload(again)).toBe(linkPayload(golden));
    }
  });
});

describe("large projects", () => {
  // 2 × 300,000 values: more than 524,288, so the level-1 stream runs (and ~4 MB of compact JSON).
  const big = fewDigitCurve(300_000, 7, 5);
  const bigProject = oneCurve(big.m, big.g);
  const bigLink = encodeLink(bigProject);

  it("a link of 300,000 points (streamed at level 1) decodes to exactly the same project", () => {
    expect(compactText(bigLink).length).toBeGreaterThan(3_000_000);
    const r = decodeLink(bigLink);
    expect(r.ok).toBe(true);
    if (r.ok) expect(projectsEqual(r.project, bigProject)).toBe(true);
  });

  it("links of 300,000 values (streamed at level 6) and 40,000 values (level 9) decode exactly and read with zlib", () => {
    for (const n of [150_000, 20_000]) {
      const { m, g } = fewDigitCurve(n, 6, n);
      const p = oneCurve(m, g);
      const link = encodeLink(p);
      const json = compactText(link);
      expect(json.length).toBeGreaterThan(n * 10);
      expect(JSON.parse(json)).toHaveProperty("c");
      const r = decodeLink(link);
      expect(r.ok && projectsEqual(r.project, p)).toBe(true);
    }
  });

  it("full-precision data (number lists) of 100,000 points decode exactly", () => {
    const r0 = rng(9);
    const m = Float64Array.from({ length: 100_000 }, () => 1e-6 * (1 + r0()));
    const g = Float64Array.from({ length: 100_000 }, () => 1e-13 * (1 + r0()));
    const p = oneCurve(m, g);
    const r = decodeLink(encodeLink(p));
    expect(r.ok && projectsEqual(r.project, p)).toBe(true);
  });

  it("the level-6 and level-1 packings are deterministic (the CLI and the app give the same bytes)", () => {
    expect(encodeLink(bigProject)).toBe(bigLink);
  });

  it("encodeLinkWithin gives the link when it fits and null as soon as it cannot, for small and streamed links", () => {
    const small = encodeLink(defaultProject());
    expect(encodeLinkWithin(defaultProject(), small.length)).toBe(small);
    expect(encodeLinkWithin(defaultProject(), small.length - 1)).toBeNull();
    expect(encodeLinkWithin(bigProject, bigLink.length)).toBe(bigLink);
    expect(encodeLinkWithin(bigProject, bigLink.length - 1)).toBeNull();
    expect(encodeLinkWithin(bigProject, 100_000)).toBeNull();
    expect(encodeLinkWithin(defaultProject(), 2)).toBeNull();
  });

  it("encodeLinkAuto leaves the curves of a large project out and names them", () => {
    const a = encodeLinkAuto(bigProject);
    expect(a.includedCurves).toBe(false);
    expect(a.omittedCurves).toEqual(["Invented"]);
    expect(a.fragment).toBe(encodeLink(bigProject, { includeCurves: false }));
  });

  it("inflateWithCap unpacks a large stream exactly as zlib does, and refuses it under a smaller cap", () => {
    const bytes = base64UrlDecode(linkPayload(bigLink));
    if (!bytes) throw new Error("not base64url");
    const want = inflateRawSync(bytes, { maxOutputLength: 200 * 1024 * 1024 });
    const got = inflateWithCap(bytes);
    expect(got.ok).toBe(true);
    if (got.ok) expect(Buffer.from(got.bytes).equals(want)).toBe(true);
    const capped = inflateWithCap(bytes, want.length - 1);
    expect(capped.ok).toBe(false);
    if (!capped.ok) {
      expect(capped.reason).toBe("too-big");
      // Steps never unpack past the room left under the cap, except at the 1 KiB floor (≤ 1032 × 1 KiB).
      expect(capped.inflatedBytes).toBeLessThanOrEqual(want.length - 1 + 1032 * 1024 + 65536);
    }
  });

  it("base64url of 1 MB of random bytes agrees with Node's encoder both ways", () => {
    const r0 = rng(11);
    const b = Uint8Array.from({ length: 1_000_001 }, () => Math.floor(r0() * 256));
    const ours = base64UrlEncode(b);
    expect(ours).toBe(Buffer.from(b).toString("base64url"));
    expect(Buffer.from(base64UrlDecode(ours) ?? []).equals(Buffer.from(b))).toBe(true);
    // Standard base64 with padding, as a tool might rewrite it, decodes too (RFC 4648 §4).
    expect(Buffer.from(base64UrlDecode(Buffer.from(b).toString("base64")) ?? []).equals(Buffer.from(b))).toBe(true);
  });
});

describe("decoding the decimal delta form", () => {
  it("m × 10^e gives the double a correctly rounded parse of the decimal gives (ECMA-262 StringToNumber)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 1, max: Number.MAX_SAFE_INTEGER }), fc.integer({ min: -40, max: 40 })), {
          minLength: 1,
          maxLength: 50,
        }),
        (pairs) => {
          const e: number[] = [];
          const d: number[] = [];
          let pm = 0;
          let pe = 0;
          for (const [m, x] of pairs) {
            d.push(m - pm);
            e.push(x - pe);
            pm = m;
            pe = x;
          }
          // Steps beyond 2⁵³ are not safe integers, which the format forbids: such inputs are not links.
          fc.pre(d.every(Number.isSafeInteger));
          const json = JSON.stringify({ c: [{ i: "x", m: { e, d }, g: { e, d } }] });
          const r = decodeLink(`v1.${deflateRawSync(json).toString("base64url")}`);
          expect(r.ok).toBe(true);
          if (!r.ok) return;
          expect(Array.from(r.project.curves[0].massEv)).toEqual(pairs.map(([m, x]) => Number(`${m}e${x}`)));
        },
      ),
      { numRuns: 300 },
    );
  });
});
