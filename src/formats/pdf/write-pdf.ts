// The PDF writer: a scene in, one vector PDF page of the figure's physical size out (paths, fills with their
// opacity, dashes, the plot clip, text as real text in an embedded subset font), beside the SVG writer.
import fontkit from "@pdf-lib/fontkit";
import {
  PDFDocument,
  PDFName,
  type PDFFont,
  type PDFOperator,
  type PDFPage,
  beginText,
  clip,
  closePath,
  concatTransformationMatrix,
  appendBezierCurve,
  endPath,
  endText,
  fill,
  fillAndStroke,
  lineTo,
  moveTo,
  popGraphicsState,
  pushGraphicsState,
  rectangle,
  setDashPattern,
  setFillingRgbColor,
  setFontAndSize,
  setGraphicsState,
  setLineJoin,
  setLineWidth,
  setStrokingRgbColor,
  setTextMatrix,
  showText,
  stroke,
  LineJoinStyle,
} from "pdf-lib";
import type { PathNode, RectNode, Scene, SceneNode, TextNode } from "../../plot/scene-types";
import { placeRuns } from "../../plot/text";
import { unitInterval } from "../../plot/format";
import { colourRgb } from "./colour";
import { parsePathData } from "./path-data";

/** Scene px are CSS px (96 per inch); PDF user space is in points (72 per inch). */
export const PT_PER_PX = 72 / 96;

/** The font files the writer embeds (TrueType/OpenType bytes); only the faces and glyphs a figure uses go in. */
export interface PdfFonts {
  regular: Uint8Array;
  italic?: Uint8Array;
  bold?: Uint8Array;
  /** Used, glyph by glyph, for characters the main faces lack (e.g. ≤, ∞ in a user's label). */
  fallback?: Uint8Array;
}

export interface WritePdfOpts {
  fonts: PdfFonts;
  /** Document title (the project's name). */
  title: string;
  /** Creator entry, e.g. "axband 0.1.0". */
  creator: string;
  /** A file attached to the document (the project file travels with the figure). */
  attachment?: { name: string; bytes: Uint8Array; description: string };
}

type Face = "regular" | "italic" | "bold" | "fallback";
const SUBSET_TAGS: Record<Face, string> = { regular: "RGL", italic: "ITL", bold: "BLD", fallback: "FBK" };

/** Lazily embedded faces of one document: a face goes into the PDF only when a text uses it. */
class FaceSet {
  private embedded = new Map<Face, PDFFont>();
  // Each face's file is read by fontkit once, for its glyph coverage and its PostScript name alike.
  private parsed = new Map<Face, ReturnType<typeof fontkit.create> | null>();
  private keys = new Map<PDFFont, PDFName>();
  constructor(
    private doc: PDFDocument,
    private fonts: PdfFonts,
  ) {}
  private bytes(face: Face): Uint8Array | undefined {
    return face === "regular" ? this.fonts.regular : this.fonts[face];
  }
  /** The face actually used for `face` (a missing italic or bold face falls back to the regular one). */
  resolve(face: Face): Face {
    return this.bytes(face) ? face : "regular";
  }
  async font(face: Face): Promise<PDFFont> {
    const f = this.resolve(face);
    let font = this.embedded.get(f);
    if (!font) {
      // A fixed six-letter subset tag (PDF 32000-1:2008 §9.6.4) instead of pdf-lib's numbered name: readers list
      // the font as a subset, and the same figure gives the same bytes.
      const bytes = this.bytes(f) as Uint8Array;
      const customName = `AXB${SUBSET_TAGS[f]}+${this.parsedFace(f)?.postscriptName ?? "Font"}`;
      font = await this.doc.embedFont(bytes, { subset: true, customName });
      this.embedded.set(f, font);
    }
    return font;
  }
  private parsedFace(f: Face) {
    if (!this.parsed.has(f)) {
      const bytes = this.bytes(f);
      this.parsed.set(f, bytes ? fontkit.create(bytes) : null);
    }
    return this.parsed.get(f);
  }
  has(face: Face, codePoint: number): boolean {
    return this.parsedFace(face === "fallback" ? face : this.resolve(face))?.hasGlyphForCodePoint(codePoint) ?? false;
  }
  key(page: PDFPage, font: PDFFont): PDFName {
    let k = this.keys.get(font);
    if (!k) {
      k = page.node.newFontDictionary(font.name, font.ref);
      this.keys.set(font, k);
    }
    return k;
  }
}

const r2 = (v: number) => Math.round(v * 100) / 100;

/** Graphics states by (fill, stroke) opacity, one ExtGState each per page. */
function opacityState(page: PDFPage, cache: Map<string, PDFName>, fillOpacity: number, strokeOpacity: number): PDFName {
  const key = `${fillOpacity}/${strokeOpacity}`;
  let name = cache.get(key);
  if (!name) {
    const dict = page.doc.context.obj({ Type: "ExtGState", ca: fillOpacity, CA: strokeOpacity });
    name = page.node.newExtGState("GS", dict);
    cache.set(key, name);
  }
  return name;
}

function pathOps(d: string): PDFOperator[] {
  const ops: PDFOperator[] = [];
  for (const c of parsePathData(d)) {
    if (c.op === "M") ops.push(moveTo(r2(c.x), r2(c.y)));
    else if (c.op === "L") ops.push(lineTo(r2(c.x), r2(c.y)));
    else if (c.op === "C") ops.push(appendBezierCurve(r2(c.x1), r2(c.y1), r2(c.x2), r2(c.y2), r2(c.x), r2(c.y)));
    else ops.push(closePath());
  }
  return ops;
}

function paintOps(
  page: PDFPage,
  states: Map<string, PDFName>,
  node: PathNode | RectNode,
  shape: PDFOperator[],
): PDFOperator[] {
  const hasFill = node.fill !== undefined && node.fill !== "none";
  const hasStroke = node.stroke !== undefined && node.stroke !== "none" && (node.strokeWidth ?? 1) > 0;
  if ((!hasFill && !hasStroke) || shape.length === 0) return [];
  const ops: PDFOperator[] = [pushGraphicsState()];
  const strokeOpacity = node.kind === "path" ? unitInterval(node.strokeOpacity, 1) : 1;
  ops.push(setGraphicsState(opacityState(page, states, unitInterval(node.fillOpacity, 1), strokeOpacity)));
  if (hasFill) ops.push(setFillingRgbColor(...colourRgb(node.fill)));
  if (hasStroke) {
    ops.push(setStrokingRgbColor(...colourRgb(node.stroke)), setLineWidth(node.strokeWidth ?? 1));
    ops.push(setLineJoin(LineJoinStyle.Bevel));
    const dash = node.kind === "path" && node.dash ? node.dash.split(/[\s,]+/).map(Number) : [];
    if (dash.length && dash.every((v) => Number.isFinite(v) && v >= 0) && dash.some((v) => v > 0))
      ops.push(setDashPattern(dash, 0));
  }
  ops.push(...shape, hasFill && hasStroke ? fillAndStroke() : hasFill ? fill() : stroke(), popGraphicsState());
  return ops;
}

/** Pieces of a run's text, each drawn in one face: the run's own face, or the fallback for missing glyphs. */
function splitByCoverage(text: string, face: Face, faces: FaceSet): { text: string; face: Face }[] {
  const out: { text: string; face: Face }[] = [];
  for (const ch of text) {
    const cp = ch.codePointAt(0) ?? 0;
    const use: Face = faces.has(face, cp) || !faces.has("fallback", cp) ? face : "fallback";
    const last = out[out.length - 1];
    if (last && last.face === use) last.text += ch;
    else out.push({ text: ch, face: use });
  }
  return out;
}

/** The operators of one text node: each run placed along its (rotated) baseline with its real glyph widths. */
async function textOps(page: PDFPage, faces: FaceSet, n: TextNode): Promise<PDFOperator[]> {
  const x = Number.isFinite(n.x) ? n.x : 0;
  const y = Number.isFinite(n.y) ? n.y : 0;
  const placed = placeRuns({ ...n, y });
  const base: Face = n.weight === "bold" ? "bold" : "regular";
  type Piece = { text: string; font: PDFFont; size: number; dy: number; width: number };
  const pieces: Piece[] = [];
  let dy = placed.baselineY - y;
  for (const run of placed.runs) {
    dy += run.dyPx;
    const size = run.sizePx ?? n.sizePx;
    const own: Face = run.italic ? "italic" : base;
    for (const part of splitByCoverage(run.text, own, faces)) {
      const font = await faces.font(part.face);
      pieces.push({ text: part.text, font, size, dy, width: font.widthOfTextAtSize(part.text, size) });
    }
  }
  const total = pieces.reduce((w, p) => w + p.width, 0);
  let dx = n.anchor === "middle" ? -total / 2 : n.anchor === "end" ? -total : 0;
  const theta = ((n.rotate && Number.isFinite(n.rotate) ? n.rotate : 0) * Math.PI) / 180;
  const [cos, sin] = [Math.cos(theta), Math.sin(theta)];
  const ops: PDFOperator[] = [pushGraphicsState(), setFillingRgbColor(...colourRgb(n.fill ?? "#000000")), beginText()];
  for (const p of pieces) {
    // Text matrix = translate(anchor) · rotate(θ) · flip(y): upright glyphs in the page's y-down scene frame.
    const px = x + cos * dx - sin * p.dy;
    const py = y + sin * dx + cos * p.dy;
    ops.push(setFontAndSize(faces.key(page, p.font), r2(p.size)));
    ops.push(setTextMatrix(r2(cos), r2(sin), r2(sin), r2(-cos), r2(px), r2(py)));
    ops.push(showText(p.font.encodeText(p.text)));
    dx += p.width;
  }
  ops.push(endText(), popGraphicsState());
  return ops;
}

async function nodeOps(
  page: PDFPage,
  faces: FaceSet,
  states: Map<string, PDFName>,
  n: SceneNode,
): Promise<PDFOperator[]> {
  if (n.kind === "path") return paintOps(page, states, n, pathOps(n.d));
  if (n.kind === "rect") {
    if (![n.x, n.y, n.w, n.h].every(Number.isFinite)) return [];
    return paintOps(page, states, n, [rectangle(r2(n.x), r2(n.y), r2(Math.max(0, n.w)), r2(Math.max(0, n.h)))]);
  }
  return textOps(page, faces, n);
}

/**
 * The PDF of a scene: one page of the scene's physical size (scene px × 0.75 pt), the scene drawn in its own
 * y-down pixel frame through one transformation, clipped layers inside the plot rectangle. Deterministic: no
 * dates, no random ids, so the same scene and options give the same bytes.
 */
export async function writePdf(scene: Scene, opts: WritePdfOpts): Promise<Uint8Array> {
  const doc = await PDFDocument.create({ updateMetadata: false });
  doc.registerFontkit(fontkit);
  doc.setTitle(opts.title || "axband figure");
  doc.setCreator(opts.creator);
  doc.setProducer(opts.creator);
  const widthPt = scene.widthPx * PT_PER_PX;
  const heightPt = scene.heightPx * PT_PER_PX;
  const page = doc.addPage([widthPt, heightPt]);
  const faces = new FaceSet(doc, opts.fonts);
  const states = new Map<string, PDFName>();
  const ops: PDFOperator[] = [
    pushGraphicsState(),
    concatTransformationMatrix(PT_PER_PX, 0, 0, -PT_PER_PX, 0, heightPt),
  ];
  const { plot } = scene;
  for (const layer of scene.layers) {
    if (layer.nodes.length === 0) continue;
    ops.push(pushGraphicsState());
    if (layer.clip) ops.push(rectangle(r2(plot.x), r2(plot.y), r2(plot.w), r2(plot.h)), clip(), endPath());
    for (const node of layer.nodes) ops.push(...(await nodeOps(page, faces, states, node)));
    ops.push(popGraphicsState());
  }
  ops.push(popGraphicsState());
  page.pushOperators(...ops);
  if (opts.attachment) {
    await doc.attach(opts.attachment.bytes, opts.attachment.name, {
      mimeType: "application/json",
      description: opts.attachment.description,
    });
  }
  // Object streams would hide the attachment's file name from simple readers; plain objects keep it findable.
  return doc.save({ useObjectStreams: false });
}
