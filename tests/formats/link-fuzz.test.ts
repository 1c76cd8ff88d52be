// Fuzzing the link decoder with 5,000 seeded mutated links (tests/formats/link-fuzz-cases.ts; `npm run fuzz` runs
// 100,000): nothing throws, nothing touches the global prototypes, every refusal has a message, everything
// accepted is a valid project, and a damaged copy of a link axband wrote opens only as exactly its project.
import { describe, expect, it } from "vitest";
import { runLinkFuzz } from "./link-fuzz-cases";

const TOTAL = 5_000;

function snapshot(): Map<string, unknown> {
  const m = new Map<string, unknown>();
  for (const [name, proto] of [
    ["Object", Object.prototype],
    ["Array", Array.prototype],
    ["Function", Function.prototype],
    ["String", String.prototype],
    ["Number", Number.prototype],
  ] as const) {
    for (const key of Reflect.ownKeys(proto))
      m.set(`${name}.${String(key)}`, Object.getOwnPropertyDescriptor(proto, key)?.value);
  }
  return m;
}

describe("link fuzz", () => {
  it(
    `${TOTAL} mutated links: no throw, no global change, a message for every refusal, valid and unchanged projects only`,
    { timeout: 120_000 },
    () => {
      const before = snapshot();
      const r = runLinkFuzz(TOTAL, 0xa5b4c3d2);
      expect(r.throws).toEqual([]);
      expect(r.emptyMessages).toEqual([]);
      expect(r.invalidAccepted).toEqual([]);
      expect(r.changedAccepted).toEqual([]);
      expect(r.accepted.reduce((a, b) => a + b) + r.refused.reduce((a, b) => a + b)).toBe(TOTAL);
      // Every kind of damage is met, and the JSON mutations also reach the repair paths (some are accepted).
      for (let k = 0; k < r.refused.length; k++) expect(r.refused[k]).toBeGreaterThan(0);
      expect(r.accepted[8]).toBeGreaterThan(TOTAL / 1000);
      expect(r.accepted[7]).toBeGreaterThan(TOTAL / 1000);
      const after = snapshot();
      expect([...after.keys()].sort()).toEqual([...before.keys()].sort());
      for (const [k, v] of before) expect(after.get(k), k).toBe(v);
      expect(({} as Record<string, unknown>).polluted).toBeUndefined();
      expect(([] as unknown as Record<string, unknown>).polluted).toBeUndefined();
    },
  );
});
