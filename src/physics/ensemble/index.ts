// Model spaces of the physics core: heavy-quark ensembles (with the Landau-pole criterion) and charge scans.
export { heavyQuarkEnsemble, multisetCount, MAX_MULTISETS } from "./ensemble";
export type { EnsembleOpts, EnsembleResult, EnsembleValue } from "./ensemble";
export { ensembleReps, heavyQuarkFermions, HEAVY_QUARK_TAGS } from "./heavy-quarks";
export { landauCheck, runningShare, LANDAU_DEFAULTS } from "./running";
export type { LandauPoleOpts } from "./running";
export { scanAnomaly, parseScanField, MAX_SCAN_COMBINATIONS } from "./scan";
export type { ScanFermion, ScanResult, ScanFieldParse } from "./scan";
