// Import step in jsdom: pasted tables and picked files are previewed with the detected delimiter, header and
// units, unreadable rows are listed as file:row:column, and one click imports every source as a curve.
// Unit factors: SI prefixes (BIPM, "The International System of Units", 9th ed. 2019, table 7) and ν = m/h
// with h = 4.135667696×10⁻¹⁵ eV·s (CODATA 2018, exact).
import { beforeEach, describe, expect, test } from "vitest";
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { ImportControls, ImportDialog } from "../../src/ui/importer/ImportDialog";
import { useImport } from "../../src/ui/importer/import-store";
import { useAxband } from "../../src/ui/store";
import { defaultProject, emptyProject } from "../../src/data";
import { exportFigureSvg } from "../../src/formats/figure-file";

function Step() {
  return (
    <>
      <ImportControls />
      <ImportDialog />
    </>
  );
}

beforeEach(() => {
  useImport.getState().cancelAll();
  useAxband.getState().resetProject(emptyProject());
  useAxband.setState({ ui: { messages: [], tabConflict: null, highlight: null, hover: null } });
});

async function paste(text: string) {
  render(<Step />);
  fireEvent.click(screen.getByRole("button", { name: "Paste data" }));
  // The import step loads on first use: wait for its paste box.
  fireEvent.change(await screen.findByLabelText("Paste data"), { target: { value: text } });
  fireEvent.click(screen.getByRole("button", { name: "Preview pasted data" }));
  await screen.findByTestId("import-detected");
}

describe("pasted data", () => {
  test("shows the first rows, the detected delimiter and the header units", async () => {
    await paste("# invented demo table\nm_a [ueV];g [1/GeV]\n1,5;3e-14\n2,0;2,5e-14\n4,0;2e-14\n");
    const detected = screen.getByTestId("import-detected");
    expect(detected.textContent).toContain("Delimiter: semicolon (detected)");
    expect(detected.textContent).toContain("decimal comma");
    expect(detected.textContent).toMatch(/Mass: μeV \(from the header\)/);
    expect(detected.textContent).toMatch(/Coupling: g_aγγ in GeV⁻¹ \(from the header\)/);
    const preview = screen.getByRole("table", { name: "First rows of paste" });
    expect(within(preview).getByText("m_a [ueV]")).toBeInTheDocument();
    expect(within(preview).getByText("2,0")).toBeInTheDocument();
    // 1.5 μeV = 1.5×10⁻⁶ eV (SI prefix micro = 10⁻⁶).
    expect(screen.getByTestId("import-first-point").textContent).toContain("m_a = 1.500e-6 eV");
  });

  test("a bad row is listed as paste:row:column and skipped on import", async () => {
    await paste("m_a [eV],g [GeV^-1]\n1e-6,1e-13\n2e-6,abc\n3e-6,2e-13\n");
    const rejected = screen.getByTestId("import-rejected");
    expect(rejected.textContent).toMatch(/paste:3:2: /);
    const confirm = screen.getByTestId("import-confirm");
    expect(confirm.textContent).toContain("skipping 1 unreadable row");
    fireEvent.click(confirm);
    await waitFor(() => expect(useAxband.getState().project.curves).toHaveLength(1));
    const c = useAxband.getState().project.curves[0];
    expect(Array.from(c.massEv)).toEqual([1e-6, 3e-6]);
    expect(Array.from(c.gInvGeV)).toEqual([1e-13, 2e-13]);
    expect(useAxband.getState().ui.messages.at(-1)?.text).toMatch(/1 unreadable row skipped/);
  });

  test("cancel imports nothing", async () => {
    await paste("1e-6,1e-13\nx,y\n");
    fireEvent.click(screen.getByRole("button", { name: "Cancel" }));
    expect(screen.queryByTestId("import-item")).toBeNull();
    expect(useAxband.getState().project.curves).toHaveLength(0);
  });

  test("values ≤ 0 are counted and reported", async () => {
    await paste("1e-6,1e-13\n2e-6,0\n3e-6,-1e-13\n4e-6,2e-13\n");
    expect(screen.getByTestId("import-nonpositive").textContent).toMatch(/^2 rows have a value ≤ 0/);
  });
});

describe("files", () => {
  test("confirm adds a curve labelled by the file name, with the chosen mass unit", async () => {
    const user = userEvent.setup({ delay: null });
    render(<Step />);
    const file = new File(["freq,g\n1,1e-13\n2,2e-13\n"], "demo-haloscope (invented).csv", { type: "text/csv" });
    await user.upload(screen.getByTestId("import-files"), file);
    await screen.findByTestId("import-detected");
    // "freq" names no unit: the step assumes eV until the user picks one; choose GHz.
    fireEvent.change(screen.getByLabelText("Mass unit"), { target: { value: "GHz" } });
    await waitFor(() => expect(screen.getByTestId("import-first-point").textContent).toContain("4.136e-6 eV"));
    fireEvent.click(screen.getByTestId("import-confirm"));
    await waitFor(() => expect(useAxband.getState().project.curves).toHaveLength(1));
    const c = useAxband.getState().project.curves[0];
    expect(c.label).toBe("demo-haloscope (invented)");
    expect(c.fileName).toBe("demo-haloscope (invented).csv");
    // 1 GHz · h = 10⁹ Hz × 4.135667696×10⁻¹⁵ eV·s (CODATA 2018).
    expect(c.massEv[0]).toBeCloseTo(4.135667696e-6, 15);
  });

  test("several files import in one click, each with its own colour", async () => {
    const user = userEvent.setup({ delay: null });
    render(<Step />);
    await user.upload(screen.getByTestId("import-files"), [
      new File(["1e-6,1e-13\n2e-6,2e-13\n"], "a.csv"),
      new File(["1e-6\t1e-12\n2e-6\t2e-12\n"], "b.txt"),
    ]);
    await waitFor(() => expect(screen.getAllByTestId("import-detected")).toHaveLength(2));
    fireEvent.click(screen.getByTestId("import-confirm"));
    await waitFor(() => expect(useAxband.getState().project.curves).toHaveLength(2));
    const [a, b] = useAxband.getState().project.curves;
    expect([a.label, b.label]).toEqual(["a", "b"]);
    expect(a.colour).not.toBe(b.colour);
  });

  test("empty, single-column and binary files get a message and change nothing", async () => {
    const user = userEvent.setup({ delay: null });
    render(<Step />);
    await user.upload(screen.getByTestId("import-files"), [
      new File([""], "empty.csv"),
      new File(["1\n2\n3\n"], "one.csv"),
      new File([new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0, 0, 1, 2, 3])], "sheet.csv"),
    ]);
    await waitFor(() => expect(screen.getAllByRole("alert")).toHaveLength(3));
    const texts = screen.getAllByRole("alert").map((a) => a.textContent ?? "");
    expect(texts[0]).toMatch(/^empty\.csv: .*empty/);
    expect(texts[1]).toMatch(/^one\.csv: .*(one|single) column/i);
    expect(texts[2]).toMatch(/^sheet\.csv: .*ZIP/);
    expect(screen.getByTestId("import-confirm")).toBeDisabled();
    expect(useAxband.getState().project.curves).toHaveLength(0);
  });
});

describe("dropping files on the page", () => {
  function drop(files: File[]) {
    const ev = new Event("drop", { bubbles: true, cancelable: true });
    Object.defineProperty(ev, "dataTransfer", { value: { types: ["Files"], files, dropEffect: "none" } });
    window.dispatchEvent(ev);
    return ev;
  }

  test("an exported axband SVG reopens its project with a status message", async () => {
    const saved = { ...defaultProject(), name: "Dropped figure project" };
    render(<Step />);
    const ev = drop([
      new File([exportFigureSvg(saved, { embedProject: true })], "figure.svg", { type: "image/svg+xml" }),
    ]);
    expect(ev.defaultPrevented).toBe(true);
    await waitFor(() => expect(useAxband.getState().project.name).toBe("Dropped figure project"));
    expect(useAxband.getState().project.curves.map((c) => c.label)).toEqual(saved.curves.map((c) => c.label));
    expect(useAxband.getState().ui.messages.at(-1)).toMatchObject({
      kind: "status",
      text: expect.stringContaining("figure.svg"),
    });
  });

  test("a bad project file gives an alert and changes nothing; a dropped CSV opens the import step", async () => {
    render(<Step />);
    const before = useAxband.getState().project;
    drop([
      new File(["<svg xmlns='http://www.w3.org/2000/svg'></svg>"], "other.svg"),
      new File(["1e-6,1e-12\n1e-5,1e-12\n"], "dropped.csv"),
    ]);
    await waitFor(() => expect(useAxband.getState().ui.messages.at(-1)?.kind).toBe("alert"));
    expect(useAxband.getState().ui.messages.at(-1)?.text).toMatch(/^other\.svg was not opened: .*no axband project/);
    expect(useAxband.getState().project).toBe(before);
    await screen.findByTestId("import-detected");
    expect(screen.getByRole("dialog", { name: "Import curves" }).textContent).toContain("dropped.csv");
  });
});
