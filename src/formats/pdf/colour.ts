// CSS colours of scene nodes (hex, rgb()/hsl() and the keywords the scene and users write) as RGB in 0..1 for
// the PDF writer; anything unreadable is black, as the SVG writer's safeColour makes it.

export type Rgb = [number, number, number];

// The CSS Color Module's keyword values for the names a figure is likely to carry (CSS Color Module Level 4,
// §6.1 named colours); others fall back to black like an unknown colour in the SVG writer.
const NAMED: Record<string, string> = {
  black: "#000000",
  white: "#ffffff",
  gray: "#808080",
  grey: "#808080",
  darkgray: "#a9a9a9",
  darkgrey: "#a9a9a9",
  lightgray: "#d3d3d3",
  lightgrey: "#d3d3d3",
  silver: "#c0c0c0",
  red: "#ff0000",
  darkred: "#8b0000",
  green: "#008000",
  darkgreen: "#006400",
  lime: "#00ff00",
  blue: "#0000ff",
  navy: "#000080",
  teal: "#008080",
  orange: "#ffa500",
  purple: "#800080",
  magenta: "#ff00ff",
  fuchsia: "#ff00ff",
  cyan: "#00ffff",
  aqua: "#00ffff",
  yellow: "#ffff00",
  gold: "#ffd700",
  brown: "#a52a2a",
  pink: "#ffc0cb",
  olive: "#808000",
  maroon: "#800000",
};

function hex(c: string): Rgb | null {
  const m = /^#([0-9a-f]{3,8})$/i.exec(c);
  if (!m) return null;
  let h = m[1];
  if (h.length === 3 || h.length === 4) h = [...h.slice(0, 3)].map((ch) => ch + ch).join("");
  if (h.length !== 6 && h.length !== 8) return null;
  return [0, 2, 4].map((i) => parseInt(h.slice(i, i + 2), 16) / 255) as Rgb;
}

function hslToRgb(hDeg: number, s: number, l: number): Rgb {
  // CSS Color Module Level 4, §7.1 "HSL to RGB" (the reference algorithm, from memory).
  const f = (n: number) => {
    const k = (n + hDeg / 30) % 12;
    const a = s * Math.min(l, 1 - l);
    return l - a * Math.max(-1, Math.min(k - 3, 9 - k, 1));
  };
  return [f(0), f(8), f(4)];
}

function functional(c: string): Rgb | null {
  const m = /^(rgba?|hsla?)\(([^)]*)\)$/i.exec(c);
  if (!m) return null;
  const parts = m[2]
    .split(/[\s,/]+/)
    .filter(Boolean)
    .map((p) => ({ v: parseFloat(p), pct: p.endsWith("%") }));
  if (parts.length < 3 || parts.slice(0, 3).some((p) => !Number.isFinite(p.v))) return null;
  const clamp = (v: number) => Math.min(1, Math.max(0, v));
  if (m[1].toLowerCase().startsWith("rgb")) {
    return parts.slice(0, 3).map((p) => clamp(p.pct ? p.v / 100 : p.v / 255)) as Rgb;
  }
  return hslToRgb((((parts[0].v % 360) + 360) % 360) as number, clamp(parts[1].v / 100), clamp(parts[2].v / 100));
}

/** RGB (0..1) of a CSS colour; black when it cannot be read. */
export function colourRgb(colour: string | undefined): Rgb {
  const c = (colour ?? "").trim().toLowerCase();
  return hex(c) ?? functional(c) ?? hex(NAMED[c] ?? "") ?? [0, 0, 0];
}
