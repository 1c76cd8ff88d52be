// A PDF figure exported by axband as the renderer's input: its attached project file is read back. Loaded only
// for a PDF input (inputs.ts): the PDF reader costs other runs a good part of their start-up.
import type { CliInput } from "./args";
import type { LoadedProject } from "./inputs";
import { InputError, readBytes } from "./read-input";

/** The project attached to an exported PDF, with notes on what was repaired (figure options not applied). */
export async function loadPdfProject(input: CliInput): Promise<LoadedProject> {
  let bytes: Uint8Array;
  try {
    bytes = new Uint8Array(readBytes(input.path));
  } catch {
    throw new InputError(`${input.path}: cannot be read`);
  }
  const { extractProjectFromPdf } = await import("../formats/figure-pdf");
  const r = await extractProjectFromPdf(bytes);
  if (!r.ok) throw new InputError(`${input.path}: ${r.error}`);
  const notes = [
    ...r.repairs.map((x) => `${input.path}: repaired: ${x}`),
    ...(r.note ? [`${input.path}: ${r.note}`] : []),
  ];
  return { project: r.project, notes };
}
