// The anomaly calculator's charge scan driven like a user: a list in a PQ charge field switches to scan mode;
// expected values by hand from E = Σ X·d·Q², N = Σ X·T·n_w (Di Luzio, Giannotti, Nardi, Visinelli,
// Phys. Rept. 870 (2020) 1; from memory): a (3,1,−1/3) heavy quark with X_L ∈ {−1, 0, 1}, X_R = 0 gives
// E/N = 2/3 twice and N = 0 once.
import { beforeEach, expect, test } from "vitest";
import { render, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { AnomalyCalculator } from "../../src/ui/models/AnomalyCalculator";
import { CalculatorScan } from "../../src/ui/models/CalculatorScan";
import { blankRow, initialCalcState } from "../../src/ui/models/calculator-state";
import { useAxband } from "../../src/ui/store";
import { resetStore } from "./helpers";

beforeEach(() => resetStore());

test("a listed PQ charge scans every value, shows the spectrum with N = 0 flagged, and adds a model set", async () => {
  const user = userEvent.setup({ delay: null });
  render(<AnomalyCalculator />);
  for (const name of ["Hypercharge Y of Q_L", "Hypercharge Y of Q_R"]) {
    const y = screen.getByRole("textbox", { name });
    await user.clear(y);
    await user.type(y, "-1/3");
  }
  const pq = screen.getByRole("textbox", { name: "PQ charge of Q_L" });
  await user.clear(pq);
  await user.type(pq, "{{-1, 0, 1}");
  expect(screen.queryByTestId("calc-errors")).toBeNull();
  await user.click(screen.getByRole("button", { name: "Scan every combination" }));
  const status = screen.getByTestId("calc-scan-result");
  expect(status).toHaveTextContent("3 combinations, 1 distinct E/N; 1 with N = 0");
  const before = useAxband.getState().project.models.length;
  await user.click(screen.getByRole("button", { name: "Add the spectrum as a model set" }));
  const models = useAxband.getState().project.models;
  expect(models).toHaveLength(before + 1);
  expect(models[models.length - 1].eOverNMin).toBe("2/3");
});

test("a bad list names the fermion and the field", async () => {
  const user = userEvent.setup({ delay: null });
  render(<AnomalyCalculator />);
  const copies = screen.getByRole("textbox", { name: "Copies of Q_L" });
  await user.clear(copies);
  await user.type(copies, "3..1");
  await user.click(screen.getByRole("button", { name: "Scan every combination" }));
  expect(screen.getByTestId("calc-scan")).toHaveTextContent("fermion 1 (Q_L): copies");
});

test("a spectrum longer than the table says how many rows it shows; the model set holds every E/N", async () => {
  const user = userEvent.setup({ delay: null });
  // Q_L (3,1,−1/3) and Q_R (3,1,2/3) with 𝒳 from 1..40 each: E/N = 2(X_L + 4X_R)/(3(X_L + X_R)) depends on
  // X_L/X_R only, one E/N per reduced fraction of 1..40 — well over 500 of them.
  const state = {
    ...initialCalcState(),
    rows: [
      blankRow({ name: "Q_L", y: "-1/3", pq: "1..40" }),
      blankRow({ name: "Q_R", y: "2/3", chirality: "R", pq: "-40..-1" }),
    ],
  };
  render(<CalculatorScan state={state} />);
  await user.click(screen.getByRole("button", { name: "Scan every combination" }));
  const distinct = Number(/(\d+) distinct E\/N/.exec(screen.getByTestId("calc-scan-result").textContent ?? "")?.[1]);
  expect(distinct).toBeGreaterThan(500);
  expect(screen.getByTestId("calc-scan").querySelectorAll("tbody tr")).toHaveLength(500);
  expect(screen.getByTestId("calc-scan-truncated")).toHaveTextContent(
    `Showing the first 500 of ${distinct.toLocaleString("en")} distinct E/N; the model set holds all`,
  );
  await user.click(screen.getByRole("button", { name: "Add the spectrum as a model set" }));
  const models = useAxband.getState().project.models;
  expect(models[models.length - 1].members).toHaveLength(distinct);
});

test("a short spectrum shows every row and no truncation note", async () => {
  const user = userEvent.setup({ delay: null });
  render(<CalculatorScan state={{ ...initialCalcState(), rows: [blankRow({ y: "-1/3", pq: "1..3" })] }} />);
  await user.click(screen.getByRole("button", { name: "Scan every combination" }));
  expect(screen.getByTestId("calc-scan").querySelectorAll("tbody tr")).toHaveLength(1);
  expect(screen.queryByTestId("calc-scan-truncated")).toBeNull();
});

// N_DW = |2N/𝒳_S| (Di Luzio, Giannotti, Nardi, Visinelli, Phys. Rept. 870 (2020) 1; from memory): a (3,1,−1/3)
// quark with 𝒳 = 1 has N = 1/2, so 𝒳_S = 2 gives N_DW = 1/2 — no Yukawa term links these charges.
test("a fractional N_DW is shown with a note and counted in the summary", async () => {
  const user = userEvent.setup({ delay: null });
  const state = { ...initialCalcState(), rows: [blankRow({ y: "-1/3", pq: "1" })], scalarCharge: "{1, 2}" };
  render(<CalculatorScan state={state} />);
  await user.click(screen.getByRole("button", { name: "Scan every combination" }));
  expect(screen.getByTestId("calc-scan-result")).toHaveTextContent(
    "2 combinations, 1 distinct E/N; 1 with N_DW not an integer (no Yukawa term links these charges).",
  );
  const cell = screen.getByTestId("calc-scan").querySelector("tbody tr td:last-child");
  expect(cell).toHaveTextContent("0.5–1 †");
  expect(screen.getByTestId("calc-scan")).toHaveTextContent(
    "† N_DW not an integer for some combinations: no Yukawa term links these charges",
  );
});
