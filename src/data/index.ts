// Project schema, migrations, share links, project files, storage form, state table, defaults and demo.
export * from "./ids";
export * from "./defaults";
export * from "./demo";
export * from "./migrate";
export * from "./schema";
export * from "./state-table";
export * from "./link";
export * from "./project-file";
export * from "./overlap";
export * from "./overlap-table";
export * from "./units";
export * from "./csv";
export * from "./rescale";
export * from "./curve-export";
export * from "./sources";
export * from "./bibtex";
export * from "./import-options";
