// A `# label:` comment names the curve in the app as it does on the command line (one behaviour for both;
// repro file tests/formats/csv/repro/labelcomment.csv, whose label and citation carry script payloads that
// must arrive as plain text); a label the user types still wins.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { beforeEach, describe, expect, test } from "vitest";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { ImportControls, ImportDialog } from "../../src/ui/importer/ImportDialog";
import { useImport } from "../../src/ui/importer/import-store";
import { useAxband } from "../../src/ui/store";
import { emptyProject } from "../../src/data";
import { parseArgs } from "../../src/cli/args";
import { loadCsvProject } from "../../src/cli/inputs";

const REPRO = join(__dirname, "../formats/csv/repro/labelcomment.csv");

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

async function upload() {
  const user = userEvent.setup({ delay: null });
  render(<Step />);
  const file = new File([readFileSync(REPRO)], "labelcomment.csv", { type: "text/csv" });
  await user.upload(screen.getByTestId("import-files"), file);
  await screen.findByTestId("import-detected");
}

describe("# label: comment", () => {
  test("names the imported curve, as the command line does with the same file", async () => {
    await upload();
    fireEvent.click(screen.getByTestId("import-confirm"));
    await waitFor(() => expect(useAxband.getState().project.curves).toHaveLength(1));
    const c = useAxband.getState().project.curves[0];
    expect(c.label).toBe('<script>alert("lbl")</script>');
    expect(c.citation).toBe('<img src=x onerror=alert("cit")>');
    const a = parseArgs([REPRO, "-o", "/tmp/unused.svg"]);
    if (!a.ok) throw new Error(a.error);
    expect(loadCsvProject(a.options).project.curves[0].label).toBe(c.label);
    // Shown as text, never as markup.
    expect(document.querySelector("script")).toBeNull();
  });
  test("a label the user typed wins over the comment", async () => {
    await upload();
    fireEvent.change(screen.getByLabelText("Label"), { target: { value: "My scan" } });
    fireEvent.click(screen.getByTestId("import-confirm"));
    await waitFor(() => expect(useAxband.getState().project.curves).toHaveLength(1));
    expect(useAxband.getState().project.curves[0].label).toBe("My scan");
  });
});
