// Worker entry of the command-line renderer: reads, parses and prepares for drawing CSV curve files off the
// main thread, so that several files are handled at once on a machine with more than one CPU (parse-parallel.ts).
import { parentPort } from "node:worker_threads";
import { parseCsvFile } from "./read-input";
import { computePrepared, preparedTransferables } from "../plot/prepare-transfer";
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
      const result = parseCsvFile(job.path, job);
      // The same preparation the figure would build on first drawing (identical by construction), for the
      // g_aγγ view a CSV figure starts in; the main thread seeds its plot cache with it.
      const prepared =
        !result.fatal && result.massEv.length > 0
          ? computePrepared(result.massEv, result.gInvGeV, job.sorted, { slopes: [0] })
          : undefined;
      reply = { index: job.index, result, prepared };
    } catch {
      // The main thread reads and parses this file again itself, and reports any problem in its own words.
      reply = { index: job.index, result: null };
    }
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
