// A curve written back as CSV in chosen units (so axband doubles as a unit converter), in the form the
// importer reads: units in the header, label and citation as comment lines, values that read back exactly.
import type { PhysicsOpts } from "../physics/constants";
import {
  couplingContext,
  couplingFromInvGeV,
  couplingToInvGeV,
  massUnitInfo,
  parseCouplingUnit,
  parseMassUnit,
  parseRational,
  type CouplingContext,
  type CouplingUnit,
  type MassUnit,
} from "./units";
import { PLANCK_EV_S } from "../physics/constants";

export interface CurveCsvInput {
  massEv: Float64Array;
  gInvGeV: Float64Array;
  label?: string;
  citation?: string;
}

export interface CurveCsvOptions {
  /** Unit of the mass column (spellings as for the importer: "eV", "ueV", "μeV", "GHz"…). */
  massUnit: string;
  /** Unit of the coupling column: "GeV^-1", "normalized", "g-gamma" or "model-line". */
  couplingUnit: string;
  /** E/N of the model line for "model-line" (number or fraction string such as "8/3"). */
  modelEOverN?: number | string;
  /** Constants for the normalized units. @default the physics core's default reference */
  physics?: PhysicsOpts;
  /** `,` `;` or tab. @default "," */
  delimiter?: string;
  /** Write `,` as the decimal point (only with `;` or tab). @default false */
  decimalComma?: boolean;
  /** Line ending. @default "\n" */
  lineEnding?: "\n" | "\r\n";
  /** Extra comment lines (without `#`), written after label and citation. @default [] */
  comments?: string[];
}

const F64 = new Float64Array(1);
const I64 = new BigInt64Array(F64.buffer);

/** The next double towards +∞ (or −∞ with dir = −1); NaN and ±∞ are returned unchanged. */
export function nextDouble(x: number, dir: 1 | -1 = 1): number {
  if (!Number.isFinite(x)) return x;
  if (x === 0) return dir * Number.MIN_VALUE;
  F64[0] = x;
  I64[0] += x > 0 === dir > 0 ? 1n : -1n;
  return F64[0];
}

/**
 * The double y nearest to `guess` for which forward(y) === target, searching a few ulps either side; the
 * guess itself when none is found (then the value reads back to within an ulp or two).
 */
function invertExactly(target: number, forward: (y: number) => number, guess: number): number {
  if (!Number.isFinite(guess)) return guess;
  let hit = forward(guess) === target ? guess : NaN;
  let up = guess;
  let down = guess;
  for (let i = 0; i < 4 && Number.isNaN(hit); i++) {
    up = nextDouble(up, 1);
    if (forward(up) === target) hit = up;
    down = nextDouble(down, -1);
    if (forward(down) === target) hit = down;
  }
  if (Number.isNaN(hit)) return guess;
  // Several doubles may map to the target; a value typed as "1.2345" GHz should be written that way again.
  for (const digits of [15, 16]) {
    const short = Number(hit.toPrecision(digits));
    if (forward(short) === target) return short;
  }
  return hit;
}

/** A double as shortest round-trip decimal, with its decimal exponent moved by `shift` (exact, textual). */
export function formatShifted(x: number, shift: number): string {
  if (Number.isNaN(x)) return "NaN";
  if (!Number.isFinite(x)) return x > 0 ? "Infinity" : "-Infinity";
  if (x === 0) return Object.is(x, -0) ? "-0" : "0";
  if (shift === 0) return String(x);
  // toExponential() without digits gives the shortest digits that read back to the same double.
  const [mant, exp] = x.toExponential().split("e");
  const e = Number(exp) + shift;
  return e === 0 ? mant : `${mant}e${e}`;
}

function massWriter(unit: MassUnit): (massEv: number) => string {
  const u = massUnitInfo(unit);
  if (u.kind === "energy") return (m) => formatShifted(m, -u.pow10);
  // The importer computes m = ν_Hz · h with ν_Hz read exactly; pick the ν that gives m back.
  return (m) =>
    formatShifted(
      invertExactly(m, (y) => y * PLANCK_EV_S, m / PLANCK_EV_S),
      -u.pow10,
    );
}

function couplingWriter(unit: CouplingUnit, ctx: CouplingContext): (g: number, massEv: number) => string {
  if (unit === "GeV^-1") return (g) => formatShifted(g, 0);
  return (g, m) =>
    formatShifted(
      invertExactly(g, (y) => couplingToInvGeV(y, m, unit, ctx), couplingFromInvGeV(g, m, unit, ctx)),
      0,
    );
}

const DELIMS: Record<string, string> = { ",": ",", comma: ",", ";": ";", semicolon: ";", "\t": "\t", tab: "\t" };

/** Header text of the coupling column for a unit. */
function couplingHeader(unit: CouplingUnit, eOverN: number | null, eOverNText: string): string {
  switch (unit) {
    case "GeV^-1":
      return "g_agg [GeV^-1]";
    case "normalized":
      return "|E/N - c_gamma| [normalized]";
    case "g-gamma":
      return "|g_gamma| [g-gamma]";
    case "model-line":
      return `g_agg/g_model [model-line E/N=${eOverN === null ? "?" : eOverNText}]`;
  }
}

/**
 * The curve as CSV text: comment lines with label, citation and units, a header that names the units
 * (`m_a [ueV],g_agg [GeV^-1]`), then one row per point in file order. Values are the shortest decimals
 * that parse back (with {@link parseCurveText}) to exactly the same doubles for energy units and GeV⁻¹;
 * for frequencies and the normalized units the written value is chosen so the import's conversion gives
 * the same double back wherever one exists (else within one ulp).
 * @throws RangeError for an unknown unit or delimiter, or "model-line" without an E/N
 */
export function curveToCsv(curve: CurveCsvInput, opts: CurveCsvOptions): string {
  const massUnit = parseMassUnit(opts.massUnit);
  if (!massUnit) throw new RangeError(`unknown mass unit "${opts.massUnit}"`);
  const cu = parseCouplingUnit(opts.couplingUnit);
  if (!cu) throw new RangeError(`unknown coupling unit "${opts.couplingUnit}"`);
  const eOverN = opts.modelEOverN !== undefined ? parseRational(opts.modelEOverN) : cu.modelEOverN;
  if (cu.unit === "model-line" && eOverN === null)
    throw new RangeError("a model-line coupling unit needs the model line's E/N");
  const delim = DELIMS[opts.delimiter ?? ","];
  if (delim === undefined) throw new RangeError(`unknown delimiter "${opts.delimiter}" (comma, semicolon or tab)`);
  const comma = opts.decimalComma === true && delim !== ",";
  const nl = opts.lineEnding ?? "\n";
  const ctx = couplingContext(opts.physics, eOverN);
  // A fraction such as 8/3 is written as typed so the header reads back to the same number.
  const eOverNText = typeof opts.modelEOverN === "string" ? opts.modelEOverN.replace(/\s+/g, "") : String(eOverN);

  const lines: string[] = ["# axband curve export"];
  if (curve.label) lines.push(`# label: ${oneLine(curve.label)}`);
  if (curve.citation) for (const l of curve.citation.split(/\r\n|\r|\n/)) lines.push(`# citation: ${l}`);
  lines.push(`# mass unit: ${massUnitInfo(massUnit).label}; coupling unit: ${cu.unit}`);
  if (cu.unit !== "GeV^-1") {
    const c = ctx.constants;
    lines.push(
      `# converted with c_gamma = ${c.cGamma}, K = ${c.kMuEv} ueV (m_a = K ueV * 1e12 GeV / f_a)${c.label ? `; ${oneLine(c.label)}` : ""}`,
    );
  }
  for (const l of opts.comments ?? []) lines.push(`# ${oneLine(l)}`);
  const massName = massUnitInfo(massUnit).kind === "frequency" ? "nu" : "m_a";
  lines.push(`${massName} [${massUnit}]${delim}${couplingHeader(cu.unit, eOverN, eOverNText)}`);

  const writeMass = massWriter(massUnit);
  const writeCoupling = couplingWriter(cu.unit, ctx);
  const n = Math.min(curve.massEv.length, curve.gInvGeV.length);
  const rows = new Array<string>(n);
  for (let i = 0; i < n; i++) {
    const m = curve.massEv[i];
    let a = writeMass(m);
    let b = writeCoupling(curve.gInvGeV[i], m);
    if (comma) {
      a = a.replace(".", ",");
      b = b.replace(".", ",");
    }
    rows[i] = a + delim + b;
  }
  return lines.join(nl) + nl + rows.join(nl) + (n > 0 ? nl : "");
}

function oneLine(s: string): string {
  return s.replace(/\s*[\r\n]+\s*/g, " ");
}

/** A file name for a curve's CSV export: the label with unsafe characters replaced, plus ".csv". */
export function curveCsvFileName(label: string): string {
  const safe = [...label.trim()]
    .map((ch) => (ch.charCodeAt(0) < 32 || '\\/:*?"<>|'.includes(ch) ? "_" : ch))
    .join("")
    .replace(/\s+/g, " ")
    .slice(0, 120);
  return `${safe || "curve"}.csv`;
}
