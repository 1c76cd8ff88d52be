// Writes the demo project file (public/demo.axband.json) from defaultProject(), so the committed file is
// always generator output: `npx tsx src/cli/write-demo.ts public/demo.axband.json`.
import { writeFileSync } from "node:fs";
import { defaultProject } from "../project/demo";
import { projectToFile } from "../formats/project-file";

/** The text of the demo project file (what the script writes). */
export function demoFileText(): string {
  return projectToFile(defaultProject());
}

const isMain =
  typeof process !== "undefined" && process.argv[1] !== undefined && /write-demo\.ts$/.test(process.argv[1]);
if (isMain) {
  const out = process.argv[2];
  if (!out) {
    console.error("usage: npx tsx src/cli/write-demo.ts OUTPUT.axband.json");
    process.exit(2);
  }
  writeFileSync(out, demoFileText());
  console.log(`wrote ${out}`);
}
