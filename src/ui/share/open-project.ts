// Opens a picked or dropped `.axband.json` project file or axband SVG/PDF figure (project in <metadata> or
// attached); validation is the data core's, this only routes the file and words the outcome.
import { MAX_IMPORT_BYTES, projectFromFile } from "../../data";
import { extractProjectFromSvg } from "../../formats/figure-read";
import type { Project } from "../../project/types";
import { repairsNote } from "../store/open-notes";

export type OpenOutcome = { ok: true; project: Project; message: string } | { ok: false; error: string };

/** True for files that open as a project rather than import as a curve: *.axband.json, *.json, *.svg, *.pdf. */
export function isProjectFileName(name: string): boolean {
  return /\.(axband\.json|json|svg|pdf)$/i.test(name);
}

const PDF_MAGIC = [0x25, 0x50, 0x44, 0x46, 0x2d]; // "%PDF-"

/** A PDF figure's attached project; pdf-lib loads only now. */
async function openPdf(file: Blob & { name: string }): Promise<OpenOutcome> {
  let bytes: Uint8Array;
  try {
    bytes = new Uint8Array(await file.arrayBuffer());
  } catch {
    return { ok: false, error: `${file.name} could not be read.` };
  }
  const { extractProjectFromPdf } = await import("../../formats/figure-pdf");
  const r = await extractProjectFromPdf(bytes);
  if (!r.ok) return { ok: false, error: `${file.name} was not opened: ${r.error}.` };
  const left = r.note ? ` Note: ${r.note}.` : "";
  return { ok: true, project: r.project, message: `Opened the project attached to ${file.name}.${left}` };
}

async function startsLikePdf(file: Blob): Promise<boolean> {
  try {
    const head = new Uint8Array(await file.slice(0, PDF_MAGIC.length).arrayBuffer());
    return PDF_MAGIC.every((b, i) => head[i] === b);
  } catch {
    return false;
  }
}

/**
 * Reads and validates a project file or exported SVG or PDF. Never throws: every failure is a sentence for the user.
 */
export async function openProjectFile(file: Blob & { name: string }): Promise<OpenOutcome> {
  if (file.size === 0) return { ok: false, error: `${file.name} is empty.` };
  if (file.size > MAX_IMPORT_BYTES) {
    return {
      ok: false,
      error: `${file.name} is ${(file.size / 1e6).toFixed(0)} MB; the limit is ${(MAX_IMPORT_BYTES / 1e6).toFixed(0)} MB.`,
    };
  }
  if (/\.pdf$/i.test(file.name) || (await startsLikePdf(file))) {
    try {
      return await openPdf(file);
    } catch (e) {
      return { ok: false, error: `${file.name} was not opened: ${e instanceof Error ? e.message : String(e)}` };
    }
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
