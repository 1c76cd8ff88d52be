// Shared checks on exported SVG text for the CLI and export tests: parse as XML with @xmldom/xmldom (fail on
// any error), and list what would make the file unsafe or not self-contained (scripts, handlers, external refs).
import { DOMParser, type Document, type Element } from "@xmldom/xmldom";

/** SVG namespace (W3C, Scalable Vector Graphics (SVG) 1.1 Second Edition, §5.1 and SVG 2 §1.4). */
export const SVG_NS = "http://www.w3.org/2000/svg";

/** Parses XML strictly: any warning-level error or worse fails the test with the parser's message. */
export function parseXml(text: string): Document {
  const problems: string[] = [];
  const doc = new DOMParser({
    onError: (level, message) => {
      if (level !== "warning") problems.push(`${level}: ${message}`);
    },
  }).parseFromString(text, "image/svg+xml");
  if (problems.length) throw new Error(`SVG is not well-formed XML:\n${problems.join("\n")}`);
  return doc;
}

export function allElements(doc: Document): Element[] {
  return Array.from(doc.getElementsByTagName("*")) as Element[];
}

/** Text content of every <text> element, in document order. */
export function texts(doc: Document): string[] {
  return (Array.from(doc.getElementsByTagNameNS(SVG_NS, "text")) as Element[]).map((e) => e.textContent ?? "");
}

/**
 * Every reason the document is not inert and self-contained: script or foreignObject elements, on…
 * attributes, href/xlink:href not pointing inside the file, url(…) not pointing at "#…", javascript: values,
 * @import in style. Empty when the file is safe.
 */
export function unsafeParts(doc: Document): string[] {
  const out: string[] = [];
  for (const el of allElements(doc)) {
    const name = (el.localName ?? el.nodeName).toLowerCase();
    if (name === "script" || name === "foreignobject" || name === "iframe" || name === "embed" || name === "object")
      out.push(`<${el.nodeName}> element`);
    if (name === "style" && /@import|url\(\s*['"]?(?!#)/i.test(el.textContent ?? ""))
      out.push("<style> with an external reference");
    for (const a of Array.from(el.attributes)) {
      const an = a.name.toLowerCase();
      const v = a.value;
      if (an.startsWith("on")) out.push(`${an}= on <${el.nodeName}>`);
      if ((an === "href" || an.endsWith(":href") || an === "src") && !v.startsWith("#"))
        out.push(`${an}="${v}" on <${el.nodeName}>`);
      if (/url\(\s*['"]?(?!#)/i.test(v)) out.push(`external url() in ${an} on <${el.nodeName}>`);
      if (/^\s*javascript:/i.test(v)) out.push(`javascript: in ${an}`);
    }
  }
  return out;
}

/**
 * Every label the figure shows: text contents plus the full legend labels the writer keeps in
 * data-legend-entry (the visible legend text may be shortened with "…").
 */
export function shownLabels(doc: Document): string[] {
  const legend = allElements(doc)
    .map((e) => e.getAttribute("data-legend-entry"))
    .filter((v): v is string => v !== null);
  return [...texts(doc), ...legend];
}

/** Element names (with prefix) that occur in the document, for "no new elements" checks. */
export function elementNames(doc: Document): Set<string> {
  return new Set(allElements(doc).map((e) => e.nodeName));
}

/** Sets hostile labels on every labelled thing of a project (two models, two curves, name, title). */
export function withCorpusLabels<
  P extends { name: string; models: { label: string }[]; curves: { label: string }[]; figure: { title: string } },
>(p: P): P {
  const c = INJECTION_CORPUS;
  return {
    ...p,
    name: c[0],
    models: p.models.map((m, i) => ({ ...m, label: i === 0 ? c[0] : c[5] })),
    curves: p.curves.map((k, i) => ({ ...k, label: i === 0 ? c[1] : `${c[3]} ${c[4]}` })),
    figure: { ...p.figure, title: `${c[2]} ${c[6]}` },
  };
}

/** Hostile label corpus (OWASP XSS Filter Evasion Cheat Sheet patterns, common practice) plus XML edge cases. */
export const INJECTION_CORPUS = [
  "<script>alert(1)</script>",
  '"><img src=x onerror=alert(1)>',
  "]]>",
  "&amp;",
  "javascript:alert(1)",
  "<![CDATA[x]]>",
  "' onload='alert(1)",
];
