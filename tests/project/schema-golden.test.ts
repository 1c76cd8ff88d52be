// Golden links and project files, one folder per schema version (tests/project/golden/vN; a link's own format
// number may be higher, e.g. the checked format v3 of schema version 1): each NAME.link.txt and
// NAME.axband.json must decode, forever, to NAME.expected.json; so must an SVG figure exported then, which carries
// the link's text in its <metadata>. Goldens are written once and never regenerated;
// a new schema version adds a folder and keeps the old ones.
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { CURRENT_VERSION, LINK_FORMAT_VERSION, decodeLink, projectFromFile, projectsEqual } from "../../src/data/index";
import { AXBAND_PROJECT_NS, EMBED_ENCODING } from "../../src/formats/figure-file";
import { extractProjectFromSvg } from "../../src/formats/figure-read";
import type { Project } from "../../src/project/types";

const GOLDEN = join(import.meta.dirname, "golden");

/**
 * What a version-1 expected project is in version 2, written out here rather than taken from the migration under
 * test: each model gains its kind (one line when both ends are the same value, which the v1 goldens write as
 * the same text, else the interval it drew), no members and the default set drawing.
 */
function upgradeV1(raw: Record<string, unknown>): Record<string, unknown> {
  const models = (raw.models as Record<string, unknown>[]).map((m) => ({
    ...m,
    kind: m.eOverNMin === m.eOverNMax ? "line" : "interval",
    members: [],
    setDraw: "extremes",
    setShare: 0.68,
  }));
  return { ...raw, version: 2, models };
}

/** Expected project from its plain JSON (curve data as number arrays), without going through the code under test. */
function expectedProject(path: string): Project {
  let json = JSON.parse(readFileSync(path, "utf8")) as Record<string, unknown>;
  if (json.version === 1) json = upgradeV1(json);
  const raw = json as unknown as Project & { curves: { massEv: number[]; gInvGeV: number[] }[] };
  return {
    ...raw,
    // Keys that joined a version without a bump are absent from goldens written before them and read as their
    // default (DEVELOPERS.md "Schema changes"): the figure font (sans, the look those figures had); the mass axis
    // in eV and the automatic frequency unit (as those figures were labelled); ticks outward (the house style); a curve's
    // exclusion mark (hatches, the house style, unless the curve set a fill opacity other than 0.3 or 0: its fill); the legend
    // text size (1, the size they were drawn with).
    figure: {
      ...raw.figure,
      font: (raw.figure as Partial<Project["figure"]>).font ?? "sans",
      massUnit: (raw.figure as Partial<Project["figure"]>).massUnit ?? "eV",
      frequencyUnit: (raw.figure as Partial<Project["figure"]>).frequencyUnit ?? "auto",
      ticks: (raw.figure as Partial<Project["figure"]>).ticks ?? "out",
      legendScale: (raw.figure as Partial<Project["figure"]>).legendScale ?? 1,
    },
    curves: raw.curves.map((c) => ({
      ...c,
      exclusionMark: c.exclusionMark ?? (c.fillOpacity !== 0.3 && c.fillOpacity !== 0 ? "fill" : "hatch"),
      massEv: Float64Array.from(c.massEv),
      gInvGeV: Float64Array.from(c.gInvGeV),
    })),
  };
}

const versions = readdirSync(GOLDEN)
  .filter((d) => /^v\d+$/.test(d))
  .map((d) => Number(d.slice(1)))
  .sort((a, b) => a - b);

describe("golden links and files", () => {
  it("there is a golden folder with a link and a file for every schema version up to the current one", () => {
    expect(versions).toEqual(Array.from({ length: CURRENT_VERSION }, (_, i) => i + 1));
    // The link format written today has a golden link in the folder of today's schema version.
    const current = readdirSync(join(GOLDEN, `v${CURRENT_VERSION}`)).filter((f) => f.endsWith(".link.txt"));
    expect(
      current.some((f) =>
        readFileSync(join(GOLDEN, `v${CURRENT_VERSION}`, f), "utf8").startsWith(`v${LINK_FORMAT_VERSION}.`),
      ),
    ).toBe(true);
    for (const v of versions) {
      const files = readdirSync(join(GOLDEN, `v${v}`));
      expect(files.some((f) => f.endsWith(".link.txt"))).toBe(true);
      expect(files.some((f) => f.endsWith(".axband.json"))).toBe(true);
    }
  });

  for (const v of versions) {
    const dir = join(GOLDEN, `v${v}`);
    const files = readdirSync(dir);
    for (const f of files.filter((x) => x.endsWith(".link.txt"))) {
      it(`v${v}/${f} decodes to its expected project`, () => {
        const fragment = readFileSync(join(dir, f), "utf8").trim();
        // A link of any format whose compact object belongs to schema version v; from format v3 on it is checked.
        const format = Number(/^v(\d+)\./.exec(fragment)?.[1]);
        const r = decodeLink(fragment);
        if (!r.ok) throw new Error(r.error);
        expect(r.repairs).toEqual([]);
        expect(r.verified).toBe(format >= 3);
        const expected = expectedProject(join(dir, f.replace(/\.link\.txt$/, ".expected.json")));
        expect(projectsEqual(r.project, expected)).toBe(true);
      });
      it(`v${v}/${f} inside an SVG figure of its time opens to its expected project`, () => {
        // The figure file's layout: the link text in <axband:project> under <metadata> (the CLI reads it as input too).
        const link = readFileSync(join(dir, f), "utf8").trim();
        const project = `<axband:project xmlns:axband="${AXBAND_PROJECT_NS}" encoding="${EMBED_ENCODING}" version="${v}">${link}</axband:project>`;
        const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10">\n<metadata>${project}</metadata>\n</svg>\n`;
        const r = extractProjectFromSvg(svg);
        if (!r.ok) throw new Error(r.error);
        expect(r.repairs).toEqual([]);
        const expected = expectedProject(join(dir, f.replace(/\.link\.txt$/, ".expected.json")));
        expect(projectsEqual(r.project, expected)).toBe(true);
      });
    }
    for (const f of files.filter((x) => x.endsWith(".axband.json"))) {
      it(`v${v}/${f} opens to its expected project`, () => {
        const r = projectFromFile(readFileSync(join(dir, f), "utf8"), f);
        if (!r.ok) throw new Error(r.error);
        expect(r.repairs).toEqual([]);
        const expected = expectedProject(join(dir, f.replace(/\.axband\.json$/, ".expected.json")));
        expect(projectsEqual(r.project, expected)).toBe(true);
      });
    }
  }

  it("the curve-less demo link carries no curves but says how many were left out", () => {
    const r = decodeLink(readFileSync(join(GOLDEN, "v1", "demo-nocurves.link.txt"), "utf8"));
    expect(r.ok && r.project.curves.length).toBe(0);
    expect(r.ok && r.omittedCurveCount).toBe(4);
  });
});
