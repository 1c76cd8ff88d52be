// Curves panel in jsdom: style, order, removal and the rescaling fields go to the store (one undoable step
// each); the CSV export writes the curve in the chosen units with the rescaling g·√(ρ₀/ρ)/√f applied
// (common practice for haloscope limits). Unit factors: SI prefix micro = 10⁻⁶ (BIPM SI
// Brochure, 9th ed. 2019, table 7).
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { CurvesPanel } from "../../src/ui/curves/CurvesPanel";
import { useAxband } from "../../src/ui/store";
import { emptyProject, newCurve, parseCurveText } from "../../src/data";
import { captureDownloads, useProject } from "./export-helpers";

function project() {
  const p = emptyProject("curves test");
  const a = newCurve(
    {
      id: "c-a",
      label: "Demo A (invented)",
      massEv: new Float64Array([1e-6, 2e-6, 4e-6]),
      gInvGeV: new Float64Array([1e-13, 2e-13, 3e-13]),
    },
    p,
  );
  const b = newCurve(
    {
      id: "c-b",
      label: "Demo B (invented)",
      massEv: new Float64Array([1e-5, 2e-5]),
      gInvGeV: new Float64Array([5e-13, 6e-13]),
    },
    { curves: [a] },
  );
  return { ...p, curves: [a, b] };
}

beforeEach(() => useProject(project()));
afterEach(() => vi.restoreAllMocks());

const curve = (id: string) => useAxband.getState().project.curves.find((c) => c.id === id)!;

describe("rescaling", () => {
  test("ρ assumed, ρ shown and the axion fraction change the stored rescale fields", () => {
    render(<CurvesPanel />);
    const [rhoAssumed] = screen.getAllByLabelText("ρ assumed");
    const [rhoShown] = screen.getAllByLabelText("ρ shown");
    const [fraction] = screen.getAllByLabelText("axion fraction f");
    fireEvent.change(rhoAssumed, { target: { value: "0.3" } });
    fireEvent.change(rhoShown, { target: { value: "0.45" } });
    fireEvent.change(fraction, { target: { value: "0.5" } });
    expect(curve("c-a").rescale).toEqual({ rhoAssumed: 0.3, rhoShown: 0.45, fraction: 0.5 });
    expect(curve("c-b").rescale).toEqual({ rhoAssumed: 0.45, rhoShown: 0.45, fraction: 1 });
    expect(screen.getAllByText(/rescaled/).length).toBeGreaterThan(0);
  });

  test("invalid values are not stored and say why", () => {
    render(<CurvesPanel />);
    const [fraction] = screen.getAllByLabelText("axion fraction f");
    fireEvent.change(fraction, { target: { value: "0" } });
    expect(curve("c-a").rescale.fraction).toBe(1);
    expect(screen.getByText("Between 0 (excluded) and 1.")).toBeInTheDocument();
    const [rhoShown] = screen.getAllByLabelText("ρ shown");
    fireEvent.change(rhoShown, { target: { value: "-1" } });
    expect(curve("c-a").rescale.rhoShown).toBe(0.45);
  });
});

describe("style and order", () => {
  test("label, visibility, role, line style, order and removal", () => {
    render(<CurvesPanel />);
    fireEvent.change(screen.getAllByLabelText("Curve label")[0], { target: { value: "Renamed (invented)" } });
    expect(curve("c-a").label).toBe("Renamed (invented)");
    fireEvent.click(screen.getByLabelText("Show Demo B (invented)"));
    expect(curve("c-b").visible).toBe(false);
    fireEvent.change(screen.getAllByLabelText("Curve role")[1], { target: { value: "projection" } });
    expect(curve("c-b").role).toBe("projection");
    fireEvent.change(screen.getAllByLabelText("Line style")[1], { target: { value: "dotted" } });
    expect(curve("c-b").lineStyle).toBe("dotted");
    fireEvent.click(screen.getByLabelText("Move Demo B (invented) up"));
    expect(useAxband.getState().project.curves.map((c) => c.id)).toEqual(["c-b", "c-a"]);
    fireEvent.click(screen.getByLabelText("Remove Demo B (invented)"));
    expect(useAxband.getState().project.curves.map((c) => c.id)).toEqual(["c-a"]);
    useAxband.getState().undo();
    expect(useAxband.getState().project.curves.map((c) => c.id)).toEqual(["c-b", "c-a"]);
  });
});

describe("CSV export", () => {
  test("writes the chosen mass unit and the rescaled couplings", async () => {
    const downloads = captureDownloads();
    useAxband.getState().updateCurve("c-a", { rescale: { rhoAssumed: 0.45, rhoShown: 0.3, fraction: 0.25 } });
    render(<CurvesPanel />);
    fireEvent.change(screen.getAllByLabelText("CSV mass unit")[0], { target: { value: "ueV" } });
    fireEvent.click(screen.getAllByRole("button", { name: "Download CSV" })[0]);
    await waitFor(() => expect(downloads).toHaveLength(1));
    expect(downloads[0].fileName).toMatch(/^Demo A \(invented\)\.csv$/);
    const back = parseCurveText(await downloads[0].text(), { fileName: downloads[0].fileName });
    expect(back.massUnit).toBe("ueV");
    // Masses round-trip through μeV exactly (the writer picks digits that read back to the same double).
    expect(Array.from(back.massEv)).toEqual([1e-6, 2e-6, 4e-6]);
    // g · √(ρ₀/ρ) / √f = g · √(0.45/0.3) / √0.25 (common practice).
    const k = Math.sqrt(0.45 / 0.3) / Math.sqrt(0.25);
    [1e-13, 2e-13, 3e-13].forEach((g, i) => expect(back.gInvGeV[i]).toBeCloseTo(g * k, 25));
    expect(useAxband.getState().ui.messages.at(-1)?.text).toMatch(/Saved Demo A/);
  });
});

describe("excluded side", () => {
  test("exclusions offer hatches (the default), fill, or both; the fill slider is off while only hatches are drawn", () => {
    render(<CurvesPanel />);
    const selects = screen.getAllByTestId("curve-exclusion-mark") as HTMLSelectElement[];
    expect(selects).toHaveLength(2);
    expect(selects[0].value).toBe("hatch");
    expect((screen.getAllByLabelText("Fill opacity")[0] as HTMLInputElement).disabled).toBe(true);
    fireEvent.change(selects[0], { target: { value: "hatch-fill" } });
    expect(curve("c-a").exclusionMark).toBe("hatch-fill");
    expect(curve("c-b").exclusionMark).toBe("hatch");
    expect((screen.getAllByLabelText("Fill opacity")[0] as HTMLInputElement).disabled).toBe(false);
  });

  test("projections and regions have no excluded side to choose", () => {
    render(<CurvesPanel />);
    fireEvent.change(screen.getAllByLabelText("Curve role")[0], { target: { value: "projection" } });
    expect(screen.getAllByTestId("curve-exclusion-mark")).toHaveLength(1);
  });
});
