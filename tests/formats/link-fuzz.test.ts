// Fuzzing the link decoder with 100,000 mutated links (truncated, bit-flipped, random base64, base64 of random
// bytes, compressed garbage, compressed nasty JSON with prototype keys, deep nesting and huge numbers, mutated
// compact objects): nothing throws, nothing touches the global prototypes, every refusal has a message, and
// everything accepted is a valid project. A fixed fast generator (not fast-check) keeps it to seconds, and
// most generated payloads are packed as stored DEFLATE blocks (level 0), which are cheap to make and unpack.
import { deflateSync, inflateSync } from "fflate";
import { describe, expect, it } from "vitest";
import {
  ProjectSchema,
  base64UrlDecode,
  base64UrlEncode,
  decodeLink,
  defaultProject,
  encodeLink,
  newCurve,
  newModel,
  projectToJsonValue,
} from "../../src/data/index";
import type { Project } from "../../src/project/types";

const TOTAL = 100_000;

/** xorshift32 (Marsaglia, "Xorshift RNGs", J. Stat. Softw. 8 (2003) 14): fast and reproducible. */
function xorshift(seed: number) {
  let x = seed >>> 0 || 1;
  const next = () => {
    x ^= x << 13;
    x >>>= 0;
    x ^= x >>> 17;
    x ^= x << 5;
    x >>>= 0;
    return x;
  };
  return { int: (n: number) => next() % n, pick: <T>(a: readonly T[]): T => a[next() % a.length] };
}

const B64 = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_";
const utf8 = (s: string) => new TextEncoder().encode(s);
const pack = (b: Uint8Array, level: 0 | 6 = 6) => `v1.${base64UrlEncode(deflateSync(b, { level }))}`;

function smallProject(): Project {
  const p = defaultProject();
  return {
    ...p,
    name: "fuzz base",
    models: [
      p.models[2],
      newModel({
        id: "calc",
        eOverNMin: "2/3",
        source: {
          kind: "calculator",
          scalarCharge: "1",
          fermions: [{ colour: "3", ew: { kind: "sm", dim: 1, y: "-1/3" }, chirality: "L", pq: 1 }],
        },
      }),
    ],
    curves: [
      newCurve({
        id: "few",
        label: "few digits",
        massEv: Float64Array.of(1e-6, 2e-6, 3e-6, 4e-6, 5e-6),
        gInvGeV: Float64Array.of(1e-14, 2e-14, 1.5e-14, 3e-14, 9e-15),
      }),
      newCurve({
        id: "full",
        label: "full",
        role: "region",
        massEv: Float64Array.of(Math.PI * 1e-5, Math.E * 1e-5, 1e-5),
        gInvGeV: Float64Array.of(1e-12, 2e-12, 3e-12),
      }),
    ],
    figure: { ...p.figure, yView: "normalized", yRange: [0.1, 10], title: "t" },
  };
}

const KEYS = [
  "n",
  "p",
  "f",
  "m",
  "c",
  "o",
  "i",
  "l",
  "a",
  "b",
  "s",
  "y",
  "k",
  "v",
  "g",
  "e",
  "d",
  "r",
  "t",
  "w",
  "h",
  "x",
  "kind",
  "fermions",
  "__proto__",
  "constructor",
  "prototype",
  "toString",
  "valueOf",
  "hasOwnProperty",
];

function randomJson(rng: ReturnType<typeof xorshift>, depth: number): string {
  const k = rng.int(depth > 3 ? 6 : 9);
  switch (k) {
    case 0:
      return rng.pick([
        "0",
        "-0",
        "1",
        "-1",
        "1e308",
        "-1e308",
        "1e999",
        "-1e999",
        "5e-324",
        "123456789012345678901234567890",
        "0.1",
        "8",
      ]);
    case 1:
      return JSON.stringify(
        rng.pick([
          "",
          "8/3",
          "1/0",
          "x",
          "__proto__",
          "constructor",
          "#fff",
          "solid",
          "typed",
          "calculator",
          "\u0000",
          "e".repeat(700),
        ]),
      );
    case 2:
      return rng.pick(["true", "false", "null"]);
    case 3:
      return "[]";
    case 4:
      return "{}";
    case 5:
      return JSON.stringify(rng.int(1e6) - 5e5);
    case 6:
    case 7: {
      const n = rng.int(5);
      return `[${Array.from({ length: n }, () => randomJson(rng, depth + 1)).join(",")}]`;
    }
    default: {
      const n = rng.int(5);
      return `{${Array.from({ length: n }, () => `${JSON.stringify(rng.pick(KEYS))}:${randomJson(rng, depth + 1)}`).join(",")}}`;
    }
  }
}

/** Replace one random node of a parsed compact object by a random JSON value (or add a random key). */
function mutateCompact(compact: unknown, rng: ReturnType<typeof xorshift>): string {
  const text = JSON.stringify(compact);
  // Pick a random value position in the JSON text (after ':' or '[' or ','), splice in a random value.
  const spots: number[] = [];
  for (let i = 0; i < text.length; i++) if (text[i] === ":" || text[i] === "[" || text[i] === ",") spots.push(i + 1);
  const at = rng.pick(spots);
  // Find the end of the value starting at `at` by scanning brackets and strings.
  let depth = 0;
  let j = at;
  let inStr = false;
  for (; j < text.length; j++) {
    const ch = text[j];
    if (inStr) {
      if (ch === "\\") j++;
      else if (ch === '"') inStr = false;
      continue;
    }
    if (ch === '"') inStr = true;
    else if (ch === "[" || ch === "{") depth++;
    else if (ch === "]" || ch === "}") {
      if (depth === 0) break;
      depth--;
    } else if (ch === "," && depth === 0) break;
  }
  const value = randomJson(rng, 1);
  const isKeyPos = text[at - 1] === "," && /^"[^"]*":/.test(text.slice(at));
  if (isKeyPos || text[at - 1] === "{")
    return `${text.slice(0, at)}${JSON.stringify(rng.pick(KEYS))}:${value},${text.slice(at)}`;
  return text.slice(0, at) + value + text.slice(j);
}

function snapshot(): Map<string, unknown> {
  const m = new Map<string, unknown>();
  for (const [name, proto] of [
    ["Object", Object.prototype],
    ["Array", Array.prototype],
    ["Function", Function.prototype],
    ["String", String.prototype],
    ["Number", Number.prototype],
  ] as const) {
    for (const key of Reflect.ownKeys(proto))
      m.set(`${name}.${String(key)}`, Object.getOwnPropertyDescriptor(proto, key)?.value);
  }
  return m;
}

describe("link fuzz", () => {
  // A few hundred µs of CPU per link at most (the valid ones go through zod); the timeout leaves room for a busy machine.
  it(
    `${TOTAL} mutated links: no throw, no global change, a message for every refusal, valid projects only`,
    { timeout: 180_000 },
    () => {
      const rng = xorshift(0xa5b4c3d2);
      const bases = [encodeLink(defaultProject(), { includeCurves: false }), encodeLink(smallProject())];
      const compacts = bases.map(
        (l) =>
          JSON.parse(new TextDecoder().decode(inflateSync(base64UrlDecode(l.slice(3)) ?? new Uint8Array()))) as unknown,
      );
      const deep = (n: number) => "[".repeat(n) + "]".repeat(n);
      const nasty = [
        '{"__proto__":{"polluted":1}}',
        '{"constructor":{"prototype":{"polluted":1}}}',
        '{"m":[{"__proto__":{"polluted":1},"a":"1"}]}',
        '{"m":[{"a":"8/3","constructor":{"prototype":{"polluted":1}}}]}',
        '{"f":{"__proto__":{"polluted":1},"x":[1e999,-1e999]}}',
        '{"c":[{"i":"x","m":{"e":[0,0],"d":[1e308,1e308]},"g":[1,2]}]}',
        '{"c":[{"i":"x","m":{"e":[999999,0],"d":[1,1]},"g":[1,2]}]}',
        '{"m":[{"a":"1e999"}],"p":{"c":{"k":-1,"g":1e999}}}',
        '{"m":[{"a":{"toString":"x"},"b":{"valueOf":1}}]}',
        '{"m":[{"a":"8/3","s":{"kind":"calculator","fermions":[{"__proto__":1}],"scalarCharge":{}}}]}',
        `{"n":"${"x".repeat(20000)}"}`,
        `{"m":[${Array.from({ length: 600 }, () => '{"a":"1"}').join(",")}]}`,
        `{"m":${deep(5000)}}`,
        deep(20000),
        `{"m":[{"a":"1","l":${deep(3000)}}]}`,
        '{"o":1e999,"n":null,"p":[],"f":null}',
      ].map((s) => pack(utf8(s)));

      const before = snapshot();
      const kinds = 10;
      const refused = new Array<number>(kinds).fill(0);
      const accepted = new Array<number>(kinds).fill(0);
      const throws: string[] = [];
      const emptyMessages: string[] = [];
      const invalidAccepted: string[] = [];

      for (let n = 0; n < TOTAL; n++) {
        const kind = n % kinds;
        const base = rng.pick(bases);
        let link: string;
        switch (kind) {
          case 0: // truncated
            link = base.slice(0, rng.int(base.length));
            break;
          case 1: {
            // one bit flipped in one character
            const i = rng.int(base.length);
            link = base.slice(0, i) + String.fromCharCode(base.charCodeAt(i) ^ (1 << rng.int(7))) + base.slice(i + 1);
            break;
          }
          case 2: {
            // a few characters replaced by other base64 characters (valid alphabet, wrong data)
            const chars = base.split("");
            for (let k = 1 + rng.int(3); k > 0; k--) chars[3 + rng.int(chars.length - 3)] = rng.pick(B64.split(""));
            link = chars.join("");
            break;
          }
          case 3: {
            // characters inserted or deleted
            const i = 3 + rng.int(base.length - 3);
            link = rng.int(2)
              ? base.slice(0, i) + base.slice(i + 1 + rng.int(4))
              : base.slice(0, i) + rng.pick(B64.split("")) + base.slice(i);
            break;
          }
          case 4: // random base64 text
            link = `v1.${Array.from({ length: rng.int(400) }, () => B64[rng.int(64)]).join("")}`;
            break;
          case 5: // valid base64 of random bytes
            link = `v1.${base64UrlEncode(Uint8Array.from({ length: rng.int(300) }, () => rng.int(256)))}`;
            break;
          case 6: // valid compression of random bytes
            link = pack(
              Uint8Array.from({ length: rng.int(200) }, () => rng.int(256)),
              rng.int(10) ? 0 : 6,
            );
            break;
          case 7: // valid compression of nasty or random JSON
            link = rng.int(10) === 0 ? rng.pick(nasty) : pack(utf8(randomJson(rng, 0)), rng.int(10) ? 0 : 6);
            break;
          case 8: // valid compression of a mutated compact object
            link = pack(utf8(mutateCompact(rng.pick(compacts), rng)), rng.int(10) ? 0 : 6);
            break;
          default: {
            // a damaged or foreign version prefix
            const rest = base.slice(3);
            link = rng.pick([
              `v${rng.int(1000)}.${rest}`,
              rest,
              `V1.${rest}`,
              `v1${rest}`,
              `#v1.${rest}`,
              `v1..${rest}`,
              `v-1.${rest}`,
            ]);
          }
        }
        let r: ReturnType<typeof decodeLink>;
        try {
          r = decodeLink(link);
        } catch (e) {
          throws.push(`${kind}: ${String(e)}`);
          continue;
        }
        if (r.ok) {
          accepted[kind]++;
          if (!ProjectSchema.safeParse(projectToJsonValue(r.project)).success) invalidAccepted.push(link);
        } else {
          refused[kind]++;
          if (typeof r.error !== "string" || r.error.trim().length < 10) emptyMessages.push(link);
        }
      }

      expect(throws).toEqual([]);
      expect(emptyMessages).toEqual([]);
      expect(invalidAccepted).toEqual([]);
      expect(accepted.reduce((a, b) => a + b) + refused.reduce((a, b) => a + b)).toBe(TOTAL);
      // Every kind of damage is met, and the JSON mutations also reach the repair paths (some are accepted).
      for (let k = 0; k < kinds; k++) expect(refused[k]).toBeGreaterThan(0);
      expect(accepted[8]).toBeGreaterThan(100);
      expect(accepted[7]).toBeGreaterThan(100);
      const after = snapshot();
      expect([...after.keys()].sort()).toEqual([...before.keys()].sort());
      for (const [k, v] of before) expect(after.get(k), k).toBe(v);
      expect(({} as Record<string, unknown>).polluted).toBeUndefined();
      expect(([] as unknown as Record<string, unknown>).polluted).toBeUndefined();
    },
  );
});
