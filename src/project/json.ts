// JSON helpers of the project: safe parsing (no prototype keys), the JSON-ready form, deep equality, and the one
// plain-object test of the codebase.
import type { Project } from "./types";

/** Whether a value is a non-null object that is not an array (parsed JSON objects, plain records). */
export function isPlainObject(x: unknown): x is Record<string, unknown> {
  return typeof x === "object" && x !== null && !Array.isArray(x);
}

const FORBIDDEN_KEYS = new Set(["__proto__", "constructor", "prototype"]);

/**
 * JSON.parse that drops the keys `__proto__`, `constructor` and `prototype` wherever they occur, so parsed
 * input can never reach an object's prototype through later copying.
 * @throws SyntaxError on invalid JSON (callers turn it into a message)
 */
export function parseJsonSafely(text: string): unknown {
  // The reviver costs a call per value; text that cannot hold such a key (not even "\u"-escaped) skips it.
  if (!/__proto__|constructor|prototype|\\u/.test(text)) return JSON.parse(text);
  return JSON.parse(text, (key, value) => (FORBIDDEN_KEYS.has(key) ? undefined : value));
}

/** The project as plain JSON-ready data: curve data as number arrays, everything else as is. */
export function projectToJsonValue(project: Project): Record<string, unknown> {
  return {
    version: project.version,
    name: project.name,
    physics: project.physics,
    models: project.models,
    curves: project.curves.map((c) => ({ ...c, massEv: Array.from(c.massEv), gInvGeV: Array.from(c.gInvGeV) })),
    figure: project.figure,
  };
}

/**
 * Deep equality of two projects (or any plain data): Float64Arrays are compared element by element, a
 * missing key equals a key holding `undefined`, and +0 equals −0.
 */
export function projectsEqual(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a === "number" && typeof b === "number") return Number.isNaN(a) && Number.isNaN(b);
  if (typeof a !== "object" || typeof b !== "object" || a === null || b === null) return false;
  if (a instanceof Float64Array || b instanceof Float64Array) {
    if (!(a instanceof Float64Array && b instanceof Float64Array) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (a[i] !== b[i] && !(Number.isNaN(a[i]) && Number.isNaN(b[i]))) return false;
    return true;
  }
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!projectsEqual(a[i], b[i])) return false;
    return true;
  }
  const ao = a as Record<string, unknown>;
  const bo = b as Record<string, unknown>;
  const keys = new Set([...Object.keys(ao), ...Object.keys(bo)]);
  for (const k of keys) if (!projectsEqual(ao[k], bo[k])) return false;
  return true;
}
