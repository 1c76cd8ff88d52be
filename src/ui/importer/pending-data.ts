// TEMPORARY adapter: data/worker functions the second UI engineer's panels call, declared with the
// documented signatures until the real modules land. Each is replaced by the real import and this file
// removed; calling one before then says so plainly.
import type { Curve, Project } from "../../data/types";
import { parseCurveSource, type CurveParseOptions, type CurveParseResult, type ImportProgress } from "../../data/csv";

function notYet(name: string): never {
  throw new Error(`${name} is not available yet in this build.`);
}

/** Stand-in for src/worker/import-client.ts: parses on the calling thread until the worker client lands. */
export function importInWorker(
  file: Blob,
  opts: CurveParseOptions,
  onProgress: (p: ImportProgress) => void,
): { promise: Promise<CurveParseResult>; cancel: () => void } {
  const ac = new AbortController();
  return { promise: parseCurveSource(file, opts, { onProgress, signal: ac.signal }), cancel: () => ac.abort() };
}
export function curveToCsv(_curve: Curve, _opts: { massUnit?: string; couplingUnit?: string }): string {
  return notYet("curveToCsv");
}
export function projectToFile(_project: Project): string {
  return notYet("projectToFile");
}
export function projectFromFile(_text: string): { ok: true; project: Project } | { ok: false; error: string } {
  return notYet("projectFromFile");
}
