// The heavy-quark ensemble panel driven like a user (jsdom has no Worker: the client runs the core a tick later on
// the page's thread): the chosen Landau-pole scale and heavy-quark mass reach the enumeration; the result shows its
// counts, both histograms and the table of distinct E/N with N_DW; the CSV carries the same rows; "add" makes a model
// set; Cancel stops a run. Expected numbers come from the physics core, whose counts are checked against Di Luzio,
// Mescia, Nardi, PRL 118 (2017) 031801 and Plakkot & Hoof, arXiv:2107.12378 in tests/physics/ensemble.test.ts.
import { afterEach, beforeEach, expect, test, vi } from "vitest";
import { fireEvent, render, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { heavyQuarkEnsemble } from "../../src/physics";
import { EnsemblePanel } from "../../src/ui/models/ensemble/EnsemblePanel";
import { useAxband } from "../../src/ui/store";
import { captureDownloads } from "./export-helpers";
import { resetStore } from "./helpers";

beforeEach(() => resetStore());
afterEach(() => vi.restoreAllMocks());

async function setField(testId: string, value: string) {
  const user = userEvent.setup({ delay: null });
  const input = screen.getByTestId(testId);
  await user.clear(input);
  await user.type(input, value);
}

test("Λ and m_Q typed in the panel reach the enumeration; the result exports as CSV and joins the project", async () => {
  const user = userEvent.setup({ delay: null });
  const downloads = captureDownloads();
  render(<EnsemblePanel open onClose={() => undefined} />);
  await setField("ensemble-max-quarks", "2");
  await setField("ensemble-pole-scale", "1e14");
  await setField("ensemble-heavy-mass", "1e10");
  await user.click(screen.getByTestId("ensemble-run"));
  const result = await screen.findByTestId("ensemble-result");
  const landauPole = { poleScaleGeV: 1e14, heavyMassGeV: 1e10 };
  const core = heavyQuarkEnsemble({ maxQuarks: 2, landauPole });
  // A lower pole scale lets more multisets through than the defaults do (the criterion is then weaker).
  expect(core.models).toBeGreaterThan(heavyQuarkEnsemble({ maxQuarks: 2 }).models);
  expect(result.textContent).toMatch(new RegExp(`^${core.models} models`));
  expect(result).toHaveTextContent(`${core.distinct.length} distinct E/N`);
  expect(screen.getByTestId("ensemble-hist").querySelectorAll("rect").length).toBeGreaterThan(3);
  expect(screen.getByTestId("ensemble-hist-log").getAttribute("aria-label")).toMatch(/\|E\/N − c_γ\| \(log axis\)/);

  // The spectrum table: one row per distinct E/N with its count and N_DW, as the CSV below.
  const rows = screen.getByTestId("ensemble-spectrum").querySelectorAll("tbody tr");
  expect(rows).toHaveLength(core.distinct.length);
  const last = core.distinct[core.distinct.length - 1];
  expect([...rows[rows.length - 1].querySelectorAll("td")].map((td) => td.textContent)).toEqual([
    last.eOverN.replace("-", "−"),
    String(last.count),
    last.nDWMin === last.nDWMax ? String(last.nDWMin) : `${last.nDWMin}–${last.nDWMax}`,
  ]);

  await user.click(screen.getByRole("button", { name: "Export CSV" }));
  expect(downloads.map((d) => d.fileName)).toEqual(["heavy-quark-ensemble.csv"]);
  const csv = (await downloads[0].text()).trim().split("\n");
  expect(csv[0]).toContain("no Landau pole below 1e14 GeV, m_Q = 1e10 GeV");
  expect(csv[2]).toBe("E/N,E/N (decimal),count,N_DW min,N_DW max");
  expect(csv.length - 3).toBe(core.distinct.length);
  const first = core.distinct[0];
  expect(csv[3].split(",")).toEqual([
    first.eOverN,
    expect.any(String),
    String(first.count),
    String(first.nDWMin),
    String(first.nDWMax),
  ]);

  await user.click(screen.getByTestId("ensemble-add"));
  const added = useAxband.getState().project.models.at(-1);
  expect(added?.kind).toBe("set");
  expect(added?.members.reduce((s, m) => s + m.count, 0)).toBe(core.models);
  expect(added?.source).toMatchObject({ kind: "ensemble", settings: { maxQuarks: 2, landauPole } });
});

test("signed charges report the models dropped for N = 0", async () => {
  const user = userEvent.setup({ delay: null });
  render(<EnsemblePanel open onClose={() => undefined} />);
  await setField("ensemble-max-quarks", "2");
  await user.selectOptions(screen.getByTestId("ensemble-charges"), "signed");
  await user.click(screen.getByTestId("ensemble-run"));
  const core = heavyQuarkEnsemble({ maxQuarks: 2, charges: "signed" });
  expect(core.zeroN).toBeGreaterThan(0);
  expect(await screen.findByTestId("ensemble-result")).toHaveTextContent(`${core.zeroN} dropped for N = 0`);
});

test("a heavy-quark mass at or above Λ cannot run; turning the criterion off can", async () => {
  const user = userEvent.setup({ delay: null });
  render(<EnsemblePanel open onClose={() => undefined} />);
  await setField("ensemble-max-quarks", "2");
  await setField("ensemble-heavy-mass", "1e19");
  expect(screen.getByTestId("ensemble-run")).toBeDisabled();
  expect(screen.getByTestId("ensemble-pole-scale")).toHaveAttribute("aria-invalid", "true");
  await user.click(screen.getByTestId("ensemble-landau-pole"));
  expect(screen.getByTestId("ensemble-heavy-mass")).toBeDisabled();
  await user.click(screen.getByTestId("ensemble-run"));
  const core = heavyQuarkEnsemble({ maxQuarks: 2, landauPole: false });
  expect((await screen.findByTestId("ensemble-result")).textContent).toMatch(new RegExp(`^${core.models} models`));
});

test("Cancel stops a run before it reports, and says so", async () => {
  render(<EnsemblePanel open onClose={() => undefined} />);
  // Synchronous clicks: the run is queued a tick later (no Worker in jsdom), so Cancel lands before it starts.
  fireEvent.click(screen.getByTestId("ensemble-run"));
  expect(screen.getByRole("status")).toHaveTextContent("Enumerating…");
  expect(screen.getByTestId("ensemble-run")).toBeDisabled();
  fireEvent.click(screen.getByRole("button", { name: "Cancel" }));
  expect(await screen.findByRole("alert")).toHaveTextContent("Cancelled.");
  expect(screen.queryByTestId("ensemble-result")).toBeNull();
  expect(screen.getByTestId("ensemble-run")).toBeEnabled();
});
