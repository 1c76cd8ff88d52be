// Opening a link, a project file or an exported SVG says what had to be repaired (not only "Opened …"), says
// when a link of the old format could not be verified, and words refusals for where the project came from.
// Inputs are the invented repro files of issue 16 (tests/formats/repro).
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { encodeLink } from "../../src/formats/codec";
import { defaultProject } from "../../src/project/demo";
import { createAxbandStore } from "../../src/ui/store";
import { initProject, type CurveArrays, type CurveDataStore, type KeyValueStorage } from "../../src/ui/store/autosave";
import { openProjectFile } from "../../src/ui/share/open-project";

const REPRO = join(import.meta.dirname, "..", "formats", "repro");
const read = (path: string) => readFileSync(join(REPRO, path), "utf8");

const noLocal: KeyValueStorage = { getItem: () => null, setItem: () => {} };
const noCurves: CurveDataStore = {
  put: async () => {},
  get: async (): Promise<CurveArrays | undefined> => undefined,
  delete: async () => {},
};

async function openLink(fragment: string) {
  const store = createAxbandStore();
  await initProject(store, { local: noLocal, curves: noCurves, fragment, clearFragment: () => {} });
  return store.getState().ui.messages.map((m) => m.text);
}

describe("opening a link", () => {
  it("names the repairs of a link that needed them (links/delta_huge: a curve left out)", async () => {
    const texts = await openLink(read("links/delta_huge.txt").trim());
    const opened = texts.find((t) => t.startsWith("Opened the project from the link"));
    expect(opened).toMatch(
      /The link needed a repair, so what opened differs from the original: curve 1 "Curve" was left out/,
    );
  });

  it("says that a v1 link cannot be verified, and says nothing of the kind for a v3 link", async () => {
    const [v1] = await openLink(read("links/tiny_range.txt").trim());
    expect(v1).toMatch(/older format without a checksum/);
    const [v3] = await openLink(encodeLink(defaultProject()));
    expect(v3).toMatch(/^Opened the project from the link/);
    expect(v3).not.toMatch(/checksum|repair/);
  });
});

describe("a refused link", () => {
  it("says what is wrong once, without a second lead-in (links/models_1e6_same: 10⁶ models)", async () => {
    const texts = await openLink(read("links/models_1e6_same.txt").trim());
    expect(texts).toEqual([
      "This link was not opened: it holds 1,000,000 models, and axband opens at most 500 models in one project. Your project is unchanged.",
    ]);
  });

  it("a damaged v3 link is called damaged, with one lead-in", async () => {
    const link = encodeLink(defaultProject());
    const at = link.length - 10;
    const texts = await openLink(`${link.slice(0, at)}${link[at] === "A" ? "B" : "A"}${link.slice(at + 1)}`);
    expect(texts).toEqual([expect.stringMatching(/^This link is damaged \(its checksum does not match/)]);
    expect(texts[0]).toMatch(/Check that it was copied completely\. Your project is unchanged\.$/);
    expect(texts[0].match(/This link/g)).toHaveLength(1);
  });
});

describe("opening a file", () => {
  it("names the repairs of a project file (projects/wrong_types2.axband.json)", async () => {
    const file = new File([read("projects/wrong_types2.axband.json")], "wrong_types2.axband.json");
    const r = await openProjectFile(file);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.message).toMatch(/^Opened wrong_types2\.axband\.json\. wrong_types2\.axband\.json needed \d+ repairs/);
    expect(r.message).toContain("project name: a list is not valid; the default is used");
    expect(r.message).toContain('colour: "red" is not valid');
  });

  it("an SVG whose project element holds plain text gets the file wording and one full stop", async () => {
    const file = new File([read("projects/script_meta_ns2.svg")], "script_meta_ns2.svg");
    const r = await openProjectFile(file);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error).toBe(
      "script_meta_ns2.svg was not opened: the project embedded in this SVG is not in axband's format.",
    );
  });
});
