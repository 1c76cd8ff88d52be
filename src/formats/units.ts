// Units of imported and exported curve columns: names and spellings, recognition in CSV headers, and the
// conversions to the internal units (eV for masses, GeV⁻¹ for couplings) through the physics core.
import { resolveConstants, type AxionConstants, type PhysicsOpts } from "../physics/constants";
import { gFromNormalized } from "../physics/coupling";
import { MASS_UNITS, type MassUnit } from "../physics/units";

export { MASS_UNITS, massFromEv, massToEv, massUnitInfo, type MassUnit, type MassUnitInfo } from "../physics/units";

/**
 * Coupling column units: g_aγγ in GeV⁻¹; the normalized coupling |E/N − c_γ|; the haloscope |g_γ| =
 * |E/N − c_γ|/2; or a multiple of the model line of a chosen E/N (g = value × g_aγγ(m, E/N)).
 */
export type CouplingUnit = "GeV^-1" | "normalized" | "g-gamma" | "model-line";

export interface CouplingUnitInfo {
  id: CouplingUnit;
  label: string;
  /** Short ASCII form written into exported CSV headers (recognised again on import). */
  ascii: string;
}

/** Every coupling unit, in the order menus show them. */
export const COUPLING_UNITS: readonly CouplingUnitInfo[] = [
  { id: "GeV^-1", label: "g_aγγ in GeV⁻¹", ascii: "GeV^-1" },
  { id: "normalized", label: "normalized |E/N − c_γ|", ascii: "normalized" },
  { id: "g-gamma", label: "|g_γ| = |E/N − c_γ|/2", ascii: "g-gamma" },
  { id: "model-line", label: "multiple of a model line", ascii: "model-line" },
];

// Spellings of micro: u, Greek small mu (U+03BC) and the micro sign (U+00B5); also the TeX-ish "mu".
const MICRO = /^(?:u|\u03bc|\u00b5|mu|micro-?)eV$/;

/**
 * The mass unit a string names, or null. Case matters where it must (meV vs MeV, mHz is not MHz); other
 * spellings are accepted in any case ("ev", "GHZ") when only one unit fits.
 */
export function parseMassUnit(text: string): MassUnit | null {
  const s = text.trim();
  if (MICRO.test(s)) return "ueV";
  if (MASS_UNITS.some((u) => u.id === s)) return s as MassUnit;
  const lower = s.toLowerCase();
  // "mev" could be meV or MeV and "mhz" could be MHz or mHz: a wrong guess would be off by 10⁹.
  if (lower === "mev" || lower === "mhz") return null;
  if (/^(?:u|\u03bc|\u00b5|mu)ev$/.test(lower)) return "ueV";
  const hit = MASS_UNITS.find((u) => u.id.toLowerCase() === lower);
  return hit ? hit.id : null;
}

/** A coupling unit with the E/N of the model line when the unit is "model-line". */
export interface ParsedCouplingUnit {
  unit: CouplingUnit;
  modelEOverN: number | null;
}

const INV_GEV =
  /^(?:GeV\s*\^\s*[({]?\s*-\s*1\s*[)}]?|GeV\u207b\u00b9|GeV\s*-\s*1|1\s*\/\s*GeV|\/\s*GeV|inv\.?\s*GeV)$/i;

/**
 * The coupling unit a string names, or null: `GeV^-1`, `GeV^{-1}`, `GeV⁻¹`, `GeV-1`, `1/GeV`; `normalized`;
 * `g-gamma`; `model-line` optionally followed by `E/N=8/3` (as exported CSV headers write it).
 */
export function parseCouplingUnit(text: string): ParsedCouplingUnit | null {
  const s = text.trim();
  if (INV_GEV.test(s)) return { unit: "GeV^-1", modelEOverN: null };
  const lower = s.toLowerCase();
  if (lower === "normalized" || lower === "normalised") return { unit: "normalized", modelEOverN: null };
  if (lower === "g-gamma" || lower === "g_gamma" || lower === "|g_gamma|")
    return { unit: "g-gamma", modelEOverN: null };
  const m = /^model[- ]line(?:\s+E\/N\s*=\s*(\S+))?$/i.exec(s);
  if (m) {
    const eOverN = m[1] === undefined ? null : parseRational(m[1]);
    if (m[1] !== undefined && eOverN === null) return null;
    return { unit: "model-line", modelEOverN: eOverN };
  }
  return null;
}

/** A decimal ("2.5", "-0.5") or a fraction ("8/3", "-1/3") as a number; null when it is neither. */
export function parseRational(text: string | number): number | null {
  if (typeof text === "number") return Number.isFinite(text) ? text : null;
  const s = text.trim().replace(/\u2212/g, "-");
  const frac = /^([+-]?\d+(?:\.\d+)?)\s*\/\s*(\d+(?:\.\d+)?)$/.exec(s);
  if (frac) {
    const den = Number(frac[2]);
    return den === 0 ? null : Number(frac[1]) / den;
  }
  if (!/^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/.test(s)) return null;
  return Number(s);
}

/** What a header field says about its column: a mass unit, a coupling unit, or nothing. */
export type HeaderUnit =
  { kind: "mass"; unit: MassUnit } | { kind: "coupling"; unit: CouplingUnit; modelEOverN: number | null } | null;

function unitOfToken(token: string): HeaderUnit {
  const mass = parseMassUnit(token);
  if (mass) return { kind: "mass", unit: mass };
  const c = parseCouplingUnit(token);
  return c ? { kind: "coupling", unit: c.unit, modelEOverN: c.modelEOverN } : null;
}

/**
 * The unit a header field names: in brackets or parentheses (`m_a [ueV]`, `mass (GHz)`, `g [1/GeV]`), as the
 * whole field (`GHz`), after the last `_` or space (`mass_eV`, `g_GeV^-1`, `mass in GHz`), or after a
 * slash (`m / eV`).
 */
export function headerUnit(field: string): HeaderUnit {
  const f = field.trim();
  const brackets = [...f.matchAll(/[[(]([^\])]*)[\])]/g)];
  for (let i = brackets.length - 1; i >= 0; i--) {
    const u = unitOfToken(brackets[i][1]);
    if (u) return u;
  }
  const whole = unitOfToken(f);
  if (whole) return whole;
  // The unit may itself contain "_"-free parts with spaces ("model-line E/N=8/3"), so try every suffix.
  const parts = f.split(/[_\s]+/).filter((p) => p !== "");
  for (let i = 1; i < parts.length; i++) {
    const u = unitOfToken(parts.slice(i).join(" "));
    if (u) return u;
  }
  const slash = /^(.*?[^\s/1])\s*\/\s*(\S.*)$/.exec(f);
  if (slash) {
    const u = unitOfToken(slash[2]);
    if (u) return u;
  }
  return null;
}

/** Numbers that coupling conversions need: the physics constants and the model line's E/N. */
export interface CouplingContext {
  constants: AxionConstants;
  /** E/N of the model line for the "model-line" unit. */
  modelEOverN: number | null;
}

/** The context for coupling conversions from physics options. */
export function couplingContext(
  physics: PhysicsOpts = {},
  modelEOverN: number | string | null = null,
): CouplingContext {
  return {
    constants: resolveConstants(physics),
    modelEOverN: modelEOverN === null ? null : parseRational(modelEOverN),
  };
}

/**
 * g_aγγ in GeV⁻¹ per unit of the coupling column at mass `massEv`: 1 for GeV⁻¹; for the normalized
 * |E/N − c_γ| it is α m /(2π K·10⁶) (physics core's gFromNormalized); twice that for |g_γ|; and the model
 * line's g_aγγ(m, E/N) for "model-line". NaN when a model line is asked for without an E/N.
 */
function couplingScale(massEv: number, unit: CouplingUnit, ctx: CouplingContext): number {
  switch (unit) {
    case "GeV^-1":
      return 1;
    case "normalized":
      return gFromNormalized(massEv, 1, ctx.constants.kMuEv);
    case "g-gamma":
      return gFromNormalized(massEv, 2, ctx.constants.kMuEv);
    case "model-line":
      return ctx.modelEOverN === null
        ? NaN
        : gFromNormalized(massEv, Math.abs(ctx.modelEOverN - ctx.constants.cGamma), ctx.constants.kMuEv);
  }
}

/** g_aγγ in GeV⁻¹ of a coupling-column value at mass `massEv` (eV). */
export function couplingToInvGeV(value: number, massEv: number, unit: CouplingUnit, ctx: CouplingContext): number {
  if (unit === "GeV^-1") return value;
  // Written out so the CSV writer can invert exactly the same floating-point expression.
  if (unit === "normalized") return gFromNormalized(massEv, value, ctx.constants.kMuEv);
  if (unit === "g-gamma") return gFromNormalized(massEv, 2 * value, ctx.constants.kMuEv);
  return value * couplingScale(massEv, unit, ctx);
}

/** A coupling in GeV⁻¹ at mass `massEv` expressed in a coupling unit (inverse of {@link couplingToInvGeV}). */
export function couplingFromInvGeV(gInvGeV: number, massEv: number, unit: CouplingUnit, ctx: CouplingContext): number {
  if (unit === "GeV^-1") return gInvGeV;
  return gInvGeV / couplingScale(massEv, unit, ctx);
}
