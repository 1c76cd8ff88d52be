// The one file-name rule for projects, figures and tables: the characters Windows refuses in names
// (Microsoft, "Naming Files, Paths, and Namespaces": < > : " / \ | ? * and codes 0–31) never reach a file name.
import { describe, expect, it } from "vitest";
import { safeFileName } from "../../src/formats/file-name";
import { projectFileName } from "../../src/formats/project-file";

describe("safeFileName", () => {
  it.each([
    ["Export test", "Export test"],
    ['a<b>c:d"e/f\\g|h?i*j', "a-b-c-d-e-f-g-h-i-j"],
    ["tab\there\u0000", "tab-here"],
    ["  .hidden. ", "hidden"],
    ["ends with a slash/", "ends with a slash"],
    ["", "fallback"],
    ["...", "fallback"],
  ])("%j → %j", (name, file) => {
    expect(safeFileName(name, "fallback")).toBe(file);
  });

  it("keeps at most 100 characters and never ends in a dot or space after the cut", () => {
    expect(safeFileName("x".repeat(300), "f")).toBe("x".repeat(100));
    expect(safeFileName(`${"y".repeat(99)}. and more`, "f")).toBe("y".repeat(99));
  });

  it("is the rule of project file names (Windows drops trailing dots, so they go)", () => {
    for (const name of ["My axion plot", "a/b", "trailing.", ""])
      expect(projectFileName({ name })).toBe(`${safeFileName(name, "project")}.axband.json`);
  });
});
