// Overlap panel in jsdom: one summary row per model × curve for a small project (a model line against a flat
// invented exclusion), sorting, the filter for pairs without overlap, exports equal to the writers on the rows as
// shown, expanding a row lists its intervals, and a click sets the highlight. Analytic case (issue 7): a flat limit g = G over [m1, m2] against the line g = k·m excludes
// [max(m1, G/k), m2]; the line is g = α m |E/N − c_γ| / (2π K·10⁶ eV GeV) (Grilli di Cortona, Hardy,
// Pardo Vega, Villadoro, JHEP 01 (2016) 034, eq. for g_aγγ; K from Gorghetto & Villadoro, JHEP 03 (2019) 033).
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { OverlapPanel } from "../../src/ui/overlap/OverlapPanel";
import { useAxband } from "../../src/ui/store";
import { emptyProject, newCurve, newModel } from "../../src/data";
import { overlapSummary } from "../../src/analysis/overlap-summary";
import { summaryToCsv, summaryToMarkdown } from "../../src/formats/overlap/exports";
import { gAgg } from "../../src/physics";
import { captureDownloads, useProject } from "./export-helpers";

const M1 = 1e-6;
// The flat level where the E/N = 8/3 line crosses at m = 1e-5 eV.
const G = gAgg(1e-5, 8 / 3, { ref: "2019" });

function project() {
  const p = emptyProject("overlap test");
  const line = newModel({ id: "m-dfsz", label: "DFSZ-type line", eOverNMin: "8/3" }, p);
  const band = newModel({ id: "m-band", label: "Wide band", eOverNMin: "0", eOverNMax: "4" }, { models: [line] });
  const masses = new Float64Array(41).map((_, i) => M1 * 10 ** (i / 20));
  const flat = newCurve(
    {
      id: "c-flat",
      label: "Flat limit (invented)",
      role: "exclusion",
      massEv: masses,
      gInvGeV: new Float64Array(41).fill(G),
    },
    p,
  );
  return { ...p, models: [line, band], curves: [flat] };
}

beforeEach(() => useProject(project()));
afterEach(() => vi.restoreAllMocks());

const bodyRows = () => within(screen.getByTestId("overlap-table")).getAllByRole("row").slice(1);

describe("overlap panel", () => {
  test("one row per overlapping pair; the line's analytic interval [10 μeV, 100 μeV] is 50 % of 1–100 μeV", () => {
    render(<OverlapPanel />);
    const rows = overlapSummary(useAxband.getState().project).filter((r) => r.verdict !== "none");
    expect(bodyRows()).toHaveLength(rows.length);
    const line = rows.find((r) => r.modelId === "m-dfsz")!;
    // ln(100/10)/ln(100/1) = 1/2 (by hand).
    expect(line.shareAny).toBeCloseTo(0.5, 12);
    const tr = bodyRows().find((r) => r.textContent?.includes("DFSZ-type line"))!;
    expect(tr.textContent).toContain("50 %");
    expect(tr.textContent).toContain("1–100 μeV");
  });

  test("strongest verdict first; pairs without overlap only with the filter", () => {
    render(<OverlapPanel />);
    const verdicts = bodyRows().map((tr) => tr.children[3].textContent);
    expect(verdicts[0]).toBe("excluded");
    expect(verdicts).not.toContain("no overlap");
  });

  test("a column header sorts, a second click reverses, a third restores the order", () => {
    render(<OverlapPanel />);
    const order = () => bodyRows().map((tr) => tr.children[1].textContent);
    const original = order();
    const header = screen.getByRole("button", { name: /^Model/ });
    fireEvent.click(header);
    expect(header.closest("th")).toHaveAttribute("aria-sort", "ascending");
    const asc = order();
    expect(asc).toEqual([...original].sort((a, b) => (a ?? "").localeCompare(b ?? "")));
    fireEvent.click(header);
    expect(order()).toEqual([...asc].reverse());
    fireEvent.click(header);
    expect(order()).toEqual(original);
  });

  test("exports equal the writers on the rows shown; expanding lists intervals; a click highlights them", async () => {
    const downloads = captureDownloads();
    render(<OverlapPanel />);
    const rows = overlapSummary(useAxband.getState().project).filter((r) => r.verdict !== "none");
    fireEvent.click(screen.getByTestId("overlap-csv"));
    fireEvent.click(screen.getByTestId("overlap-md"));
    await waitFor(() => expect(downloads).toHaveLength(2));
    expect(await downloads[0].text()).toBe(summaryToCsv(rows));
    expect(await downloads[1].text()).toBe(summaryToMarkdown(rows));
    expect(screen.getByTestId("overlap-caption").textContent).toMatch(
      /^With c_γ = 1\.92\(4\) and K = 5\.691\(51\) μeV/,
    );
    const expand = within(bodyRows()[0]).getByTestId("overlap-expand");
    expect(expand).toHaveAttribute("aria-expanded", "false");
    fireEvent.click(expand);
    expect(expand).toHaveAttribute("aria-expanded", "true");
    const list = screen.getByTestId("overlap-intervals");
    expect(within(list).getAllByRole("row").length).toBe(1 + rows[0].intervals.count);
    fireEvent.click(bodyRows()[0]);
    const h = useAxband.getState().ui.highlight!;
    expect(h.modelId).toBe(rows[0].modelId);
    expect(h.intervalsEv).toHaveLength(rows[0].intervalCount);
    expect(bodyRows()[0]).toHaveAttribute("aria-selected", "true");
    fireEvent.click(within(list).getAllByRole("button")[0]);
    expect(useAxband.getState().ui.highlight!.intervalsEv).toHaveLength(1);
  });

  test("says what is missing when there is nothing to compare", () => {
    useProject(emptyProject());
    render(<OverlapPanel />);
    expect(screen.queryByTestId("overlap-table")).toBeNull();
    expect(screen.getByText(/Add a model and import a curve/)).toBeInTheDocument();
  });
});
