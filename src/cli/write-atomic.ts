// All-or-nothing output for the renderer: every file is written to a temporary name in its own directory and
// renamed into place only when all of them were written, so a failure never leaves a half-written figure.
import { renameSync, unlinkSync, writeFileSync } from "node:fs";
import { basename, dirname, join } from "node:path";

export interface OutputFile {
  path: string;
  data: string | Uint8Array;
}

/** Temporary sibling of `path`: hidden, unique per process and call, same directory (so rename is atomic). */
export function tempPathFor(path: string, n = 0): string {
  return join(dirname(path), `.${basename(path)}.${process.pid}.${Date.now().toString(36)}${n}.tmp`);
}

/**
 * Writes the files: all to temporary siblings first, then renames each over its target. On any error the
 * temporary files are removed and the error is rethrown; targets written before are not touched.
 */
export function writeAllOrNothing(files: readonly OutputFile[]): void {
  const temps: string[] = [];
  try {
    files.forEach((f, i) => {
      const tmp = tempPathFor(f.path, i);
      temps.push(tmp);
      writeFileSync(tmp, f.data);
    });
    files.forEach((f, i) => renameSync(temps[i], f.path));
    temps.length = 0;
  } finally {
    for (const t of temps) {
      try {
        unlinkSync(t);
      } catch {
        // already renamed or never created
      }
    }
  }
}
