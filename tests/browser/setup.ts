// Runs before every browser test file: takes the run lock (run-lock.ts) for the whole file, shared with one other
// file or alone when the file called runsAlone(), so a timed file never measures its page beside another file's.
import { afterAll, beforeAll, inject } from "vitest";
import { takeAloneMark } from "./run-lock";

let token: string | undefined;

beforeAll(async () => {
  const res = await fetch(`${inject("runLockUrl")}acquire?mode=${takeAloneMark() ? "alone" : "shared"}`);
  token = await res.text();
});

afterAll(async () => {
  if (token !== undefined) await fetch(`${inject("runLockUrl")}release?token=${token}`);
});
