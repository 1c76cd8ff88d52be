// The version the command line writes into its files (PDF creator), from package.json at build time.
import pkg from "../../package.json" with { type: "json" };

export const AXBAND_VERSION: string = pkg.version;
