// Reading the renderer's input files: a failure as one line naming the file, and a CSV file decoded and parsed
// as the app's import does. Small on purpose: the parse workers load this module and the CSV parser only.
import { readFileSync } from "node:fs";
import { basename } from "node:path";
import { decodeImportBytes, formatProblem, parseCurveText, type CurveParseResult } from "../formats/csv";
import type { CliOptions } from "./args";

/** A problem with the user's input or options: reported on stderr, exit code 2, nothing written. */
export class InputError extends Error {}

/** A file's bytes; an InputError naming the file when it cannot be read. */
export function readBytes(path: string): Buffer {
  try {
    return readFileSync(path);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why =
      code === "ENOENT"
        ? "no such file"
        : code === "EISDIR"
          ? "is a directory"
          : code === "EACCES"
            ? "permission denied"
            : (e as Error).message;
    throw new InputError(`${path}: cannot read the file (${why})`);
  }
}

/** A CSV file's text, decoded as the app's import decodes it (UTF-16 by its BOM, UTF-8, else Windows-1252). */
function readCsvText(path: string): { text: string; encoding: string } {
  const d = decodeImportBytes(readBytes(path));
  if (!d.ok) throw new InputError(formatProblem(path, d.problem));
  return d;
}

/** Reads and parses one CSV input as the app's import would (the worker threads call this too). */
export function parseCsvFile(path: string, opts: Pick<CliOptions, "massUnit" | "couplingUnit">): CurveParseResult {
  const { text, encoding } = readCsvText(path);
  return parseCurveText(text, {
    fileName: basename(path),
    massUnit: opts.massUnit,
    couplingUnit: opts.couplingUnit,
    encoding,
  });
}
