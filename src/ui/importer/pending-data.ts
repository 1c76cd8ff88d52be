// TEMPORARY adapter: the data/plot/worker functions the second UI engineer's panels call, declared with the
// documented signatures until the real modules land. Each is replaced by the real import and this file
// removed; calling one before then says so plainly.
import type { Curve, Project } from "../../data/types";

function notYet(name: string): never {
  throw new Error(`${name} is not available yet in this build.`);
}

export interface ParseOpts {
  fileName?: string;
  massUnit?: string;
  couplingUnit?: string;
  delimiter?: string;
  modelEOverN?: string;
  physics?: import("../../physics").PhysicsOpts;
  log10Mass?: boolean;
  log10Coupling?: boolean;
  massColumn?: number;
  couplingColumn?: number;
}
export interface ParseResult {
  massEv: Float64Array;
  gInvGeV: Float64Array;
  rejected: { row: number; column: number; reason: string }[];
  nonPositive: number;
  delimiter: string;
  header: string[] | null;
}
export function parseCurveText(_text: string, _opts?: ParseOpts): ParseResult {
  return notYet("parseCurveText");
}
export const MAX_IMPORT_BYTES = 200 * 1024 * 1024;
export function importInWorker(
  _file: Blob,
  _opts: ParseOpts,
  _onProgress: (fraction: number) => void,
): { promise: Promise<ParseResult>; cancel: () => void } {
  return notYet("importInWorker");
}
export function curveToCsv(_curve: Curve, _opts: { massUnit?: string; couplingUnit?: string }): string {
  return notYet("curveToCsv");
}
export function encodeLinkAuto(_project: Project): { fragment: string; omittedCurveIds: string[] } {
  return notYet("encodeLinkAuto");
}
export function decodeLink(_fragment: string): { ok: true; project: Project } | { ok: false; error: string } {
  return notYet("decodeLink");
}
export function projectToFile(_project: Project): string {
  return notYet("projectToFile");
}
export function projectFromFile(_text: string): { ok: true; project: Project } | { ok: false; error: string } {
  return notYet("projectFromFile");
}
export function exportFigureSvg(_project: Project, _opts: { preset?: string; embedProject?: boolean }): string {
  return notYet("exportFigureSvg");
}
export function extractProjectFromSvg(_svg: string): { ok: true; project: Project } | { ok: false; error: string } {
  return notYet("extractProjectFromSvg");
}
export function modelsToCsv(_project: Project): string {
  return notYet("modelsToCsv");
}
