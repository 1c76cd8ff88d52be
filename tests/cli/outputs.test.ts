// The renderer's output paths and sizes: an output that names an input (or another output) by another
// spelling is refused, a PNG over 100 megapixels is refused before anything is drawn, and an unwritable
// directory gives one line, not a stack trace; the input is never touched.
import { chmodSync, mkdirSync, readFileSync, symlinkSync, writeFileSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import { projectFileText, smallProject, tempDir, runRender as run } from "./fixtures";

function projectIn(dir: string): string {
  const path = join(dir, "p.json");
  writeFileSync(path, projectFileText(smallProject()));
  return path;
}

describe("an output naming an input another way is refused", () => {
  it.each([
    ["-o", (dir: string) => join(dir, ".", "p.json")],
    ["--models-csv", (dir: string) => join(dir, "sub", "..", "p.json")],
    ["-o", (dir: string) => relative(process.cwd(), join(dir, "p.json"))],
    ["--png", (dir: string) => join(dir, "link.json")],
  ])("%s", async (flag, outPath) => {
    const dir = tempDir();
    mkdirSync(join(dir, "sub"));
    const input = projectIn(dir);
    symlinkSync(input, join(dir, "link.json"));
    const before = readFileSync(input, "utf8");
    const r = await run([input, flag, outPath(dir)]);
    expect(r.status).toBe(2);
    expect(r.err).toMatch(/is the input file|an output path is also an input file/);
    expect(readFileSync(input, "utf8")).toBe(before);
  });
  it("two outputs naming one file are refused too", async () => {
    const dir = tempDir();
    const r = await run([projectIn(dir), "-o", join(dir, "f.svg"), "--models-csv", join(dir, ".", "f.svg")]);
    expect(r.status).toBe(2);
    expect(r.err).toMatch(/also the output of -o|two outputs have the same path/);
  });
});

describe("PNG size cap (100 megapixels)", () => {
  it.each(["1e9", "1e7", "20000"])("--dpi %s is refused before drawing, with the pixel count", async (dpi) => {
    const dir = tempDir();
    const png = join(dir, "f.png");
    const r = await run([projectIn(dir), "--png", png, "--dpi", dpi]);
    expect(r.status).toBe(2);
    expect(r.err).toMatch(/megapixels/);
    expect(r.err).not.toMatch(/\n\s+at /);
  });
  it("300 dpi of a single-column figure is far below the cap and written", async () => {
    const dir = tempDir();
    const r = await run([projectIn(dir), "--png", join(dir, "f.png"), "--dpi", "300"]);
    expect(r.status).toBe(0);
  });
});

describe("an unwritable output directory", () => {
  it.skipIf(process.getuid?.() === 0)("gives one line and no stack trace", async () => {
    const dir = tempDir();
    const input = projectIn(dir);
    const locked = join(dir, "locked");
    mkdirSync(locked);
    chmodSync(locked, 0o500);
    const r = await run([input, "-o", join(locked, "f.svg")]);
    chmodSync(locked, 0o700);
    expect(r.status).toBe(2);
    expect(r.err.split("\n")).toEqual([
      expect.stringMatching(/f\.svg: cannot write .*permission denied/),
      "nothing was written",
    ]);
  });
  it("a file name the system refuses (too long) gives one line too (also as root)", async () => {
    const dir = tempDir();
    const r = await run([projectIn(dir), "-o", join(dir, "x".repeat(250) + ".svg")]);
    expect(r.status).toBe(2);
    expect(r.err.split("\n")).toEqual([expect.stringMatching(/\.svg: cannot write /), "nothing was written"]);
  });
  it("an output path through a file (p.json/f.svg) says that the file is no directory", async () => {
    const dir = tempDir();
    const input = projectIn(dir);
    const r = await run([input, "-o", join(input, "f.svg")]);
    expect(r.status).toBe(2);
    expect(r.err.split("\n")).toEqual([
      `axband render: ${join(input, "f.svg")}: ${input} is a file, not a directory`,
      "nothing was written",
    ]);
  });
});
