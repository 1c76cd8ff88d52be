// Public face of the physics core: pure functions of plain numbers, loadable in plain Node.
export * from "./constants";
export * from "./coupling";
