// The import step's own transient store (never saved or undone): sources waiting, their parse jobs, and the
// actions the controls and the import dialog share; the curves it creates go to the project store in one step.
import { create } from "zustand";
import { labelFromFileName, newCurve, type CurveParseResult } from "../../data";
import type { Curve } from "../../project/types";
import { useAxband } from "../store";
import { prepareSpecOf } from "../../plot/prepare-transfer";
import { ensurePrepared, startParse, type ParseJob } from "./parse-runner";
import {
  importable,
  initialSettings,
  PARSE_KEYS,
  parseOptsOf,
  problemOf,
  settingsAfterParse,
  type ImportItem,
  type ImportSettings,
} from "./import-items";
import { isProjectFileName, openProjectFile } from "../share/open-project";

export interface ImportState {
  items: ImportItem[];
  /** The paste box is open (the dialog shows it even with no sources yet). */
  pasteOpen: boolean;
  /** A sentence for the whole step (e.g. rows turned up unreadable after a click on Import). */
  notice: string | null;
  busy: boolean;
  addSources: (sources: { name: string; blob: Blob; label?: string }[]) => void;
  /** Project files and exported SVGs reopen the project; the other files join the import step. */
  addFiles: (files: File[]) => Promise<void>;
  changeSettings: (key: string, patch: Partial<ImportSettings>) => void;
  removeItem: (key: string) => void;
  setPasteOpen: (open: boolean) => void;
  cancelAll: () => void;
  /** Imports every ready source as a curve (one undo step); returns how many curves were added. */
  confirm: () => Promise<number>;
}

let keyCounter = 0;
const jobs = new Map<string, { id: number; job: ParseJob }>();
let jobCounter = 0;

function isAbort(e: unknown): boolean {
  return e instanceof Error && e.name === "AbortError";
}

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n.toLocaleString("en")} ${n === 1 ? one : many}`;
}

type ItemPatch = Partial<ImportItem> | ((it: ImportItem) => Partial<ImportItem>);

function patchItem(key: string, patch: ItemPatch): void {
  useImport.setState((s) => ({
    items: s.items.map((it) => (it.key === key ? { ...it, ...(typeof patch === "function" ? patch(it) : patch) } : it)),
  }));
}

/** Progress redraws the dialog: at most every 100 ms (and at the end), which is smooth enough for a bar. */
function progressReporter(key: string, id: number): (fraction: number) => void {
  let lastShown = 0;
  return (fraction) => {
    const now = Date.now();
    if (fraction < 1 && now - lastShown < 100) return;
    lastShown = now;
    if (jobs.get(key)?.id === id) patchItem(key, { progress: fraction });
  };
}

function runParse(item: ImportItem): void {
  jobs.get(item.key)?.job.cancel();
  const id = ++jobCounter;
  const { physics, figure } = useAxband.getState().project;
  const job = startParse(
    item.source,
    parseOptsOf(item, physics),
    progressReporter(item.key, id),
    prepareSpecOf(item.settings, figure.yView, physics),
  );
  jobs.set(item.key, { id, job });
  patchItem(item.key, { status: "parsing", progress: 0 });
  job.promise.then(
    (result: CurveParseResult) => {
      if (jobs.get(item.key)?.id !== id) return;
      jobs.delete(item.key);
      patchItem(item.key, (it) => ({
        status: "ready",
        progress: 1,
        result,
        settings: settingsAfterParse(it.settings, result, it.labelEdited),
        problem: problemOf(it.fileName, result),
      }));
    },
    (e: unknown) => {
      if (jobs.get(item.key)?.id !== id) return;
      jobs.delete(item.key);
      if (isAbort(e)) return;
      patchItem(item.key, {
        status: "failed",
        problem: `${item.fileName} could not be read: ${e instanceof Error ? e.message : String(e)}`,
      });
    },
  );
}

function clearImport(): void {
  for (const { job } of jobs.values()) job.cancel();
  jobs.clear();
  useImport.setState({ items: [], notice: null, busy: false, pasteOpen: false });
}

function newItem(src: { name: string; blob: Blob; label?: string }): ImportItem {
  return {
    key: `imp-${++keyCounter}`,
    fileName: src.name,
    source: src.blob,
    sizeBytes: src.blob.size,
    problem: null,
    settings: initialSettings(src.label ?? labelFromFileName(src.name)),
    labelEdited: false,
    status: "parsing",
    progress: 0,
    result: null,
  };
}

/** The ready items as new curves, their colours chosen against the project's curves and each other. */
function curvesOf(ready: ImportItem[], existing: readonly Curve[]): Curve[] {
  const context: { curves: Pick<Curve, "colour">[] } = { curves: [...existing] };
  const curves: Curve[] = [];
  for (const it of ready) {
    const r = it.result as CurveParseResult;
    const s = it.settings;
    const curve = newCurve(
      {
        label: s.label.trim() || labelFromFileName(it.fileName),
        role: s.role,
        massEv: r.massEv,
        gInvGeV: r.gInvGeV,
        keepOrder: s.role === "region" ? true : s.keepOrder,
        citation: s.citation.trim(),
        fileName: it.fileName,
      },
      context,
    );
    context.curves.push(curve);
    curves.push(curve);
  }
  return curves;
}

function importSummary(curves: Curve[], ready: ImportItem[], rejected: number, sourceCount: number): string {
  const nonPositive = ready.reduce((n, it) => n + (it.result?.nonPositive ?? 0), 0);
  const parts = [`Imported ${plural(curves.length, "curve")}: ${curves.map((c) => c.label).join(", ")}.`];
  if (rejected > 0) parts.push(`${plural(rejected, "unreadable row")} skipped.`);
  if (nonPositive > 0) parts.push(`${plural(nonPositive, "row")} with a value ≤ 0 kept but not drawn on the log axes.`);
  const left = sourceCount - ready.length;
  if (left > 0) parts.push(`${plural(left, "source")} not imported.`);
  return parts.join(" ");
}

/** Project files and exported SVGs reopen the project; the other files join the import step. */
async function openOrAddFiles(files: File[]): Promise<void> {
  const { replaceProject, pushMessage } = useAxband.getState();
  for (const f of files.filter((x) => isProjectFileName(x.name))) {
    const r = await openProjectFile(f);
    if (r.ok) replaceProject(r.project, r.message);
    else pushMessage("alert", r.error);
  }
  const rest = files.filter((x) => !isProjectFileName(x.name));
  if (rest.length > 0) useImport.getState().addSources(rest.map((f) => ({ name: f.name, blob: f })));
}

/** A big curve's drawing preparation is built in the worker, so adding it does not block the page. */
async function prepareAll(ready: ImportItem[]): Promise<void> {
  const { figure, physics } = useAxband.getState().project;
  await Promise.all(
    ready.map((it) => ensurePrepared(it.result as CurveParseResult, prepareSpecOf(it.settings, figure.yView, physics))),
  );
}

export const useImport = create<ImportState>()((set, get) => ({
  items: [],
  pasteOpen: false,
  notice: null,
  busy: false,

  addSources(sources) {
    for (const src of sources) {
      const item = newItem(src);
      set((s) => ({ items: [...s.items, item], notice: null }));
      runParse(item);
    }
  },

  addFiles: openOrAddFiles,

  changeSettings(key, patch) {
    const item = get().items.find((it) => it.key === key);
    if (!item) return;
    const settings = { ...item.settings, ...patch };
    if (patch.role === "region") settings.keepOrder = true;
    const next: ImportItem = { ...item, settings, labelEdited: item.labelEdited || "label" in patch };
    patchItem(key, { settings, labelEdited: next.labelEdited });
    if (PARSE_KEYS.some((k) => k in patch && patch[k] !== item.settings[k])) runParse(next);
  },

  removeItem(key) {
    jobs.get(key)?.job.cancel();
    jobs.delete(key);
    set((s) => ({ items: s.items.filter((it) => it.key !== key) }));
  },

  setPasteOpen(open) {
    set({ pasteOpen: open });
  },

  cancelAll: clearImport,

  async confirm() {
    set({ busy: true });
    const unseen = get().items.some((it) => it.status === "parsing");
    await Promise.allSettled([...jobs.values()].map((j) => j.job.promise));
    // Results are written by the jobs' own then-handlers, which ran before allSettled resolved.
    const list = get().items;
    const ready = list.filter(importable);
    const rejected = ready.reduce((n, it) => n + (it.result?.rejectedCount ?? 0), 0);
    if (unseen && rejected > 0) {
      set({
        busy: false,
        notice: "Some rows could not be read (listed above). Click Import again to skip them, or Cancel.",
      });
      return 0;
    }
    if (ready.length === 0) {
      set({ busy: false, notice: "Nothing to import: no source gave a curve (see the messages above)." });
      return 0;
    }
    await prepareAll(ready);
    // Cancelled meanwhile: nothing is imported.
    if (!get().busy) return 0;
    const curves = curvesOf(ready, useAxband.getState().project.curves);
    useAxband.getState().addCurves(curves);
    useAxband.getState().pushMessage("status", importSummary(curves, ready, rejected, list.length));
    clearImport();
    return curves.length;
  },
}));
