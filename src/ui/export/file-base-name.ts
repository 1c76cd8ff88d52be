// The base name of every file the app writes for a project (figures, tables, the project file): the project's
// name, unless it is empty, "Untitled", or the demo's name kept on work that has none of the demo's content.
import { defaultProject } from "../../project/demo";
import type { Project } from "../../project/types";
import { safeFileName } from "./download";

/** The demo's name, and the ids of its models and curves (the demo content). */
function demoOf(): { name: string; ids: Set<string> } {
  const d = defaultProject();
  return { name: d.name, ids: new Set([...d.models, ...d.curves].map((x) => x.id)) };
}

/**
 * The project's name as a file name, or `fallback` when there is none, or when the project still has the demo's
 * name but none of the demo's content (new work is not named after the demo).
 */
export function fileBaseName(project: Pick<Project, "name" | "models" | "curves">, fallback: string): string {
  const name = project.name.trim();
  const demo = demoOf();
  const leftDemo = name === demo.name && ![...project.models, ...project.curves].some((x) => demo.ids.has(x.id));
  return safeFileName(name === "" || name === "Untitled" || leftDemo ? fallback : name, fallback);
}
