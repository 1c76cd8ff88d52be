// The calculator model source keeps the scalars and terms its charges were solved from: files with them
// validate, files without them (older ones) still do, and a link carries them unchanged.
import { describe, expect, it } from "vitest";
import { defaultFigure, defaultPhysics, newModel, restoreProject } from "../../src/data/index";
import { decodeLink, encodeLink } from "../../src/formats/codec";
import { PROJECT_VERSION, type Project } from "../../src/project/types";

// The heavy-quark model (3,1,0) with the Yukawa Φ Q̄_L Q_R (Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801).
const source = {
  kind: "calculator" as const,
  fermions: [
    { name: "Q_L", colour: "3", ew: { kind: "sm" as const, dim: 1, y: "0" }, chirality: "L" as const, pq: "1" },
    { name: "Q_R", colour: "3", ew: { kind: "sm" as const, dim: 1, y: "0" }, chirality: "R" as const, pq: "0" },
  ],
  scalarCharge: "1",
  scalars: [{ name: "Phi", ew: { kind: "sm" as const, dim: 1, y: "0" } }],
  terms: ["Qbar_L Phi Q_R"],
  forbidden: ["Qbar_L Q_R"],
  normalize: "Phi",
};

function project(s: Project["models"][number]["source"]): Project {
  return {
    version: PROJECT_VERSION,
    name: "charges",
    physics: defaultPhysics(),
    models: [newModel({ id: "m", eOverNMin: "0", eOverNMax: "0", label: "KSVZ (3,1,0)", source: s })],
    curves: [],
    figure: defaultFigure(),
  };
}

describe("calculator source with terms", () => {
  it("validates with and without the optional scalars, terms, forbidden and normalize", () => {
    const withTerms = restoreProject(JSON.parse(JSON.stringify(project(source))));
    expect(withTerms.ok && withTerms.project.models[0].source).toEqual(source);
    const { scalars: _s, terms: _t, forbidden: _f, normalize: _n, ...old } = source;
    const without = restoreProject(JSON.parse(JSON.stringify(project(old))));
    expect(without.ok && without.project.models[0].source).toEqual(old);
  });
  it("a link carries the terms unchanged", () => {
    const d = decodeLink(encodeLink(project(source)));
    expect(d.ok && d.project.models[0].source).toEqual(source);
  });
});
