// A project file or axband SVG as the renderer's input, validated as in the app; loaded only for such inputs,
// since the validator is a good part of a CSV run's start-up.
import { basename } from "node:path";
import { projectFromFile } from "../formats/project-file";
import { extractProjectFromSvg } from "../formats/figure-read";
import type { CliInput } from "./args";
import type { LoadedProject } from "./inputs";
import { InputError, readBytes } from "./read-input";

/** The project in a .axband.json file or an exported SVG, with notes on what was repaired on loading. */
export function loadSavedProject(input: CliInput): LoadedProject {
  const text = readBytes(input.path).toString("utf8");
  const r = input.kind === "svg" ? extractProjectFromSvg(text) : projectFromFile(text, basename(input.path));
  if (!r.ok)
    throw new InputError(
      input.kind === "svg" ? `${input.path}: ${r.error}` : `${input.path}: not a usable axband project: ${r.error}`,
    );
  return { project: r.project, notes: r.repairs.map((s) => `${input.path}: repaired on loading: ${s}`) };
}
