// The cancellation of an import, apart from the parser so that code which only waits on a parse (the page's
// worker client) does not load the parser with it.
/** Error thrown (as a rejection) when an import is cancelled through its AbortSignal. */
export class ImportCancelled extends Error {
  override name = "AbortError";
  constructor() {
    super("import cancelled");
  }
}

/** True for the rejection of a cancelled import. */
export function isImportCancelled(err: unknown): boolean {
  return err instanceof Error && err.name === "AbortError";
}
