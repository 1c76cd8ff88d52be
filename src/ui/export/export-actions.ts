// What the export menu's buttons do: write SVG, PDF, PNG or model CSV, download it and say so; the writers load
// on demand (the PDF writer, its fonts and pdf-lib only when a PDF is asked for).
import { embedCapText, exportFigureSvgWithInfo } from "../../formats/figure-file";
import { modelsToCsv } from "../../formats/model-csv";
import { setPngDpi } from "../../formats/png-meta";
import { presetOf } from "../../plot/layout";
import type { Project } from "../../project/types";
import { useAxband } from "../store";
import { downloadBlob, downloadText } from "./download";
import { fileBaseName } from "./file-base-name";
import { pngFigure, rasteriseSvg, type PngScale } from "./png";

/** Base name of exported figure files (see fileBaseName). */
const figureBaseName = (project: Project): string => fileBaseName(project, "axband-figure");

const push = (level: "status" | "alert", text: string): void => {
  useAxband.getState().pushMessage(level, text);
};

export function saveSvg(): void {
  try {
    const project = useAxband.getState().project;
    const size = presetOf(project.figure);
    const { svg, embeddedCurves, omittedCurves, omittedPoints, omittedBecause } = exportFigureSvgWithInfo(project, {
      preset: project.figure.preset,
      embedProject: true,
    });
    const name = `${figureBaseName(project)}.svg`;
    downloadBlob(name, new Blob([svg], { type: "image/svg+xml" }));
    const cm = `${(size.widthMm / 10).toFixed(1)} × ${(size.heightMm / 10).toFixed(1)} cm`;
    if (embeddedCurves) return push("status", `Saved ${name} (${cm}; drop it on axband to reopen the project).`);
    const n = omittedCurves.length;
    push(
      "alert",
      `Saved ${name} (${cm}) without the data of ${n === 1 ? "its curve" : `its ${n} curves`} (${omittedPoints.toLocaleString("en")} points, over ${embedCapText(omittedBecause ?? "size")} for embedded data): dropped on axband it reopens the models and figure only. Save the project file to keep the data.`,
    );
  } catch (e) {
    push("alert", `The SVG could not be made: ${e instanceof Error ? e.message : String(e)}.`);
  }
}

export async function savePng(pngScale: PngScale): Promise<void> {
  try {
    const project = useAxband.getState().project;
    const target = pngFigure(project, pngScale);
    const { fontFaceCss, withFontFaces } = await import("./png-fonts");
    // Without the font files (offline, blocked) the PNG is still drawn, in the closest system font, and says so.
    const css = await fontFaceCss(target.svg, project.figure.font).catch(() => null);
    const svg = css ? withFontFaces(target.svg, css) : target.svg;
    const png = setPngDpi(await rasteriseSvg(svg, target.widthPx, target.heightPx), target.dpi);
    const name = `${figureBaseName(project)}${pngScale === "1x" ? "" : `@${pngScale}`}.png`;
    downloadBlob(name, new Blob([png as BlobPart], { type: "image/png" }));
    const note = css ? "" : " The figure font could not be loaded, so the text uses a system font.";
    push("status", `Saved ${name} (${target.widthPx} × ${target.heightPx} px, ${Math.round(target.dpi)} dpi).${note}`);
  } catch (e) {
    push("alert", `The PNG could not be made: ${e instanceof Error ? e.message : String(e)}`);
  }
}

/** Writes the figure as a vector PDF with the project attached; pdf-lib, fontkit and the font files load here. */
export async function savePdf(): Promise<void> {
  try {
    const project = useAxband.getState().project;
    const { projectPdf } = await import("./pdf");
    const r = await projectPdf(project, project.figure.font);
    const name = `${figureBaseName(project)}.pdf`;
    downloadBlob(name, new Blob([r.pdf as BlobPart], { type: "application/pdf" }));
    const size = presetOf(project.figure);
    const cm = `${(size.widthMm / 10).toFixed(1)} × ${(size.heightMm / 10).toFixed(1)} cm`;
    if (r.embeddedCurves) return push("status", `Saved ${name} (${cm}; drop it on axband to reopen the project).`);
    const n = r.omittedCurves.length;
    push(
      "alert",
      `Saved ${name} (${cm}) without the data of ${n === 1 ? "its curve" : `its ${n} curves`} (too large to embed): dropped on axband it reopens the models and figure only. Save the project file to keep the data.`,
    );
  } catch (e) {
    push("alert", `The PDF could not be made: ${e instanceof Error ? e.message : String(e)}.`);
  }
}

export function saveModelCsv(): void {
  const project = useAxband.getState().project;
  if (project.models.length === 0) return push("alert", "There are no models to export.");
  try {
    const name = `${figureBaseName(project)}-models.csv`;
    downloadText(name, modelsToCsv(project), "text/csv");
    push("status", `Saved ${name}.`);
  } catch (e) {
    push("alert", `The model CSV could not be made: ${e instanceof Error ? e.message : String(e)}.`);
  }
}
