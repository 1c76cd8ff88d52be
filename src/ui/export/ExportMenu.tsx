// Figure export: the size preset (the same Figure.preset the screen uses), the SVG download (self-contained,
// project embedded so the file reopens in axband), PNG at 1×, 2× or 300 dpi with the dpi written into the
// file (drawn from an SVG thinned for the PNG's pixels, without the project), and the model lines and bands
// as CSV. All files come from the same scene builder as the screen.
import { useState } from "react";
import type { SizePreset } from "../../project/types";
import { embedCapText, exportFigureSvgWithInfo } from "../../formats/figure-file";
import { PRESETS, presetOf, CUSTOM_MM_LIMITS } from "../../plot/layout";
import { modelsToCsv } from "../../formats/model-csv";
import { setPngDpi } from "../../formats/png-meta";
import { useAxband } from "../store";
import { downloadBlob, downloadText, safeFileName } from "./download";
import { pngFigure, rasteriseSvg, type PngScale } from "./png";
import { NumberField } from "../curves/NumberField";
import { Popover } from "./Popover";
import "../curves/curves.css";
import "./export.css";

export const PRESET_OPTIONS: { value: SizePreset; label: string }[] = [
  { value: "slide", label: PRESETS.slide.label },
  { value: "single-column", label: PRESETS["single-column"].label },
  { value: "double-column", label: PRESETS["double-column"].label },
  { value: "custom", label: "Custom size" },
];

const PNG_SCALES: { value: PngScale; label: string }[] = [
  { value: "1x", label: "1× (screen)" },
  { value: "2x", label: "2× (sharp on high-dpi screens)" },
  { value: "300dpi", label: "300 dpi at the physical size" },
];

/** Base name of exported figure files: the project name, or "axband-figure". */
export function figureBaseName(projectName: string): string {
  return safeFileName(
    projectName.trim() === "" || projectName === "Untitled" ? "axband-figure" : projectName,
    "axband-figure",
  );
}

/** The export controls. */
export function ExportMenu() {
  const figure = useAxband((s) => s.project.figure);
  const setFigure = useAxband((s) => s.setFigure);
  const pushMessage = useAxband((s) => s.pushMessage);
  const [pngScale, setPngScale] = useState<PngScale>("2x");
  const [busy, setBusy] = useState(false);
  const [open, setOpen] = useState(false);
  const size = presetOf(figure);
  const mmRule = (n: number) =>
    n >= CUSTOM_MM_LIMITS[0] && n <= CUSTOM_MM_LIMITS[1] ? null : `${CUSTOM_MM_LIMITS[0]}–${CUSTOM_MM_LIMITS[1]} mm`;

  const svgNow = () => {
    const project = useAxband.getState().project;
    return { project, ...exportFigureSvgWithInfo(project, { preset: project.figure.preset, embedProject: true }) };
  };

  const saveSvg = () => {
    try {
      const { project, svg, embeddedCurves, omittedCurves, omittedPoints, omittedBecause } = svgNow();
      const name = `${figureBaseName(project.name)}.svg`;
      downloadBlob(name, new Blob([svg], { type: "image/svg+xml" }));
      const cm = `${(size.widthMm / 10).toFixed(1)} × ${(size.heightMm / 10).toFixed(1)} cm`;
      if (embeddedCurves) pushMessage("status", `Saved ${name} (${cm}; drop it on axband to reopen the project).`);
      else {
        const n = omittedCurves.length;
        pushMessage(
          "alert",
          `Saved ${name} (${cm}) without the data of ${n === 1 ? "its curve" : `its ${n} curves`} (${omittedPoints.toLocaleString("en")} points, over ${embedCapText(omittedBecause ?? "size")} for embedded data): dropped on axband it reopens the models and figure only. Save the project file to keep the data.`,
        );
      }
    } catch (e) {
      pushMessage("alert", `The SVG could not be made: ${e instanceof Error ? e.message : String(e)}.`);
    }
  };

  const savePng = async () => {
    setBusy(true);
    try {
      const project = useAxband.getState().project;
      const target = pngFigure(project, pngScale);
      const png = setPngDpi(await rasteriseSvg(target.svg, target.widthPx, target.heightPx), target.dpi);
      const name = `${figureBaseName(project.name)}${pngScale === "1x" ? "" : `@${pngScale}`}.png`;
      downloadBlob(name, new Blob([png as BlobPart], { type: "image/png" }));
      pushMessage(
        "status",
        `Saved ${name} (${target.widthPx} × ${target.heightPx} px, ${Math.round(target.dpi)} dpi).`,
      );
    } catch (e) {
      pushMessage("alert", `The PNG could not be made: ${e instanceof Error ? e.message : String(e)}`);
    } finally {
      setBusy(false);
    }
  };

  const saveModelCsv = () => {
    const project = useAxband.getState().project;
    if (project.models.length === 0) {
      pushMessage("alert", "There are no models to export.");
      return;
    }
    try {
      const name = `${figureBaseName(project.name)}-models.csv`;
      downloadText(name, modelsToCsv(project), "text/csv");
      pushMessage("status", `Saved ${name}.`);
    } catch (e) {
      pushMessage("alert", `The model CSV could not be made: ${e instanceof Error ? e.message : String(e)}.`);
    }
  };

  return (
    <span className="ax-header-group ax-panel ax-export">
      <button
        type="button"
        className="primary"
        data-testid="export-svg"
        title={`Download the figure as SVG (${size.label})`}
        onClick={saveSvg}
      >
        Export SVG
      </button>
      <Popover label="▾" ariaLabel="More export options" open={open} onOpenChange={setOpen} testId="export-menu">
        <section>
          <h3>Figure size</h3>
          <div className="ax-export-row">
            <select
              aria-label="Figure size preset"
              value={figure.preset}
              onChange={(e) => setFigure({ preset: e.target.value as SizePreset })}
            >
              {PRESET_OPTIONS.map((p) => (
                <option key={p.value} value={p.value}>
                  {p.label}
                </option>
              ))}
            </select>
            <span className="ax-hint">
              {(size.widthMm / 10).toFixed(1)} × {(size.heightMm / 10).toFixed(1)} cm
            </span>
          </div>
          {figure.preset === "custom" ? (
            <div className="ax-export-row">
              <NumberField
                label="width"
                unit="mm"
                value={figure.customWidthMm}
                validate={mmRule}
                onCommit={(n) => setFigure({ customWidthMm: n }, { coalesceKey: "figure:customWidthMm" })}
              />
              <NumberField
                label="height"
                unit="mm"
                value={figure.customHeightMm}
                validate={mmRule}
                onCommit={(n) => setFigure({ customHeightMm: n }, { coalesceKey: "figure:customHeightMm" })}
              />
            </div>
          ) : null}
        </section>
        <section>
          <h3>Image</h3>
          <div className="ax-export-row">
            <select
              aria-label="PNG resolution"
              value={pngScale}
              onChange={(e) => setPngScale(e.target.value as PngScale)}
            >
              {PNG_SCALES.map((s) => (
                <option key={s.value} value={s.value}>
                  {s.label}
                </option>
              ))}
            </select>
            <button type="button" data-testid="export-png" disabled={busy} onClick={() => void savePng()}>
              {busy ? "Drawing…" : "Download PNG"}
            </button>
          </div>
        </section>
        <section>
          <h3>Data</h3>
          <div className="ax-export-row">
            <button type="button" data-testid="export-model-csv" onClick={saveModelCsv}>
              Model lines and bands (CSV)
            </button>
          </div>
          <p className="ax-hint">m_a, f_a, g_low, g_high over the figure&apos;s mass range, one block per model.</p>
        </section>
      </Popover>
    </span>
  );
}
