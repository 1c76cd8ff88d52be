// Opens a project from a file the user picked or dropped: a `.axband.json` project file or an SVG figure
// exported by axband (the project travels in its <metadata>). Validation is the data core's; this only
// routes the file and words the outcome.
import { MAX_IMPORT_BYTES, projectFromFile } from "../../data";
import { extractProjectFromSvg } from "../../formats/figure-file";
import type { Project } from "../../project/types";
import { repairsNote } from "../store/open-notes";

export type OpenOutcome = { ok: true; project: Project; message: string } | { ok: false; error: string };

/** True for files that open as a project rather than import as a curve: *.axband.json, *.json, *.svg. */
export function isProjectFileName(name: string): boolean {
  return /\.(axband\.json|json|svg)$/i.test(name);
}

/**
 * Reads and validates a project file or exported SVG. Never throws: every failure is a sentence for the user.
 */
export async function openProjectFile(file: Blob & { name: string }): Promise<OpenOutcome> {
  if (file.size === 0) return { ok: false, error: `${file.name} is empty.` };
  if (file.size > MAX_IMPORT_BYTES) {
    return {
      ok: false,
      error: `${file.name} is ${(file.size / 1e6).toFixed(0)} MB; the limit is ${(MAX_IMPORT_BYTES / 1e6).toFixed(0)} MB.`,
    };
  }
  let text: string;
  try {
    text = await file.text();
  } catch {
    return { ok: false, error: `${file.name} could not be read.` };
  }
  const isSvg =
    /\.svg$/i.test(file.name) || /^\s*(<\?xml[^>]*>\s*)?(<!--[\s\S]*?-->\s*)*<svg\b/i.test(text.slice(0, 4096));
  try {
    if (isSvg) {
      const r = extractProjectFromSvg(text);
      if (!r.ok) return { ok: false, error: `${file.name} was not opened: ${r.error}.` };
      const left = r.note ? ` Note: ${r.note}.` : "";
      const repaired = repairsNote(r.repairs, file.name);
      return {
        ok: true,
        project: r.project,
        message: `Opened the project embedded in ${file.name}.${left}${repaired}`,
      };
    }
    const r = projectFromFile(text, file.name);
    if (!r.ok) return { ok: false, error: r.error };
    return { ok: true, project: r.project, message: `Opened ${file.name}.${repairsNote(r.repairs, file.name)}` };
  } catch (e) {
    return { ok: false, error: `${file.name} was not opened: ${e instanceof Error ? e.message : String(e)}` };
  }
}
