// Dialect and header detection: from the first lines of a file, the delimiter, the decimal mark, whether a
// header names the columns, which columns hold mass and coupling, and their units (options override).
import {
  headerUnit,
  massUnitInfo,
  parseCouplingUnit,
  parseMassUnit,
  parseRational,
  type CouplingUnit,
  type HeaderUnit,
  type MassUnit,
} from "../units";
import { isNumberText } from "./numbers";
import { splitFields, splitHeader, WS } from "./fields";
import type { CurveParseOptions, ImportMessage, ImportProblem, UnitSource } from "./types";

/** A non-comment line kept for detection, with its 1-based line number. */
export interface SniffLine {
  row: number;
  text: string;
}

/** How the file is read, fixed before the data rows are. */
export interface Layout {
  delim: number;
  comma: boolean;
  /** Line of the header, or -1. */
  headerRow: number;
  header: string[] | null;
  massCol: number;
  gCol: number;
  massUnit: MassUnit;
  massUnitSource: UnitSource;
  couplingUnit: CouplingUnit;
  couplingUnitSource: UnitSource;
  eOverN: number | null;
  messages: ImportMessage[];
}

const DELIM_NAMES: Record<string, number> = {
  ",": 44,
  comma: 44,
  ";": 59,
  semicolon: 59,
  "\t": 9,
  tab: 9,
  "\\t": 9,
  " ": WS,
  space: WS,
  spaces: WS,
  whitespace: WS,
};

const badOptions = (message: string): ImportProblem => ({ code: "bad-options", message });

/** Fixes delimiter, header, columns and units from the first lines (and the options), or names what is wrong. */
export function detectLayout(lines: SniffLine[], o: CurveParseOptions): Layout | ImportProblem {
  const userMass = o.massColumn !== undefined ? Math.floor(o.massColumn) - 1 : null;
  const userG = o.couplingColumn !== undefined ? Math.floor(o.couplingColumn) - 1 : null;
  if (
    (userMass !== null && !(userMass >= 0)) ||
    (userG !== null && !(userG >= 0)) ||
    (userMass !== null && userMass === userG)
  ) {
    return badOptions("the mass and coupling columns must be two different columns, counted from 1");
  }
  const probeM = userMass ?? (userG === 0 ? 1 : 0);
  const probeG = userG ?? (probeM === 0 ? 1 : 0);

  // Header candidate: a first line with letters whose data columns are not numbers.
  const first = lines[0]?.text ?? "";
  const letters = /\p{L}/u.test(first.replace(/[eE][+-]?\d/g, ""));
  const sample = letters && lines.length > 1 ? lines.slice(1) : lines;

  const dialect = chooseDialect(o, sample, probeM, probeG);
  if ("code" in dialect) return dialect;
  const { delim, comma } = dialect;

  let isHeader = o.header;
  if (isHeader === undefined && lines.length > 0) {
    const f = splitFields(first, delim);
    isHeader =
      letters &&
      !(f.length > Math.max(probeM, probeG) && isNumberText(f[probeM], comma) && isNumberText(f[probeG], comma));
  }
  const dataCols = sample.length > 0 && sample !== lines ? splitFields(sample[0].text, delim).length : 0;
  const header = isHeader && lines.length > 0 ? splitHeader(first, delim, dataCols) : null;
  const units: HeaderUnit[] = header ? header.map(headerUnit) : [];
  const messages: ImportMessage[] = [];
  const { massCol, gCol } = chooseColumns(userMass, userG, units, messages);
  const mass = chooseMassUnit(o, units[massCol] ?? null, massCol, messages);
  if ("code" in mass) return mass;
  const coupling = chooseCouplingUnit(o, units[gCol] ?? null, gCol, messages);
  if ("code" in coupling) return coupling;
  const unknown =
    (mass.source === "default" && unknownUnit(header?.[massCol], massCol, "mass")) ||
    (coupling.source === "default" && unknownUnit(header?.[gCol], gCol, "coupling"));
  if (unknown) return unknown;
  return {
    delim,
    comma,
    headerRow: header ? lines[0].row : -1,
    header,
    massCol,
    gCol,
    massUnit: mass.unit,
    massUnitSource: mass.source,
    couplingUnit: coupling.unit,
    couplingUnitSource: coupling.source,
    eOverN: coupling.eOverN,
    messages,
  };
}

/** The delimiter (given or detected) and the decimal mark. */
function chooseDialect(
  o: CurveParseOptions,
  sample: SniffLine[],
  probeM: number,
  probeG: number,
): { delim: number; comma: boolean } | ImportProblem {
  if (o.delimiter !== undefined && o.delimiter !== "" && o.delimiter !== "auto") {
    const d = DELIM_NAMES[o.delimiter] ?? DELIM_NAMES[o.delimiter.toLowerCase()];
    if (d === undefined) return badOptions(`unknown delimiter "${o.delimiter}" (use comma, semicolon, tab or spaces)`);
    const comma =
      o.decimalComma ?? (d !== 44 && score(sample, d, true, probeM, probeG) > score(sample, d, false, probeM, probeG));
    return { delim: d, comma };
  }
  const marks = o.decimalComma === undefined ? [false, true] : [o.decimalComma];
  const candidates: [number, boolean][] = [];
  for (const d of [44, 59, 9, WS]) {
    for (const m of marks) {
      // Unless told otherwise, a comma delimiter goes with decimal points (a decimal comma would need quotes).
      if (o.decimalComma === undefined && d === 44 && m) continue;
      candidates.push([d, m]);
    }
  }
  let best = candidates[0];
  let bestScore = -1;
  for (const cand of candidates) {
    const sc = score(sample, cand[0], cand[1], probeM, probeG);
    if (sc > bestScore) {
      best = cand;
      bestScore = sc;
    }
  }
  if (bestScore === 0) {
    // Nothing numeric: take the delimiter that splits the lines most consistently into several fields.
    let bestCount = 0;
    best = [WS, false];
    for (const d of [44, 59, 9, WS]) {
      const k = consistentFields(sample, d);
      if (k > bestCount) {
        bestCount = k;
        best = [d, false];
      }
    }
  }
  const [delim, comma] = best;
  return { delim, comma };
}

/** Columns: the user's, else the ones the header units point at, else 1 and 2. */
function chooseColumns(
  userMass: number | null,
  userG: number | null,
  units: HeaderUnit[],
  messages: ImportMessage[],
): { massCol: number; gCol: number } {
  let massCol = userMass;
  let gCol = userG;
  const headerMass = units.findIndex((u) => u?.kind === "mass");
  const headerG = units.findIndex((u) => u?.kind === "coupling");
  if (massCol === null && headerMass >= 0 && headerMass !== gCol) massCol = headerMass;
  if (gCol === null && headerG >= 0 && headerG !== massCol) gCol = headerG;
  if (massCol === null) massCol = gCol === 0 ? 1 : 0;
  if (gCol === null) gCol = firstOther(massCol, units);
  if (userMass === null && userG === null && (massCol !== 0 || gCol !== 1)) {
    messages.push({
      level: "info",
      text: `the header names the units of columns ${massCol + 1} (mass) and ${gCol + 1} (coupling); those are read`,
    });
  }
  return { massCol, gCol };
}

function firstOther(massCol: number, units: HeaderUnit[]): number {
  for (let i = 0; i < units.length; i++) if (i !== massCol && units[i]?.kind === "coupling") return i;
  return massCol === 0 ? 1 : 0;
}

function chooseMassUnit(
  o: CurveParseOptions,
  hm: HeaderUnit,
  massCol: number,
  messages: ImportMessage[],
): { unit: MassUnit; source: UnitSource } | ImportProblem {
  let unit: MassUnit = "eV";
  let source: UnitSource = "default";
  if (o.massUnit !== undefined && o.massUnit !== "" && o.massUnit !== "auto") {
    const u = parseMassUnit(o.massUnit);
    if (!u) return badOptions(`unknown mass unit "${o.massUnit}"`);
    unit = u;
    source = "option";
    if (hm?.kind === "mass" && hm.unit !== u) {
      messages.push({
        level: "warning",
        text: `the header says the mass is in ${massUnitInfo(hm.unit).label}; reading it in ${massUnitInfo(u).label} as chosen`,
      });
    }
  } else if (hm?.kind === "mass") {
    unit = hm.unit;
    source = "header";
  }
  if (hm?.kind === "coupling") {
    messages.push({
      level: "warning",
      text: `the header of column ${massCol + 1}, read as the mass, names a coupling unit`,
    });
  }
  return { unit, source };
}

function chooseCouplingUnit(
  o: CurveParseOptions,
  hg: HeaderUnit,
  gCol: number,
  messages: ImportMessage[],
): { unit: CouplingUnit; source: UnitSource; eOverN: number | null } | ImportProblem {
  let unit: CouplingUnit = "GeV^-1";
  let source: UnitSource = "default";
  let eOverN: number | null = null;
  if (o.couplingUnit !== undefined && o.couplingUnit !== "" && o.couplingUnit !== "auto") {
    const u = parseCouplingUnit(o.couplingUnit);
    if (!u) return badOptions(`unknown coupling unit "${o.couplingUnit}"`);
    unit = u.unit;
    source = "option";
    eOverN = u.modelEOverN;
    if (hg?.kind === "coupling" && hg.unit !== u.unit) {
      messages.push({
        level: "warning",
        text: `the header says the coupling is "${hg.unit}"; reading it as "${u.unit}" as chosen`,
      });
    }
  } else if (hg?.kind === "coupling") {
    unit = hg.unit;
    source = "header";
    eOverN = hg.modelEOverN;
  }
  if (hg?.kind === "mass") {
    messages.push({
      level: "warning",
      text: `the header of column ${gCol + 1}, read as the coupling, names a mass unit`,
    });
  }
  if (o.modelEOverN !== undefined) {
    eOverN = parseRational(o.modelEOverN);
    if (eOverN === null) return badOptions(`the model line's E/N "${o.modelEOverN}" is not a number or fraction`);
  }
  if (unit === "model-line" && eOverN === null) {
    return badOptions("the coupling is a multiple of a model line: choose the model line's E/N");
  }
  return { unit, source, eOverN };
}

/**
 * A header field that names, in brackets, something that reads like a unit of this kind (ends in eV or Hz;
 * holds eV for a coupling; or holds a character that could not be decoded) but is no unit the import knows:
 * reading such a column in a default unit would be a silent guess, so the file stops until one is chosen.
 */
function unknownUnit(field: string | undefined, col: number, kind: "mass" | "coupling"): ImportProblem | null {
  if (field === undefined) return null;
  for (const m of field.matchAll(/[[(]([^\])]*)[\])]/g)) {
    const t = m[1].trim();
    if (!(t.includes("\ufffd") || (kind === "mass" ? /(?:ev|hz)$/i : /ev/i).test(t))) continue;
    const why = t.includes("\ufffd") ? " (a character could not be decoded: is the file in another encoding?)" : "";
    return {
      code: "unknown-unit",
      message: `the header of column ${col + 1} ("${field}") names the unit "${t}", which the import does not know${why}; choose the ${kind} unit`,
    };
  }
  return null;
}

/** How many sample lines read as numbers in both columns with this delimiter and decimal mark. */
function score(lines: SniffLine[], delim: number, comma: boolean, c1: number, c2: number): number {
  let ok = 0;
  for (const l of lines) {
    const f = splitFields(l.text, delim);
    if (f.length > Math.max(c1, c2) && isNumberText(f[c1], comma) && isNumberText(f[c2], comma)) ok++;
  }
  return ok;
}

/** The field count shared by most sample lines when it is at least 2, weighted by how many share it. */
function consistentFields(lines: SniffLine[], delim: number): number {
  const counts = new Map<number, number>();
  for (const l of lines) {
    const k = splitFields(l.text, delim).length;
    counts.set(k, (counts.get(k) ?? 0) + 1);
  }
  let best = 0;
  for (const [k, n] of counts) if (k >= 2 && n > best) best = n;
  return best;
}
