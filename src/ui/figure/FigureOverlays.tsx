// What the screen draws over the scene and the export does not: the hover crosshair and the note naming the
// curves still being prepared for drawing.
import type { Scene } from "../../plot/scene-types";
import type { Curve } from "../../project/types";
import { selectHover, useAxband } from "../store";
import { insidePlot } from "./view-math";

/** Thin crosshair at the hover point. Re-renders alone on hover. */
export function Crosshair({ scene }: { scene: Scene }) {
  const hover = useAxband(selectHover);
  if (!hover) return null;
  const { plot, scales } = scene;
  const [m0, m1] = scales.massDomainEv.map(Math.log10);
  const [y0, y1] = scales.yDomain.map(Math.log10);
  const x = plot.x + ((Math.log10(hover.massEv) - m0) / (m1 - m0)) * plot.w;
  const y = plot.y + plot.h - ((Math.log10(hover.y) - y0) / (y1 - y0)) * plot.h;
  if (!insidePlot(scene, x, y)) return null;
  return (
    <g className="crosshair" pointerEvents="none" aria-hidden="true">
      <path
        d={`M${plot.x},${y}H${plot.x + plot.w}M${x},${plot.y}V${plot.y + plot.h}`}
        stroke="#2b3440"
        strokeOpacity={0.45}
        strokeWidth={0.75}
        strokeDasharray="3 3"
        fill="none"
      />
      <circle cx={x} cy={y} r={2.5} fill="none" stroke="#2b3440" strokeWidth={1} />
    </g>
  );
}

/** Inside the top left of the plot area (placed from the scene), so the figure does not move for it. */
const PREPARING_STYLE = {
  position: "absolute",
  margin: 0,
  padding: "2px 8px",
  background: "rgba(255, 255, 255, 0.92)",
  border: "1px solid var(--line)",
  borderRadius: 4,
  pointerEvents: "none",
  // Centred at the top of the plot: the legend sits in a corner.
  transform: "translateX(-50%)",
  maxWidth: "60%",
} as const;

/** The note over the plot while curves are being prepared for drawing. */
function preparingNote(waiting: readonly Curve[]): string {
  const names = waiting.map((c) => `“${c.label}”`);
  if (names.length === 1) return `Preparing curve ${names[0]} for drawing…`;
  return `Preparing ${names.length} curves for drawing: ${names.join(", ")}…`;
}

export function PreparingNote({ scene, waiting }: { scene: Scene; waiting: readonly Curve[] }) {
  if (waiting.length === 0) return null;
  const { plot } = scene;
  return (
    <p
      className="note figure-preparing"
      data-testid="figure-preparing"
      aria-live="polite"
      style={{
        ...PREPARING_STYLE,
        left: `${((plot.x + plot.w / 2) / scene.widthPx) * 100}%`,
        top: `${((plot.y + 8) / scene.heightPx) * 100}%`,
      }}
    >
      {preparingNote(waiting)}
    </p>
  );
}
