// Saves a file the way a browser sees a real download: an <a download> pointing at a blob: URL, clicked
// programmatically. The URL is revoked a little later so that slow browsers still get to read it.

/** What {@link downloadBlob} did, for tests and for status messages. */
export interface DownloadResult {
  fileName: string;
  bytes: number;
}

// The one file-name rule lives with the file formats; re-exported here for the download buttons.
export { safeFileName } from "../../formats/file-name";

/**
 * Downloads a blob under a file name.
 * @param fileName name with extension, e.g. "figure.svg"
 * @param blob the content
 * @param doc document to use (tests pass their own). @default window.document
 */
export function downloadBlob(fileName: string, blob: Blob, doc: Document = document): DownloadResult {
  const url = URL.createObjectURL(blob);
  const a = doc.createElement("a");
  a.href = url;
  a.download = fileName;
  a.rel = "noopener";
  a.style.display = "none";
  doc.body.appendChild(a);
  a.click();
  a.remove();
  // Chromium reads the blob asynchronously after the click; revoking at once can cancel the download.
  setTimeout(() => URL.revokeObjectURL(url), 30_000);
  return { fileName, bytes: blob.size };
}

/**
 * Downloads text as a UTF-8 file.
 * @param mime media type. @default "text/plain"
 */
export function downloadText(fileName: string, text: string, mime = "text/plain"): DownloadResult {
  return downloadBlob(fileName, new Blob([text], { type: `${mime};charset=utf-8` }));
}
