// Checks of reading an import source in slices (string, bytes, Blob/File; UTF-8 and UTF-16 per the BOM) with
// progress and cancel, and of the import client's main-thread fallback where no Web Worker exists (Node).
import { afterAll, describe, expect, test } from "vitest";
import { isImportCancelled, MAX_IMPORT_BYTES, parseCurveSource, parseCurveText } from "../../../src/data";
import {
  disposeImportWorker,
  importInWorker,
  importWorkerAvailable,
  previewFile,
} from "../../../src/worker/import-client";

function table(rows: number): string {
  let s = "# invented test table\nm_a [ueV],g [1/GeV]\n";
  for (let i = 1; i <= rows; i++) s += `${(i * 0.37).toPrecision(6)},${(i * 1.3e-14).toExponential(5)}\n`;
  return s;
}

function same(a: { massEv: Float64Array; gInvGeV: Float64Array }, b: { massEv: Float64Array; gInvGeV: Float64Array }) {
  expect(Array.from(a.massEv)).toEqual(Array.from(b.massEv));
  expect(Array.from(a.gInvGeV)).toEqual(Array.from(b.gInvGeV));
}

const text = table(20000);
const reference = parseCurveText(text, { fileName: "t.csv" });

describe("parseCurveSource", () => {
  test("string in small slices: same result, progress rises to 1", async () => {
    const seen: number[] = [];
    const r = await parseCurveSource(
      text,
      { fileName: "t.csv" },
      { sliceChars: 4096, onProgress: (p) => seen.push(p.fraction) },
    );
    same(r, reference);
    expect(r.massEv.length).toBe(20000);
    expect(seen.length).toBeGreaterThan(10);
    expect(seen.at(-1)).toBe(1);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
  });
  test("UTF-8 bytes, with a multi-byte μ split across slices", async () => {
    const bytes = new TextEncoder().encode("m [\u03bceV],g\n" + "1,2\n".repeat(10));
    const r = await parseCurveSource(bytes, {}, { sliceChars: 3 });
    expect(r.massUnit).toBe("ueV");
    expect(r.massEv.length).toBe(10);
  });
  test("a Blob (File) read in slices, also slices that cut a line or a multi-byte μ", async () => {
    same(await parseCurveSource(new Blob([text]), { fileName: "t.csv" }), reference);
    same(await parseCurveSource(new Blob([text]), { fileName: "t.csv" }, { blobSliceBytes: 1000 }), reference);
    const mu = await parseCurveSource(new Blob(["m [\u03bceV],g\n1,2\n"]), {}, { blobSliceBytes: 4 });
    expect(mu.massUnit).toBe("ueV");
    expect(Array.from(mu.massEv)).toEqual([1e-6]);
  });
  test("UTF-16LE with BOM (spreadsheet 'Unicode text' export) is decoded", async () => {
    const s = "\uFEFFm [ueV]\tg\r\n1\t2\r\n";
    const bytes = new Uint8Array(s.length * 2);
    for (let i = 0; i < s.length; i++) {
      bytes[2 * i] = s.charCodeAt(i) & 0xff;
      bytes[2 * i + 1] = s.charCodeAt(i) >> 8;
    }
    const r = await parseCurveSource(bytes.buffer);
    expect(Array.from(r.massEv)).toEqual([1e-6]);
  });
  test("binary and empty files come back with the problem, not an exception", async () => {
    const bin = await parseCurveSource(new Blob([new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0, 0, 1])]), {
      fileName: "x.xlsx",
    });
    expect(bin.fatal?.code).toBe("binary");
    expect(bin.messages[0].text).toMatch(/^x\.xlsx: the file looks like a ZIP archive/);
    expect((await parseCurveSource(new Blob([]))).fatal?.code).toBe("empty");
  });
  test("cancel through the AbortSignal rejects with an AbortError", async () => {
    const controller = new AbortController();
    const p = parseCurveSource(
      text,
      {},
      {
        sliceChars: 1024,
        signal: controller.signal,
        onProgress: (pr) => {
          if (pr.fraction > 0.2) controller.abort();
        },
      },
    );
    const err = await p.then(
      () => null,
      (e: unknown) => e,
    );
    expect(isImportCancelled(err)).toBe(true);
  });
});

describe("importInWorker without a Worker (Node, jsdom): main-thread fallback", () => {
  afterAll(() => disposeImportWorker());
  test("no Worker here, so the fallback runs", () => {
    expect(importWorkerAvailable()).toBe(false);
  });
  test("a File: the name becomes the file name in messages; progress in fractions", async () => {
    const fractions: number[] = [];
    const file = new File([text], "scan.csv");
    const job = importInWorker(file, {}, (f) => fractions.push(f));
    const r = await job.promise;
    same(r, reference);
    expect(r.fileName).toBe("scan.csv");
    expect(fractions.at(-1)).toBe(1);
  });
  test("a string", async () => {
    same(await importInWorker(text).promise, reference);
  });
  test("cancel() rejects the promise with an AbortError", async () => {
    const job = importInWorker("1,2\n".repeat(200000), {});
    job.cancel();
    const err = await job.promise.then(
      () => null,
      (e: unknown) => e,
    );
    expect(isImportCancelled(err)).toBe(true);
  });
  test("a file over the 200 MB cap is refused before reading", async () => {
    // A real 200 MB Blob is not needed: the check reads only `size` and the first bytes.
    const fake = new Blob(["1,2\n"]);
    Object.defineProperty(fake, "size", { value: MAX_IMPORT_BYTES + 1 });
    const r = await importInWorker(fake, { fileName: "big.csv" }).promise;
    expect(r.fatal?.code).toBe("too-large");
  });
});

describe("previewFile: the import step's quick look", () => {
  test("reads only the head of a large file; detection matches the full parse", async () => {
    const file = new File([text], "scan.csv");
    const r = await previewFile(file);
    expect(r.truncated).toBe(true);
    expect(r.delimiter).toBe(reference.delimiter);
    expect(r.header).toEqual(reference.header);
    expect(r.massUnit).toBe("ueV");
    expect(r.preview.length).toBe(20);
    expect(r.preview[0]).toEqual(reference.preview[0]);
    expect(r.massEv.length).toBeLessThan(reference.massEv.length);
    expect(Array.from(r.massEv)).toEqual(Array.from(reference.massEv.subarray(0, r.massEv.length)));
  });
  test("a small file is read whole", async () => {
    const r = await previewFile(new File(["1,2\n3,4\n"], "s.csv"));
    expect(r.truncated).toBe(false);
    expect(r.massEv.length).toBe(2);
  });
});
