// Sources panel in jsdom: lists every reference projectSources gives for the project with its details,
// marks fields filled from memory, shows the citations typed at import, and downloads references.bib with
// exactly sourcesToBibtex's text. Reference contents themselves are checked in the data core's tests.
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { act, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { SourcesPanel } from "../../src/ui/sources/SourcesPanel";
import { useAxband } from "../../src/ui/store";
import { defaultProject, newCurve, projectSources, sourcesToBibtex } from "../../src/data";
import { captureDownloads, useProject } from "./export-helpers";

const BIB = `@article{Demo2099,
  author = {Nobody, A.},
  title = {An invented haloscope result for the axband tests},
  journal = {Invented Journal},
  year = {2099}
}`;

beforeEach(() => {
  const p = defaultProject();
  const cited = newCurve(
    {
      id: "c-bib",
      label: "Cited demo (invented)",
      massEv: new Float64Array([1e-6, 1e-5]),
      gInvGeV: new Float64Array([1e-12, 1e-12]),
      citation: BIB,
    },
    p,
  );
  const plain = newCurve(
    {
      id: "c-uncited",
      label: "Uncited demo (invented)",
      massEv: new Float64Array([1e-6, 1e-5]),
      gInvGeV: new Float64Array([1e-11, 1e-11]),
    },
    p,
  );
  useProject({ ...p, curves: [...p.curves, cited, plain] });
});
afterEach(() => vi.restoreAllMocks());

describe("sources panel", () => {
  test("lists every reference with its details and marks fields from memory", () => {
    render(<SourcesPanel />);
    const entries = projectSources(useAxband.getState().project);
    const shown = screen.getAllByTestId("source-entry");
    expect(shown).toHaveLength(entries.length);
    entries.forEach((e, i) => {
      expect(shown[i]).toHaveAttribute("data-source-key", e.key);
      expect(within(shown[i]).getByText(e.text, { selector: ".ax-source-text" })).toBeInTheDocument();
      for (const [name, value] of Object.entries(e.fields)) {
        const dt = within(shown[i]).getByText(name, { selector: "dt" });
        expect(dt.nextElementSibling?.textContent).toContain(value);
      }
      const memory = within(shown[i]).queryByTestId("source-from-memory");
      if (e.fromMemory.length > 0) expect(memory?.textContent).toContain(e.fromMemory.join(", "));
      else expect(memory).toBeNull();
    });
    // The BibTeX entry typed at import is listed verbatim.
    expect(screen.getByText(/An invented haloscope result/, { selector: "pre" })).toBeInTheDocument();
    expect(screen.getByTestId("sources-uncited").textContent).toContain("Uncited demo (invented)");
  });

  test("BibTeX export downloads references.bib with sourcesToBibtex's text", async () => {
    const downloads = captureDownloads();
    render(<SourcesPanel />);
    fireEvent.click(screen.getByTestId("sources-bibtex"));
    await waitFor(() => expect(downloads).toHaveLength(1));
    expect(downloads[0].fileName).toBe("references.bib");
    const text = await downloads[0].text();
    expect(text).toBe(sourcesToBibtex(projectSources(useAxband.getState().project)));
    expect(text).toContain("@article{Demo2099");
  });

  test("hidden curves' citations leave the list", () => {
    render(<SourcesPanel />);
    expect(screen.queryByText(/An invented haloscope result/, { selector: "pre" })).toBeInTheDocument();
    act(() => useAxband.getState().updateCurve("c-bib", { visible: false }));
    expect(screen.queryByText(/An invented haloscope result/, { selector: "pre" })).toBeNull();
  });
});
