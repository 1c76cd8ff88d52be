// The model kinds in the Models panel, driven like a user: "5/3 | 44/3" adds the band between two lines (no
// cancellation note, unlike the interval 5/3..44/3), catalogue entries picked together become a model set,
// and a set's drawing is chosen in the list. E/N of the heavy quarks R1 = (3, 1, −1/3) → 2/3 and
// R2 = (3, 1, 2/3) → 8/3: Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801, Table I (from memory).
import { beforeEach, describe, expect, test } from "vitest";
import { render, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { ModelsPanel } from "../../src/ui/models/ModelsPanel";
import { useAxband } from "../../src/ui/store";
import { resetStore } from "./helpers";

beforeEach(() => resetStore());

const models = () => useAxband.getState().project.models;

describe("between lines", () => {
  test('"5/3 | 44/3" adds the band between the two lines; it does not cancel', async () => {
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    await user.type(screen.getByTestId("model-eovern"), "44/3 | 5/3{Enter}");
    expect(models()).toHaveLength(1);
    expect(models()[0]).toMatchObject({
      kind: "between",
      label: "E/N = 5/3 | 44/3",
      eOverNMin: "5/3",
      eOverNMax: "44/3",
      members: [
        { eOverN: "5/3", count: 1 },
        { eOverN: "44/3", count: 1 },
      ],
    });
    expect(screen.queryByTestId("cancellation-note")).toBeNull();
    expect(screen.getByLabelText("E/N of E/N = 5/3 | 44/3")).toHaveValue("5/3 | 44/3");
    expect(document.querySelector('[data-model-kind="between"]')).not.toBeNull();
  });

  test("the field's hint names the three forms and is read with the field", () => {
    render(<ModelsPanel />);
    const hint = screen.getByTestId("model-eovern-hint");
    expect(hint.textContent).toContain("5/3..44/3");
    expect(hint.textContent).toContain("5/3 | 44/3");
    expect(screen.getByTestId("model-eovern").getAttribute("aria-describedby")).toBe(hint.id);
  });

  test('"5/3 | 2 | 44/3" keeps three lines; one value or an empty part is an error naming the form', async () => {
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    const input = screen.getByTestId("model-eovern");
    await user.type(input, "5/3 | 2 | 44/3{Enter}");
    expect(models()[0].members.map((m) => m.eOverN)).toEqual(["5/3", "2", "44/3"]);
    for (const bad of ["5/3 |", "2 | 2", "5/3 | x"]) {
      await user.clear(input);
      await user.type(input, `${bad}{Enter}`);
      expect(screen.getByTestId("model-eovern-error").textContent).toMatch(/E\/N lines/);
    }
    expect(models()).toHaveLength(1);
  });

  test("editing an interval in the list into lines changes its kind", async () => {
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    await user.type(screen.getByTestId("model-eovern"), "5/3..44/3{Enter}");
    expect(screen.getByTestId("cancellation-note")).toBeInTheDocument();
    const field = screen.getByLabelText("E/N of E/N = 5/3..44/3");
    await user.clear(field);
    await user.type(field, "5/3 | 44/3{Enter}");
    expect(models()[0]).toMatchObject({ kind: "between", eOverNMin: "5/3", eOverNMax: "44/3" });
    expect(screen.queryByTestId("cancellation-note")).toBeNull();
  });
});

describe("model sets", () => {
  test("two picked catalogue entries are added as one model set, drawn between its extremes", async () => {
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    // The catalogue loads apart from the first figure: wait for it.
    await screen.findByTestId("catalogue-add-set");
    await user.click(screen.getByText("Catalogue"));
    const add = screen.getByTestId("catalogue-add-set");
    expect(add).toBeDisabled();
    for (const id of ["ksvz-r1", "ksvz-r2"]) {
      const row = document.querySelector(`[data-catalogue-id="${id}"]`) as HTMLElement;
      await user.click(row.querySelector('[data-testid="catalogue-pick"]') as HTMLElement);
    }
    expect(add).toHaveTextContent("Add 2 picked as model set");
    await user.click(add);
    expect(models()).toHaveLength(1);
    const set = models()[0];
    expect(set).toMatchObject({ kind: "set", setDraw: "extremes", eOverNMin: "2/3", eOverNMax: "8/3" });
    expect(set.members.map((m) => [m.eOverN, m.count])).toEqual([
      ["2/3", 1],
      ["8/3", 1],
    ]);
    expect(set.source).toEqual({ kind: "catalogue", catalogueId: "ksvz-r1,ksvz-r2" });
    expect(screen.getByTestId("set-draw")).toHaveTextContent("2 models, 2 E/N values");
  });

  test("the list changes a set's drawing and its central share", async () => {
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    // The catalogue loads apart from the first figure: wait for it.
    await screen.findByTestId("catalogue-add-set");
    await user.click(screen.getByText("Catalogue"));
    for (const id of ["ksvz-r1", "ksvz-r2"]) {
      const row = document.querySelector(`[data-catalogue-id="${id}"]`) as HTMLElement;
      await user.click(row.querySelector('[data-testid="catalogue-pick"]') as HTMLElement);
    }
    await user.click(screen.getByTestId("catalogue-add-set"));
    const label = models()[0].label;
    await user.selectOptions(screen.getByLabelText(`Drawing of ${label}`), "lines");
    expect(models()[0].setDraw).toBe("lines");
    await user.selectOptions(screen.getByLabelText(`Drawing of ${label}`), "central");
    const share = screen.getByLabelText(`Share of the models in the central band of ${label}, in per cent`);
    expect(share).toHaveValue(68);
    await user.clear(share);
    await user.type(share, "95");
    expect(models()[0].setShare).toBeCloseTo(0.95, 12);
  });
});
