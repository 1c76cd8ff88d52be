// PQ charges from the Lagrangian: the term syntax, the gauge check and the exact solver.
export { solvePqCharges } from "./solve";
export { parseTerm, formatTerm, type TermParse } from "./syntax";
export type * from "./types";
