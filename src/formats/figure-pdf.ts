// The exported PDF figure: the same scene as the SVG export written by the PDF writer, with the project file
// attached (NAME.axband.json, under the SVG's embedding caps), and reading that project back from a PDF.
import {
  PDFArray,
  PDFDict,
  PDFDocument,
  PDFName,
  PDFRawStream,
  PDFString,
  PDFHexString,
  decodePDFRawStream,
} from "pdf-lib";
import type { Project, SizePreset } from "../project/types";
import { EXPORT_RESOLUTION, EMBED_MAX_CHARS, EMBED_MAX_POINTS, exportScene, projectMetadata } from "./figure-file";
import { writePdf, type PdfFonts } from "./pdf/write-pdf";
import { projectFileName, projectFromFile, projectToFile } from "./project-file";

export interface ExportPdfOpts {
  fonts: PdfFonts;
  /** "axband <version>", written as the PDF's creator. */
  creator: string;
  preset?: SizePreset;
  /** Thinning resolution (columns per scene px). @default EXPORT_RESOLUTION */
  resolution?: number;
  /** Attach the project file. @default true */
  embedProject?: boolean;
}

/** What the attachment carries: the whole project, or the project without curve data (too large to embed). */
export interface PdfWithInfo {
  pdf: Uint8Array;
  embedded: boolean;
  embeddedCurves: boolean;
  omittedCurves: string[];
}

/** UTF-8 bytes in this realm's Uint8Array: pdf-lib checks `instanceof`, which another realm's (jsdom's) fails. */
const realmBytes = (text: string) => new Uint8Array(new TextEncoder().encode(text));

const OMITTED_DESC = /(\d+) curve\(s\) left out/;

/**
 * The PDF of a project at its preset's physical size. The project file goes in as an attachment while its
 * curve data stay within the SVG's caps (EMBED_MAX_POINTS points, EMBED_MAX_CHARS of packed payload);
 * otherwise the attachment carries models, figure and constants, and its description says how many curves
 * were left out. Same project and fonts give the same bytes.
 */
export async function exportFigurePdfWithInfo(project: Project, opts: ExportPdfOpts): Promise<PdfWithInfo> {
  const p =
    opts.preset && opts.preset !== project.figure.preset
      ? { ...project, figure: { ...project.figure, preset: opts.preset } }
      : project;
  const scene = exportScene(p, { resolution: opts.resolution ?? EXPORT_RESOLUTION });
  const embed = opts.embedProject ?? true;
  const info = embed ? projectMetadata(p, EMBED_MAX_CHARS, EMBED_MAX_POINTS).info : null;
  const withCurves = info?.embeddedCurves ?? false;
  const attached = withCurves ? p : { ...p, curves: [] };
  const left = p.curves.length - attached.curves.length;
  const description = withCurves
    ? "axband project: open this PDF in axband to edit the figure"
    : `axband project without curve data: ${left} curve(s) left out (too large to embed); the project file keeps them`;
  const pdf = await writePdf(scene, {
    fonts: opts.fonts,
    title: p.name,
    creator: opts.creator,
    attachment: embed
      ? { name: projectFileName(p), bytes: realmBytes(projectToFile(attached)), description }
      : undefined,
  });
  return { pdf, embedded: embed, embeddedCurves: withCurves, omittedCurves: info?.omittedCurves ?? [] };
}

export type PdfExtractResult =
  { ok: true; project: Project; repairs: string[]; note?: string } | { ok: false; error: string };

function text(v: unknown): string | undefined {
  return v instanceof PDFString || v instanceof PDFHexString ? v.decodeText() : undefined;
}

/** The attached files of a PDF: name, description and bytes (the /EmbeddedFiles name tree, flat or one level deep). */
function attachments(doc: PDFDocument): { name: string; desc: string; bytes: Uint8Array }[] {
  const names = doc.catalog.lookupMaybe(PDFName.of("Names"), PDFDict);
  const tree = names?.lookupMaybe(PDFName.of("EmbeddedFiles"), PDFDict);
  if (!tree) return [];
  const leaves: PDFDict[] = [tree];
  const kids = tree.lookupMaybe(PDFName.of("Kids"), PDFArray);
  for (let i = 0; kids && i < kids.size(); i++) {
    const kid = kids.lookup(i);
    if (kid instanceof PDFDict) leaves.push(kid);
  }
  const out: { name: string; desc: string; bytes: Uint8Array }[] = [];
  for (const leaf of leaves) {
    const arr = leaf.lookupMaybe(PDFName.of("Names"), PDFArray);
    for (let i = 0; arr && i + 1 < arr.size(); i += 2) {
      const spec = arr.lookup(i + 1);
      if (!(spec instanceof PDFDict)) continue;
      const ef = spec.lookupMaybe(PDFName.of("EF"), PDFDict);
      const stream = ef?.lookup(PDFName.of("F"));
      if (!(stream instanceof PDFRawStream)) continue;
      const name =
        text(spec.lookup(PDFName.of("UF"))) ?? text(spec.lookup(PDFName.of("F"))) ?? text(arr.lookup(i)) ?? "";
      out.push({ name, desc: text(spec.lookup(PDFName.of("Desc"))) ?? "", bytes: decodePDFRawStream(stream).decode() });
    }
  }
  return out;
}

/**
 * The project attached to a PDF exported by axband, validated like a project file. Never throws: a PDF that
 * is not axband's, is damaged or truncated gives `{ ok: false, error }`.
 */
export async function extractProjectFromPdf(bytes: Uint8Array): Promise<PdfExtractResult> {
  const head = new TextDecoder("latin1").decode(bytes.subarray(0, 1024));
  if (!head.includes("%PDF-")) return { ok: false, error: "this is not a PDF file" };
  let doc: PDFDocument;
  try {
    doc = await PDFDocument.load(bytes, { updateMetadata: false, throwOnInvalidObject: true });
    if (doc.getPageCount() === 0) throw new Error("no pages");
  } catch {
    return { ok: false, error: "this PDF is damaged or incomplete (it may have been truncated)" };
  }
  let files: ReturnType<typeof attachments>;
  try {
    files = attachments(doc);
  } catch {
    return { ok: false, error: "the files attached to this PDF cannot be read (the PDF is damaged)" };
  }
  const file = files.find((f) => /\.axband\.json$/i.test(f.name));
  if (!file) {
    return {
      ok: false,
      error: "this PDF carries no axband project (it was exported without it, or by another program)",
    };
  }
  const r = projectFromFile(new TextDecoder().decode(file.bytes), file.name);
  if (!r.ok) return { ok: false, error: `the project attached to this PDF cannot be read: ${r.error}` };
  const left = OMITTED_DESC.exec(file.desc)?.[1];
  const note = left
    ? `this figure was exported without the data of ${left === "1" ? "its curve" : `its ${left} curves`} (too large to embed), so it reopens with the models, figure and constants only; open the project file (.axband.json) for the curves`
    : undefined;
  return { ok: true, project: r.project, repairs: r.repairs, note };
}
