// CRC-32 (the checksum of PNG, zlib and gzip), used by PNG chunks and by share links of format v3 and later.

let crcTable: Uint32Array | undefined;

/** Byte-wise table of the reflected CRC-32 polynomial 0xEDB88320 used by PNG (and zlib, gzip). */
function table(): Uint32Array {
  if (crcTable) return crcTable;
  crcTable = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    crcTable[n] = c >>> 0;
  }
  return crcTable;
}

/**
 * CRC-32 as PNG defines it (ISO/IEC 15948 Annex D): reflected polynomial 0xEDB88320, initial value and
 * final xor 0xFFFFFFFF. Returns an unsigned 32-bit integer.
 * @param start first byte included. @default 0
 * @param end one past the last byte included. @default bytes.length
 */
export function crc32(bytes: Uint8Array, start = 0, end = bytes.length): number {
  const t = table();
  let c = 0xffffffff;
  for (let i = start; i < end; i++) c = t[(c ^ bytes[i]) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}
