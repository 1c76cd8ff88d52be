// Checks of the BibTeX parser and writer against the format as documented: bibtex.org "BibTeX Format
// Description" (@STRING abbreviations, `#` concatenation, @PREAMBLE, @COMMENT, case-insensitive tag names,
// values in braces or quotes) and the token rules restated in python-bibtexparser issue #396 (numbers,
// macro names and brace-balanced strings, concatenated with #; its example `10 # "~" # jan` with
// @STRING{jan = "Jan."} gives "10~Jan.").
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import {
  bibtexFieldText,
  escapeBibtexValue,
  formatBibtexEntry,
  parseBibtex,
  unescapeBibtexValue,
} from "../../src/formats/bibtex";

describe("parseBibtex", () => {
  test("an entry with braced, quoted and numeric values; tag names are case-insensitive (bibtex.org)", () => {
    const text = `@Article{DiLuzio:2016sbl,
      Author = "Di Luzio, Luca and Mescia, Federico and Nardi, Enrico",
      TITLE  = {{Redefining the Axion Window}},
      journal = {Phys. Rev. Lett.},
      volume = 118,
      pages  = "031801",
      year   = 2017
    }`;
    const { entries, problems } = parseBibtex(text);
    expect(problems).toEqual([]);
    expect(entries).toHaveLength(1);
    const e = entries[0];
    expect(e.type).toBe("article");
    expect(e.key).toBe("DiLuzio:2016sbl");
    expect(e.fields.author).toBe("Di Luzio, Luca and Mescia, Federico and Nardi, Enrico");
    expect(e.fields.title).toBe("{Redefining the Axion Window}");
    expect(bibtexFieldText(e.fields.title)).toBe("Redefining the Axion Window");
    expect(e.fields.volume).toBe("118");
    expect(e.fields.year).toBe("2017");
    expect(e.raw).toBe(text);
    expect(e.raw.slice(e.keyStart, e.keyEnd)).toBe("DiLuzio:2016sbl");
  });

  test('@string macros and # concatenation: the example of bibtex.org (foo # " and Mr. Bar")', () => {
    const { entries } = parseBibtex(`@string { foo = "Mrs. Foo" }
      @misc{x, author = foo # " and Mr. Bar"}`);
    expect(entries[0].fields.author).toBe("Mrs. Foo and Mr. Bar");
  });

  test("numbers, strings and macros concatenate; a user @string overrides the month (bibtexparser #396)", () => {
    const { entries } = parseBibtex(`@STRING{ jan = "Jan." }
      @INBOOK{inbook-full, month = 10 # "~" # jan, }`);
    expect(entries[0].fields.month).toBe("10~Jan.");
    // Without the @string, the standard three-letter month macro expands.
    expect(parseBibtex("@misc{y, month = feb}").entries[0].fields.month).toBe("February");
  });

  test("@comment and @preamble are skipped; text between entries is ignored, an e-mail '@' too", () => {
    const { entries, problems } = parseBibtex(`Data from the authors (write to someone@example.org).
      @comment{ this {is} ignored }
      @preamble{ "\\newcommand{\\noop}[1]{}" }
      @misc{a, note = {kept}}`);
    expect(problems).toEqual([]);
    expect(entries.map((e) => e.key)).toEqual(["a"]);
  });

  test("parentheses as entry delimiters; nested braces and quotes inside braces are kept verbatim", () => {
    const { entries } = parseBibtex(`@misc(p, title = {A {"quoted"} {\\em word}}, note = "x {y} z")`);
    expect(entries[0].fields.title).toBe(`A {"quoted"} {\\em word}`);
    expect(entries[0].fields.note).toBe("x {y} z");
  });

  test("white space runs inside a value collapse to one space", () => {
    const { entries } = parseBibtex("@misc{w, title = {Two\n     lines\t here}}");
    expect(entries[0].fields.title).toBe("Two lines here");
  });

  test("a broken entry is reported with its line and dropped; the next entry is still read", () => {
    const { entries, problems } = parseBibtex(`@article{bad, title = {never closed,
      year = 2020
      @misc{good, note = {fine}}`);
    expect(entries.map((e) => e.key)).toEqual(["good"]);
    expect(problems.length).toBeGreaterThan(0);
    expect(problems[0].line).toBe(1);
  });

  test("a duplicated field keeps the first value and says so", () => {
    const { entries, problems } = parseBibtex("@misc{d, year = 2019, year = 2020}");
    expect(entries[0].fields.year).toBe("2019");
    expect(problems[0].message).toMatch(/twice/);
  });

  test("plain text without any entry gives no entries", () => {
    expect(parseBibtex("Smith et al., Phys. Rev. Lett. 124 (2020) 101303").entries).toEqual([]);
  });
});

describe("escaping and writing", () => {
  test("LaTeX specials are escaped; braces as \\textbraceleft{} so every field stays brace-balanced", () => {
    expect(escapeBibtexValue("50% & $5 #1 a_b ~x^2 {c} \\")).toBe(
      "50\\% \\& \\$5 \\#1 a\\_b \\textasciitilde{}x\\textasciicircum{}2 \\textbraceleft{}c\\textbraceright{} \\textbackslash{}",
    );
    expect(escapeBibtexValue("c_γ = 1.92 ± 0.04 μeV")).toBe("c\\_γ = 1.92 ± 0.04 μeV");
  });

  test("round trip: escape → write → parse → unescape gives the text back (property)", () => {
    fc.assert(
      fc.property(
        fc.string({ unit: "grapheme", maxLength: 60 }),
        fc.string({ unit: "grapheme-ascii", maxLength: 40 }),
        (a, b) => {
          const text = `${a}{%}${b}\\_#&$~^`;
          const written = formatBibtexEntry("misc", "k1", [["note", escapeBibtexValue(text)]]);
          const { entries, problems } = parseBibtex(written);
          expect(problems).toEqual([]);
          expect(unescapeBibtexValue(entries[0].fields.note)).toBe(text.replace(/\s+/g, " ").trim());
        },
      ),
      { numRuns: 300 },
    );
  });

  test("formatBibtexEntry lays out one field per line in the given order", () => {
    expect(
      formatBibtexEntry("article", "K", [
        ["author", "A"],
        ["year", "2020"],
      ]),
    ).toBe("@article{K,\n  author = {A},\n  year   = {2020},\n}");
  });

  test("bibtexFieldText strips only a pair of braces that wraps the whole value", () => {
    expect(bibtexFieldText("{The QCD axion}")).toBe("The QCD axion");
    expect(bibtexFieldText("{A} and {B}")).toBe("{A} and {B}");
  });
});
