// Writes an autosave holding one big invented closed region (project text in localStorage, curve chunks in
// IndexedDB) exactly as the app stores it: for the browser tests that restore a big curve and bench/region-zoom.mjs.
import type { Page } from "playwright-core";
import { emptyProject, newCurve, serializeForStorage } from "../../src/data";
import { CHUNK_POINTS, STORAGE_KEY, chunkKey } from "../../src/ui/store/autosave";

/**
 * An invented contour about m = 3×10⁻⁵ eV, g = 10⁻¹² GeV⁻¹ in log-log space (1.2 decades by 0.8 decades), point i
 * at angle a = 2πi/points with radius r = 1 + wobble·sin(wobbleTurns·a + i/wobblePeriodPoints) + noise·h(i),
 * h a fixed hash in (−1, 1) (not Math.random, so every run draws the same curve).
 */
export interface InventedContour {
  points: number;
  wobble: number;
  /** Whole wobbles around the contour (0: none tied to the angle). */
  wobbleTurns: number;
  /** A wobble every this many points along the file (Infinity: none). */
  wobblePeriodPoints: number;
  noise: number;
}

export interface StoredRegion {
  curveId: string;
  label: string;
  projectName: string;
  contour: InventedContour;
  /** The figure's view; the app's default when left out. */
  massRangeEv?: [number, number];
  yRange?: [number, number];
}

/**
 * Writes the autosave from a same-origin page that does not run the app (the demo project file), so nothing saves
 * over it before the caller loads the app. A fixed legend place: the tests and the bench are about the curve's
 * preparation and drawing, and the automatic placement's first run would add its own work to the first drawing.
 */
export async function seedStoredRegion(page: Page, baseUrl: string, region: StoredRegion): Promise<void> {
  const project = emptyProject(region.projectName);
  project.curves = [newCurve({ id: region.curveId, label: region.label, role: "region" })];
  project.figure.legend = "top-right";
  if (region.massRangeEv) project.figure.massRangeEv = region.massRangeEv;
  if (region.yRange) project.figure.yRange = region.yRange;
  const { points } = region.contour;
  const chunkKeys = Array.from({ length: Math.ceil(points / CHUNK_POINTS) }, (_, k) => chunkKey(region.curveId, k));
  await page.goto(baseUrl + "demo.axband.json", { waitUntil: "load" });
  await page.evaluate(
    async ({ meta, key, id, contour, chunk, chunkKeys }) => {
      localStorage.setItem(key, meta);
      const db = await new Promise<IDBDatabase>((resolve, reject) => {
        const req = indexedDB.open("axband", 1);
        req.onupgradeneeded = () => req.result.createObjectStore("curves");
        req.onsuccess = () => resolve(req.result);
        req.onerror = () => reject(req.error);
      });
      const tx = db.transaction("curves", "readwrite");
      const store = tx.objectStore("curves");
      const { points, wobble, wobbleTurns, wobblePeriodPoints, noise } = contour;
      for (let k = 0; k < chunkKeys.length; k++) {
        const n = Math.min(chunk, points - k * chunk);
        const massEv = new Float64Array(n);
        const gInvGeV = new Float64Array(n);
        for (let j = 0; j < n; j++) {
          const i = k * chunk + j;
          const a = (2 * Math.PI * i) / points;
          const hash = noise ? (Math.sin(i * 12.9898) * 43758.5453) % 1 : 0;
          const r = 1 + wobble * Math.sin(wobbleTurns * a + i / wobblePeriodPoints) + noise * hash;
          massEv[j] = 10 ** (-4.5 + 1.2 * r * Math.cos(a));
          gInvGeV[j] = 10 ** (-12 + 0.8 * r * Math.sin(a));
        }
        store.put({ massEv, gInvGeV }, chunkKeys[k]);
      }
      store.put({ v: 1, length: points, chunks: chunkKeys.length }, id);
      await new Promise<void>((resolve, reject) => {
        tx.oncomplete = () => resolve();
        tx.onerror = () => reject(tx.error);
      });
      db.close();
    },
    {
      meta: serializeForStorage(project).meta,
      key: STORAGE_KEY,
      id: region.curveId,
      contour: region.contour,
      chunk: CHUNK_POINTS,
      chunkKeys,
    },
  );
}
