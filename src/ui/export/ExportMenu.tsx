// Figure export menu: the size preset, SVG (project embedded), PDF, PNG at 1×, 2× or 300 dpi, and model CSV;
// every file comes from the same scene builder as the screen.
import { useState } from "react";
import type { SizePreset } from "../../project/types";
import { PRESETS, presetOf } from "../../plot/layout";
import { CUSTOM_MM_LIMITS } from "../../project/limits";
import { useAxband } from "../store";
import type { PngScale } from "./png";
import { NumberField } from "../curves/NumberField";
import { Popover } from "./Popover";
import { ProjectNameField } from "../share/ProjectSections";
import "../curves/curves.css";
import "./export.css";

const PRESET_OPTIONS: { value: SizePreset; label: string }[] = [
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

// The writers (SVG, PNG, CSV) load on the first export, apart from the first figure.
const actions = () => import("./export-actions");
const saveSvg = () => void actions().then((a) => a.saveSvg());
const saveModelCsv = () => void actions().then((a) => a.saveModelCsv());

const mmRule = (n: number) =>
  n >= CUSTOM_MM_LIMITS[0] && n <= CUSTOM_MM_LIMITS[1] ? null : `${CUSTOM_MM_LIMITS[0]}–${CUSTOM_MM_LIMITS[1]} mm`;

function SizeSection() {
  const figure = useAxband((s) => s.project.figure);
  const setFigure = useAxband((s) => s.setFigure);
  const size = presetOf(figure);
  return (
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
  );
}

function ImageSection() {
  const [pngScale, setPngScale] = useState<PngScale>("2x");
  const [busy, setBusy] = useState(false);
  const onPng = async () => {
    setBusy(true);
    try {
      await (await actions()).savePng(pngScale);
    } finally {
      setBusy(false);
    }
  };
  return (
    <section>
      <h3>Image</h3>
      <div className="ax-export-row">
        <select aria-label="PNG resolution" value={pngScale} onChange={(e) => setPngScale(e.target.value as PngScale)}>
          {PNG_SCALES.map((s) => (
            <option key={s.value} value={s.value}>
              {s.label}
            </option>
          ))}
        </select>
        <button type="button" data-testid="export-png" disabled={busy} onClick={() => void onPng()}>
          {busy ? "Drawing…" : "Download PNG"}
        </button>
      </div>
    </section>
  );
}

function PdfSection() {
  const [busy, setBusy] = useState(false);
  const onPdf = async () => {
    setBusy(true);
    try {
      await (await actions()).savePdf();
    } finally {
      setBusy(false);
    }
  };
  return (
    <section>
      <h3>PDF</h3>
      <div className="ax-export-row">
        <button type="button" data-testid="export-pdf" disabled={busy} aria-busy={busy} onClick={() => void onPdf()}>
          {busy ? "Preparing PDF…" : "Download PDF"}
        </button>
      </div>
      <p className="ax-hint">Vector PDF at the figure size, fonts embedded, project attached (for pdfLaTeX).</p>
    </section>
  );
}

function DataSection() {
  return (
    <section>
      <h3>Data</h3>
      <div className="ax-export-row">
        <button type="button" data-testid="export-model-csv" onClick={saveModelCsv}>
          Model lines and bands (CSV)
        </button>
      </div>
      <p className="ax-hint">m_a, f_a, g_low, g_high over the figure&apos;s mass range, one block per model.</p>
    </section>
  );
}

/** The export controls. */
export function ExportMenu() {
  const figure = useAxband((s) => s.project.figure);
  const [open, setOpen] = useState(false);
  const size = presetOf(figure);
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
          <h3>File name</h3>
          <ProjectNameField />
        </section>
        <SizeSection />
        <PdfSection />
        <ImageSection />
        <DataSection />
      </Popover>
    </span>
  );
}
