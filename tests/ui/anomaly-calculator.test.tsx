// The anomaly calculator driven like a user. Expected values: Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801,
// Table I (from memory): (3,1,0) → E/N = 0; (3,1,−1/3) → 2/3; (3,1,2/3) → 8/3; (8,1,−1) → 8/3 with N_DW = 6.
// N_DW = |2N/X_S| (common practice), = 1 for one heavy quark in the fundamental.
import { beforeEach, describe, expect, test } from "vitest";
import { render, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { AnomalyCalculator } from "../../src/ui/models/AnomalyCalculator";
import { useAxband } from "../../src/ui/store";
import { resetStore } from "./helpers";

beforeEach(() => {
  resetStore();
  localStorage.clear(); // the calculator keeps its draft there
});

const eOverN = () => screen.getByTestId("calc-eovern").textContent;

describe("live result", () => {
  test("the start table, a heavy quark (3, 1, 0), gives E = 0, N = 1/2, E/N = 0, N_DW = 1", () => {
    render(<AnomalyCalculator />);
    expect(screen.getByTestId("calc-e")).toHaveTextContent("0");
    expect(screen.getByTestId("calc-n")).toHaveTextContent("1/2");
    expect(eOverN()).toBe("0");
    expect(screen.getByTestId("calc-ndw")).toHaveTextContent("1");
  });

  test("typing hypercharge 2/3 for both chiralities updates E/N to 8/3", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    for (const name of ["Hypercharge Y of Q_L", "Hypercharge Y of Q_R"]) {
      const y = screen.getByRole("textbox", { name });
      await user.clear(y);
      await user.type(y, "2/3");
    }
    expect(eOverN()).toBe("8/3");
  });

  test("a bad charge shows a message naming the field and keeps the previous result", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    for (const name of ["Hypercharge Y of Q_L", "Hypercharge Y of Q_R"]) {
      const y = screen.getByRole("textbox", { name });
      await user.clear(y);
      await user.type(y, "2/3");
    }
    const pq = screen.getByRole("textbox", { name: "PQ charge of Q_L" });
    await user.clear(pq);
    await user.type(pq, "1/0");
    const errors = screen.getByTestId("calc-errors");
    expect(errors).toHaveTextContent("fermion 1 (Q_L)");
    expect(errors).toHaveTextContent("PQ charge");
    expect(pq).toHaveAttribute("aria-invalid", "true");
    expect(eOverN()).toBe("8/3");
    expect(screen.getByText(/Showing the last valid result/)).toBeInTheDocument();
    expect(screen.getByTestId("calc-add-model")).toBeDisabled();
    await user.clear(pq);
    await user.type(pq, "1");
    expect(screen.queryByTestId("calc-errors")).toBeNull();
    expect(eOverN()).toBe("8/3");
  });

  test("a decimal charge is refused (it would not be exact)", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    const y = screen.getByRole("textbox", { name: "Hypercharge Y of Q_L" });
    await user.clear(y);
    await user.type(y, "0.333");
    expect(screen.getByTestId("calc-errors")).toHaveTextContent(/hypercharge/i);
    expect(eOverN()).toBe("0");
  });
});

describe("catalogue and models", () => {
  test("loading the heavy quark (3, 1, −1/3) gives E/N = 2/3 and N_DW = 1", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    await user.selectOptions(screen.getByRole("combobox", { name: "Catalogue entry to load" }), "ksvz-r1");
    await user.click(screen.getByRole("button", { name: "Load" }));
    expect(eOverN()).toBe("2/3");
    expect(screen.getByTestId("calc-ndw")).toHaveTextContent("1");
    expect(screen.getByRole("textbox", { name: "Hypercharge Y of Q_L" })).toHaveValue("-1/3");
  });

  test("loading the colour octet (8, 1, −1) gives E/N = 8/3 with N_DW = 6", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    await user.selectOptions(screen.getByRole("combobox", { name: "Catalogue entry to load" }), "ksvz-r12");
    await user.click(screen.getByRole("button", { name: "Load" }));
    expect(eOverN()).toBe("8/3");
    expect(screen.getByTestId("calc-ndw")).toHaveTextContent("6");
  });

  test("adding a fermion row and removing it changes the result back", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    await user.click(screen.getByRole("button", { name: "+ Fermion" }));
    // a third, left-handed colour triplet singlet with X = 1 and Y = −1/3: E = 1·3·1/9 = 1/3, N adds 1/2
    const pq = screen.getByRole("textbox", { name: "PQ charge of fermion 3" });
    await user.clear(pq);
    await user.type(pq, "1");
    const y = screen.getByRole("textbox", { name: "Hypercharge Y of fermion 3" });
    await user.clear(y);
    await user.type(y, "-1/3");
    expect(screen.getByTestId("calc-n")).toHaveTextContent("1");
    expect(eOverN()).toBe("1/3");
    await user.click(screen.getByRole("button", { name: "Remove fermion 3" }));
    expect(eOverN()).toBe("0");
  });

  test("Add as model creates a model with source calculator and its field content", async () => {
    const user = userEvent.setup({ delay: null });
    render(<AnomalyCalculator />);
    await user.selectOptions(screen.getByRole("combobox", { name: "Catalogue entry to load" }), "ksvz-r2");
    await user.click(screen.getByRole("button", { name: "Load" }));
    await user.click(screen.getByTestId("calc-add-model"));
    const [m] = useAxband.getState().project.models;
    expect(m.eOverNMin).toBe("8/3");
    expect(m.label).toContain("8/3");
    expect(m.source.kind).toBe("calculator");
    if (m.source.kind === "calculator") {
      expect(m.source.fermions).toHaveLength(2);
      expect(m.source.fermions[0]).toMatchObject({ colour: "3", chirality: "L", ew: { kind: "sm", dim: 1, y: "2/3" } });
      expect(m.source.scalarCharge).toBe("1");
    }
  });
});
