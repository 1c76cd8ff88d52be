// The calculator computes the anomaly once per edit: the shown result, the breakdown and "Add as model" share it.
// The real tryAnomaly is wrapped (not replaced) to count its calls.
import { beforeEach, expect, test, vi } from "vitest";
import { render, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import * as anomaly from "../../src/physics/anomaly";
import { AnomalyCalculator } from "../../src/ui/models/AnomalyCalculator";
import { resetStore } from "./helpers";

vi.mock("../../src/physics/anomaly", async (importOriginal) => {
  const real = await importOriginal<typeof import("../../src/physics/anomaly")>();
  return { ...real, tryAnomaly: vi.fn(real.tryAnomaly) };
});

beforeEach(() => {
  resetStore();
  localStorage.clear(); // the calculator keeps its draft there
});

test("one keystroke in a charge field runs the anomaly computation once, and the breakdown shows its result", async () => {
  const user = userEvent.setup({ delay: null });
  render(<AnomalyCalculator />);
  const y = screen.getByRole("textbox", { name: "Hypercharge Y of Q_L" });
  await user.clear(y);
  const calls = vi.mocked(anomaly.tryAnomaly);
  calls.mockClear();
  await user.type(y, "2");
  expect(calls).toHaveBeenCalledTimes(1);
  // Y = 2 for Q_L (X = 1) alone: E = 3·2² = 12, N = 1/2 (Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801, eq. 2,
  // from memory), so the breakdown's ΔE column reads 12 for Q_L.
  expect(screen.getByTestId("calc-e")).toHaveTextContent("12");
  const firstRow = screen.getByText("Per-field breakdown").closest("details")!.querySelector("tbody tr")!;
  expect(firstRow.textContent).toContain("12");
});
