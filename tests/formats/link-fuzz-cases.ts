// Mutated share links for the fuzz test (seeded, 5,000 links) and `npm run fuzz` (100,000): truncated, bit-flipped,
// random base64, base64 of random bytes, compressed garbage, compressed nasty JSON with prototype keys, deep
// nesting and huge numbers, mutated compact objects (unchecked v1 and re-checksummed v3), damaged prefixes.
// A fixed fast generator (not fast-check) keeps it quick; most payloads are stored DEFLATE blocks (level 0).
import { deflateSync, inflateSync } from "fflate";
import { crc32 } from "../../src/formats/crc32";
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
  projectsEqual,
} from "../../src/data/index";
import type { Project } from "../../src/project/types";

/** Kinds of mutation made from a link axband wrote (cut, bit flip, letters replaced, inserted or deleted, prefix). */
const DAMAGED_COPY = new Set([0, 1, 2, 3, 9]);

/** The checksum of format v3 computed here from its definition (CRC-32, big-endian, base64url). */
function checksumOf(text: string): string {
  const c = crc32(new TextEncoder().encode(text));
  return base64UrlEncode(Uint8Array.of(c >>> 24, (c >>> 16) & 255, (c >>> 8) & 255, c & 255));
}

export interface FuzzCounts {
  total: number;
  /** Per kind of mutation (0–9). */
  accepted: number[];
  refused: number[];
  throws: string[];
  emptyMessages: string[];
  invalidAccepted: string[];
  /** Damaged copies of a written link that opened as a different project (must stay empty). */
  changedAccepted: string[];
}

/** xorshift32 (Marsaglia, "Xorshift RNGs", J. Stat. Softw. 8 (2003) 14): fast and reproducible. */
export function xorshift(seed: number) {
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
const packChecked = (b: Uint8Array) => {
  const text = `v3.${base64UrlEncode(deflateSync(b, { level: 0 }))}`;
  return `${text}.${checksumOf(text)}`;
};

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

/** Decodes `total` mutated links made with the xorshift generator seeded by `seed` and counts what happened. */
export function runLinkFuzz(total: number, seed: number): FuzzCounts {
  const rng = xorshift(seed);
  const bases = [encodeLink(defaultProject(), { includeCurves: false }), encodeLink(smallProject())];
  const originals = bases.map((l) => {
    const r = decodeLink(l);
    if (!r.ok) throw new Error(r.error);
    return r.project;
  });
  const compacts = bases.map(
    (l) =>
      JSON.parse(
        new TextDecoder().decode(inflateSync(base64UrlDecode(l.slice(3, l.lastIndexOf("."))) ?? new Uint8Array())),
      ) as unknown,
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

  const kinds = 10;
  const refused = new Array<number>(kinds).fill(0);
  const accepted = new Array<number>(kinds).fill(0);
  const throws: string[] = [];
  const emptyMessages: string[] = [];
  const invalidAccepted: string[] = [];
  const changedAccepted: string[] = [];

  for (let n = 0; n < total; n++) {
    const kind = n % kinds;
    const from = rng.int(bases.length);
    const base = bases[from];
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
      case 8: {
        // valid compression of a mutated compact object: unchecked (v1), or with a matching checksum (v3)
        const json = utf8(mutateCompact(rng.pick(compacts), rng));
        link = rng.int(2) ? packChecked(json) : pack(json, rng.int(10) ? 0 : 6);
        break;
      }
      default: {
        // a damaged or foreign version prefix
        const rest = base.slice(3);
        link = rng.pick([
          `v${rng.int(1000)}.${rest}`,
          rest,
          `V3.${rest}`,
          `v3${rest}`,
          `#v3.${rest}`,
          `v3..${rest}`,
          `v-3.${rest}`,
          `v1.${rest}`,
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
      // A damaged copy of a link axband wrote opens only as exactly the project it was made from.
      if (DAMAGED_COPY.has(kind) && !projectsEqual(r.project, originals[from])) changedAccepted.push(link);
    } else {
      refused[kind]++;
      if (typeof r.error !== "string" || r.error.trim().length < 10) emptyMessages.push(link);
    }
  }

  return { total, accepted, refused, throws, emptyMessages, invalidAccepted, changedAccepted };
}
