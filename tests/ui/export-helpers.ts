// Test helper for the second UI engineer's component tests: captures downloads (blob URL + <a download>
// click) in jsdom, which has no URL.createObjectURL, and resets the app store to a given project.
import { vi } from "vitest";
import { useAxband } from "../../src/ui/store";
import type { Project } from "../../src/project/types";

export interface CapturedDownload {
  fileName: string;
  blob: Blob;
  text: () => Promise<string>;
}

/** Starts capturing downloads; returns the list that fills as the UI saves files. */
export function captureDownloads(): CapturedDownload[] {
  const list: CapturedDownload[] = [];
  const blobs = new Map<string, Blob>();
  let n = 0;
  Object.defineProperty(URL, "createObjectURL", {
    configurable: true,
    value: (b: Blob) => {
      const url = `blob:test/${++n}`;
      blobs.set(url, b);
      return url;
    },
  });
  Object.defineProperty(URL, "revokeObjectURL", { configurable: true, value: () => undefined });
  vi.spyOn(HTMLAnchorElement.prototype, "click").mockImplementation(function (this: HTMLAnchorElement) {
    const blob = blobs.get(this.href);
    if (blob) list.push({ fileName: this.download, blob, text: () => readText(blob) });
  });
  return list;
}

function readText(blob: Blob): Promise<string> {
  if (typeof blob.text === "function") return blob.text();
  return new Promise((resolve, reject) => {
    const r = new FileReader();
    r.onload = () => resolve(String(r.result));
    r.onerror = () => reject(r.error);
    r.readAsText(blob);
  });
}

/** Puts a project into the app store with an empty history and no messages. */
export function useProject(project: Project): void {
  useAxband.getState().resetProject(project);
  useAxband.setState({ ui: { messages: [], tabConflict: null, highlight: null, hover: null } });
}
