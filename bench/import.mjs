// `node bench/import.mjs`: CSV import throughput (MB/s, median of several runs) of axband's parser alone,
// one-shot and in 1 MB chunks, side by side with d3-dsv's csvParseRows in the same run, on the invented
// bench curves. Prints medians and ratios; never passes or fails on timings.
import { readFileSync } from "node:fs";
import { performance } from "node:perf_hooks";
import { tsImport } from "tsx/esm/api";
import { csvParseRows } from "d3-dsv";
import { arg, benchSets, median } from "./import-data.mjs";

const runs = Number(arg("runs", "7"));
const csv = await tsImport("../src/formats/csv/index.ts", import.meta.url);

/** What a user of d3-dsv would write for the same job: rows of strings, then numbers into typed arrays. */
function d3ToArrays(text) {
  const rows = csvParseRows(text);
  const out = { massEv: new Float64Array(rows.length), gInvGeV: new Float64Array(rows.length) };
  let n = 0;
  for (const row of rows) {
    if (row.length < 2 || row[0].startsWith("#")) continue;
    const m = +row[0];
    const g = +row[1];
    if (Number.isNaN(m) || Number.isNaN(g)) continue; // the header row
    out.massEv[n] = m;
    out.gInvGeV[n] = g;
    n++;
  }
  return { massEv: out.massEv.slice(0, n), gInvGeV: out.gInvGeV.slice(0, n) };
}

function chunkedParse(text) {
  const p = csv.createCurveParser({ sizeHint: text.length });
  const step = 1 << 20;
  for (let i = 0; i < text.length; i += step) p.push(text.slice(i, i + step));
  return p.finish();
}

const methods = [
  ["axband parseCurveText (one pass into Float64Array)", (t) => csv.parseCurveText(t)],
  ["axband createCurveParser, 1 MB chunks", chunkedParse],
  ["d3-dsv csvParseRows + Number() into Float64Array", d3ToArrays],
  ["d3-dsv csvParseRows alone (strings only)", (t) => csvParseRows(t)],
];

function same(a, b) {
  if (a.massEv.length !== b.massEv.length) return false;
  for (let i = 0; i < a.massEv.length; i++)
    if (a.massEv[i] !== b.massEv[i] || a.gInvGeV[i] !== b.gInvGeV[i]) return false;
  return true;
}

console.log(`node ${process.version}, ${runs} runs per method (plus one warm-up), median throughput`);
for (const set of benchSets()) {
  const texts = set.files.map((f) => readFileSync(f.path, "utf8"));
  const bytes = set.files.reduce((s, f) => s + f.bytes, 0);
  const rows = texts.reduce((s, t) => s + csv.parseCurveText(t).massEv.length, 0);
  const agree = texts.every((t) => same(csv.parseCurveText(t), d3ToArrays(t)));
  console.log(
    `\n${set.name}: ${set.files.length} file(s), ${(bytes / 1e6).toFixed(1)} MB, ${rows.toLocaleString("en")} rows; axband and d3-dsv give identical arrays: ${agree ? "yes" : "NO"}`,
  );
  // Methods take turns within each run, so a change in machine load hits all of them alike.
  const times = methods.map(() => []);
  for (let r = 0; r <= runs; r++) {
    methods.forEach(([, fn], k) => {
      const t0 = performance.now();
      for (const t of texts) fn(t);
      const dt = (performance.now() - t0) / 1000;
      if (r > 0) times[k].push(dt);
    });
  }
  const results = methods.map(([label], k) => {
    const t = median(times[k]);
    return { label, mbps: bytes / 1e6 / t, t };
  });
  const base = results[2].mbps;
  for (const r of results) {
    console.log(
      `  ${r.label.padEnd(54)} ${r.mbps.toFixed(1).padStart(7)} MB/s  (${(r.t * 1000).toFixed(0)} ms)  ×${(r.mbps / base).toFixed(2)} vs d3-dsv + Number()`,
    );
  }
}
