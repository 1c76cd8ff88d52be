// Curve CSV import: one pass over the text straight into Float64Arrays, chunk by chunk; delimiter, header,
// units and decimal mark are detected. Hand-written rather than a CSV library, so numbers go straight into arrays.
export * from "./types";
export { MAX_IMPORT_BYTES, checkImportFile, decodeImportBytes } from "./file-check";
export { readNumberText } from "./numbers";
export { createCurveParser, parseCurveText } from "./parser";
export * from "./source";
