// axe-core (Deque) run inside the page: the violations of serious or critical impact, as "rule: targets" lines.
import { createRequire } from "node:module";
import { readFileSync } from "node:fs";
import type { Page } from "playwright-core";

const AXE_SOURCE = readFileSync(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");

interface AxeResult {
  violations: { id: string; impact: string; nodes: { target: string[]; failureSummary?: string }[] }[];
}

/** Every axe-core violation on the page as it is (the rules axe runs by default), as "impact rule: targets". */
export async function axeViolations(page: Page): Promise<string[]> {
  if (!(await page.evaluate(() => "axe" in window))) await page.addScriptTag({ content: AXE_SOURCE });
  return page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document) => Promise<AxeResult> } }).axe;
    const r = await axe.run(document);
    return r.violations.map(
      (v) =>
        `${v.impact} ${v.id}: ${v.nodes.map((n) => `${n.target.join(" ")} (${n.failureSummary ?? ""})`).join(", ")}`,
    );
  });
}

/** The violations of serious or critical impact. */
export async function seriousViolations(page: Page): Promise<string[]> {
  return (await axeViolations(page)).filter((v) => v.startsWith("serious ") || v.startsWith("critical "));
}
