// Checks of the curve CSV export: header units and comment lines the importer reads back, exact round trips
// in the energy units (fast-check property over random doubles), conversions against CODATA 2018 h and the
// physics core, and the near-exact round trip for frequencies and normalized units.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { curveCsvFileName, curveToCsv, formatShifted, nextDouble, parseCurveText } from "../../src/data";
import { gAgg } from "../../src/physics";

const H_EV_S = 4.135667696e-15; // CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93 (2021) 025010)
const f64 = (xs: number[]) => Float64Array.from(xs);

/** Distance in units in the last place between two finite doubles of the same sign. */
function ulps(a: number, b: number): number {
  if (a === b) return 0;
  const buf = new Float64Array([a, b]);
  const bits = new BigInt64Array(buf.buffer);
  const d = bits[0] - bits[1];
  return Number(d < 0n ? -d : d);
}

describe("what the file looks like", () => {
  const csv = curveToCsv(
    {
      massEv: f64([1e-6, 2.5e-5]),
      gInvGeV: f64([1e-12, 3e-13]),
      label: "Scan A",
      citation: "Doe et al., J. Inv. 1 (2030) 1",
    },
    { massUnit: "ueV", couplingUnit: "GeV^-1" },
  );
  test("comment lines with label and citation, a header with the units, one row per point", () => {
    expect(csv.split("\n")).toEqual([
      "# axband curve export",
      "# label: Scan A",
      "# citation: Doe et al., J. Inv. 1 (2030) 1",
      "# mass unit: μeV; coupling unit: GeV^-1",
      "m_a [ueV],g_agg [GeV^-1]",
      "1,1e-12",
      "2.5e1,3e-13",
      "",
    ]);
  });
  test("the importer reads units, label and citation back", () => {
    const r = parseCurveText(csv);
    expect(r.massUnit).toBe("ueV");
    expect(r.couplingUnit).toBe("GeV^-1");
    expect(r.label).toBe("Scan A");
    expect(r.citation).toBe("Doe et al., J. Inv. 1 (2030) 1");
    expect(Array.from(r.massEv)).toEqual([1e-6, 2.5e-5]);
  });
  test("a multi-line BibTeX citation survives with its indentation", () => {
    const citation = "@article{doe2030,\n  author = {Doe, J.},\n  year = {2030}\n}";
    const out = curveToCsv(
      { massEv: f64([1]), gInvGeV: f64([1]), citation },
      { massUnit: "eV", couplingUnit: "GeV^-1" },
    );
    expect(parseCurveText(out).citation).toBe(citation);
  });
  test("semicolon with decimal comma, tab, CRLF", () => {
    const c = { massEv: f64([1.5e-6]), gInvGeV: f64([2.5e-12]) };
    const semi = curveToCsv(c, {
      massUnit: "ueV",
      couplingUnit: "1/GeV",
      delimiter: ";",
      decimalComma: true,
      lineEnding: "\r\n",
    });
    expect(semi).toContain("\r\n1,5;2,5e-12\r\n");
    expect(Array.from(parseCurveText(semi).massEv)).toEqual([1.5e-6]);
    const tab = curveToCsv(c, { massUnit: "eV", couplingUnit: "GeV^-1", delimiter: "tab" });
    expect(tab).toContain("\n0.0000015\t2.5e-12\n");
  });
  test("bad options throw a RangeError naming the problem", () => {
    const c = { massEv: f64([1]), gInvGeV: f64([1]) };
    expect(() => curveToCsv(c, { massUnit: "parsec", couplingUnit: "GeV^-1" })).toThrow(/parsec/);
    expect(() => curveToCsv(c, { massUnit: "eV", couplingUnit: "model-line" })).toThrow(/E\/N/);
  });
  test("file name from the label", () => {
    expect(curveCsvFileName("Scan A / run 2")).toBe("Scan A _ run 2.csv");
    expect(curveCsvFileName("  ")).toBe("curve.csv");
  });
});

describe("conversions written out", () => {
  test("1 GHz is 4.135667696 μeV (h, CODATA 2018): a mass of 4.135667696e-6 eV is written as 1 GHz", () => {
    const out = curveToCsv(
      { massEv: f64([1e9 * H_EV_S]), gInvGeV: f64([1]) },
      { massUnit: "GHz", couplingUnit: "GeV^-1" },
    );
    expect(out).toContain("nu [GHz],g_agg [GeV^-1]\n1,1\n");
  });
  test("normalized: the E/N = 0 line is written as 1.92 (c_γ of Grilli di Cortona et al., JHEP 01 (2016) 034)", () => {
    const m = 3e-5;
    const out = curveToCsv(
      { massEv: f64([m]), gInvGeV: f64([gAgg(m, 0)]) },
      { massUnit: "eV", couplingUnit: "normalized" },
    );
    const value = Number(out.trim().split("\n").pop()?.split(",")[1]);
    expect(value).toBeCloseTo(1.92, 14);
    expect(out).toContain("c_gamma = 1.92, K = 5.691");
  });
  test("model line E/N = 8/3: its own line is written as 1", () => {
    const m = 3e-5;
    const out = curveToCsv(
      { massEv: f64([m]), gInvGeV: f64([gAgg(m, 8 / 3)]) },
      { massUnit: "eV", couplingUnit: "model-line", modelEOverN: "8/3" },
    );
    expect(out).toContain("[model-line E/N=8/3]");
    expect(Number(out.trim().split("\n").pop()?.split(",")[1])).toBeCloseTo(1, 14);
    const back = parseCurveText(out);
    expect(back.couplingUnit).toBe("model-line");
    expect(back.modelEOverN).toBe(8 / 3);
  });
});

describe("shortest decimals with a shifted exponent", () => {
  test("formatShifted moves the exponent and keeps the shortest digits (ECMAScript Number::toString)", () => {
    expect(formatShifted(1.234e-7, 6)).toBe("1.234e-1");
    expect(formatShifted(0.1 + 0.2, 0)).toBe("0.30000000000000004");
    expect(formatShifted(-0, 3)).toBe("-0");
    expect(formatShifted(5, 0)).toBe("5");
  });
  test("nextDouble steps one ulp (IEEE 754-2019 nextUp/nextDown)", () => {
    expect(nextDouble(1)).toBe(1 + Number.EPSILON);
    expect(nextDouble(1, -1)).toBe(1 - Number.EPSILON / 2);
    expect(nextDouble(0)).toBe(Number.MIN_VALUE);
    expect(nextDouble(-1, 1)).toBe(-1 + Number.EPSILON / 2);
  });
});

const finite = fc.double({ noNaN: true, noDefaultInfinity: true });
const table = fc.array(fc.tuple(finite, finite), { minLength: 1, maxLength: 40 });

describe("property: export → import round-trips exactly (Float64 equality) in energy units and GeV⁻¹", () => {
  test("random finite doubles, every energy unit, every delimiter, decimal comma", () => {
    fc.assert(
      fc.property(
        table,
        fc.constantFrom("eV", "meV", "ueV", "\u03bceV", "neV", "peV", "keV", "MeV", "GeV"),
        fc.constantFrom(",", ";", "\t"),
        fc.boolean(),
        fc.boolean(),
        (rows, massUnit, delimiter, decimalComma, crlf) => {
          const massEv = f64(rows.map((r) => r[0]));
          const gInvGeV = f64(rows.map((r) => r[1]));
          const csv = curveToCsv(
            { massEv, gInvGeV, label: "t" },
            { massUnit, couplingUnit: "GeV^-1", delimiter, decimalComma, lineEnding: crlf ? "\r\n" : "\n" },
          );
          const r = parseCurveText(csv);
          expect(r.rejected).toEqual([]);
          expect(r.massEv.length).toBe(rows.length);
          for (let i = 0; i < rows.length; i++) {
            expect(Object.is(r.massEv[i], massEv[i])).toBe(true);
            expect(Object.is(r.gInvGeV[i], gInvGeV[i])).toBe(true);
          }
          expect(r.nonPositive).toBe(rows.filter(([m, g]) => !(m > 0) || !(g > 0)).length);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("property: frequencies and normalized units read back to within an ulp", () => {
  const positive = fc.double({ min: 1e-12, max: 1e3, noNaN: true });
  test("random masses in Hz…GHz and couplings in normalized, g-gamma, model-line units", () => {
    let exact = 0;
    let total = 0;
    fc.assert(
      fc.property(
        fc.array(fc.tuple(positive, fc.double({ min: 1e-20, max: 1e-6, noNaN: true })), {
          minLength: 1,
          maxLength: 20,
        }),
        fc.constantFrom("Hz", "kHz", "MHz", "GHz"),
        fc.constantFrom("normalized", "g-gamma", "model-line"),
        (rows, massUnit, couplingUnit) => {
          const massEv = f64(rows.map((r) => r[0]));
          const gInvGeV = f64(rows.map((r) => r[1]));
          const csv = curveToCsv({ massEv, gInvGeV }, { massUnit, couplingUnit, modelEOverN: "2/3" });
          const r = parseCurveText(csv, { modelEOverN: "2/3" });
          for (let i = 0; i < rows.length; i++) {
            expect(ulps(r.massEv[i], massEv[i])).toBeLessThanOrEqual(1);
            expect(ulps(r.gInvGeV[i], gInvGeV[i])).toBeLessThanOrEqual(4);
            total++;
            if (r.massEv[i] === massEv[i] && r.gInvGeV[i] === gInvGeV[i]) exact++;
          }
        },
      ),
      { numRuns: 200 },
    );
    // The writer searches for the value whose conversion gives the same double back; most points are exact.
    expect(exact / total).toBeGreaterThan(0.7);
  });
});
