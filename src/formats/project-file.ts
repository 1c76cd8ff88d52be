// Project files (NAME.axband.json, curve data included) and the autosave form for browser storage (text plus one
// binary record per curve); reading either goes through the restore step of links and never throws.
import { parseJsonSafely, projectToJsonValue } from "../project/json";
import { restoreProject } from "../project/restore";
import { CURVE_STATE, PROJECT_STATE, keysFor, type PersistTarget } from "../project/state-table";
import type { Curve, Project } from "../project/types";
import { PROJECT_VERSION } from "../project/types";
import { safeFileName } from "./file-name";

/** Value of the "format" field that marks a project file. */
export const PROJECT_FILE_FORMAT = "axband-project";
/** Value of the "format" field of the autosave record. */
export const STORAGE_FORMAT = "axband-storage";
/** File name ending of project files. */
export const PROJECT_FILE_SUFFIX = ".axband.json";
/** Longest project file text accepted (100 MiB of characters). */
export const PROJECT_FILE_MAX_CHARS = 100 * 1024 * 1024;

type Rec = Record<string, unknown>;

// -------------------------------------------------------------------------------------------------- pretty JSON

// Long number arrays are wrapped, so a file with large curves stays readable and diffs well.
const NUMBERS_PER_LINE = 10;

function pretty(v: unknown, indent: string): string {
  if (v instanceof Float64Array) return pretty(Array.from(v), indent);
  if (Array.isArray(v)) {
    if (v.length === 0) return "[]";
    const inner = `${indent}  `;
    if (v.every((x) => typeof x === "number")) {
      const nums = v.map((x) => JSON.stringify(x));
      if (nums.length <= NUMBERS_PER_LINE) return `[${nums.join(", ")}]`;
      const lines: string[] = [];
      for (let i = 0; i < nums.length; i += NUMBERS_PER_LINE)
        lines.push(inner + nums.slice(i, i + NUMBERS_PER_LINE).join(", "));
      return `[\n${lines.join(",\n")}\n${indent}]`;
    }
    return `[\n${v.map((x) => inner + pretty(x, inner)).join(",\n")}\n${indent}]`;
  }
  if (typeof v === "object" && v !== null) {
    const entries = Object.entries(v).filter(([, x]) => x !== undefined);
    if (entries.length === 0) return "{}";
    const inner = `${indent}  `;
    return `{\n${entries.map(([k, x]) => `${inner}${JSON.stringify(k)}: ${pretty(x, inner)}`).join(",\n")}\n${indent}}`;
  }
  return JSON.stringify(v) ?? "null";
}

// ---------------------------------------------------------------------------------------------------- selection

/** The project keys (and, per curve, the curve keys) that go to `target`, per the state table. */
function selectFor(project: Project, target: PersistTarget): Rec {
  const json = projectToJsonValue(project);
  const out: Rec = {};
  for (const key of keysFor(PROJECT_STATE, target)) {
    if (key === "curves") {
      const curveKeys = keysFor(CURVE_STATE, target);
      out.curves = (json.curves as Rec[]).map((c) => Object.fromEntries(curveKeys.map((k) => [k, c[k]])));
    } else {
      out[key] = json[key];
    }
  }
  return out;
}

// -------------------------------------------------------------------------------------------------------- files

/**
 * The project file text: pretty JSON with `"format": "axband-project"`, the schema version and everything
 * else, curve data included (as number arrays: each number is the shortest decimal that reads back exactly).
 */
export function projectToFile(project: Project): string {
  return `${pretty({ format: PROJECT_FILE_FORMAT, ...selectFor(project, { kind: "file" }), version: project.version }, "")}\n`;
}

/** A file name for the project: its name made safe ("project" when nothing is left) + ".axband.json". */
export function projectFileName(project: Pick<Project, "name">): string {
  return `${safeFileName(project.name, "project")}${PROJECT_FILE_SUFFIX}`;
}

export type ProjectFromFileResult = { ok: true; project: Project; repairs: string[] } | { ok: false; error: string };

/**
 * Read a project file. Never throws: text that is not JSON, not an axband project, from a newer version, or
 * invalid gives `{ ok: false, error }` with a message naming the file.
 * @param text the file's content
 * @param fileName shown in messages. @default "This file"
 */
export function projectFromFile(text: string, fileName?: string): ProjectFromFileResult {
  const what = fileName ? `The file "${fileName}"` : "This file";
  try {
    if (typeof text !== "string") return { ok: false, error: `${what} could not be read (no text).` };
    if (text.length > PROJECT_FILE_MAX_CHARS) {
      return {
        ok: false,
        error: `${what} is too large (more than ${PROJECT_FILE_MAX_CHARS / 1048576} MB); it was not opened.`,
      };
    }
    let raw: unknown;
    try {
      raw = parseJsonSafely(text.replace(/^\uFEFF/, ""));
    } catch (e) {
      return {
        ok: false,
        error: `${what} is not an axband project file (it is not valid JSON: ${e instanceof Error ? e.message : String(e)}).`,
      };
    }
    if (typeof raw !== "object" || raw === null || Array.isArray(raw) || (raw as Rec).format !== PROJECT_FILE_FORMAT) {
      return {
        ok: false,
        error: `${what} is not an axband project file (it has no "format": "${PROJECT_FILE_FORMAT}").`,
      };
    }
    const r = restoreProject(raw);
    if (!r.ok) {
      if (r.futureVersion !== undefined) {
        return {
          ok: false,
          error: `${what} was made by a newer version of axband (format v${r.futureVersion}); this version reads files up to format v${PROJECT_VERSION}. Reload the page to get the newest axband.`,
        };
      }
      return { ok: false, error: `${what} could not be opened: ${r.error}.` };
    }
    return r;
  } catch (e) {
    return { ok: false, error: `${what} could not be read (${e instanceof Error ? e.message : String(e)}).` };
  }
}

// ------------------------------------------------------------------------------------------------------ storage

/** The data arrays of one curve, stored apart from the rest (e.g. in IndexedDB, which keeps Float64Arrays as they are). */
export interface StoredCurveData {
  id: string;
  massEv: Float64Array;
  gInvGeV: Float64Array;
}

/**
 * The autosave form: `meta`, a JSON string of everything except curve data (small: fits localStorage), and
 * `curves`, the data arrays per curve id (the arrays are the project's own, not copies: they are never mutated).
 */
export function serializeForStorage(project: Project): { meta: string; curves: StoredCurveData[] } {
  const meta = { format: STORAGE_FORMAT, ...selectFor(project, { kind: "storage-meta" }), version: project.version };
  const separate = keysFor(CURVE_STATE, { kind: "storage-separate" });
  const curves = project.curves.map((c) => {
    const rec: Rec = { id: c.id };
    for (const k of separate) rec[k] = c[k];
    return rec as unknown as StoredCurveData;
  });
  return { meta: JSON.stringify(meta), curves };
}

export type DeserializeResult = { ok: true; project: Project; repairs: string[] } | { ok: false; error: string };

/**
 * Rebuild the autosaved project from {@link serializeForStorage}'s parts. A curve whose data record is
 * missing or broken is left out and named in `repairs`; the rest restores as usual. Never throws.
 * @param meta the stored `meta` string
 * @param curves the stored data records (Float64Array or plain number arrays). @default []
 */
export function deserializeFromStorage(
  meta: string,
  curves: readonly { id: string; massEv: ArrayLike<number>; gInvGeV: ArrayLike<number> }[] = [],
): DeserializeResult {
  const what = "The autosaved project";
  try {
    if (typeof meta !== "string") return { ok: false, error: `${what} could not be read (no text).` };
    let raw: unknown;
    try {
      raw = parseJsonSafely(meta);
    } catch {
      return { ok: false, error: `${what} is damaged (not valid JSON).` };
    }
    if (typeof raw !== "object" || raw === null || Array.isArray(raw) || (raw as Rec).format !== STORAGE_FORMAT) {
      return { ok: false, error: `${what} is not in the expected form (no "format": "${STORAGE_FORMAT}").` };
    }
    const byId = new Map<string, (typeof curves)[number]>();
    for (const c of Array.isArray(curves) ? curves : []) if (c && typeof c.id === "string") byId.set(c.id, c);
    const missing: string[] = [];
    const obj = raw as Rec;
    const metaCurves = Array.isArray(obj.curves) ? (obj.curves as unknown[]) : undefined;
    const separate = keysFor(CURVE_STATE, { kind: "storage-separate" }) as (keyof Curve)[];
    const withData = metaCurves?.flatMap((c) => {
      if (typeof c !== "object" || c === null) return [c];
      const cm = c as Rec;
      const data = typeof cm.id === "string" ? byId.get(cm.id) : undefined;
      if (!data) {
        missing.push(typeof cm.label === "string" ? cm.label : String(cm.id));
        return [];
      }
      const full: Rec = { ...cm };
      for (const k of separate) full[k] = (data as unknown as Rec)[k];
      return [full];
    });
    const r = restoreProject(metaCurves ? { ...obj, curves: withData } : obj);
    if (!r.ok) return { ok: false, error: `${what} could not be restored: ${r.error}.` };
    const repairs = missing.map((label) => `curve "${label}" was left out: its data were not found in browser storage`);
    return { ok: true, project: r.project, repairs: [...repairs, ...r.repairs] };
  } catch (e) {
    return { ok: false, error: `${what} could not be read (${e instanceof Error ? e.message : String(e)}).` };
  }
}
