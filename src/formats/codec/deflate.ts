// Raw DEFLATE for links: packing sized to the payload (stopping early past a length limit) and inflating with a cap.
import { Deflate, Inflate, deflateSync, inflateSync } from "fflate";

/** Most bytes a link may unpack to; anything larger is refused before it is fully unpacked (50 MB). */
export const LINK_MAX_DECODED_BYTES = 50 * 1024 * 1024;

// DEFLATE level by payload size, counted in curve values (known before anything is written, so the choice is
// the same wherever the project is encoded): level 9, packed in one go, up to 131,072 values (about 1 MB of
// JSON for data of 7 digits), which covers every link-sized payload; streamed at level 6 up to 524,288 values;
// streamed at level 1 above, where fflate's higher levels would spend seconds per million points for a few per
// cent of size (measured on 2·10⁶ invented 7-digit points: 28 MB of JSON packs to 6.7 MB at level 1 in ~1 s,
// to 6.2 MB at level 6 in ~5 s).
const LEVEL9_MAX_VALUES = 1 << 17;
const LEVEL6_MAX_VALUES = 1 << 19;

/** DEFLATE level for a link carrying `values` curve numbers (see above). */
export function levelFor(values: number): 9 | 6 | 1 {
  return values <= LEVEL9_MAX_VALUES ? 9 : values <= LEVEL6_MAX_VALUES ? 6 : 1;
}

/** Thrown while packing once the link is certain to exceed the caller's length limit. */
export class OverLimit extends Error {}

/**
 * Packs the compact JSON as it is written: at level 9 it is held and packed in one go at the end; at lower
 * levels (large payloads) it streams through the deflater, and with a byte limit packing stops as soon as
 * the packed output passes it, so a project far too large costs about the limit's worth of work.
 */
export class Packer {
  private raw: Uint8Array[] = [];
  private rawBytes = 0;
  private out: Uint8Array[] = [];
  private outBytes = 0;
  private readonly deflater: Deflate | undefined;

  constructor(
    private readonly level: 9 | 6 | 1,
    private readonly maxOutBytes: number,
  ) {
    if (level !== 9) {
      this.deflater = new Deflate({ level }, (data) => {
        this.out.push(data);
        this.outBytes += data.length;
      });
    }
  }

  push(chunk: Uint8Array): void {
    if (this.deflater) {
      this.deflater.push(chunk);
      if (this.outBytes > this.maxOutBytes) throw new OverLimit();
      return;
    }
    this.raw.push(chunk);
    this.rawBytes += chunk.length;
  }

  finish(): Uint8Array {
    if (this.deflater) this.deflater.push(new Uint8Array(0), true);
    const packed = this.deflater
      ? concatBytes(this.out, this.outBytes)
      : deflateSync(concatBytes(this.raw, this.rawBytes), { level: this.level });
    if (packed.length > this.maxOutBytes) throw new OverLimit();
    return packed;
  }
}

function concatBytes(parts: readonly Uint8Array[], total: number): Uint8Array {
  if (parts.length === 1 && parts[0].length === total) return parts[0];
  const all = new Uint8Array(total);
  let o = 0;
  for (const p of parts) {
    all.set(p, o);
    o += p.length;
  }
  return all;
}

class TooBig extends Error {}

const SCRATCH_BYTES = 256 * 1024;
let scratch: Uint8Array | undefined;

/** Outcome of {@link inflateWithCap}: the bytes, or why not (with how many bytes were unpacked before stopping). */
export type InflateResult =
  { ok: true; bytes: Uint8Array } | { ok: false; reason: "too-big" | "damaged"; inflatedBytes: number };

/**
 * Inflate raw DEFLATE, stopping as soon as the output passes `capBytes`. DEFLATE expands at most ~1032× per
 * input byte, and the input is fed in steps of at most (room left under the cap) / 1032 bytes, never below
 * 1 KiB, so at most ~1 MiB is unpacked past the cap.
 * @param capBytes most output bytes accepted. @default LINK_MAX_DECODED_BYTES
 */
export function inflateWithCap(data: Uint8Array, capBytes: number = LINK_MAX_DECODED_BYTES): InflateResult {
  if (data.length === 0) return { ok: false, reason: "damaged", inflatedBytes: 0 };
  // Most links unpack to a few kB: inflate into a reused buffer, which spares fflate's per-call growth buffers
  // (≥ 128 kB each). fflate stops writing at the end of a given buffer, so a result that fills it completely
  // may be cut off: then inflate again with the streaming path below, which has no such limit but the cap.
  if (data.length < SCRATCH_BYTES / 2 && SCRATCH_BYTES <= capBytes) {
    scratch ??= new Uint8Array(SCRATCH_BYTES);
    let out: Uint8Array;
    try {
      out = inflateSync(data, { out: scratch });
    } catch {
      return { ok: false, reason: "damaged", inflatedBytes: 0 };
    }
    if (out.length < SCRATCH_BYTES) return { ok: true, bytes: out === scratch ? out.slice() : out };
  }
  const chunks: Uint8Array[] = [];
  let total = 0;
  const inflater = new Inflate((chunk) => {
    total += chunk.length;
    if (total > capBytes) throw new TooBig();
    chunks.push(chunk);
  });
  try {
    for (let i = 0; i < data.length;) {
      // No step can unpack to more than the room left under the cap (≤ 1032 bytes per input byte), except at
      // the 1 KiB floor near the cap; larger steps far from it spare fflate's per-push window copies.
      const step = Math.max(1024, Math.min(1 << 20, Math.floor((capBytes - total) / 1032)));
      const end = Math.min(data.length, i + step);
      inflater.push(data.subarray(i, end), end >= data.length);
      i = end;
    }
  } catch (e) {
    return { ok: false, reason: e instanceof TooBig ? "too-big" : "damaged", inflatedBytes: total };
  }
  const out = new Uint8Array(total);
  let o = 0;
  for (const c of chunks) {
    out.set(c, o);
    o += c.length;
  }
  return { ok: true, bytes: out };
}
