// A PDF figure exported by axband as the renderer's input: its attached project file is read back (PDF
// parsing is asynchronous, so this sits beside the synchronous loaders of inputs.ts).
import { readFileSync } from "node:fs";
import type { CliOptions } from "./args";
import { InputError, applyFigureOptions, loadProject, undrawablePointNotes, type PreParsed } from "./inputs";

/** As loadProject, for every input kind including an exported PDF. */
export async function loadAnyProject(
  opts: CliOptions,
  preParsed: PreParsed = [],
): Promise<ReturnType<typeof loadProject>> {
  const first = opts.inputs[0];
  if (first?.kind !== "pdf") return loadProject(opts, preParsed);
  let bytes: Uint8Array;
  try {
    bytes = new Uint8Array(readFileSync(first.path));
  } catch {
    throw new InputError(`${first.path}: cannot be read`);
  }
  // The PDF reader loads only for a PDF input: it costs the other runs a good part of their start-up.
  const { extractProjectFromPdf } = await import("../formats/figure-pdf");
  const r = await extractProjectFromPdf(bytes);
  if (!r.ok) throw new InputError(`${first.path}: ${r.error}`);
  const notes = [
    ...r.repairs.map((x) => `${first.path}: repaired: ${x}`),
    ...(r.note ? [`${first.path}: ${r.note}`] : []),
  ];
  return {
    project: applyFigureOptions(r.project, opts),
    notes: [...notes, ...undrawablePointNotes(r.project, first.path)],
  };
}
