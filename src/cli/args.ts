// Command-line arguments of the renderer (`npm run render -- …`): a pure parser from argv to options, and
// the usage text. Kept apart from render.ts so the rules (roles per file, ranges, presets) are unit-testable.
import type { CurveRole, ExclusionMark, LegendPlace, SizePreset } from "../project/types";
import { LEGEND_SCALE_LIMITS } from "../project/limits";
import { CURVE_ROLES, EXCLUSION_MARKS, FIGURE_FONTS, LEGEND_PLACES, SIZE_PRESETS } from "../project/figure-options";
import type { FigureFontFamily } from "../formats/pdf/fonts";
import { overlapFormat } from "./overlap-out";
import { parseMassText, type ParsedValue } from "../formats/axis-range";
import { AXES_OPTIONS, AXES_USAGE, readAxesOption, type AxesCliOptions } from "./args-axes";

/** One input file; `role` is set for CSV files (from the --role in effect for it). */
export interface CliInput {
  path: string;
  kind: "project" | "svg" | "pdf" | "csv";
  role: CurveRole;
}

export interface CliOptions extends AxesCliOptions {
  inputs: CliInput[];
  /** SVG output path. */
  out?: string;
  /** PNG output path. */
  png?: string;
  /** PNG density at the physical size, dots per inch. @default 300 */
  dpi: number;
  /** PNG at this multiple of the 96 px-per-inch scene size instead of `dpi` (1×, 2×). */
  scale?: number;
  preset?: SizePreset;
  widthMm?: number;
  heightMm?: number;
  /** Put the project into the SVG's <metadata>. @default true */
  embed: boolean;
  /** Also write model lines and bands as CSV to this path. */
  modelsCsv?: string;
  /** Also write the overlap summary (.csv, .md or .tex) and its intervals (.csv or .md). */
  overlap?: string;
  overlapIntervals?: string;
  /** E/N texts from --model, in order ("8/3", "0..44/3"). */
  models: string[];
  massUnit?: string;
  couplingUnit?: string;
  /** Skip (and report) CSV rows that cannot be read instead of stopping. @default false */
  skipBadRows: boolean;
  massRangeEv?: [number, number];
  gRange?: [number, number];
  /** How every exclusion curve marks its excluded side. @default each curve's own (hatches for CSV input) */
  exclusions?: ExclusionMark;
  title?: string;
  /** The figure's font family (SVG, PNG and PDF). @default the project's (a new project's is "sans") */
  font?: FigureFontFamily;
  /** Where the legend goes. @default the project's (a new project's is "auto") */
  legend?: LegendPlace;
  /** Legend text size as a factor of its default (Figure.legendScale). @default the project's */
  legendScale?: number;
  help: boolean;
}

export type ArgsResult = { ok: true; options: CliOptions } | { ok: false; error: string };

export const USAGE = `axband render: figures from a project without a browser

usage:
  npm run render -- PROJECT.axband.json -o figure.svg [--png figure.png --dpi 300] [--preset single-column]
  npm run render -- exported.svg -o figure.svg        (an SVG exported by axband carries its project)
  npm run render -- exported.pdf -o figure.pdf        (so does a PDF exported by axband, as an attachment)
  npm run render -- a.csv [--role projection] b.csv -o figure.svg [--model 8/3 --model 0..44/3]

output (at least one of -o, --png, --models-csv, --overlap, --overlap-intervals):
  -o, --out FILE.svg|.pdf   write the figure as SVG (the same SVG the app exports) or, for a name ending in
                            .pdf, as a vector PDF of the figure's physical size with the project attached
  --font sans|serif         the figure's font in SVG, PNG and PDF: Computer Modern Sans or Serif, LaTeX's own
                            look (default: the project's; sans for CSV input)
  --exclusions hatch|fill|hatch-fill  mark every exclusion's excluded side with short hatches (the house
                            style), the translucent fill, or both (default: each curve's own)
  --legend PLACE            where the legend goes: auto (a free inner corner, else outside right or below),
                            top-left, top-right, bottom-left, bottom-right, outside-right, below (under the
                            plot, in columns), above (between title and plot), on-plot (each label beside its
                            own line, clear of the data; no legend box), hidden (default: the project's)
  --legend-scale K          legend text size as a factor of the default, 0.7 to 1.5 (1: 7 pt at single-column);
                            entries wrap, and any that must still be shortened are named on stderr
  --png FILE.png            write the figure as PNG
  --dpi N                   PNG dots per inch at the figure's physical size (default 300)
  --scale K                 PNG at K times the 96-px-per-inch size instead (1 or 2, as the app's 1x/2x)
  --preset NAME             slide | single-column | double-column | custom (default: the project's own)
  --width-mm W --height-mm H  size of the custom preset, in mm
  --no-embed                leave the project out of the SVG's <metadata> (smaller file, cannot be reopened);
                            by default it is embedded, with curve data while that stays under 2 MB
  --models-csv FILE.csv     also write the model lines and bands as CSV (m_a, f_a, g_low, g_high)
  --overlap FILE            also write the overlap summary, one row per model × curve that overlap:
                            FILE.csv, FILE.md (with a caption paragraph) or FILE.tex (booktabs + siunitx)
  --overlap-intervals FILE  also write every overlap interval: FILE.csv or FILE.md
  --mass-range LO:HI        mass axis in eV, e.g. 1e-7:1e-2, or with units, 5ueV:1.2GHz (CSV input: default
                            fitted to the data)
  --g-range LO:HI           y axis in GeV^-1 (CSV input: default fitted to the data)
  --title TEXT              figure title

${AXES_USAGE}

CSV input (two columns, mass and coupling; '#' comment lines; optional header with units):
  --role R                  exclusion | projection | region for the CSV files after it (up to the next
                            --role); files before any --role are exclusions
  --model E/N               a model line (8/3) or band (0..44/3); repeatable
  --mass-unit U             mass unit when the header names none: eV, meV, ueV, neV, peV, keV, GeV, Hz, kHz,
                            MHz, GHz, THz
  --coupling-unit U         coupling unit when the header names none: GeV^-1 (or 1/GeV)
  --skip-bad-rows           skip unreadable rows (each reported as file:row:column: reason) instead of stopping

  -h, --help                this text

Exit codes: 0 written; 2 bad input or options (nothing written); 1 unexpected failure.
Nothing is downloaded; outputs are written to a temporary file next to the target, then renamed.`;

function kindOf(path: string): CliInput["kind"] {
  const p = path.toLowerCase();
  if (p.endsWith(".json")) return "project";
  if (p.endsWith(".svg")) return "svg";
  if (p.endsWith(".pdf")) return "pdf";
  return "csv";
}

function parseRange(flag: string, text: string, parse?: (t: string) => ParsedValue): [number, number] | string {
  const parts = text.split(/[:,]/).map((s) => s.trim());
  if (parts.length !== 2) return `${flag}: expected LO:HI, e.g. 1e-7:1e-2, got "${text}"`;
  const read = parts.map((p) => (parse ? parse(p) : { ok: true as const, value: Number(p) }));
  for (const r of read) if (!r.ok) return `${flag}: ${r.reason}`;
  const [lo, hi] = read.map((r) => (r.ok ? r.value : NaN));
  if (!(Number.isFinite(lo) && Number.isFinite(hi) && lo > 0 && hi > 0))
    return `${flag}: both ends must be positive numbers (log axis), got "${text}"`;
  if (lo >= hi) return `${flag}: LO must be below HI, got "${text}"`;
  return [lo, hi];
}

function positive(flag: string, text: string): number | string {
  const v = Number(text);
  return Number.isFinite(v) && v > 0 && text.trim() !== "" ? v : `${flag}: expected a positive number, got "${text}"`;
}

/** What an option's handler may change besides the options: the roles given so far. */
interface ParseState {
  o: CliOptions;
  roles: CurveRole[];
}

/**
 * One command-line option: its spellings, whether it takes a value, and what it does; an error text is
 * returned for a bad value. One entry per option, so adding an option is adding one line here.
 */
interface OptionSpec {
  names: readonly string[];
  /** A flag takes no value (`--no-embed`); every other option takes exactly one. */
  flag?: true;
  apply: (s: ParseState, value: string, name: string) => string | void;
}

/** A handler storing a positive number into `key`. */
function positiveInto(key: "dpi" | "scale" | "widthMm" | "heightMm"): OptionSpec["apply"] {
  return (s, value, name) => {
    const r = positive(name, value);
    if (typeof r === "string") return r;
    s.o[key] = r;
  };
}

/** A handler storing a LO:HI range into `key`. */
function rangeInto(key: "massRangeEv" | "gRange", parse?: (t: string) => ParsedValue): OptionSpec["apply"] {
  return (s, value, name) => {
    const r = parseRange(name, value, parse);
    if (typeof r === "string") return r;
    s.o[key] = r;
  };
}

/** A handler accepting one of `allowed` into `set`. */
function oneOf<T extends string>(allowed: readonly T[], set: (o: CliOptions, v: T) => void): OptionSpec["apply"] {
  return (s, value, name) => {
    const list = allowed.length === 2 ? allowed.join(" or ") : `one of ${allowed.join(", ")}`;
    if (!allowed.includes(value as T)) return `${name}: expected ${list}, got "${value}"`;
    set(s.o, value as T);
  };
}

const OPTIONS: readonly OptionSpec[] = [
  { names: ["-h", "--help"], flag: true, apply: (s) => void (s.o.help = true) },
  { names: ["--no-embed"], flag: true, apply: (s) => void (s.o.embed = false) },
  { names: ["--skip-bad-rows"], flag: true, apply: (s) => void (s.o.skipBadRows = true) },
  { names: ["-o", "--out"], apply: (s, v) => void (s.o.out = v) },
  { names: ["--png"], apply: (s, v) => void (s.o.png = v) },
  { names: ["--models-csv"], apply: (s, v) => void (s.o.modelsCsv = v) },
  {
    names: ["--overlap", "--overlap-intervals"],
    apply: (s, v, name) => {
      const r = overlapFormat(name, v, name === "--overlap");
      if (r !== "csv" && r !== "md" && r !== "tex") return r;
      if (name === "--overlap") s.o.overlap = v;
      else s.o.overlapIntervals = v;
    },
  },
  { names: ["--dpi"], apply: positiveInto("dpi") },
  { names: ["--scale"], apply: positiveInto("scale") },
  { names: ["--width-mm"], apply: positiveInto("widthMm") },
  { names: ["--height-mm"], apply: positiveInto("heightMm") },
  { names: ["--preset"], apply: oneOf(SIZE_PRESETS, (o, v) => (o.preset = v)) },
  {
    names: ["--role"],
    apply: (s, v, name) =>
      CURVE_ROLES.includes(v as CurveRole)
        ? void s.roles.push(v as CurveRole)
        : `${name}: expected one of ${CURVE_ROLES.join(", ")}, got "${v}"`,
  },
  { names: ["--model"], apply: (s, v) => void s.o.models.push(v) },
  { names: ["--font"], apply: oneOf(FIGURE_FONTS, (o, v) => (o.font = v)) },
  { names: ["--legend"], apply: oneOf(LEGEND_PLACES, (o, v) => (o.legend = v)) },
  { names: ["--legend-scale"], apply: legendScale },
  { names: ["--mass-unit"], apply: (s, v) => void (s.o.massUnit = v) },
  { names: ["--coupling-unit"], apply: (s, v) => void (s.o.couplingUnit = v) },
  { names: ["--mass-range"], apply: rangeInto("massRangeEv", (t) => parseMassText(t, "eV")) },
  { names: ["--g-range"], apply: rangeInto("gRange") },
  { names: ["--title"], apply: (s, v) => void (s.o.title = v) },
  { names: ["--exclusions"], apply: exclusions },
  ...AXES_OPTIONS.map((n): OptionSpec => ({
    names: [n],
    apply: (s, v, name) => readAxesOption(name, v, s.o) ?? undefined,
  })),
];

function exclusions(s: ParseState, value: string, name: string): string | void {
  if (!EXCLUSION_MARKS.includes(value as ExclusionMark))
    return `${name}: expected ${EXCLUSION_MARKS.slice(0, -1).join(", ")} or ${EXCLUSION_MARKS.at(-1)}, got "${value}"`;
  s.o.exclusions = value as ExclusionMark;
}

function legendScale(s: ParseState, value: string, name: string): string | void {
  const [lo, hi] = LEGEND_SCALE_LIMITS;
  const v = Number(value);
  if (!(value.trim() !== "" && Number.isFinite(v) && v >= lo && v <= hi))
    return `${name}: expected a factor from ${lo} to ${hi} (1 = the default size), got "${value}"`;
  s.o.legendScale = v;
}

const BY_NAME = new Map(OPTIONS.flatMap((spec) => spec.names.map((n) => [n, spec] as const)));

/** The first contradiction between the options and inputs read, or null. */
function conflicts(o: CliOptions, argv: readonly string[], roles: CurveRole[], lastFileRoleCount: number) {
  if (o.inputs.length === 0) return "no input file (a .axband.json project, an exported .svg, or CSV files)";
  if (!o.out && !o.png && !o.modelsCsv && !o.overlap && !o.overlapIntervals)
    return "nothing to write: give -o FILE.svg, --png FILE.png, --models-csv FILE.csv or --overlap FILE";
  const projects = o.inputs.filter((f) => f.kind !== "csv");
  // A trailing --role would otherwise be dropped without a word (it never reaches back to earlier files).
  if (projects.length === 0 && roles.length > lastFileRoleCount)
    return `--role ${roles[roles.length - 1]} is followed by no CSV file: a --role applies to the files after it`;
  if (projects.length > 0 && o.inputs.length > 1)
    return "give either one project (.json or exported .svg) or CSV files, not both or several projects";
  if (projects.length > 0 && (o.models.length > 0 || roles.length > 0))
    return "--model and --role apply to CSV input only; edit the project in the app to change its models";
  if (o.scale !== undefined && argv.some((a) => a === "--dpi" || a.startsWith("--dpi=")))
    return "give --dpi or --scale, not both";
  if ((o.widthMm !== undefined || o.heightMm !== undefined) && o.preset !== "custom")
    return "--width-mm/--height-mm need --preset custom";
  const outs = [o.out, o.png, o.modelsCsv, o.overlap, o.overlapIntervals].filter((p): p is string => !!p);
  if (new Set(outs).size !== outs.length) return "two outputs have the same path";
  if (outs.some((p) => o.inputs.some((f) => f.path === p))) return "an output path is also an input file";
  return null;
}

/**
 * Reads the renderer's argv (without `node` and the script). `--name=value` and `--name value` both work;
 * `--` ends the options. Input kind goes by extension: `.json` project, `.svg` exported figure, else CSV.
 */
export function parseArgs(argv: readonly string[]): ArgsResult {
  const o: CliOptions = { inputs: [], dpi: 300, embed: true, models: [], skipBadRows: false, help: false };
  const state: ParseState = { o, roles: [] };
  const pending: { path: string; roleCount: number }[] = [];
  let onlyFiles = false;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (onlyFiles || !arg.startsWith("-") || arg === "-") {
      pending.push({ path: arg, roleCount: state.roles.length });
      continue;
    }
    if (arg === "--") {
      onlyFiles = true;
      continue;
    }
    const eq = arg.startsWith("--") ? arg.indexOf("=") : -1;
    const name = eq > 0 ? arg.slice(0, eq) : arg;
    const spec = BY_NAME.get(name);
    if (!spec) return { ok: false, error: `unknown option ${name}` };
    if (spec.flag && eq > 0) return { ok: false, error: `${name} takes no value` };
    let value = "";
    if (!spec.flag && eq > 0) value = arg.slice(eq + 1);
    else if (!spec.flag) {
      if (i + 1 >= argv.length) return { ok: false, error: `${name} needs a value` };
      value = argv[++i];
    }
    const error = spec.apply(state, value, name);
    if (typeof error === "string") return { ok: false, error };
  }
  o.inputs = pending.map(({ path, roleCount }) => ({
    path,
    kind: kindOf(path),
    role: roleCount > 0 ? state.roles[roleCount - 1] : "exclusion",
  }));
  if (o.help) return { ok: true, options: o };
  const lastFileRoleCount = pending.length > 0 ? pending[pending.length - 1].roleCount : 0;
  const error = conflicts(o, argv, state.roles, lastFileRoleCount);
  return error ? { ok: false, error } : { ok: true, options: o };
}
