// Checks of the rescaling of haloscope-type limits: g·√(ρ₀/ρ) for another local dark-matter density and
// g/√f for an axion fraction f of the dark matter. Both follow from the haloscope signal power growing as
// g²·ρ_a (Sikivie, PRL 51 (1983) 1415, from memory) with ρ_a = f·ρ; the rescaling itself is common practice.
import { describe, expect, test } from "vitest";
import { isRescaled, rescaleCurve, rescaleFactor, rescaleLegendSuffix, validateRescale } from "../../src/data";

const g = Float64Array.from([1e-12, 3e-13, 0, -1e-14]);

describe("rescaleCurve (common practice)", () => {
  test("density: a limit computed for ρ₀ = 0.45 GeV/cm³ shown at ρ = 0.3 moves up by √(0.45/0.3)", () => {
    const out = rescaleCurve(g, { rhoAssumed: 0.45, rhoShown: 0.3 });
    for (let i = 0; i < g.length; i++) expect(out[i]).toBeCloseTo(g[i] * Math.sqrt(0.45 / 0.3), 28);
    expect(out[0] / g[0]).toBeCloseTo(1.224744871391589, 14);
  });
  test("fraction: f = 0.5 weakens the limit by √2; f = 1 changes nothing", () => {
    const out = rescaleCurve(g, { fraction: 0.5 });
    expect(out[0] / g[0]).toBeCloseTo(Math.SQRT2, 14);
    expect(Array.from(rescaleCurve(g, { fraction: 1 }))).toEqual(Array.from(g));
  });
  test("both together multiply: √(ρ₀/ρ)/√f", () => {
    const out = rescaleCurve(g, { rhoAssumed: 0.3, rhoShown: 0.45, fraction: 0.25 });
    expect(out[1] / g[1]).toBeCloseTo(Math.sqrt(0.3 / 0.45) / Math.sqrt(0.25), 14);
    expect(rescaleFactor({ rhoAssumed: 0.3, rhoShown: 0.45, fraction: 0.25 })).toBeCloseTo(
      Math.sqrt(0.3 / 0.45) * 2,
      14,
    );
  });
  test("squaring back: g² ρ f is unchanged, as the power argument requires", () => {
    const out = rescaleCurve(g, { rhoAssumed: 0.4, rhoShown: 0.7, fraction: 0.6 });
    expect(out[0] ** 2 * 0.7 * 0.6).toBeCloseTo(g[0] ** 2 * 0.4, 35);
  });
  test("no options, or equal densities: values unchanged; the input array is never changed", () => {
    const copy = Float64Array.from(g);
    const out = rescaleCurve(g, {});
    expect(out).not.toBe(g);
    expect(Array.from(out)).toEqual(Array.from(g));
    expect(Array.from(rescaleCurve(g, { rhoAssumed: 0.45, rhoShown: 0.45 }))).toEqual(Array.from(g));
    rescaleCurve(g, { fraction: 0.1 });
    expect(Array.from(g)).toEqual(Array.from(copy));
  });
  test("invalid parameters are refused with a reason", () => {
    expect(validateRescale({ fraction: 0 })).toMatch(/fraction/);
    expect(validateRescale({ fraction: 1.5 })).toMatch(/fraction/);
    expect(validateRescale({ rhoShown: -1 })).toMatch(/density/);
    expect(validateRescale({ rhoAssumed: 0.45, rhoShown: 0.3, fraction: 0.5 })).toBeNull();
    expect(() => rescaleCurve(g, { rhoAssumed: 0 })).toThrow(RangeError);
  });
});

describe("legend", () => {
  test("isRescaled: a different density or f < 1", () => {
    expect(isRescaled({ rhoAssumed: 0.45, rhoShown: 0.45, fraction: 1 })).toBe(false);
    expect(isRescaled({ rhoAssumed: 0.45, rhoShown: 0.3, fraction: 1 })).toBe(true);
    expect(isRescaled({ rhoAssumed: 0.45, rhoShown: 0.45, fraction: 0.5 })).toBe(true);
  });
  test('suffix "rescaled: ρ = 0.3 GeV/cm³, f = 0.5"', () => {
    expect(rescaleLegendSuffix({ rhoAssumed: 0.45, rhoShown: 0.3, fraction: 0.5 })).toBe(
      "rescaled: ρ = 0.3 GeV/cm³, f = 0.5",
    );
    expect(rescaleLegendSuffix({ rhoAssumed: 0.45, rhoShown: 0.3, fraction: 1 })).toBe("rescaled: ρ = 0.3 GeV/cm³");
    expect(rescaleLegendSuffix({ rhoAssumed: 0.45, rhoShown: 0.45, fraction: 0.1 })).toBe("rescaled: f = 0.1");
    expect(rescaleLegendSuffix({ rhoAssumed: 0.45, rhoShown: 0.45, fraction: 1 })).toBe("");
  });
});
