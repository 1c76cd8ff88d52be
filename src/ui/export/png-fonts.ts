// The figure font for the app's PNG: an SVG drawn into a canvas through an <img> may load no outside file, so
// the CMU faces the figure uses go into the SVG as @font-face rules with data: URLs (woff2, loaded on demand).
import type { FigureFont } from "../../project/types";
import sansRegular from "computer-modern/fonts/cmu-sans-serif-500-roman.woff2?url";
import sansItalic from "computer-modern/fonts/cmu-sans-serif-500-italic.woff2?url";
import sansBold from "computer-modern/fonts/cmu-sans-serif-700-roman.woff2?url";
import serifRegular from "computer-modern/fonts/cmu-serif-500-roman.woff2?url";
import serifItalic from "computer-modern/fonts/cmu-serif-500-italic.woff2?url";
import serifBold from "computer-modern/fonts/cmu-serif-700-roman.woff2?url";

type Face = "regular" | "italic" | "bold";

const FAMILY: Record<FigureFont, string> = { sans: "CMU Sans Serif", serif: "CMU Serif" };
const URLS: Record<FigureFont, Record<Face, string>> = {
  sans: { regular: sansRegular, italic: sansItalic, bold: sansBold },
  serif: { regular: serifRegular, italic: serifItalic, bold: serifBold },
};
const DESCRIPTORS: Record<Face, string> = {
  regular: "font-style:normal;font-weight:400 500",
  italic: "font-style:italic;font-weight:400 500",
  bold: "font-style:normal;font-weight:600 900",
};

/** The faces an SVG figure uses: regular always, italic and bold when its text asks for them. */
export function facesUsed(svg: string): Face[] {
  const faces: Face[] = ["regular"];
  if (/font-style="italic"/.test(svg)) faces.push("italic");
  if (/font-weight="bold"/.test(svg)) faces.push("bold");
  return faces;
}

function base64(bytes: Uint8Array): string {
  let s = "";
  const CHUNK = 0x8000; // apply() takes a bounded number of arguments
  for (let i = 0; i < bytes.length; i += CHUNK) s += String.fromCharCode(...bytes.subarray(i, i + CHUNK));
  return btoa(s);
}

/** The @font-face rules (data: URLs) of the faces of `font` this SVG uses. Rejects when a file cannot be fetched. */
export async function fontFaceCss(svg: string, font: FigureFont): Promise<string> {
  const rules = await Promise.all(
    facesUsed(svg).map(async (face) => {
      const r = await fetch(URLS[font][face]);
      if (!r.ok) throw new Error(`the figure font could not be loaded (HTTP ${r.status})`);
      const data = base64(new Uint8Array(await r.arrayBuffer()));
      return `@font-face{font-family:"${FAMILY[font]}";${DESCRIPTORS[face]};src:url(data:font/woff2;base64,${data}) format("woff2")}`;
    }),
  );
  return rules.join("");
}

/** The SVG with the rules in a <style> right after the root element's start tag. */
export function withFontFaces(svg: string, css: string): string {
  return svg.replace(/<svg\b[^>]*>/i, (tag) => `${tag}<style>${css}</style>`);
}
