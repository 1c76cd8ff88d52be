// The calculator's charges from the Lagrangian and its editing comforts, driven like a user. Expected values:
// Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801, Table I (from memory): the heavy quark (3,1,0) with the
// Yukawa Φ Q̄_L Q_R has E/N = 0, N_DW = 1; (3,1,−1/3) has E/N = 2/3.
import { beforeEach, describe, expect, test, vi } from "vitest";
import { render, screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { AnomalyCalculator } from "../../src/ui/models/AnomalyCalculator";
import { ModelsPanel } from "../../src/ui/models/ModelsPanel";
import { useCalculatorRequest } from "../../src/ui/models/calculator-draft";
import { useAxband } from "../../src/ui/store";
import { resetStore } from "./helpers";

beforeEach(() => {
  resetStore();
  localStorage.clear();
  vi.restoreAllMocks();
  useCalculatorRequest.setState({ open: false, edit: null });
});

const eOverN = () => screen.getByTestId("calc-eovern").textContent;

async function typeTerms(user: ReturnType<typeof userEvent.setup>, kept: string, forbidden = "") {
  await user.click(screen.getByText("Charges from the Lagrangian"));
  const k = screen.getByRole("textbox", { name: "Kept terms" });
  await user.clear(k);
  await user.type(k, kept);
  if (forbidden) await user.type(screen.getByRole("textbox", { name: "Forbidden terms" }), forbidden);
  await user.click(screen.getByRole("button", { name: "Solve charges" }));
}

describe("charges from the Lagrangian", () => {
  test("the Yukawa Qbar_L Phi Q_R solves the start table's heavy quark (3,1,0): charges 1 and 0, E/N = 0, N_DW = 1", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    // Scramble the typed charges first: the solver must set them.
    const pq = screen.getByRole("textbox", { name: "PQ charge of Q_L" });
    await user.clear(pq);
    await user.type(pq, "5");
    await typeTerms(user, "Qbar_L Phi Q_R", "Qbar_L Q_R");
    expect(pq).toHaveValue("1");
    expect(screen.getByRole("textbox", { name: "PQ charge of Q_R" })).toHaveValue("0");
    expect(eOverN()).toBe("0");
    expect(screen.getByTestId("calc-ndw")).toHaveTextContent("1");
    expect(screen.getByTestId("charge-report")).toHaveTextContent("E/N = 0 is determined by the terms; N_DW = 1");
    expect(screen.getByTestId("charge-report")).not.toHaveTextContent("Not forbidden");
  });

  test("an unknown field names the line and the character; a term that is not gauge invariant is named", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    await typeTerms(user, "Qbar_L Phi Foo");
    expect(screen.getByTestId("solve-errors")).toHaveTextContent(
      'Kept terms, line 1 "Qbar_L Phi Foo": unknown field "Foo" (character 12)',
    );
    await typeTerms(user, "Q_L Phi Q_R");
    expect(screen.getByTestId("solve-errors")).toHaveTextContent("colour");
  });

  test("renaming the normalised scalar keeps it normalised; the Yukawa through the renamed field still solves", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    await user.click(screen.getByText("Charges from the Lagrangian"));
    const name = screen.getByRole("textbox", { name: "Name of scalar 1" });
    await user.clear(name);
    await user.type(name, "S");
    expect(screen.getByRole("combobox", { name: "PQ charge 𝒳 = 1 for" })).toHaveValue("S");
    await typeTerms(user, "Qbar_L S Q_R");
    expect(screen.getByTestId("charge-report")).toHaveTextContent("𝒳 = 1 for S");
    expect(eOverN()).toBe("0");
  });

  test("a bare mass left in the forbidden list but allowed by the symmetry is reported", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    await typeTerms(user, "Qbar_L Phi Q_R", "Qbar_L Q_R Phi");
    expect(screen.getByTestId("charge-report")).toHaveTextContent("Not forbidden by this symmetry: Qbar_L Q_R Phi");
  });
});

test("a second heavy quark without a Yukawa: E/N is not determined, and its free charges are offered as a scan", async () => {
  const user = userEvent.setup({ delay: null });
  render(<AnomalyCalculator />);
  for (const n of [1, 2]) {
    await user.click(screen.getByRole("button", { name: "+ Fermion" }));
    const name = screen.getByRole("textbox", { name: `Name of fermion ${n + 2}` });
    await user.type(name, n === 1 ? "Q2_L" : "Q2_R");
  }
  await user.selectOptions(screen.getByRole("combobox", { name: "Chirality of Q2_R" }), "R");
  // (3,1,2/3) beside (3,1,0): with Y = 0 for both, E = 0 for any charges and E/N = 0 would still be fixed.
  for (const name of ["Hypercharge Y of Q2_L", "Hypercharge Y of Q2_R"]) {
    await user.clear(screen.getByRole("textbox", { name }));
    await user.type(screen.getByRole("textbox", { name }), "2/3");
  }
  await typeTerms(user, "Qbar_L Phi Q_R");
  expect(screen.getByTestId("charge-report")).toHaveTextContent("E/N is not determined");
  expect(screen.getByTestId("charge-report")).toHaveTextContent("Q2_L, Q2_R");
  await user.click(screen.getByTestId("scan-free"));
  expect(screen.getByRole("textbox", { name: "PQ charge of Q2_L" })).toHaveValue("{-1, 0, 1}");
  expect(screen.getByRole("button", { name: "Scan every combination" })).toBeInTheDocument();
});

describe("calculator comforts", () => {
  test("β is typed as in papers; singlet rows have no β field; the breakdown shows n_w", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    await user.selectOptions(screen.getByRole("combobox", { name: "Electroweak kind of Q_L" }), "su3l");
    const beta = screen.getByRole("textbox", { name: "β of Q_L" });
    await user.clear(beta);
    await user.type(beta, "1/3");
    expect(screen.getByTestId("calc-errors")).toHaveTextContent("rational multiple of √3");
    await user.clear(beta);
    await user.type(beta, "-1/√3");
    expect(screen.queryByTestId("calc-errors")).toBeNull();
    expect(beta).toHaveAttribute("title", expect.stringContaining("b = β/√3 = -1/3"));
    await user.selectOptions(screen.getByRole("combobox", { name: "SU(3)_L representation of Q_L" }), "1");
    expect(screen.queryByRole("textbox", { name: "β of Q_L" })).toBeNull();
    expect(screen.getByRole("columnheader", { name: "n_w" })).toBeInTheDocument();
  });

  test("the model gets its name; Load asks before replacing an edited draft; the draft survives a remount", async () => {
    const user = userEvent.setup({ delay: null });
    const first = render(<AnomalyCalculator />);
    await user.type(screen.getByRole("textbox", { name: "Model name" }), "My quark");
    first.unmount();
    render(<AnomalyCalculator />);
    expect(screen.getByRole("textbox", { name: "Model name" })).toHaveValue("My quark");
    const confirm = vi.spyOn(window, "confirm").mockReturnValue(false);
    await user.selectOptions(screen.getByRole("combobox", { name: "Catalogue entry to load" }), "ksvz-r1");
    await user.click(screen.getByRole("button", { name: "Load" }));
    expect(confirm).toHaveBeenCalledTimes(1);
    expect(eOverN()).toBe("0");
    await user.click(screen.getByTestId("calc-add-model"));
    expect(useAxband.getState().project.models[0].label).toBe("My quark, E/N = 0");
  });

  test("a calculator model reopens for editing from the model list and the update replaces it", async () => {
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    await user.click(screen.getByRole("button", { name: "Anomaly calculator…" }));
    const dialog = screen.getByRole("dialog");
    await user.click(await within(dialog).findByTestId("calc-add-model"));
    const [m] = useAxband.getState().project.models;
    await user.selectOptions(within(dialog).getByRole("combobox", { name: "Catalogue entry to load" }), "ksvz-r1");
    await user.click(within(dialog).getByRole("button", { name: "Load" }));
    await user.click(within(dialog).getByRole("button", { name: "Close the anomaly calculator" }));
    await user.click(screen.getByRole("button", { name: `Edit ${m.label} in the anomaly calculator` }));
    expect(within(dialog).getByRole("textbox", { name: "Hypercharge Y of Q_L" })).toHaveValue("0");
    const y = within(dialog).getByRole("textbox", { name: "Hypercharge Y of Q_L" });
    await user.clear(y);
    await user.type(y, "-1/3");
    const yr = within(dialog).getByRole("textbox", { name: "Hypercharge Y of Q_R" });
    await user.clear(yr);
    await user.type(yr, "-1/3");
    await user.click(within(dialog).getByTestId("calc-add-model"));
    const models = useAxband.getState().project.models;
    expect(models).toHaveLength(1);
    expect(models[0].eOverNMin).toBe("2/3");
  });
});
