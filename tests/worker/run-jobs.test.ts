// The runs worker's jobs (src/worker/run-jobs.ts): the chunks it thins are the page's own thinning of those
// chunks, it keeps the arrays it is sent until dropped, and a job for arrays it does not have is an error.
import { describe, expect, test } from "vitest";
import { createRunsHandler, thinRunChunks, type RunsResponse } from "../../src/worker/run-jobs";
import { thinRunChunk, RUN_CHUNK } from "../../src/plot/thinning/runs";
import { rng } from "../plot/fixture";

/** Invented noisy file-order data: 5,000 points of a random walk in (lm, v). */
function walk(n: number) {
  const r = rng(3);
  const lm = new Float64Array(n);
  const v = new Float64Array(n);
  for (let i = 1; i < n; i++) {
    lm[i] = lm[i - 1] + (r() - 0.5) * 0.01;
    v[i] = v[i - 1] + (r() - 0.5) * 0.01;
  }
  return { lm, v };
}

describe("run jobs", () => {
  test("the chunks' indices, concatenated, are the page's thinning of each chunk", () => {
    const { lm, v } = walk(5000);
    const chunks = [4, 0, 2];
    const r = thinRunChunks(lm, v, 0.004, 0.003, chunks);
    expect(r.offsets[0]).toBe(0);
    chunks.forEach((c, k) => {
      const part = Array.from(r.indices.subarray(r.offsets[k], r.offsets[k + 1]));
      expect(part).toEqual(Array.from(thinRunChunk(lm, v, c, 0.004, 0.003)));
      // Absolute indices inside the chunk, ascending, with its first and last point.
      expect(part[0]).toBe(c * RUN_CHUNK);
      expect(part[part.length - 1]).toBe(Math.min(5000, (c + 1) * RUN_CHUNK) - 1);
      expect(part.every((x, i) => i === 0 || x > part[i - 1])).toBe(true);
    });
    // The last chunk is short (5,000 = 4 × 1,024 + 904), and thinning keeps fewer points than it had.
    expect(r.offsets[1]).toBeLessThan(904);
  });

  test("the handler answers from the arrays it was sent, and forgets them when dropped", () => {
    const { lm, v } = walk(3000);
    const out: RunsResponse[] = [];
    const handle = createRunsHandler((msg) => out.push(msg));
    handle({ type: "data", key: 7, lm, v });
    handle({ type: "runs", id: 1, key: 7, tx: 0.004, ty: 0.003, chunks: Int32Array.of(1, 2) });
    expect(out[0].type).toBe("runs");
    const first = out[0] as Extract<RunsResponse, { type: "runs" }>;
    expect(first.id).toBe(1);
    expect(first).toEqual({ type: "runs", id: 1, ...thinRunChunks(lm, v, 0.004, 0.003, [1, 2]) });
    handle({ type: "drop", key: 7 });
    handle({ type: "runs", id: 2, key: 7, tx: 0.004, ty: 0.003, chunks: Int32Array.of(0) });
    expect(out[1]).toMatchObject({ type: "error", id: 2 });
  });
});
