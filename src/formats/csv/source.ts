// Reading a string, bytes or a Blob/File in slices (in a worker, or on the main thread when no worker is
// available), with progress, cancellation and the file checks first.
import { ImportCancelled, isImportCancelled } from "./cancel";
import { binaryProblem, checkImportFile, type ImportEncoding } from "./file-check";
import { createCurveParser, parseCurveText } from "./parser";
import {
  formatProblem,
  type CurveParseOptions,
  type CurveParser,
  type CurveParseResult,
  type ImportProblem,
} from "./types";

export interface ImportProgress {
  /** 0..1 of the input read. */
  fraction: number;
  /** Lines read so far. */
  lines: number;
}

export interface ParseSourceHooks {
  onProgress?: (p: ImportProgress) => void;
  signal?: AbortSignal;
  /** Characters per slice of a string source. @default 1 << 20 */
  sliceChars?: number;
  /** Bytes per slice of a Blob/File source. @default 1 << 20 */
  blobSliceBytes?: number;
  /** Give the event loop a turn after this much work, so cancel and other messages get through. @default 50 */
  yieldMs?: number;
}

export { ImportCancelled, isImportCancelled };

function emptyResult(opts: CurveParseOptions, problem: ImportProblem): CurveParseResult {
  const r = parseCurveText("", opts);
  return {
    ...r,
    fatal: problem,
    messages: [{ level: "error", text: formatProblem(opts.fileName ?? "input", problem) }],
  };
}

function turn(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/**
 * Parses a string, bytes or a Blob/File in slices, reporting progress and yielding to the event loop so the
 * caller's thread stays responsive; rejects with {@link ImportCancelled} when `signal` aborts. Files go
 * through {@link checkImportFile} first (size cap, binary data, encoding); bytes that are not valid UTF-8
 * further on are read again as Windows-1252.
 */
export async function parseCurveSource(
  source: string | ArrayBuffer | Uint8Array | Blob,
  opts: CurveParseOptions = {},
  hooks: ParseSourceHooks = {},
): Promise<CurveParseResult> {
  const { onProgress, signal } = hooks;
  const yieldMs = hooks.yieldMs ?? 50;
  let last = Date.now();
  let lastReport = -1;
  const step = async (parser: CurveParser, fraction: number) => {
    if (signal?.aborted) throw new ImportCancelled();
    if (onProgress && fraction - lastReport >= 0.005) {
      lastReport = fraction;
      onProgress({ fraction, lines: parser.lines });
    }
    if (Date.now() - last >= yieldMs) {
      await turn();
      last = Date.now();
      if (signal?.aborted) throw new ImportCancelled();
    }
  };
  const done = (parser: CurveParser) => {
    const r = parser.finish();
    onProgress?.({ fraction: 1, lines: parser.lines });
    return r;
  };

  if (typeof source === "string") {
    const parser = createCurveParser({ sizeHint: source.length, ...opts });
    const slice = hooks.sliceChars ?? 1 << 20;
    for (let i = 0; i < source.length; i += slice) {
      parser.push(source.slice(i, i + slice));
      await step(parser, Math.min(1, (i + slice) / source.length));
    }
    return done(parser);
  }

  const size = source instanceof Blob ? source.size : source.byteLength;
  const headBytes =
    source instanceof Blob
      ? new Uint8Array(await source.slice(0, 4096).arrayBuffer())
      : source instanceof Uint8Array
        ? source.subarray(0, 4096)
        : new Uint8Array(source, 0, Math.min(4096, source.byteLength));
  const check = checkImportFile({ name: opts.fileName, size, firstBytes: headBytes });
  if (!check.ok) return emptyResult(opts, check.problem);
  const all = source instanceof Blob ? null : source instanceof Uint8Array ? source : new Uint8Array(source);
  // 1 MB slices of a Blob: fewer round trips to the blob store than a stream's 64 KB chunks, still a smooth
  // progress bar; bytes in memory in slices of about sliceChars characters.
  const slice = source instanceof Blob ? (hooks.blobSliceBytes ?? 1 << 20) : (hooks.sliceChars ?? 1 << 20) * 2;
  const bytesAt = async (i: number) =>
    all
      ? all.subarray(i, i + slice)
      : new Uint8Array(await (source as Blob).slice(i, Math.min(size, i + slice)).arrayBuffer());

  // Null when the bytes turn out not to be valid UTF-8 further on: the caller reads again as Windows-1252.
  const readAs = async (encoding: ImportEncoding): Promise<CurveParseResult | null> => {
    const decoder = new TextDecoder(encoding, { fatal: encoding === "utf-8" });
    const parser = createCurveParser({ sizeHint: size, ...opts, encoding });
    try {
      for (let i = 0; i < size; i += slice) {
        const bytes = await bytesAt(i);
        if (signal?.aborted) throw new ImportCancelled();
        parser.push(decoder.decode(bytes, { stream: true }));
        await step(parser, Math.min(1, (i + slice) / size));
      }
      parser.push(decoder.decode());
    } catch (e) {
      if (e instanceof TypeError && encoding === "utf-8") return null;
      throw e;
    }
    return done(parser);
  };
  return (await readAs(check.encoding)) ?? (await readAs("windows-1252")) ?? emptyResult(opts, binaryProblem());
}
