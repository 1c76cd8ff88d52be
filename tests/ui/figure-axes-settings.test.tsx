// The axis settings in the Figure panel: the mass unit relabels the range fields (values stay in eV), typed
// ends may carry a unit ("5 µeV", "1.2 GHz" through m = hν), an unreadable end is named with its field, and
// the frequency-unit and tick selects write the figure. h = 4.135667696×10⁻¹⁵ eV·s (CODATA 2018, exact).
import { beforeEach, describe, expect, test } from "vitest";
import { fireEvent, render, screen } from "@testing-library/react";
import { defaultProject } from "../../src/project/demo";
import { FigureSettings } from "../../src/ui/settings/FigureSettings";
import { useAxband } from "../../src/ui/store";
import { resetStore } from "./helpers";

beforeEach(() => resetStore(defaultProject()));

const figure = () => useAxband.getState().project.figure;

describe("axis units in the figure settings", () => {
  test("µeV relabels the mass range fields: 10⁻⁷…10⁻² eV reads 0.1 to 10000", () => {
    render(<FigureSettings />);
    fireEvent.change(screen.getByTestId("figure-mass-unit"), { target: { value: "ueV" } });
    expect(figure().massUnit).toBe("ueV");
    expect(screen.getByTestId("range-mass-min")).toHaveValue("0.1");
    expect(screen.getByTestId("range-mass-max")).toHaveValue("10000");
    expect(screen.getByText("m_a [μeV]")).toBeInTheDocument();
    expect(figure().massRangeEv).toEqual([1e-7, 1e-2]);
  });

  test("ends with units: 1.2 GHz to 50 ueV sets 1.2e9·h eV to 5×10⁻⁵ eV; a bare number is in the axis unit", () => {
    render(<FigureSettings />);
    const min = screen.getByTestId("range-mass-min");
    const max = screen.getByTestId("range-mass-max");
    fireEvent.change(min, { target: { value: "1.2 GHz" } });
    fireEvent.change(max, { target: { value: "50 ueV" } });
    fireEvent.keyDown(max, { key: "Enter" });
    const [lo, hi] = figure().massRangeEv;
    expect(lo / (1.2e9 * 4.135667696e-15)).toBeCloseTo(1, 12);
    expect(hi / 5e-5).toBeCloseTo(1, 12);
    fireEvent.change(screen.getByTestId("figure-mass-unit"), { target: { value: "meV" } });
    fireEvent.change(min, { target: { value: "0.01" } });
    fireEvent.change(max, { target: { value: "10 meV" } });
    fireEvent.keyDown(max, { key: "Enter" });
    expect(figure().massRangeEv[0] / 1e-5).toBeCloseTo(1, 12);
    expect(figure().massRangeEv[1] / 1e-2).toBeCloseTo(1, 12);
  });

  test("an unreadable end names the field and keeps the range", () => {
    render(<FigureSettings />);
    const min = screen.getByTestId("range-mass-min");
    fireEvent.change(min, { target: { value: "5 parsecs" } });
    fireEvent.keyDown(min, { key: "Enter" });
    expect(screen.getByText(/m_a min: “parsecs” is not a unit/)).toBeInTheDocument();
    expect(figure().massRangeEv).toEqual([1e-7, 1e-2]);
  });

  test("frequency unit (shown with the frequency top axis) and tick sides write the figure", () => {
    render(<FigureSettings />);
    expect(screen.queryByTestId("figure-frequency-unit")).toBeNull();
    expect(figure().ticks).toBe("out");
    fireEvent.change(screen.getByLabelText("Top axis"), { target: { value: "frequency" } });
    fireEvent.change(screen.getByTestId("figure-frequency-unit"), { target: { value: "THz" } });
    expect(figure().frequencyUnit).toBe("THz");
    fireEvent.change(screen.getByTestId("figure-ticks"), { target: { value: "all" } });
    expect(figure().ticks).toBe("all");
  });
});
