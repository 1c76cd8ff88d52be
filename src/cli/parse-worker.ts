// Worker entry of the command-line renderer: reads and parses CSV curve files off the main thread, so that
// several files are parsed at once on a machine with more than one CPU (see parse-parallel.ts).
import { readFileSync } from "node:fs";
import { parentPort } from "node:worker_threads";
import { parseCurveText } from "../data/csv";
import type { ParseJob, ParseReply } from "./parse-parallel";

const port = parentPort;
if (port) {
  port.on("message", (job: ParseJob | null) => {
    if (job === null) {
      port.close();
      return;
    }
    let reply: ParseReply;
    try {
      const text = readFileSync(job.path, "utf8");
      const result = parseCurveText(text, { fileName: job.fileName, massUnit: job.massUnit, couplingUnit: job.couplingUnit });
      reply = { index: job.index, result };
    } catch {
      // The main thread reads and parses this file again itself, and reports any problem in its own words.
      reply = { index: job.index, result: null };
    }
    // Moved, not copied: the point arrays are most of the result's bytes.
    const buffers = reply.result ? [...new Set([reply.result.massEv.buffer, reply.result.gInvGeV.buffer])] : [];
    port.postMessage(reply, buffers as ArrayBuffer[]);
  });
}
