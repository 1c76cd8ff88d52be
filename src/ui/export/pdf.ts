// The app's PDF export, loaded on demand with pdf-lib and fontkit: the figure font's files come in as Vite
// asset URLs (fetched only when a PDF is made) and go to the same writer as the command line's.
import { exportFigurePdfWithInfo, type PdfWithInfo } from "../../formats/figure-pdf";
import type { FigureFontFamily } from "../../formats/pdf/fonts";
import type { PdfFonts } from "../../formats/pdf/write-pdf";
import type { Project } from "../../project/types";
import { version } from "../../../package.json";
import sansRegular from "computer-modern/fonts/cmu-sans-serif-500-roman.ttf?url";
import sansItalic from "computer-modern/fonts/cmu-sans-serif-500-italic.ttf?url";
import sansBold from "computer-modern/fonts/cmu-sans-serif-700-roman.ttf?url";
import sansFallback from "dejavu-fonts-ttf/ttf/DejaVuSans.ttf?url";
import serifRegular from "computer-modern/fonts/cmu-serif-500-roman.ttf?url";
import serifItalic from "computer-modern/fonts/cmu-serif-500-italic.ttf?url";
import serifBold from "computer-modern/fonts/cmu-serif-700-roman.ttf?url";
import serifFallback from "dejavu-fonts-ttf/ttf/DejaVuSerif.ttf?url";

/** The URLs of each family's faces: the files FIGURE_FONT_FILES names, as the bundler serves them. */
export const FONT_URLS: Record<FigureFontFamily, Record<keyof PdfFonts, string>> = {
  sans: { regular: sansRegular, italic: sansItalic, bold: sansBold, fallback: sansFallback },
  serif: { regular: serifRegular, italic: serifItalic, bold: serifBold, fallback: serifFallback },
};

/** The creator entry of the app's PDFs. */
export const PDF_CREATOR = `axband ${version}`;

async function fetchBytes(url: string): Promise<Uint8Array> {
  const r = await fetch(url);
  if (!r.ok) throw new Error(`the font file ${url.split("/").pop()} could not be loaded (HTTP ${r.status})`);
  return new Uint8Array(await r.arrayBuffer());
}

/** The faces of a family as bytes (fetched in parallel; the browser caches them for the next export). */
export async function loadPdfFonts(family: FigureFontFamily): Promise<PdfFonts> {
  const urls = FONT_URLS[family];
  const [regular, italic, bold, fallback] = await Promise.all(
    [urls.regular, urls.italic, urls.bold, urls.fallback].map(fetchBytes),
  );
  return { regular, italic, bold, fallback };
}

/** The project's PDF figure at its preset, with the project attached. */
export async function projectPdf(project: Project, family: FigureFontFamily): Promise<PdfWithInfo> {
  return exportFigurePdfWithInfo(project, {
    fonts: await loadPdfFonts(family),
    creator: PDF_CREATOR,
    preset: project.figure.preset,
  });
}
