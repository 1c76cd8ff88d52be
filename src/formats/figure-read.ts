// Reading back the project an SVG exported by axband carries (figure-file.ts writes it): apart from the writer,
// as decoding validates with the schema (zod), which the command line's SVG output does not need to load.
import type { Project } from "../project/types";
import { decodeEmbeddedProject } from "./codec/decode";
import { AXBAND_PROJECT_NS, EMBED_ENCODING } from "./figure-file";

export type ExtractResult =
  | {
      ok: true;
      project: Project;
      /** Curves whose data were left out of the embedded project at export (too large to embed); 0 when all are in. */
      omittedCurveCount: number;
      /** A sentence for the user when curve data were left out (without a full stop at the end), else undefined. */
      note?: string;
      /** What the restore step repaired or left out (empty for a figure axband wrote). */
      repairs: string[];
      /** Whether the embedded project carried a checksum that matched (figures exported before format v3 have none). */
      verified: boolean;
    }
  | { ok: false; error: string };

// The element may carry any prefix (an editor may rewrite it); its local name and encoding identify it.
const EMBED_RE = /<([A-Za-z_][\w.-]*:)?project\b([^>]*)>([^<]*)<\/\1?project\s*>/g;

/**
 * The project embedded in an SVG exported by axband, decoded and validated exactly like a project file or
 * a link (schema check, migrations, size cap). Never throws: anything wrong gives `{ ok: false, error }`.
 * A figure exported without its curve data (over EMBED_MAX_POINTS or EMBED_MAX_CHARS) opens with models, figure and constants,
 * and says how many curves were left out (`omittedCurveCount`, `note`).
 */
export function extractProjectFromSvg(svgText: string): ExtractResult {
  if (typeof svgText !== "string" || !/<svg[\s>]/.test(svgText)) return { ok: false, error: "this is not an SVG file" };
  if (!svgText.includes(AXBAND_PROJECT_NS)) {
    return {
      ok: false,
      error: "this SVG carries no axband project (it was exported without the project, or by another program)",
    };
  }
  for (const m of svgText.matchAll(EMBED_RE)) {
    const attrs = m[2];
    const enc = /\sencoding\s*=\s*["']([^"']*)["']/.exec(attrs)?.[1];
    if (enc !== EMBED_ENCODING) {
      if (enc !== undefined) return { ok: false, error: `the embedded project uses the unknown encoding "${enc}"` };
      continue;
    }
    const payload = m[3].replace(/\s+/g, "");
    const r = decodeEmbeddedProject(payload);
    if (!r.ok) return { ok: false, error: `the project embedded in this SVG ${r.error}` };
    const left = r.omittedCurveCount;
    const read = { ok: true as const, project: r.project, repairs: r.repairs, verified: r.verified };
    if (left === 0) return { ...read, omittedCurveCount: 0 };
    const note = `this figure was exported without the data of its ${left === 1 ? "curve" : `${left} curves`} (too large to embed in the SVG), so it reopens with the models, figure and constants only; open the project file (.axband.json) for the curves`;
    return { ...read, omittedCurveCount: left, note };
  }
  return { ok: false, error: "this SVG mentions axband but its embedded project element is missing or damaged" };
}
