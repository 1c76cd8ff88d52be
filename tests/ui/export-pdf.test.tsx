// PDF export and PDF opening in jsdom: the export menu's PDF item shows that it is preparing, downloads
// NAME.pdf with the project attached and the creator "axband <version>" (version from package.json), fetching
// the font files the writer's font table names; a dropped PDF opens its project, and a foreign or truncated
// PDF gives a message naming the file and changes nothing. Sources: a PDF file starts with "%PDF-"
// (ISO 32000-1:2008, §7.5.2); Creator and Title are Info dictionary entries (same, §14.3.3, Table 317).
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { PDFDocument } from "pdf-lib";
import { ExportMenu } from "../../src/ui/export/ExportMenu";
import { FONT_URLS } from "../../src/ui/export/pdf";
import { openProjectFile } from "../../src/ui/share/open-project";
import { useAxband } from "../../src/ui/store";
import { defaultProject } from "../../src/data";
import { extractProjectFromPdf } from "../../src/formats/figure-pdf";
import { FIGURE_FONT_FILES } from "../../src/formats/pdf/fonts";
import { captureDownloads, useProject } from "./export-helpers";
import pkg from "../../package.json" with { type: "json" };

const require = createRequire(import.meta.url);
const fetched: string[] = [];

/** jsdom cannot fetch the bundler's asset URLs: serve them from node_modules, as Vite's server does. */
function serveFonts() {
  vi.stubGlobal(
    "fetch",
    vi.fn((url: string) => {
      fetched.push(url);
      const spec = url.replace(/^\/node_modules\//, "");
      const bytes = readFileSync(require.resolve(spec));
      return Promise.resolve(new Response(bytes));
    }),
  );
}

beforeEach(() => {
  fetched.length = 0;
  serveFonts();
  useProject({ ...defaultProject(), name: "PDF test (invented)" });
});
afterEach(() => {
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

describe("the PDF item of the export menu", () => {
  test("font URLs are the files of the writer's font table", () => {
    for (const family of ["sans", "serif"] as const) {
      for (const face of ["regular", "italic", "bold", "fallback"] as const) {
        expect(FONT_URLS[family][face].endsWith(FIGURE_FONT_FILES[family][face])).toBe(true);
      }
    }
  });

  test("shows 'Preparing PDF…', then downloads NAME.pdf with the project attached and axband's version", async () => {
    const downloads = captureDownloads();
    render(<ExportMenu />);
    fireEvent.click(screen.getByTestId("export-menu"));
    fireEvent.click(screen.getByTestId("export-pdf"));
    expect(screen.getByTestId("export-pdf").textContent).toBe("Preparing PDF…");
    expect(screen.getByTestId("export-pdf")).toHaveProperty("disabled", true);
    await waitFor(() => expect(downloads).toHaveLength(1), { timeout: 20_000 });
    await waitFor(() => expect(screen.getByTestId("export-pdf").textContent).toBe("Download PDF"));
    expect(downloads[0].fileName).toBe("PDF test (invented).pdf");
    expect(fetched.every((u) => u.includes("/fonts/") || u.includes("/ttf/"))).toBe(true);
    const bytes = new Uint8Array(await downloads[0].blob.arrayBuffer());
    expect(new TextDecoder().decode(bytes.subarray(0, 5))).toBe("%PDF-");
    const doc = await PDFDocument.load(bytes, { updateMetadata: false });
    expect(doc.getPageCount()).toBe(1);
    expect(doc.getTitle()).toBe("PDF test (invented)");
    expect(doc.getCreator()).toBe(`axband ${pkg.version}`);
    const back = await extractProjectFromPdf(bytes);
    expect(back.ok && back.project.name).toBe("PDF test (invented)");
    expect(useAxband.getState().ui.messages.at(-1)?.text).toMatch(/^Saved PDF test \(invented\)\.pdf/);
  }, 30_000);
});

describe("opening a PDF", () => {
  async function exported(): Promise<Uint8Array> {
    const downloads = captureDownloads();
    render(<ExportMenu />);
    fireEvent.click(screen.getByTestId("export-menu"));
    fireEvent.click(screen.getByTestId("export-pdf"));
    await waitFor(() => expect(downloads).toHaveLength(1), { timeout: 20_000 });
    return new Uint8Array(await downloads[0].blob.arrayBuffer());
  }

  test("an exported PDF reopens its project; foreign and truncated PDFs are refused with the file's name", async () => {
    const bytes = await exported();
    const r = await openProjectFile(new File([bytes as BlobPart], "figure.pdf", { type: "application/pdf" }));
    expect(r.ok && r.project.name).toBe("PDF test (invented)");
    expect(r.ok && r.message).toMatch(/figure\.pdf/);

    const foreignDoc = await PDFDocument.create();
    foreignDoc.addPage([200, 200]);
    const foreign = await foreignDoc.save();
    const f = await openProjectFile(new File([foreign as BlobPart], "paper.pdf"));
    expect(f).toEqual({ ok: false, error: expect.stringMatching(/^paper\.pdf was not opened: .*no axband project/) });

    const cut = bytes.subarray(0, Math.floor(bytes.length / 2));
    const t = await openProjectFile(new File([cut as BlobPart], "cut.pdf"));
    expect(t.ok).toBe(false);
    expect(!t.ok && t.error).toMatch(/^cut\.pdf was not opened: .*(damaged|incomplete|truncated|no axband)/);
  }, 30_000);

  test("a PDF without the .pdf name is still recognised by its first bytes", async () => {
    const bytes = await exported();
    const r = await openProjectFile(new File([bytes as BlobPart], "figure.bin"));
    expect(r.ok).toBe(true);
  }, 30_000);
});
