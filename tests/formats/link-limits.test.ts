// A link over the project's size limits says which limit, not that it is damaged: links/models_1e6_same (issue 16)
// carries 10⁶ identical models in a 58 kB link, which is intact but over the 500-model cap.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { PROJECT_LIMITS, decodeLink } from "../../src/data/index";

describe("links over a size limit", () => {
  it("10⁶ models: names the count and the cap, and does not call the link damaged", () => {
    const r = decodeLink(readFileSync(join(import.meta.dirname, "repro", "links", "models_1e6_same.txt"), "utf8"));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(PROJECT_LIMITS.models).toBe(500);
    expect(r.error).toBe(
      "This link was not opened: it holds 1,000,000 models, and axband opens at most 500 models in one project.",
    );
    expect(r.error).not.toMatch(/damaged|copied/);
  });
});
