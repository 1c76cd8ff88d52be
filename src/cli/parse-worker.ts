// Worker entry of the command-line renderer: reads, parses and prepares for drawing CSV curve files off the
// main thread, or prepares curves the main thread parsed (parse-parallel.ts), so that files are handled at once.
import { parentPort } from "node:worker_threads";
import { parseCsvFile } from "./read-input";
import { preparedTransferables } from "../plot/prepare-transfer";
import { prepareForFigure, type ParseJob, type ParseReply, type PrepareJob, type PrepareReply } from "./parse-parallel";

function parseReply(job: ParseJob): ParseReply {
  try {
    const result = parseCsvFile(job.path, job);
    return { index: job.index, result, prepared: prepareForFigure(result, job.sorted) };
  } catch {
    // The main thread reads and parses this file again itself, and reports any problem in its own words.
    return { index: job.index, result: null };
  }
}

function prepareReply(job: PrepareJob): PrepareReply {
  try {
    return { index: job.index, prepared: prepareForFigure(job, job.sorted) ?? null };
  } catch {
    // Prepared on the main thread when first drawn.
    return { index: job.index, prepared: null };
  }
}

const port = parentPort;
if (port) {
  port.on("message", (job: ParseJob | PrepareJob | null) => {
    if (job === null) {
      port.close();
      return;
    }
    if ("kind" in job) {
      const reply = prepareReply(job);
      port.postMessage(reply, reply.prepared ? preparedTransferables(reply.prepared) : []);
      return;
    }
    const reply = parseReply(job);
    // Moved, not copied: the point arrays are most of the result's bytes.
    const buffers = reply.result
      ? [
          ...new Set([
            reply.result.massEv.buffer,
            reply.result.gInvGeV.buffer,
            ...(reply.prepared ? preparedTransferables(reply.prepared) : []),
          ]),
        ]
      : [];
    port.postMessage(reply, buffers as ArrayBuffer[]);
  });
}
