// The import step's own small store: the sources waiting to be imported, their parse jobs, and the actions
// the controls (file picker and paste box in the curves panel, drops anywhere on the page) and the import
// dialog share. Transient: never saved or undone; the curves it creates go to the project store in one step.
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

export const useImport = create<ImportState>()((set, get) => {
  const patchItem = (key: string, patch: Partial<ImportItem> | ((it: ImportItem) => Partial<ImportItem>)) =>
    set((s) => ({
      items: s.items.map((it) =>
        it.key === key ? { ...it, ...(typeof patch === "function" ? patch(it) : patch) } : it,
      ),
    }));

  const runParse = (item: ImportItem) => {
    jobs.get(item.key)?.job.cancel();
    const id = ++jobCounter;
    const { physics, figure } = useAxband.getState().project;
    // Progress redraws the dialog: at most every 100 ms (and at the end), which is smooth enough for a bar.
    let lastShown = 0;
    const job = startParse(
      item.source,
      parseOptsOf(item, physics),
      (fraction) => {
        const now = Date.now();
        if (fraction < 1 && now - lastShown < 100) return;
        lastShown = now;
        if (jobs.get(item.key)?.id === id) patchItem(item.key, { progress: fraction });
      },
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
  };

  const clear = () => {
    for (const { job } of jobs.values()) job.cancel();
    jobs.clear();
    set({ items: [], notice: null, busy: false, pasteOpen: false });
  };

  return {
    items: [],
    pasteOpen: false,
    notice: null,
    busy: false,

    addSources(sources) {
      for (const src of sources) {
        const item: ImportItem = {
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
        set((s) => ({ items: [...s.items, item], notice: null }));
        runParse(item);
      }
    },

    async addFiles(files) {
      const { replaceProject, pushMessage } = useAxband.getState();
      for (const f of files.filter((x) => isProjectFileName(x.name))) {
        const r = await openProjectFile(f);
        if (r.ok) replaceProject(r.project, r.message);
        else pushMessage("alert", r.error);
      }
      const rest = files.filter((x) => !isProjectFileName(x.name));
      if (rest.length > 0) get().addSources(rest.map((f) => ({ name: f.name, blob: f })));
    },

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

    cancelAll: clear,

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
      const { figure, physics } = useAxband.getState().project;
      // A big curve's drawing preparation is built in the worker, so adding it does not block the page.
      await Promise.all(
        ready.map((it) =>
          ensurePrepared(it.result as CurveParseResult, prepareSpecOf(it.settings, figure.yView, physics)),
        ),
      );
      // Cancelled meanwhile: nothing is imported.
      if (!get().busy) return 0;
      const project = useAxband.getState().project;
      const context: { curves: Pick<Curve, "colour">[] } = { curves: [...project.curves] };
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
      useAxband.getState().addCurves(curves);
      const nonPositive = ready.reduce((n, it) => n + (it.result?.nonPositive ?? 0), 0);
      const parts = [`Imported ${plural(curves.length, "curve")}: ${curves.map((c) => c.label).join(", ")}.`];
      if (rejected > 0) parts.push(`${plural(rejected, "unreadable row")} skipped.`);
      if (nonPositive > 0)
        parts.push(`${plural(nonPositive, "row")} with a value ≤ 0 kept but not drawn on the log axes.`);
      const left = list.length - ready.length;
      if (left > 0) parts.push(`${plural(left, "source")} not imported.`);
      useAxband.getState().pushMessage("status", parts.join(" "));
      clear();
      return curves.length;
    },
  };
});
