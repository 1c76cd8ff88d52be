// The anomaly calculator's charge scan driven like a user: a list in a PQ charge field switches to scan mode;
// expected values by hand from E = Σ X·d·Q², N = Σ X·T·n_w (Di Luzio, Giannotti, Nardi, Visinelli,
// Phys. Rept. 870 (2020) 1; from memory): a (3,1,−1/3) heavy quark with X_L ∈ {−1, 0, 1}, X_R = 0 gives
// E/N = 2/3 twice and N = 0 once.
import { beforeEach, expect, test } from "vitest";
import { render, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { AnomalyCalculator } from "../../src/ui/models/AnomalyCalculator";
import { useAxband } from "../../src/ui/store";
import { resetStore } from "./helpers";

beforeEach(() => resetStore());

test("a listed PQ charge scans every value, shows the spectrum with N = 0 flagged, and adds a model set", async () => {
  const user = userEvent.setup();
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
  const user = userEvent.setup();
  render(<AnomalyCalculator />);
  const copies = screen.getByRole("textbox", { name: "Copies of Q_L" });
  await user.clear(copies);
  await user.type(copies, "3..1");
  await user.click(screen.getByRole("button", { name: "Scan every combination" }));
  expect(screen.getByTestId("calc-scan")).toHaveTextContent("fermion 1 (Q_L): copies");
});
