// The small case of the overlap issue, rebuilt from invented data: 3 models (two lines with a theory spread and
// an interval band) × 3 curves (a cavity scan with 8 dips, one of them noisy at its bottom near 21.9 μeV; a flat
// limit; a projection). Checks: one row per model × curve; each dip is one interval however its edges cross; no
// two listed intervals print the same and no interval prints as "a – a"; the E/N column is filled the same way
// for every verdict on screen and in the exports ("all" where the whole band is covered, else the covered E/N).
// Model lines g = α/(2π f_a)·|E/N − c_γ| with m_a f_a fixed (Grilli di Cortona et al., JHEP 01 (2016) 034).
import { describe, expect, test } from "vitest";
import { gAgg } from "../../src/physics";
import { emptyProject, newCurve, newModel } from "../../src/project/defaults";
import { overlapSummary } from "../../src/analysis/overlap-summary";
import { intervalView, rowView } from "../../src/formats/overlap/view";
import { intervalsToCsv, summaryToCsv } from "../../src/formats/overlap/exports";

const DIPS_MU_EV = [2.1, 3.4, 5.0, 7.7, 11.2, 15.8, 21.9, 33.0];
const NOISY = 6; // the dip at 21.9 μeV

/** g of the E/N = 0 line at m (eV). */
const ksvz = (m: number) => gAgg(m, 0, { ref: "2019" });

/** An invented cavity scan: 20 × the E/N = 0 line, with 8 narrow dips to 0.1 × it; one dip's bottom is noisy. */
function cavityScan() {
  const mass: number[] = [];
  const g: number[] = [];
  const at = (mEv: number, f: number) => {
    mass.push(mEv);
    g.push(f * ksvz(mEv));
  };
  at(1e-6, 20);
  DIPS_MU_EV.forEach((mu, j) => {
    const m = mu * 1e-6;
    const w = m * 2e-3;
    at(m - w, 20);
    if (j === NOISY) {
      // The bottom wanders around the E/N = 8/3 line (0.39 × the E/N = 0 line there), in and out of its 1σ band
      // (c_γ ± 0.04 on |8/3 − 1.92| = 0.75, about ± 6 %): a dozen separate crossings.
      const r = Math.abs(8 / 3 - 1.92) / 1.92;
      for (let k = 0; k <= 24; k++) at(m - w / 2 + (k * w) / 24, r * (k % 2 ? 0.85 : 1.15));
    } else {
      at(m - w / 2, 0.1);
      at(m + w / 2, 0.1);
    }
    at(m + w, 20);
  });
  at(5e-5, 20);
  return newCurve({
    id: "cavity",
    label: "cavity scan",
    massEv: Float64Array.from(mass),
    gInvGeV: Float64Array.from(g),
  });
}

function smallCase() {
  const p = emptyProject("small case");
  p.models = [
    newModel({ id: "ksvz", label: "KSVZ-type", eOverNMin: "0", sigmas: 1 }),
    newModel({ id: "dfsz", label: "DFSZ-type", eOverNMin: "8/3", sigmas: 1 }),
    newModel({ id: "band", label: "window", eOverNMin: "5/3", eOverNMax: "44/3" }),
  ];
  const flat = (id: string, role: "exclusion" | "projection", f: number) =>
    newCurve({
      id,
      label: id,
      role,
      massEv: Float64Array.from([1e-6, 5e-5]),
      gInvGeV: Float64Array.from([1e-6, 5e-5].map((m) => f * ksvz(m))),
    });
  p.curves = [cavityScan(), flat("flat limit", "exclusion", 0.5), flat("projection", "projection", 0.05)];
  return p;
}

describe("the issue's small case: 3 models × 3 curves, a cavity scan with 8 dips", () => {
  const rows = overlapSummary(smallCase());
  const shown = rows.filter((r) => r.verdict !== "none");
  const find = (model: string, curve: string) => rows.find((r) => r.modelId === model && r.curveId === curve)!;

  test("at most one row per model × curve", () => {
    expect(rows.length).toBeLessThanOrEqual(9);
    expect(new Set(rows.map((r) => `${r.modelId}|${r.curveId}`)).size).toBe(rows.length);
  });

  test("each clean dip is one interval, wholly and partly covered parts together", () => {
    const r = find("ksvz", "cavity");
    // Every dip reaches 0.1 × the E/N = 0 line, below its spread band: 8 intervals, one per dip.
    expect(r.intervalCount).toBe(8);
    expect(r.verdict).toBe("excluded-whole");
  });

  test("no two listed intervals print the same, and none prints as 'a – a'", () => {
    for (const r of shown) {
      const view = rowView(r);
      const printed = new Set<string>();
      for (let i = 0; i < r.intervals.count; i++) {
        const iv = intervalView(r, view, i);
        expect(iv.lo, `${r.modelId} × ${r.curveId} #${i}`).not.toBe(iv.hi);
        printed.add(`${iv.lo}–${iv.hi}`);
      }
      expect(printed.size).toBe(r.intervals.count);
    }
    // The noisy dip gives several intervals under the E/N = 8/3 line, all near 21.9 μeV.
    const noisy = find("dfsz", "cavity");
    expect(noisy.intervalCount).toBeGreaterThan(DIPS_MU_EV.length);
  });

  test("the E/N column is filled for every verdict, the same on screen and in the CSV", () => {
    const csv = summaryToCsv(shown).trim().split("\n");
    const col = csv[0].split(",").indexOf("EN_best");
    shown.forEach((r, k) => {
      const text = rowView(r).eOverN;
      expect(text, `${r.modelId} × ${r.curveId}`).not.toBe("");
      expect(text).not.toBe("none");
      if (r.shareWhole > 0) expect(text).toBe("all");
      else expect(text).not.toBe("all");
      expect(csv[k + 1].split(",")[col]).toBe(text);
    });
  });

  test("the interval E/N is filled the same way on screen and in the intervals CSV", () => {
    const lines = intervalsToCsv(shown).trim().split("\n");
    const header = lines[0].split(",");
    let n = 1;
    for (const r of shown) {
      const view = rowView(r);
      for (let i = 0; i < r.intervals.count; i++, n++) {
        const fields = lines[n].split(",");
        const iv = intervalView(r, view, i);
        expect(fields[header.indexOf("EN_covered")], `${r.modelId} × ${r.curveId} #${i}`).toBe(iv.eOverN);
        if (r.intervals.whole[i] > 0) expect(iv.eOverN).toBe("all");
        else expect(iv.eOverN).not.toBe("all");
      }
    }
  });
});
