// Public face of the physics core: pure functions of plain numbers, loadable in plain Node.
export * from "./constants";
export * from "./coupling";
export * from "./model-set";
export * from "./rational";
export * from "./su3";
export * from "./anomaly";
export * from "./catalogue";
export * from "./eovern-parse";
export * from "./ensemble";
export type * from "./anomaly-types";
export * from "./charges";
export * from "./beta";
