// Overlap panel in jsdom: rows for a small project (a model line against a flat invented exclusion), sorting
// by column, the default order (strongest verdict first), filters, the CSV/Markdown exports equal the data
// core's writers on the rows as shown, and a row click sets the highlight. Analytic case (issue 7): a flat limit g = G over [m1, m2] against the line g = k·m excludes
// [max(m1, G/k), m2]; the line is g = α m |E/N − c_γ| / (2π K·10⁶ eV GeV) (Grilli di Cortona, Hardy,
// Pardo Vega, Villadoro, JHEP 01 (2016) 034, eq. for g_aγγ; K from Gorghetto & Villadoro, JHEP 03 (2019) 033).
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { OverlapPanel } from "../../src/ui/overlap/OverlapPanel";
import { sortRows, verdictText } from "../../src/ui/overlap/table-logic";
import { useAxband } from "../../src/ui/store";
import {
  emptyProject,
  newCurve,
  newModel,
  overlapTable,
  overlapTableToCsv,
  overlapTableToMarkdown,
} from "../../src/data";
import { gAgg } from "../../src/physics";
import { siFormat } from "../../src/ui/format";
import { captureDownloads, useProject } from "./export-helpers";

const M1 = 1e-6;
const M2 = 1e-4;
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
  test("renders the rows of overlapTable, with the analytic interval of the line", () => {
    render(<OverlapPanel />);
    const expected = overlapTable(useAxband.getState().project);
    expect(expected.length).toBeGreaterThan(0);
    expect(bodyRows()).toHaveLength(expected.length);
    const lineRow = expected.find((r) => r.modelId === "m-dfsz" && r.kind === "excluded-whole")!;
    expect(lineRow.massMinEv).toBeCloseTo(1e-5, 15);
    expect(lineRow.massMaxEv).toBeCloseTo(M2, 15);
    const shown = bodyRows().find(
      (tr) => tr.textContent?.includes("DFSZ-type line") && tr.textContent.includes("excluded"),
    )!;
    expect(shown.textContent).toContain(`${siFormat(lineRow.massMinEv, "eV")} – ${siFormat(lineRow.massMaxEv, "eV")}`);
  });

  // Ordering is our own convention (not physics): the strongest verdict first, "no overlap" last.
  test("by default the exclusions come first and the rows without overlap last", () => {
    render(<OverlapPanel />);
    const verdicts = bodyRows().map((tr) => tr.children[3].textContent);
    const models = bodyRows().map((tr) => tr.children[0].textContent);
    // The line (listed first) is wholly excluded above 10 μeV; the band straddles c_γ, so only part of it is.
    expect(verdicts.slice(0, 2)).toEqual([verdictText("excluded-whole"), verdictText("excluded-part")]);
    expect(models.slice(0, 2)).toEqual(["DFSZ-type line", "Wide band"]);
    const firstNone = verdicts.indexOf(verdictText("none"));
    expect(firstNone).toBeGreaterThan(1);
    expect(verdicts.slice(firstNone).every((v) => v === verdictText("none"))).toBe(true);
    // Within "no overlap": models as listed in the project.
    expect(models.slice(firstNone)).toEqual(["DFSZ-type line", "Wide band"]);
  });

  test("clicking a column header sorts, a second click reverses, a third restores the order", () => {
    render(<OverlapPanel />);
    const order = () => bodyRows().map((tr) => tr.children[0].textContent);
    const original = order();
    const header = screen.getByRole("button", { name: /^Model/ });
    fireEvent.click(header);
    expect(header.closest("th")).toHaveAttribute("aria-sort", "ascending");
    const asc = order();
    expect(asc).toEqual([...original].sort((a, b) => (a ?? "").localeCompare(b ?? "")));
    fireEvent.click(header);
    expect(header.closest("th")).toHaveAttribute("aria-sort", "descending");
    expect(order()).toEqual([...asc].reverse());
    fireEvent.click(header);
    expect(order()).toEqual(original);
    fireEvent.click(screen.getByRole("button", { name: /^m_a range/ }));
    const lows = overlapTable(useAxband.getState().project)
      .map((r) => r.massMinEv)
      .sort((a, b) => a - b);
    expect(bodyRows()[0].children[4].textContent?.startsWith(siFormat(lows[0], "eV"))).toBe(true);
  });

  test("filters by model and by verdict", () => {
    render(<OverlapPanel />);
    fireEvent.change(screen.getByLabelText("Filter by model"), { target: { value: "m-band" } });
    expect(bodyRows().length).toBeGreaterThan(0);
    expect(bodyRows().every((tr) => tr.children[0].textContent === "Wide band")).toBe(true);
    fireEvent.change(screen.getByLabelText("Filter by model"), { target: { value: "" } });
    fireEvent.change(screen.getByLabelText("Filter by verdict"), { target: { value: "none" } });
    expect(bodyRows().length).toBeGreaterThan(0);
    expect(bodyRows().every((tr) => tr.children[3].textContent === "no overlap")).toBe(true);
  });

  test("CSV and Markdown exports equal the data core's writers; a row click highlights its interval", async () => {
    const downloads = captureDownloads();
    render(<OverlapPanel />);
    const rows = sortRows(overlapTable(useAxband.getState().project), null);
    fireEvent.click(screen.getByTestId("overlap-csv"));
    fireEvent.click(screen.getByTestId("overlap-md"));
    await waitFor(() => expect(downloads).toHaveLength(2));
    expect(downloads[0].fileName).toBe("overlap test-overlap.csv");
    expect(await downloads[0].text()).toBe(overlapTableToCsv(rows));
    expect(await downloads[1].text()).toBe(overlapTableToMarkdown(rows));
    const i = rows.findIndex((r) => r.kind === "excluded-whole");
    fireEvent.click(bodyRows()[i]);
    expect(useAxband.getState().ui.highlight).toEqual({
      massMinEv: rows[i].massMinEv,
      massMaxEv: rows[i].massMaxEv,
      modelId: rows[i].modelId,
      curveId: rows[i].curveId,
    });
    expect(bodyRows()[i]).toHaveAttribute("aria-selected", "true");
    fireEvent.click(bodyRows()[i]);
    expect(useAxband.getState().ui.highlight).toBeNull();
  });

  test("says what is missing when there is nothing to compare", () => {
    useProject(emptyProject());
    render(<OverlapPanel />);
    expect(screen.queryByTestId("overlap-table")).toBeNull();
    expect(screen.getByText(/Add a model and import a curve/)).toBeInTheDocument();
  });
});
