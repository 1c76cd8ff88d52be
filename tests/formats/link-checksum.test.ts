// Link format v3's checksum: every single-bit change of a link is refused with a message (the current project
// is kept by the callers), older v1 links still open but say they are unverified. The repro links are share
// links damaged by one bit in the wild (issue 16): a v1 link has no way to notice.
import { Buffer } from "node:buffer";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { crc32 as zlibCrc32 } from "node:zlib";
import { describe, expect, it } from "vitest";
import { decodeLink, encodeLink, projectsEqual } from "../../src/data/index";
import type { Project } from "../../src/project/types";
import { linkPayload } from "./link-parts";

const REPRO = join(import.meta.dirname, "repro", "links");
const repro = (name: string) => readFileSync(join(REPRO, `${name}.txt`), "utf8").trim();

/** The project a damaged v1 repro link was made from: its one damaged value put back by hand. */
function undamaged(name: "flip_en" | "flip_mass"): Project {
  const r = decodeLink(repro(name));
  if (!r.ok) throw new Error(r.error);
  const p = r.project;
  if (name === "flip_en") {
    // One flipped bit turned "8/3" into "9/3" (issue 16).
    expect(p.models[0].eOverNMin).toBe("9/3");
    p.models[0] = { ...p.models[0], eOverNMin: "8/3", eOverNMax: "8/3" };
  } else {
    // One flipped bit turned masses 1e-6, 2e-6, 5e-6, 1e-5 eV into 8.000001 … eV (issue 16).
    expect(Array.from(p.curves[0].massEv)).toEqual([8.000001, 8.000002, 8.000005, 8.00001]);
    p.curves[0] = { ...p.curves[0], massEv: Float64Array.of(1e-6, 2e-6, 5e-6, 1e-5) };
  }
  return p;
}

/** Every link that differs from `link` in exactly one of the seven low bits of one character. */
function singleBitChanges(link: string): string[] {
  const out: string[] = [];
  for (let i = 0; i < link.length; i++)
    for (let b = 0; b < 7; b++)
      out.push(link.slice(0, i) + String.fromCharCode(link.charCodeAt(i) ^ (1 << b)) + link.slice(i + 1));
  return out;
}

describe("link checksum (format v3)", () => {
  it("the checksum is CRC-32 of the text before it, big-endian, in base64url (checked with zlib's crc32)", () => {
    const link = encodeLink(undamaged("flip_en"));
    const at = link.lastIndexOf(".");
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(zlibCrc32(Buffer.from(link.slice(0, at), "ascii")));
    expect(link.slice(at + 1)).toBe(crc.toString("base64url"));
    expect(linkPayload(link).length).toBe(at - 3);
  });

  for (const name of ["flip_en", "flip_mass"] as const) {
    it(`refuses every single-bit change of the ${name} project's link with a message`, () => {
      const project = undamaged(name);
      const link = encodeLink(project);
      const good = decodeLink(link);
      expect(good.ok && good.verified && projectsEqual(good.project, project)).toBe(true);
      const changed = singleBitChanges(link);
      expect(changed.length).toBe(link.length * 7);
      const opened = changed.filter((l) => decodeLink(l).ok);
      expect(opened).toEqual([]);
      for (const l of changed) {
        const r = decodeLink(l);
        if (!r.ok) expect(r.error).toMatch(/^This (link|is not an axband project link)/);
      }
    });
  }

  it("refuses every cut-off copy and every swap of two neighbouring characters", () => {
    const link = encodeLink(undamaged("flip_mass"));
    for (let n = 0; n < link.length; n++) expect(decodeLink(link.slice(0, n)).ok).toBe(false);
    for (let i = 3; i + 1 < link.length; i++) {
      if (link[i] === link[i + 1]) continue;
      expect(decodeLink(link.slice(0, i) + link[i + 1] + link[i] + link.slice(i + 2)).ok).toBe(false);
    }
  });

  it("a wrong checksum is named as such", () => {
    const link = encodeLink(undamaged("flip_en"));
    const bad = `${link.slice(0, 10)}${link[10] === "A" ? "B" : "A"}${link.slice(11)}`;
    const r = decodeLink(bad);
    expect(!r.ok && r.error).toMatch(/damaged \(its checksum does not match/);
    const noSum = decodeLink(link.slice(0, link.lastIndexOf(".")));
    expect(!noSum.ok && noSum.error).toMatch(/checksum is missing/);
  });

  it("v1 links (no checksum) still open, marked as unverified; the damaged repro links show what v1 cannot see", () => {
    for (const name of ["flip_en", "flip_mass"]) {
      const r = decodeLink(repro(name));
      expect(r.ok).toBe(true);
      if (r.ok) expect(r.verified).toBe(false);
    }
  });
});
