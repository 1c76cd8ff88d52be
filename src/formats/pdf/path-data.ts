// Reads the SVG path data of scene nodes (absolute and relative M/L/H/V/C/Q/Z, the compact number form of the
// path writer) into absolute drawing commands, so the PDF writer draws exactly the outline the SVG has.

export type PathCommand =
  | { op: "M" | "L"; x: number; y: number }
  | { op: "C"; x1: number; y1: number; x2: number; y2: number; x: number; y: number }
  | { op: "Z" };

const TOKEN = /([MmLlHhVvCcSsQqTtAaZz])|([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)/g;

/** Numbers before the end point of the commands drawn as a straight segment to it (control points, arc radii). */
const SKIPPED_NUMBERS: Record<string, number> = { L: 0, T: 0, Q: 2, S: 2, A: 5 };

/** Tokens of path data: command letters and numbers (".5.5" is two numbers, as the SVG grammar says). */
function tokens(d: string): (string | number)[] {
  const out: (string | number)[] = [];
  for (const m of d.matchAll(TOKEN)) out.push(m[1] ?? Number(m[2]));
  return out;
}

/**
 * Absolute commands of SVG path data. Arcs and the smooth-curve shorthands do not occur in scenes; they are
 * drawn as straight segments to their end points rather than dropped, so an outline never loses a vertex.
 */
export function parsePathData(d: string): PathCommand[] {
  const t = tokens(d);
  const out: PathCommand[] = [];
  let i = 0;
  let cmd = "";
  let x = 0;
  let y = 0;
  let startX = 0;
  let startY = 0;
  const num = (): number => {
    const v = t[i++];
    return typeof v === "number" && Number.isFinite(v) ? v : NaN;
  };
  while (i < t.length) {
    if (typeof t[i] === "string") cmd = t[i++] as string;
    else if (cmd === "") return out; // numbers before any command: not a path
    const rel = cmd === cmd.toLowerCase();
    const ox = rel ? x : 0;
    const oy = rel ? y : 0;
    const upper = cmd.toUpperCase();
    switch (upper) {
      case "M": {
        x = ox + num();
        y = oy + num();
        out.push({ op: "M", x, y });
        [startX, startY] = [x, y];
        cmd = rel ? "l" : "L"; // later pairs are line-tos
        break;
      }
      case "H":
        x = ox + num();
        out.push({ op: "L", x, y });
        break;
      case "V":
        y = oy + num();
        out.push({ op: "L", x, y });
        break;
      case "C": {
        const x1 = ox + num();
        const y1 = oy + num();
        const x2 = ox + num();
        const y2 = oy + num();
        x = ox + num();
        y = oy + num();
        out.push({ op: "C", x1, y1, x2, y2, x, y });
        break;
      }
      case "L":
      case "T":
      case "Q":
      case "S":
      case "A":
        i += SKIPPED_NUMBERS[upper];
        x = ox + num();
        y = oy + num();
        out.push({ op: "L", x, y });
        break;
      case "Z":
        out.push({ op: "Z" });
        [x, y] = [startX, startY];
        if (typeof t[i] === "number") return out; // Z takes no numbers: the rest is not path data
        break;
      default:
        return out;
    }
    if (!Number.isFinite(x) || !Number.isFinite(y)) return out.slice(0, -1);
  }
  return out;
}
