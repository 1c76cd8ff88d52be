// Golden figures: the fixture project rendered at every size preset (and in the normalized view with a
// frequency axis), compared with committed SVGs after a normalisation (ids renumbered, numbers rounded to
// 3 decimals; common practice for figure tests). A mismatch writes NAME-changed.svg next to the golden;
// AXBAND_UPDATE_GOLDEN=1 rewrites the goldens. A missing golden fails.
import { existsSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";
import { buildScene, writeSvg } from "../../src/plot/index";
import { parseXml, unsafeParts } from "../cli/svg-checks";
import { goldenVariants as variants } from "./fixture";

const GOLDEN_DIR = join(dirname(fileURLToPath(import.meta.url)), "golden");
const UPDATE = process.env.AXBAND_UPDATE_GOLDEN === "1";

/** Ids renumbered in order of first appearance (references follow), numbers rounded to 3 decimals. */
export function normaliseSvg(svg: string): string {
  const ids = new Map<string, string>();
  for (const m of svg.matchAll(/\sid="([^"]*)"/g)) if (!ids.has(m[1])) ids.set(m[1], `id${ids.size + 1}`);
  let out = svg.replace(/(\sid=")([^"]*)(")/g, (_, a, id, b) => a + (ids.get(id) ?? id) + b);
  out = out.replace(/url\(#([^)]*)\)/g, (_, id) => `url(#${ids.get(id) ?? id})`);
  out = out.replace(/-?\d+\.\d+(?:e[-+]?\d+)?/g, (n) => {
    const r = Math.round(Number(n) * 1000) / 1000;
    return Object.is(r, -0) ? "0" : String(r);
  });
  return out;
}

describe("golden SVG figures", () => {
  for (const [name, project] of variants()) {
    test(`${name} matches tests/plot/golden/${name}.svg`, () => {
      const svg = writeSvg(buildScene(project), { metadata: "axband golden test" });
      const doc = parseXml(svg);
      expect(unsafeParts(doc)).toEqual([]);
      const goldenPath = join(GOLDEN_DIR, `${name}.svg`);
      const changedPath = join(GOLDEN_DIR, `${name}-changed.svg`);
      if (UPDATE) {
        writeFileSync(goldenPath, svg);
        rmSync(changedPath, { force: true });
      }
      expect(existsSync(goldenPath), `missing golden ${goldenPath}; run with AXBAND_UPDATE_GOLDEN=1 to create it`).toBe(
        true,
      );
      const same = normaliseSvg(readFileSync(goldenPath, "utf8")) === normaliseSvg(svg);
      if (!same) writeFileSync(changedPath, svg);
      else rmSync(changedPath, { force: true });
      expect(same, `figure changed; see ${changedPath}`).toBe(true);
    });
  }

  test("the normalisation renumbers ids and rounds numbers, nothing else", () => {
    const a = '<g id="x-1" clip-path="url(#x-1)"><path d="M1.0004 2L3.12345 4"/></g>';
    expect(normaliseSvg(a)).toBe('<g id="id1" clip-path="url(#id1)"><path d="M1 2L3.123 4"/></g>');
  });
});
