// Histograms of an E/N spectrum as plain SVG: counts against E/N, and against |E/N − c_γ| on a log axis
// (the quantity g_aγγ is proportional to).
import type { EnsembleValue } from "../../../physics/ensemble";

const W = 360;
const H = 110;
const PAD = 18;
const BINS = 40;

interface Props {
  values: readonly EnsembleValue[];
  cGamma: number;
  log?: boolean;
}

const valueOf = (s: string) => {
  const [p, q] = s.split("/");
  return Number(p) / Number(q ?? "1");
};

function fmt(x: number): string {
  return Math.abs(x) >= 1e4 || (x !== 0 && Math.abs(x) < 1e-2) ? x.toExponential(1) : String(+x.toPrecision(3));
}

export function Histogram({ values, cGamma, log = false }: Props) {
  const xs = values.map((v) => {
    const x = valueOf(v.eOverN);
    return log ? Math.log10(Math.max(Math.abs(x - cGamma), 1e-6)) : x;
  });
  if (xs.length === 0) return null;
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  const span = hi - lo || 1;
  const bins = new Array<number>(BINS).fill(0);
  xs.forEach((x, i) => (bins[Math.min(BINS - 1, Math.floor(((x - lo) / span) * BINS))] += values[i].count));
  const top = Math.max(...bins);
  const bw = (W - 2 * PAD) / BINS;
  const label = log ? "|E/N − c_γ|" : "E/N";
  const end = (x: number) => fmt(log ? 10 ** x : x);
  return (
    <svg
      className="ensemble-hist"
      width={W}
      height={H + 14}
      viewBox={`0 0 ${W} ${H + 14}`}
      role="img"
      aria-label={`Histogram of ${label}${log ? " (log axis)" : ""} from ${end(lo)} to ${end(hi)}, largest bin ${top} models`}
      data-testid={log ? "ensemble-hist-log" : "ensemble-hist"}
    >
      {bins.map((b, i) =>
        b > 0 ? (
          <rect
            key={i}
            x={PAD + i * bw}
            y={H - (b / top) * (H - PAD)}
            width={Math.max(1, bw - 1)}
            height={(b / top) * (H - PAD)}
            fill="currentColor"
            opacity={0.7}
          >
            <title>{`${b} models`}</title>
          </rect>
        ) : null,
      )}
      <line x1={PAD} x2={W - PAD} y1={H} y2={H} stroke="currentColor" />
      <text x={PAD} y={H + 12} fontSize="10">
        {end(lo)}
      </text>
      <text x={W / 2} y={H + 12} fontSize="10" textAnchor="middle">
        {label}
        {log ? " (log)" : ""}
      </text>
      <text x={W - PAD} y={H + 12} fontSize="10" textAnchor="end">
        {end(hi)}
      </text>
    </svg>
  );
}
