// The catalogue's models derived from their Lagrangians: each entry's kept terms give, through the PQ-charge
// solver, the E/N and N_DW its typed charges give, and the forbidden terms stay forbidden.
import { describe, expect, test } from "vitest";
import { anomaly, catalogue, parseTerm, solvePqCharges, toFractionString } from "../../src/physics";

describe("catalogue models from their terms (Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801; Di Luzio et al., Phys. Rept. 870 (2020) 1; from memory)", () => {
  for (const e of catalogue()) {
    test(`${e.id}: ${e.lagrangian.terms.join(", ")}`, () => {
      const names = [...e.fermions.map((f) => f.name ?? ""), ...e.lagrangian.scalars.map((s) => s.name)];
      const parse = (t: string) => {
        const r = parseTerm(t, names);
        if (!r.ok) throw new Error(`${t}: ${r.message}`);
        return r.term;
      };
      const r = solvePqCharges({
        fermions: e.fermions,
        scalars: e.lagrangian.scalars,
        terms: e.lagrangian.terms.map(parse),
        forbidden: e.lagrangian.forbidden.map(parse),
        normalize: e.lagrangian.normalize,
      });
      const typed = anomaly(e.fermions, { scalarCharge: e.scalarCharge });
      expect(r.ok).toBe(true);
      if (!r.ok) return;
      expect([r.axion, r.determined]).toEqual([true, true]);
      expect(r.eOverN).toBe(toFractionString(typed.eOverN!));
      expect(r.nDW).toBe(toFractionString(typed.domainWallExact!));
      expect(r.forbiddenAllowed).toEqual([]);
      if (e.group === "ksvz") expect([r.charges.Q_L, r.charges.Q_R]).toEqual(["1", "0"]);
    });
  }
});
