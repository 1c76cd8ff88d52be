// The Models panel driven like a user: typed E/N values and intervals, bad input, the catalogue, list edits.
// E/N values of the heavy-quark models: Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801, Table I (from memory);
// c_γ = 1.92 from Grilli di Cortona et al., JHEP 01 (2016) 034.
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { render, screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { ModelsPanel } from "../../src/ui/models/ModelsPanel";
import { useAxband } from "../../src/ui/store";
import { resetStore } from "./helpers";

beforeEach(() => resetStore());

const models = () => useAxband.getState().project.models;

describe("typed E/N", () => {
  test('typing "8/3" and clicking add creates a model line labelled "E/N = 8/3"', async () => {
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    await user.type(screen.getByTestId("model-eovern"), "8/3");
    await user.click(screen.getByTestId("add-model"));
    expect(models()).toHaveLength(1);
    expect(models()[0]).toMatchObject({
      label: "E/N = 8/3",
      eOverNMin: "8/3",
      eOverNMax: "8/3",
      source: { kind: "typed" },
    });
    expect(screen.getByDisplayValue("E/N = 8/3")).toBeInTheDocument();
    expect(screen.getByTestId("model-eovern")).toHaveValue("");
  });

  test("Enter adds an interval as a band that keeps the typed text; it cancels since 5/3 < c_γ = 1.92 < 44/3", async () => {
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    await user.type(screen.getByTestId("model-eovern"), "5/3..44/3{Enter}");
    expect(models()).toHaveLength(1);
    expect(models()[0]).toMatchObject({ label: "E/N = 5/3..44/3", eOverNMin: "5/3", eOverNMax: "44/3" });
    expect(screen.getByTestId("cancellation-note")).toHaveTextContent("reaches g = 0 (cancellation)");
  });

  test("a line away from c_γ has no cancellation note", async () => {
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    await user.type(screen.getByTestId("model-eovern"), "0.5..1.5{Enter}");
    expect(models()[0]).toMatchObject({ eOverNMin: "0.5", eOverNMax: "1.5" });
    expect(screen.queryByTestId("cancellation-note")).toBeNull();
  });

  test.each(["8/0", "abc", "", "1..2..3"])("bad input %j shows a message and adds nothing", async (bad) => {
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    const input = screen.getByTestId("model-eovern");
    if (bad) await user.type(input, bad);
    await user.click(screen.getByTestId("add-model"));
    expect(models()).toHaveLength(0);
    const msg = screen.getByTestId("model-eovern-error");
    expect(msg.textContent).toMatch(/E\/N/);
    expect(input).toHaveAttribute("aria-invalid", "true");
    expect(input.getAttribute("aria-describedby")?.split(" ")).toContain(msg.id);
  });
});

describe("catalogue", () => {
  test("adding the heavy quark (3, 1, −1/3) gives a model E/N = 2/3 from the catalogue", async () => {
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    // The catalogue loads apart from the first figure: wait for it.
    await screen.findByTestId("catalogue-add-set");
    await user.click(screen.getByText("Catalogue"));
    const entry = document.querySelector('[data-catalogue-id="ksvz-r1"]') as HTMLElement;
    expect(within(entry).getByText(/E\/N = 2\/3/)).toBeInTheDocument();
    await user.click(within(entry).getByRole("button", { name: /^Add / }));
    expect(models()).toHaveLength(1);
    expect(models()[0]).toMatchObject({ eOverNMin: "2/3", source: { kind: "catalogue", catalogueId: "ksvz-r1" } });
  });

  test("both groups are there, and the two-doublet models show 8/3 and 2/3 (PDG axion review, from memory)", async () => {
    render(<ModelsPanel />);
    // The catalogue loads apart from the first figure: wait for it.
    await screen.findByTestId("catalogue-add-set");
    expect(screen.getByRole("group", { name: /KSVZ-type/ })).toBeInTheDocument();
    const dfsz = screen.getByRole("group", { name: /DFSZ-type/ });
    const text = dfsz.textContent ?? "";
    expect(text).toContain("E/N = 8/3");
    expect(text).toContain("E/N = 2/3");
  });
});

describe("model list", () => {
  afterEach(() => {
    vi.useRealTimers();
  });

  test("label edit, visibility, spread, reorder and remove go to the store; a label burst is one undo step", async () => {
    // The store joins steps within 500 ms by Date.now(): the clock stands still here, so a busy machine's slow
    // keystrokes cannot split the burst (timers stay real for user-event).
    vi.useFakeTimers({ toFake: ["Date"] });
    const s = useAxband.getState();
    s.addModel({ eOverNMin: "0", label: "A" });
    s.addModel({ eOverNMin: "8/3", label: "B" });
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    const label = screen.getByDisplayValue("A");
    await user.clear(label);
    await user.type(label, "KSVZ");
    expect(models()[0].label).toBe("KSVZ");
    await user.click(screen.getByRole("checkbox", { name: /Show KSVZ/ }));
    expect(models()[0].visible).toBe(false);
    await user.selectOptions(screen.getByRole("combobox", { name: /Theory spread of KSVZ/ }), "2");
    expect(models()[0].sigmas).toBe(2);
    await user.click(screen.getByRole("button", { name: "Move B up" }));
    expect(models().map((m) => m.label)).toEqual(["B", "KSVZ"]);
    await user.click(screen.getByRole("button", { name: "Remove B" }));
    expect(models().map((m) => m.label)).toEqual(["KSVZ"]);
    // undo: remove, move, spread, visibility, then the whole typing burst in one step
    for (let i = 0; i < 4; i++) useAxband.getState().undo();
    expect(models().map((m) => m.label)).toEqual(["KSVZ", "B"]);
    useAxband.getState().undo();
    expect(models()[0].label).toBe("A");
  });

  test("editing E/N in a row: a bad value keeps the previous one with a message", async () => {
    useAxband.getState().addModel({ eOverNMin: "8/3", label: "B" });
    const user = userEvent.setup({ delay: null });
    render(<ModelsPanel />);
    const field = screen.getByRole("textbox", { name: "E/N of B" });
    await user.clear(field);
    await user.type(field, "2/0{Enter}");
    expect(models()[0].eOverNMin).toBe("8/3");
    expect(screen.getByText(/zero denominator/)).toBeInTheDocument();
    await user.clear(field);
    await user.type(field, "2/3{Enter}");
    expect(models()[0]).toMatchObject({ eOverNMin: "2/3", eOverNMax: "2/3" });
  });
});
