// File names of everything the app writes for a project (issue 16: work that kept the demo's name after its content
// was removed was saved and exported as "axband demo…"): the project file and the overlap tables follow the same
// rule as the figure exports.
// (.tsx: it runs in the jsdom project, for the download link it captures.)
import { afterEach, expect, test, vi } from "vitest";
import { defaultProject } from "../../src/data";
import { fileBaseName } from "../../src/ui/export/file-base-name";
import { saveProjectFile } from "../../src/ui/share/project-actions";
import { captureDownloads, useProject } from "./export-helpers";

afterEach(() => vi.restoreAllMocks());

const demo = defaultProject();

test("the demo's name names the demo, not new work that kept the name", () => {
  expect(fileBaseName(demo, "axband")).toBe(demo.name);
  expect(fileBaseName({ ...demo, models: [], curves: [] }, "axband")).toBe("axband");
  expect(fileBaseName({ ...demo, name: "Untitled" }, "axband")).toBe("axband");
  expect(fileBaseName({ ...demo, name: "  " }, "axband")).toBe("axband");
  expect(fileBaseName({ ...demo, name: "Cavity run 3", models: [], curves: [] }, "axband")).toBe("Cavity run 3");
});

test("the project file of such work is project.axband.json; the demo itself keeps its name", async () => {
  const downloads = captureDownloads();
  useProject({ ...demo, models: [], curves: [] });
  expect(await saveProjectFile()).toBe("project.axband.json");
  useProject(demo);
  expect(await saveProjectFile()).toBe(`${demo.name}.axband.json`);
  expect(downloads.map((d) => d.fileName)).toEqual(["project.axband.json", `${demo.name}.axband.json`]);
});
