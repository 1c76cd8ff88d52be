// `npm run fuzz`: the link decoder against 100,000 mutated links (the generator of tests/formats/link-fuzz-cases.ts,
// whose test runs a seeded 5,000). Prints what was accepted and refused per kind of mutation, and exits with 1
// when a link threw, was refused without a message, or opened as an invalid or changed project.
import { performance } from "node:perf_hooks";
import { tsImport } from "tsx/esm/api";

const arg = (name, dflt) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : dflt;
};
const total = Number(arg("links", "100000"));
const seed = Number(arg("seed", String(0xa5b4c3d2)));
const { runLinkFuzz } = await tsImport("../tests/formats/link-fuzz-cases.ts", import.meta.url);

const KINDS = [
  "cut off",
  "one bit flipped",
  "letters replaced",
  "letters inserted or deleted",
  "random base64",
  "base64 of random bytes",
  "compressed random bytes",
  "compressed nasty or random JSON",
  "compressed mutated compact object",
  "damaged prefix",
];
const t0 = performance.now();
const r = runLinkFuzz(total, seed);
const seconds = (performance.now() - t0) / 1000;
console.log(`${total.toLocaleString("en")} links, seed ${seed}, ${seconds.toFixed(1)} s`);
console.log("kind                                   accepted  refused");
KINDS.forEach((k, i) =>
  console.log(`${k.padEnd(38)} ${String(r.accepted[i]).padStart(8)} ${String(r.refused[i]).padStart(8)}`),
);
const problems = [
  ["threw", r.throws],
  ["refused without a message", r.emptyMessages],
  ["opened as an invalid project", r.invalidAccepted],
  ["damaged copy opened as a changed project", r.changedAccepted],
];
for (const [what, list] of problems)
  console.log(`${what}: ${list.length}${list.length ? ` (first: ${list[0].slice(0, 80)})` : ""}`);
if (problems.some(([, list]) => list.length > 0)) process.exitCode = 1;
