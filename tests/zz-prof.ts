import { Session } from "node:inspector";
import { writeFileSync } from "node:fs";
import { afterAll, beforeAll } from "vitest";
const s = new Session();
s.connect();
const post = (m: string, p?: object) => new Promise<any>((res, rej) => s.post(m, p ?? {}, (e, r) => (e ? rej(e) : res(r))));
beforeAll(async () => { await post("Profiler.enable"); await post("Profiler.setSamplingInterval", { interval: 500 }); await post("Profiler.start"); });
afterAll(async () => { const { profile } = await post("Profiler.stop"); writeFileSync(`/tmp/u17prof/${process.env.U17NAME ?? "p"}.cpuprofile`, JSON.stringify(profile)); });
