// The sources panel's content: the references behind a figure (constants, formulas, catalogue models, curve
// citations) and their BibTeX export with stable keys.
import { catalogue } from "../physics/catalogue";
import { bibtexFieldText, escapeBibtexValue, formatBibtexEntry, isSafeBibtexKey, parseBibtex } from "./bibtex";
import type { Project } from "../project/types";

export type SourceKind = "constants" | "custom-constants" | "models" | "curve";

/** One reference of the sources panel. */
export interface SourceEntry {
  /** Stable BibTeX key. */
  key: string;
  kind: SourceKind;
  /** What of the figure rests on it, in words ("α (fine-structure constant)", "curve: Demo …"). */
  usedFor: string[];
  /** BibTeX entry type ("article", "misc"). */
  entryType: string;
  /** Fields as plain text (escaped on export), in export order; names in `rawFields` hold BibTeX already. */
  fields: Record<string, string>;
  /** Fields whose value is BibTeX text (author lists with protective braces, a user's own entry). */
  rawFields: string[];
  /** The user's BibTeX entry exactly as typed (exported verbatim, except a key renamed to avoid a clash). */
  bibtex?: string;
  // Bibliographic details were checked against public copies of the papers' abstract pages and reference lists
  // (arXiv listings and mirrors, publisher and institutional repositories); a field that could not be checked is
  // listed here and flagged in the sources panel, never in the exported BibTeX.
  /** Fields filled from memory, not yet checked against the paper. */
  fromMemory: string[];
  /** One-line human-readable citation for the panel. */
  text: string;
  /** Curves citing it (kind "curve"). */
  curveIds: string[];
}

interface BuiltIn {
  key: string;
  entryType: string;
  fields: [string, string][];
  rawFields: string[];
  fromMemory: string[];
  text: string;
}

// Checked: authors, title, journal, volume, article number, year and DOI in several independent reference
// lists (e.g. NIST-based data packages and papers citing it as Rev. Mod. Phys. 93, 025010 (2021)).
const CODATA_2018: BuiltIn = {
  key: "CODATA2018",
  entryType: "article",
  fields: [
    ["author", "Tiesinga, Eite and Mohr, Peter J. and Newell, David B. and Taylor, Barry N."],
    ["title", "CODATA recommended values of the fundamental physical constants: 2018"],
    ["journal", "Rev. Mod. Phys."],
    ["volume", "93"],
    ["pages", "025010"],
    ["year", "2021"],
    ["doi", "10.1103/RevModPhys.93.025010"],
  ],
  rawFields: ["author"],
  fromMemory: [],
  text: "E. Tiesinga, P. J. Mohr, D. B. Newell, B. N. Taylor, “CODATA recommended values of the fundamental physical constants: 2018”, Rev. Mod. Phys. 93 (2021) 025010",
};

// Checked: authors and title on the arXiv listing (1511.02867, hep-ph); DOI 10.1007/JHEP01(2016)034, which
// carries journal, volume (01), article (034) and year, in a public reference list.
const GDC_2016: BuiltIn = {
  key: "GrilliDiCortona2016",
  entryType: "article",
  fields: [
    ["author", "{Grilli di Cortona}, Giovanni and Hardy, Edward and {Pardo Vega}, Javier and Villadoro, Giovanni"],
    ["title", "The QCD axion, precisely"],
    ["journal", "JHEP"],
    ["volume", "01"],
    ["pages", "034"],
    ["year", "2016"],
    ["doi", "10.1007/JHEP01(2016)034"],
    ["eprint", "1511.02867"],
    ["archiveprefix", "arXiv"],
    ["primaryclass", "hep-ph"],
  ],
  rawFields: ["author"],
  fromMemory: [],
  text: "G. Grilli di Cortona, E. Hardy, J. Pardo Vega, G. Villadoro, “The QCD axion, precisely”, JHEP 01 (2016) 034, arXiv:1511.02867",
};

// Checked: authors, title (capitals as on the listing) and arXiv number (1812.01008, hep-ph) on the arXiv listing and
// its mirrors. The journal reference JHEP 03 (2019) 033 was found only in one secondary reference list, never on a
// record of the paper itself (searched again for this entry: no journal or DOI record reached), so it stays unchecked
// and has no DOI; the panel says so, the BibTeX does not.
const GV_2019: BuiltIn = {
  key: "Gorghetto2019",
  entryType: "article",
  fields: [
    ["author", "Gorghetto, Marco and Villadoro, Giovanni"],
    ["title", "Topological Susceptibility and QCD Axion Mass: QED and NNLO corrections"],
    ["journal", "JHEP"],
    ["volume", "03"],
    ["pages", "033"],
    ["year", "2019"],
    ["eprint", "1812.01008"],
    ["archiveprefix", "arXiv"],
    ["primaryclass", "hep-ph"],
  ],
  rawFields: ["author"],
  fromMemory: ["journal", "volume", "pages", "year"],
  text: "M. Gorghetto, G. Villadoro, “Topological Susceptibility and QCD Axion Mass: QED and NNLO corrections”, JHEP 03 (2019) 033, arXiv:1812.01008",
};

// Checked: authors, title (capitals as on the listing), arXiv:2107.12378 (hep-ph) and the abstract's counts on the
// arXiv listing and its mirrors. The journal reference Phys. Rev. D 104 (2021) 075017 is from memory.
const PH_2021: BuiltIn = {
  key: "Plakkot2021",
  entryType: "article",
  fields: [
    ["author", "Plakkot, Vaisakh and Hoof, Sebastian"],
    ["title", "Anomaly Ratio Distributions of Hadronic Axion Models with Multiple Heavy Quarks"],
    ["journal", "Phys. Rev. D"],
    ["volume", "104"],
    ["pages", "075017"],
    ["year", "2021"],
    ["eprint", "2107.12378"],
    ["archiveprefix", "arXiv"],
    ["primaryclass", "hep-ph"],
  ],
  rawFields: ["author"],
  fromMemory: ["journal", "volume", "pages", "year"],
  text: "V. Plakkot, S. Hoof, “Anomaly Ratio Distributions of Hadronic Axion Models with Multiple Heavy Quarks”, Phys. Rev. D 104 (2021) 075017, arXiv:2107.12378",
};

// Checked: title, Phys. Rev. Lett. 118, 031801 (2017), issue 3, DOI and arXiv:1610.07593 on the arXiv
// listing and the University of Barcelona repository record.
const DLMN_PRL: BuiltIn = {
  key: "DiLuzio2017PRL",
  entryType: "article",
  fields: [
    ["author", "{Di Luzio}, Luca and Mescia, Federico and Nardi, Enrico"],
    ["title", "Redefining the Axion Window"],
    ["journal", "Phys. Rev. Lett."],
    ["volume", "118"],
    ["number", "3"],
    ["pages", "031801"],
    ["year", "2017"],
    ["doi", "10.1103/PhysRevLett.118.031801"],
    ["eprint", "1610.07593"],
    ["archiveprefix", "arXiv"],
    ["primaryclass", "hep-ph"],
  ],
  rawFields: ["author"],
  fromMemory: [],
  text: "L. Di Luzio, F. Mescia, E. Nardi, “Redefining the Axion Window”, Phys. Rev. Lett. 118 (2017) 031801, arXiv:1610.07593",
};

// Checked: title, Phys. Rev. D 96(7), 075003 (2017), DOI on the Durham repository record; arXiv:1705.05370.
const DLMN_PRD: BuiltIn = {
  key: "DiLuzio2017PRD",
  entryType: "article",
  fields: [
    ["author", "{Di Luzio}, Luca and Mescia, Federico and Nardi, Enrico"],
    ["title", "Window for preferred axion models"],
    ["journal", "Phys. Rev. D"],
    ["volume", "96"],
    ["number", "7"],
    ["pages", "075003"],
    ["year", "2017"],
    ["doi", "10.1103/PhysRevD.96.075003"],
    ["eprint", "1705.05370"],
    ["archiveprefix", "arXiv"],
  ],
  rawFields: ["author"],
  fromMemory: [],
  text: "L. Di Luzio, F. Mescia, E. Nardi, “Window for preferred axion models”, Phys. Rev. D 96 (2017) 075003, arXiv:1705.05370",
};

// Checked: Workman et al. (Particle Data Group), PTEP 2022, 083C01 (2022) on the PDG authors page and the
// DOI 10.1093/ptep/ptac097 in a public BibTeX list. The title of the axion review inside it is not checked.
const PDG_2022: BuiltIn = {
  key: "PDG2022",
  entryType: "article",
  fields: [
    ["author", "Workman, R. L. and others"],
    ["collaboration", "Particle Data Group"],
    ["title", "Review of Particle Physics"],
    ["journal", "PTEP"],
    ["volume", "2022"],
    ["pages", "083C01"],
    ["year", "2022"],
    ["doi", "10.1093/ptep/ptac097"],
    ["note", "Review: Axions and other similar particles"],
  ],
  rawFields: ["author"],
  fromMemory: ["note"],
  text: "R. L. Workman et al. (Particle Data Group), “Review of Particle Physics”, PTEP 2022 (2022) 083C01; review “Axions and other similar particles”",
};

function fromBuiltIn(b: BuiltIn, kind: SourceKind, usedFor: string[]): SourceEntry {
  return {
    key: b.key,
    kind,
    usedFor,
    entryType: b.entryType,
    fields: Object.fromEntries(b.fields),
    rawFields: [...b.rawFields],
    fromMemory: [...b.fromMemory],
    text: b.text,
    curveIds: [],
  };
}

/** FNV-1a, 32 bits, as 8 hex digits: a short stable key from a citation's text. */
function fnv1a(text: string): string {
  let h = 0x811c9dc5;
  for (let k = 0; k < text.length; k++) {
    h ^= text.charCodeAt(k);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).padStart(8, "0");
}

function shortAuthors(author: string): string {
  const names = bibtexFieldText(author)
    .split(/\s+and\s+/)
    .map((a) => (a.includes(",") ? a.split(",")[0] : (a.trim().split(/\s+/).pop() ?? a)).replace(/[{}]/g, "").trim())
    .filter((a) => a && a !== "others");
  if (names.length === 0) return "";
  return names.length > 2 ? `${names[0]} et al.` : names.join(" and ");
}

function textOfEntry(fields: Record<string, string>, key: string): string {
  const get = (name: string): string => (fields[name] ? bibtexFieldText(fields[name]) : "");
  const parts = [
    shortAuthors(fields.author ?? ""),
    get("title") ? `“${get("title")}”` : "",
    [get("journal"), get("volume"), get("year") ? `(${get("year")})` : "", get("pages")].filter(Boolean).join(" "),
    get("eprint") ? `arXiv:${get("eprint")}` : "",
  ].filter(Boolean);
  return parts.length > 0 ? parts.join(", ") : key;
}

function replaceKey(raw: string, start: number, end: number, key: string): string {
  return raw.slice(0, start) + key + raw.slice(end);
}

/** A catalogue source names one entry, or several joined by commas (a model set picked from the catalogue). */
function catalogueGroups(catalogueId: string): Set<string> {
  const ids = new Set(catalogueId.split(",").map((id) => id.trim()));
  return new Set(catalogue().flatMap((c) => (ids.has(c.id) ? [c.group] : [])));
}

/** CODATA, then the g_aγγ formula, c_γ and K as the selected reference (or the user's constants) gives them. */
function constantSources(physics: Project["physics"]): SourceEntry[] {
  const out: SourceEntry[] = [
    fromBuiltIn(CODATA_2018, "constants", [
      "α = 7.2973525693(11)×10⁻³ (fine-structure constant)",
      "h = 4.135667696×10⁻¹⁵ eV·s (m_a ↔ frequency)",
    ]),
  ];
  const ref = physics.ref;
  if (ref === "custom") {
    out.push(fromBuiltIn(GDC_2016, "constants", ["g_aγγ = α/(2π f_a)·(E/N − c_γ)"]));
    out.push(customConstantsSource(physics.custom));
  } else if (ref === "2016") {
    out.push(
      fromBuiltIn(GDC_2016, "constants", ["g_aγγ = α/(2π f_a)·(E/N − c_γ)", "c_γ = 1.92(4)", "K = 5.70(6)(4) μeV"]),
    );
  } else {
    out.push(fromBuiltIn(GDC_2016, "constants", ["g_aγγ = α/(2π f_a)·(E/N − c_γ)", "c_γ = 1.92(4)"]));
    out.push(fromBuiltIn(GV_2019, "constants", ["K = 5.691(51) μeV"]));
  }
  return out;
}

function customConstantsSource(c: Project["physics"]["custom"]): SourceEntry {
  const label = c.label.trim() || "user-entered constants";
  const values = `c_γ = ${c.cGamma} ± ${c.cGammaSigma}, K = ${c.kMuEv} ± ${c.kMuEvSigma} μeV (m_a = K μeV · 10¹² GeV/f_a)`;
  return {
    key: `customConstants-${fnv1a(`${label}|${values}`)}`,
    kind: "custom-constants",
    usedFor: [`c_γ and K: ${values}`],
    entryType: "misc",
    fields: { title: label, note: `User-entered constants: ${values}` },
    rawFields: [],
    fromMemory: [],
    text: `${label}: ${values}`,
    curveIds: [],
  };
}

/**
 * The papers behind the visible models: Di Luzio, Mescia, Nardi for heavy-quark catalogue models and for ensembles
 * (their representations R1–R15), Plakkot & Hoof for ensembles (multi-quark ensembles and their Landau-pole
 * criterion), the PDG review for DFSZ-type catalogue models.
 */
function modelSources(models: Project["models"]): SourceEntry[] {
  const heavyQuark: string[] = [];
  const dfsz: string[] = [];
  const ensembles: string[] = [];
  for (const m of models) {
    if (!m.visible) continue;
    if (m.source.kind === "ensemble") ensembles.push(m.label);
    if (m.source.kind !== "catalogue") continue;
    const groups = catalogueGroups(m.source.catalogueId);
    if (groups.has("dfsz")) dfsz.push(m.label);
    if ([...groups].some((g) => g !== "dfsz")) heavyQuark.push(m.label);
  }
  const out: SourceEntry[] = [];
  if (heavyQuark.length > 0 || ensembles.length > 0) {
    const used = [
      ...(heavyQuark.length > 0 ? [`heavy-quark catalogue models: ${heavyQuark.join(", ")}`] : []),
      ...(ensembles.length > 0 ? [`representations R1–R15 of heavy-quark ensembles: ${ensembles.join(", ")}`] : []),
    ];
    out.push(fromBuiltIn(DLMN_PRL, "models", used));
  }
  if (heavyQuark.length > 0) {
    const names = heavyQuark.join(", ");
    out.push(fromBuiltIn(DLMN_PRD, "models", [`heavy-quark representations and preferred window: ${names}`]));
  }
  if (ensembles.length > 0) {
    const use = `heavy-quark ensembles and their Landau-pole criterion: ${ensembles.join(", ")}`;
    out.push(fromBuiltIn(PH_2021, "models", [use]));
  }
  if (dfsz.length > 0) out.push(fromBuiltIn(PDG_2022, "models", [`DFSZ-type catalogue models: ${dfsz.join(", ")}`]));
  return out;
}

type Curve = Project["curves"][number];

/** A curve's citation as entries: each BibTeX entry that parses, else one @misc with the text as its note. */
function curveCandidates(curve: Curve, citation: string, parsed: ReturnType<typeof parseBibtex>): SourceEntry[] {
  const use = `curve: ${curve.label}`;
  if (parsed.entries.length > 0)
    return parsed.entries.map((e) => ({
      key: e.key,
      kind: "curve",
      usedFor: [use],
      entryType: e.type,
      fields: { ...e.fields },
      rawFields: Object.keys(e.fields),
      bibtex: e.raw,
      fromMemory: [],
      text: textOfEntry(e.fields, e.key),
      curveIds: [curve.id],
    }));
  return [
    {
      key: `curve-${fnv1a(citation)}`,
      kind: "curve",
      usedFor: [use],
      entryType: "misc",
      fields: { note: citation },
      rawFields: [],
      fromMemory: [],
      text: citation,
      curveIds: [curve.id],
    },
  ];
}

/** Appends the visible curves' citations to `out`, merging identical ones and renaming clashing keys. */
function addCurveSources(out: SourceEntry[], curves: Project["curves"]): void {
  const byKey = new Map(out.map((e) => [e.key, e]));
  for (const curve of curves) {
    if (!curve.visible) continue;
    const citation = curve.citation.trim();
    if (!citation) continue;
    const use = `curve: ${curve.label}`;
    const parsed = parseBibtex(citation);
    for (const cand of curveCandidates(curve, citation, parsed)) {
      const same = byKey.get(cand.key);
      if (same && (same.bibtex ?? same.text) === (cand.bibtex ?? cand.text)) {
        same.usedFor.push(use);
        same.curveIds.push(curve.id);
        continue;
      }
      if (same || !isSafeBibtexKey(cand.key)) {
        // A different entry under the same key (or an awkward key): give this one a derived, stable key.
        const base = isSafeBibtexKey(cand.key) ? cand.key : "curve";
        let key = `${base}-${fnv1a(cand.bibtex ?? cand.text)}`;
        while (byKey.has(key)) key += "x";
        const entry = parsed.entries.find((e) => e.raw === cand.bibtex);
        if (entry && cand.bibtex) cand.bibtex = replaceKey(entry.raw, entry.keyStart, entry.keyEnd, key);
        cand.key = key;
      }
      byKey.set(cand.key, cand);
      out.push(cand);
    }
  }
}

/**
 * The references behind what the project's figure shows (visible models and curves), in panel order:
 * CODATA 2018 (α, h); the g_aγγ formula and c_γ (Grilli di Cortona et al. 2016); K from the selected
 * reference (2016 paper, or Gorghetto & Villadoro 2019) or the user's custom constants with their label;
 * Di Luzio, Mescia, Nardi (PRL 2017, PRD 2017) when heavy-quark catalogue models are shown (the PRL and
 * Plakkot & Hoof 2021 for heavy-quark ensembles); the PDG review when DFSZ-type catalogue models are; then each visible curve's citation: a BibTeX entry that parses is
 * kept verbatim (its key renamed only when it clashes with a different entry), free text becomes a @misc
 * entry with note = the text. Identical citations of several curves give one entry.
 * @param project the whole state; nothing in it is changed.
 */
export function projectSources(project: Project): SourceEntry[] {
  const out = [...constantSources(project.physics), ...modelSources(project.models)];
  addCurveSources(out, project.curves);
  return out;
}

/**
 * The entries as one BibTeX file: built-in and free-text entries written field by field (plain-text values
 * escaped: \ { } & % $ # _ ~ ^), a user's own BibTeX entry verbatim. Fields from memory are never flagged
 * here (the panel says so): nothing in a field may print "unchecked". Entries are separated by a blank line;
 * the text ends in "\n".
 * @param entries as returned by {@link projectSources}.
 */
export function sourcesToBibtex(entries: SourceEntry[]): string {
  const blocks: string[] = [];
  for (const e of entries) {
    if (e.bibtex) {
      blocks.push(e.bibtex.trim());
      continue;
    }
    const raw = new Set(e.rawFields);
    const fields: [string, string][] = Object.entries(e.fields)
      .filter(([name]) => name !== "note")
      .map(([name, value]) => [name, raw.has(name) ? value : escapeBibtexValue(value)]);
    // Fields still unchecked are flagged in the sources panel only: a flag in a field would print in the
    // bibliography of the paper that uses this file.
    if (e.fields.note) fields.push(["note", raw.has("note") ? e.fields.note : escapeBibtexValue(e.fields.note)]);
    // Titles get one protective brace pair so styles keep their capitals (QCD, NNLO).
    const withTitle = fields.map(([name, value]): [string, string] =>
      name === "title" ? [name, `{${value}}`] : [name, value],
    );
    blocks.push(formatBibtexEntry(e.entryType, e.key, withTitle));
  }
  return blocks.length > 0 ? blocks.join("\n\n") + "\n" : "";
}
