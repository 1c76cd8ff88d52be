// The sources list and its BibTeX export. The bibliographic values are those of the papers as listed on
// their abstract pages and in publisher/repository records: CODATA 2018 (Tiesinga, Mohr, Newell, Taylor,
// Rev. Mod. Phys. 93 (2021) 025010), Grilli di Cortona, Hardy, Pardo Vega, Villadoro (JHEP 01 (2016) 034,
// arXiv:1511.02867), Gorghetto & Villadoro (arXiv:1812.01008; journal reference unchecked, from memory),
// Di Luzio, Mescia, Nardi (PRL 118 (2017) 031801, arXiv:1610.07593; PRD 96 (2017) 075003,
// arXiv:1705.05370), Workman et al. (PDG), PTEP 2022 (2022) 083C01, Plakkot & Hoof (arXiv:2107.12378; journal
// reference from memory).
import { describe, expect, test } from "vitest";
import { emptyProject, newCurve, newModel } from "../../src/project/defaults";
import { DEMO_CITATION } from "../../src/project/demo";
import { bibtexFieldText, parseBibtex } from "../../src/formats/bibtex";
import { projectSources, sourcesToBibtex, type SourceEntry } from "../../src/formats/sources";
import type { Project } from "../../src/project/types";

function keys(entries: SourceEntry[]): string[] {
  return entries.map((e) => e.key);
}

function byKey(entries: SourceEntry[], key: string): SourceEntry {
  const e = entries.find((x) => x.key === key);
  if (!e) throw new Error(`no entry ${key}`);
  return e;
}

const USER_BIBTEX = `@article{Smith:2020abc,
  author = {Smith, A. and Jones, B.},
  title = {{An invented haloscope search}},
  journal = {Phys. Rev. Lett.},
  volume = {999},
  pages = {000001},
  year = {2020}
}`;

function project(): Project {
  const p = emptyProject();
  p.models = [newModel({ id: "m1", eOverNMin: "0" })];
  p.curves = [
    newCurve({ id: "c1", label: "Demo A (invented)", citation: DEMO_CITATION }),
    newCurve({ id: "c2", label: "Demo B (invented)", citation: DEMO_CITATION }),
    newCurve({ id: "c3", label: "Typed entry", citation: USER_BIBTEX }),
    newCurve({ id: "c4", label: "Hidden", citation: "not shown", visible: false }),
    newCurve({ id: "c5", label: "No citation" }),
  ];
  return p;
}

describe("projectSources", () => {
  test("default reference 2019: CODATA 2018, the 2016 paper (formula, c_γ) and Gorghetto & Villadoro (K)", () => {
    const s = projectSources(project());
    expect(keys(s).slice(0, 3)).toEqual(["CODATA2018", "GrilliDiCortona2016", "Gorghetto2019"]);
    expect(byKey(s, "Gorghetto2019").usedFor).toEqual(["K = 5.691(51) μeV"]);
    expect(byKey(s, "CODATA2018").usedFor.join(" ")).toMatch(
      /α = 7\.2973525693\(11\)×10⁻³.*h = 4\.135667696×10⁻¹⁵ eV·s/,
    );
  });

  test("reference 2016: no 2019 paper, K from the 2016 paper", () => {
    const p = project();
    p.physics.ref = "2016";
    const s = projectSources(p);
    expect(keys(s)).not.toContain("Gorghetto2019");
    expect(byKey(s, "GrilliDiCortona2016").usedFor).toContain("K = 5.70(6)(4) μeV");
  });

  test("custom constants: an entry with the user's label and values, no published K", () => {
    const p = project();
    p.physics.ref = "custom";
    p.physics.custom = {
      cGamma: 2.1,
      cGammaSigma: 0.1,
      kMuEv: 5.9,
      kMuEvSigma: 0.2,
      label: "Lattice & χPT fit, 50% bigger_errors",
    };
    const s = projectSources(p);
    expect(keys(s)).not.toContain("Gorghetto2019");
    const custom = s.find((e) => e.kind === "custom-constants");
    expect(custom?.fields.title).toBe("Lattice & χPT fit, 50% bigger_errors");
    expect(custom?.fields.note).toContain("c_γ = 2.1 ± 0.1, K = 5.9 ± 0.2 μeV");
    // Stable key: the same settings give the same key.
    expect(projectSources(p).find((e) => e.kind === "custom-constants")?.key).toBe(custom?.key);
  });

  test("bibliographic details as printed by the papers", () => {
    const s = projectSources(project());
    expect(byKey(s, "CODATA2018").fields).toMatchObject({
      title: "CODATA recommended values of the fundamental physical constants: 2018",
      journal: "Rev. Mod. Phys.",
      volume: "93",
      pages: "025010",
      year: "2021",
      doi: "10.1103/RevModPhys.93.025010",
    });
    expect(byKey(s, "GrilliDiCortona2016").fields).toMatchObject({
      title: "The QCD axion, precisely",
      journal: "JHEP",
      volume: "01",
      pages: "034",
      year: "2016",
      eprint: "1511.02867",
    });
    const gv = byKey(s, "Gorghetto2019");
    expect(gv.fields.eprint).toBe("1812.01008");
    expect(gv.fromMemory).toEqual(["journal", "volume", "pages", "year"]);
  });

  test("heavy-quark catalogue models add Di Luzio, Mescia, Nardi; DFSZ-type ones the PDG review; hidden ones nothing", () => {
    const p = project();
    p.models.push(newModel({ id: "k", label: "KSVZ-type R2", source: { kind: "catalogue", catalogueId: "ksvz-r2" } }));
    p.models.push(
      newModel({ id: "d", label: "DFSZ-type I", source: { kind: "catalogue", catalogueId: "dfsz-i" }, visible: false }),
    );
    let s = projectSources(p);
    expect(keys(s)).toEqual(expect.arrayContaining(["DiLuzio2017PRL", "DiLuzio2017PRD"]));
    expect(keys(s)).not.toContain("PDG2022");
    expect(byKey(s, "DiLuzio2017PRL").fields).toMatchObject({
      journal: "Phys. Rev. Lett.",
      volume: "118",
      pages: "031801",
      year: "2017",
      eprint: "1610.07593",
    });
    expect(byKey(s, "DiLuzio2017PRD").fields).toMatchObject({
      journal: "Phys. Rev. D",
      volume: "96",
      pages: "075003",
      eprint: "1705.05370",
    });
    p.models[2].visible = true;
    s = projectSources(p);
    expect(byKey(s, "PDG2022").fields).toMatchObject({
      journal: "PTEP",
      volume: "2022",
      pages: "083C01",
      doi: "10.1093/ptep/ptac097",
    });
    expect(byKey(s, "PDG2022").usedFor[0]).toContain("DFSZ-type I");
  });

  test("a catalogue model set cites the groups of its entries; a set of DFSZ-type entries only the PDG review", () => {
    const p = project();
    const set = (id: string, ids: string) =>
      newModel({ id, label: `Catalogue set ${id}`, kind: "set", source: { kind: "catalogue", catalogueId: ids } });
    p.models.push(set("s1", "dfsz-i,dfsz-ii"));
    let s = projectSources(p);
    expect(keys(s)).toContain("PDG2022");
    expect(keys(s)).not.toContain("DiLuzio2017PRL");
    p.models.push(set("s2", "ksvz-r2,dfsz-i"));
    s = projectSources(p);
    expect(byKey(s, "DiLuzio2017PRL").usedFor.join(" ")).toContain("Catalogue set s2");
    expect(byKey(s, "PDG2022").usedFor.join(" ")).toMatch(/Catalogue set s1.*Catalogue set s2/);
  });

  test("a heavy-quark ensemble cites Di Luzio, Mescia, Nardi (representations) and Plakkot & Hoof (arXiv:2107.12378)", () => {
    const p = project();
    p.models.push(
      newModel({ id: "e", label: "Ensemble", kind: "set", source: { kind: "ensemble", settings: { maxQuarks: 28 } } }),
    );
    const s = projectSources(p);
    expect(byKey(s, "DiLuzio2017PRL").usedFor.join(" ")).toContain("representations R1–R15");
    expect(keys(s)).not.toContain("DiLuzio2017PRD");
    const ph = byKey(s, "Plakkot2021");
    expect(ph.fields).toMatchObject({ eprint: "2107.12378", primaryclass: "hep-ph" });
    expect(ph.fields.title).toBe("Anomaly Ratio Distributions of Hadronic Axion Models with Multiple Heavy Quarks");
    // The journal reference is recalled, not checked: flagged in the panel, absent from the printing fields' text.
    expect(ph.fromMemory).toEqual(["journal", "volume", "pages", "year"]);
    expect(sourcesToBibtex(s)).not.toMatch(/from memory|unchecked/i);
  });

  test("curve citations: free text → one @misc for identical texts, BibTeX kept verbatim, hidden curves left out", () => {
    const s = projectSources(project());
    const curves = s.filter((e) => e.kind === "curve");
    expect(curves).toHaveLength(2);
    const demo = curves.find((e) => e.entryType === "misc");
    expect(demo?.fields.note).toBe(DEMO_CITATION);
    expect(demo?.curveIds).toEqual(["c1", "c2"]);
    const typed = byKey(s, "Smith:2020abc");
    expect(typed.bibtex).toBe(USER_BIBTEX);
    expect(typed.curveIds).toEqual(["c3"]);
    expect(typed.text).toBe("Smith and Jones, “An invented haloscope search”, Phys. Rev. Lett. 999 (2020) 000001");
    expect(s.some((e) => e.curveIds.includes("c4"))).toBe(false);
  });

  test("a user key that clashes with a different entry is renamed, stably, in the verbatim text too", () => {
    const p = project();
    p.curves[2].citation = USER_BIBTEX.replace("Smith:2020abc", "CODATA2018");
    const s = projectSources(p);
    const renamed = s.find((e) => e.kind === "curve" && e.entryType === "article");
    expect(renamed?.key).toMatch(/^CODATA2018-[0-9a-f]{8}$/);
    expect(renamed?.bibtex?.startsWith(`@article{${renamed?.key},`)).toBe(true);
    expect(projectSources(p).find((e) => e.kind === "curve" && e.entryType === "article")?.key).toBe(renamed?.key);
  });

  test("free-text keys are stable across calls and projects", () => {
    const a = projectSources(project()).find((e) => e.entryType === "misc" && e.kind === "curve");
    const b = projectSources(project()).find((e) => e.entryType === "misc" && e.kind === "curve");
    expect(a?.key).toMatch(/^curve-[0-9a-f]{8}$/);
    expect(b?.key).toBe(a?.key);
  });
});

describe("sourcesToBibtex", () => {
  test("round trip: the export parses back with every key and the same field texts", () => {
    const p = project();
    p.physics.ref = "custom";
    p.physics.custom = {
      cGamma: 2.1,
      cGammaSigma: 0.1,
      kMuEv: 5.9,
      kMuEvSigma: 0.2,
      label: "Fit {v2} & 50% ~ a_b #3 ^ \\",
    };
    p.curves[0].citation = "Our own reanalysis, 100% invented; see {notes} & tables_#2";
    const entries = projectSources(p);
    const bib = sourcesToBibtex(entries);
    const parsed = parseBibtex(bib);
    expect(parsed.problems).toEqual([]);
    expect(parsed.entries.map((e) => e.key)).toEqual(keys(entries));
    for (const e of entries) {
      const back = parsed.entries.find((x) => x.key === e.key)!;
      if (e.bibtex) {
        expect(back.raw).toBe(e.bibtex);
        continue;
      }
      for (const [name, value] of Object.entries(e.fields)) {
        if (name === "note" || e.rawFields.includes(name)) continue;
        expect(bibtexFieldText(back.fields[name])).toBe(value);
      }
    }
    const custom = parsed.entries.find((x) => x.key.startsWith("customConstants-"))!;
    expect(custom.fields.title).toBe(
      "{Fit \\textbraceleft{}v2\\textbraceright{} \\& 50\\% \\textasciitilde{} a\\_b \\#3 \\textasciicircum{} \\textbackslash{}}",
    );
    const free = parsed.entries.find(
      (x) => x.type === "misc" && x.key.startsWith("curve-") && x.fields.note.includes("reanalysis"),
    )!;
    expect(bibtexFieldText(free.fields.note)).toBe("Our own reanalysis, 100% invented; see {notes} & tables_#2");
  });

  test("no field of the exported BibTeX says 'from memory' or 'unchecked' (it would print in a bibliography)", () => {
    const bib = sourcesToBibtex(projectSources(project()));
    expect(bib).not.toMatch(/from memory|unchecked/i);
    const gv = parseBibtex(bib).entries.find((e) => e.key === "Gorghetto2019")!;
    expect(gv.fields.note).toBeUndefined();
    const codata = parseBibtex(bib).entries.find((e) => e.key === "CODATA2018")!;
    expect(codata.fields.note).toBeUndefined();
  });

  test("titles carry one protective brace pair; the user's entry appears exactly as typed", () => {
    const bib = sourcesToBibtex(projectSources(project()));
    expect(bib).toContain("title         = {{The QCD axion, precisely}}");
    expect(bib).toContain(USER_BIBTEX);
    expect(bib.endsWith("}\n")).toBe(true);
  });
});
