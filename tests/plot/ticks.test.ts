// Checks of the log axes: decade labels with real superscripts and minus signs, minor ticks at log10(k),
// label thinning, narrow ranges, and the f_a and frequency top axes against published constants.
import { describe, expect, test } from "vitest";
import {
  buildScene,
  logTicks,
  frequencyUnit,
  massToX,
  xToMass,
  yToPx,
  pxToY,
  decadeLabelStep,
  runsWidthPx,
  type LogTick,
} from "../../src/plot/index";
import { fixtureProject, rng, textNodes, textOf } from "./fixture";

const opts = (pxPerDecade: number) => ({ pxPerDecade, labelExtentPx: () => 20 });
const labelled = (ticks: LogTick[]) => ticks.filter((t) => t.label);

describe("decade ticks", () => {
  test("a labelled major tick at every decade, label runs '10' + superscript with U+2212 (ISO 80000-1:2009 §7.1.3 minus sign, from memory; Unicode U+2212 MINUS SIGN)", () => {
    const ticks = logTicks(1e-7, 1e-2, opts(100));
    const majors = ticks.filter((t) => t.major);
    expect(majors.map((t) => t.value)).toEqual([1e-7, 1e-6, 1e-5, 1e-4, 1e-3, 1e-2]);
    const m6 = majors.find((t) => t.value === 1e-6);
    expect(m6?.label).toEqual([{ text: "10" }, { text: "\u22126", shift: "sup" }]);
    for (const t of majors) {
      expect(t.label).not.toBeNull();
      const text = (t.label ?? []).map((r) => r.text).join("");
      expect(text).not.toMatch(/e|-/); // never "1e-6", never a hyphen-minus
    }
  });

  test("minor ticks at 2…9 sit at log10(k) of a decade (log10 2 = 0.30103, log10 5 = 0.69897: Abramowitz & Stegun, Table 4.1, from memory)", () => {
    const ticks = logTicks(1e-6, 1e-5, opts(300));
    const minors = ticks.filter((t) => !t.major).map((t) => t.value);
    expect(minors.length).toBe(8);
    minors.forEach((v, i) => expect(v / 1e-6).toBeCloseTo(i + 2, 9));
    // positions on a real scene: the fraction of a decade between 10⁻⁶ and 2·10⁻⁶ is log10 2
    const scene = buildScene(fixtureProject());
    const decade = massToX(scene, 1e-5) - massToX(scene, 1e-6);
    expect((massToX(scene, 2e-6) - massToX(scene, 1e-6)) / decade).toBeCloseTo(0.30103, 5);
    expect((massToX(scene, 5e-6) - massToX(scene, 1e-6)) / decade).toBeCloseTo(0.69897, 5);
  });

  test("minor ticks are dropped when 9 and 10 would be closer than 2 px (common practice)", () => {
    // 9→10 is log10(10/9) = 0.0458 of a decade: 30 px/decade gives 1.4 px, 60 px/decade 2.7 px
    expect(logTicks(1e-20, 1e-5, opts(30)).filter((t) => !t.major)).toHaveLength(0);
    expect(logTicks(1e-20, 1e-5, opts(60)).filter((t) => !t.major).length).toBeGreaterThan(0);
  });

  test("wide ranges label every 2nd or 3rd decade but keep a tick at every decade (common practice)", () => {
    expect(decadeLabelStep(5)).toBe(1);
    expect(decadeLabelStep(12)).toBe(2);
    expect(decadeLabelStep(20)).toBe(3);
    const ticks = logTicks(1e-22, 1e-8, opts(200)); // 14 decades, plenty of room: thinning by count alone
    const majors = ticks.filter((t) => t.major);
    expect(majors).toHaveLength(15);
    const labels = labelled(majors).map((t) => Math.round(Math.log10(t.value)));
    expect(labels.every((e) => e % 2 === 0)).toBe(true);
    expect(labels).toEqual([-22, -20, -18, -16, -14, -12, -10, -8]);
    const wider = labelled(logTicks(1e-30, 1e-10, opts(200))).map((t) => Math.round(Math.log10(t.value)));
    expect(wider.every((e) => e % 3 === 0)).toBe(true);
  });

  test("labels thin out when they would overlap: 60 px wide labels on 25 px per decade get every 3rd decade", () => {
    const ticks = logTicks(1e-9, 1e-3, { pxPerDecade: 25, labelExtentPx: () => 60, labelGapPx: 4 });
    const exps = labelled(ticks).map((t) => Math.round(Math.log10(t.value)));
    expect(exps).toEqual([-9, -6, -3]);
  });

  test("a range under one decade gets labels at 1…9 × 10⁻⁶ when they fit, written 2×10⁻⁶ (ISO 80000-1 multiplication sign; 1…9 between decades: common practice)", () => {
    const ticks = logTicks(1.5e-6, 8e-6, opts(600));
    const texts = labelled(ticks).map((t) =>
      (t.label ?? []).map((r) => (r.shift === "sup" ? `^${r.text}` : r.text)).join(""),
    );
    expect(texts).toEqual([2, 3, 4, 5, 6, 7, 8].map((k) => `${k}×10^\u22126`));
    expect(labelled(ticks).every((t) => t.value >= 1.5e-6 && t.value <= 8e-6)).toBe(true);
    // Narrower label room: 1-2-3-5 or 1-2-5 instead (35 px labels need 39 px; 7→8 is 600·log10(8/7) = 34.8 px).
    const sparse = labelled(logTicks(1.5e-6, 8e-6, { pxPerDecade: 600, labelExtentPx: () => 35 }));
    expect(sparse.map((t) => Math.round(t.value * 1e7) / 10)).toEqual([2, 3, 5]);
  });

  test("a range of one to two decades is labelled at 1, 2 and 5 × 10^k (common practice)", () => {
    const lab = labelled(logTicks(2e-6, 6e-5, opts(300)));
    expect(lab.map((t) => Number(t.value.toPrecision(6)))).toEqual([2e-6, 5e-6, 1e-5, 2e-5, 5e-5]);
    expect(lab.filter((t) => t.major).map((t) => t.value)).toEqual([1e-5]);
  });

  test("a very narrow range gets linear nice steps 3.1, 3.15, 3.2 … ×10⁻⁶ (1-2-5 steps of the decimal grid, common practice)", () => {
    const lab = labelled(logTicks(3.1e-6, 3.4e-6, { pxPerDecade: 20000, labelExtentPx: () => 60 }));
    expect(lab.length).toBeGreaterThanOrEqual(3);
    const steps = lab.slice(1).map((t, i) => t.value - lab[i].value);
    for (const d of steps) expect(d / steps[0]).toBeCloseTo(1, 9);
    expect([0.05e-6, 0.1e-6]).toContainEqual(Number(steps[0].toPrecision(6)));
    expect(lab.map((t) => (t.label ?? []).map((r) => r.text).join(""))).toContain("3.2×10\u22126");
  });

  test("a very narrow range still gets at least two labels (D3 linear ticks inside the decade)", () => {
    const ticks = logTicks(3.1e-6, 3.4e-6, opts(2000));
    const lab = labelled(ticks);
    expect(lab.length).toBeGreaterThanOrEqual(2);
    for (const t of lab) expect(t.value).toBeGreaterThanOrEqual(3.1e-6 * (1 - 1e-9));
  });
});

describe("labels never collide (common practice: no overlapping tick labels)", () => {
  test("random narrow and wide ranges at several axis lengths: ≥ 2 labels, spaced by their estimated widths", () => {
    const r = rng(99);
    const width = (runs: { text: string; shift?: string }[]) => runsWidthPx(runs as never, 16);
    for (let i = 0; i < 300; i++) {
      const lo = 10 ** (-12 + 10 * r());
      const span = 10 ** (-1.8 + 3 * r()); // 0.016 to 16 decades
      const hi = lo * 10 ** span;
      const axisPx = 150 + 900 * r();
      const ppd = axisPx / span;
      const ticks = logTicks(lo, hi, { pxPerDecade: ppd, labelExtentPx: width, labelGapPx: 8 });
      const lab = labelled(ticks);
      expect(lab.length, `range ${lo}..${hi}`).toBeGreaterThanOrEqual(2);
      for (let k = 1; k < lab.length; k++) {
        const dist = ppd * Math.log10(lab[k].value / lab[k - 1].value);
        expect(dist).toBeGreaterThanOrEqual((width(lab[k].label!) + width(lab[k - 1].label!)) / 2 + 8 - 1e-6);
      }
    }
  });
});

describe("zoomed axes have at least three labels (common practice: a reader needs three to see the scale)", () => {
  test("random spans of 0.02 to 2 decades on 300–1000 px axes, scientific and plain labels at 16 px with the slide's 12.8 px gap: ≥ 3 labels, none overlapping", () => {
    const r = rng(7);
    const width = (runs: readonly { text: string; shift?: string }[]) => runsWidthPx(runs as never, 16);
    for (let i = 0; i < 400; i++) {
      const lo = 10 ** (-12 + 14 * r());
      const span = 10 ** (-1.7 + 2 * r()); // 0.02 to 2 decades
      const hi = lo * 10 ** span;
      const ppd = (300 + 700 * r()) / span;
      const format = i % 2 ? undefined : (v: number) => [{ text: String(Number(v.toPrecision(6))) }];
      const lab = labelled(logTicks(lo, hi, { pxPerDecade: ppd, labelExtentPx: width, labelGapPx: 12.8, format }));
      expect(lab.length, `range ${lo}..${hi}`).toBeGreaterThanOrEqual(3);
      for (let k = 1; k < lab.length; k++) {
        const dist = ppd * Math.log10(lab[k].value / lab[k - 1].value);
        expect(dist).toBeGreaterThanOrEqual((width(lab[k].label!) + width(lab[k - 1].label!)) / 2 + 12.8 - 1e-6);
      }
    }
  });
});

describe("scale helpers invert each other", () => {
  test("xToMass(massToX(m)) = m and pxToY(yToPx(y)) = y", () => {
    const scene = buildScene(fixtureProject());
    for (const m of [1e-7, 3.3e-6, 5e-4, 1e-2]) expect(xToMass(scene, massToX(scene, m)) / m).toBeCloseTo(1, 12);
    for (const g of [1e-17, 2.2e-13, 1e-9]) expect(pxToY(scene, yToPx(scene, g)) / g).toBeCloseTo(1, 12);
    expect(massToX(scene, 1e-7)).toBeCloseTo(scene.plot.x, 9);
    expect(yToPx(scene, 1e-9)).toBeCloseTo(scene.plot.y, 9);
  });
});

function topLabelAt(scene: ReturnType<typeof buildScene>, text: string) {
  return textNodes(scene, "axes").find((n) => n.id?.startsWith("toplabel-") && textOf(n) === text);
}

describe("top axes", () => {
  test("f_a axis reads 10¹² GeV at m = 5.691 μeV with the 2019 reference (Gorghetto & Villadoro, JHEP 03 (2019) 033)", () => {
    const p = fixtureProject();
    p.figure.topAxis = "fa";
    const scene = buildScene(p);
    const label = topLabelAt(scene, "1012");
    expect(label?.runs).toEqual([{ text: "10" }, { text: "12", shift: "sup" }]);
    expect(Math.abs((label?.x ?? NaN) - massToX(scene, 5.691e-6))).toBeLessThan(0.01);
    // f_a decreases to the right: 10¹³ GeV lies left of 10¹² GeV
    expect(topLabelAt(scene, "1013")!.x).toBeLessThan(label!.x);
  });

  test("with the 2016 reference the same label sits at m = 5.70 μeV (Grilli di Cortona et al., JHEP 01 (2016) 034)", () => {
    const p = fixtureProject();
    p.physics.ref = "2016";
    const scene = buildScene(p);
    expect(Math.abs(topLabelAt(scene, "1012")!.x - massToX(scene, 5.7e-6))).toBeLessThan(0.01);
  });

  test("both axes stay in step after a zoom: 10¹¹ GeV sits at 56.91 μeV on the new mass scale", () => {
    const p = fixtureProject();
    p.figure.massRangeEv = [2e-5, 3e-4];
    const scene = buildScene(p);
    expect(Math.abs(topLabelAt(scene, "1011")!.x - massToX(scene, 5.691e-5))).toBeLessThan(0.01);
  });

  test("frequency axis reads 1 GHz at m = 4.135667696 μeV (h = 4.135667696×10⁻¹⁵ eV·s, CODATA 2018, exact)", () => {
    const p = fixtureProject();
    p.figure.topAxis = "frequency";
    p.figure.massRangeEv = [1e-6, 1e-4];
    const scene = buildScene(p);
    const title = textNodes(scene, "axes").find((n) => n.id === "toptitle");
    expect(textOf(title!)).toContain("[GHz]");
    const one = topLabelAt(scene, "1");
    expect(Math.abs(one!.x - massToX(scene, 4.135667696e-6))).toBeLessThan(0.01);
    expect(Math.abs(topLabelAt(scene, "10")!.x - massToX(scene, 4.135667696e-5))).toBeLessThan(0.01);
  });

  test("SI prefix follows the visible range (BIPM SI Brochure, 9th ed. 2019, table of SI prefixes: k, M, G, T; from memory)", () => {
    expect(frequencyUnit(2e3, 8e5).unit).toBe("kHz");
    expect(frequencyUnit(3e6, 4e8).unit).toBe("MHz");
    expect(frequencyUnit(2.4e8, 2.4e10).unit).toBe("GHz");
    expect(frequencyUnit(5e11, 9e13).unit).toBe("THz");
    const wide = frequencyUnit(2.4e7, 2.4e15);
    expect(wide.unit).toBe("Hz");
    expect(wide.plain).toBe(false);
  });
});
