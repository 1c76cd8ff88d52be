// Lint rules for axband (run by `npm run lint`): typescript-eslint's recommended set, React hooks rules
// for the UI, and a fence that keeps the pure cores (physics, data, plot) free of React, the DOM and the store.
import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";

const pureCoreFence = {
  patterns: [
    {
      group: ["react", "react-dom", "react-dom/*", "zustand", "zustand/*"],
      message: "Pure cores must not import React or the store.",
    },
    { group: ["**/ui/**", "**/ui", "**/worker/**"], message: "Pure cores must not import the UI or the worker." },
  ],
};

const LAYERS = ["physics", "project", "analysis", "plot", "formats"];
function layerFences() {
  return LAYERS.slice(0, -1).map((layer, i) => ({
    files: [`src/${layer}/**/*.ts`],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            ...pureCoreFence.patterns,
            {
              group: [...LAYERS.slice(i + 1), "data", "cli"].map((above) => `**/${above}/**`),
              message: `src/${layer} sits below ${LAYERS.slice(i + 1).join(", ")}: it must not import them.`,
            },
          ],
        },
      ],
    },
  }));
}

export default tseslint.config(
  { ignores: ["**/dist/**", "**/node_modules/**", "**/.out/**", "**/.artifacts/**"] },
  {
    files: ["**/*.{ts,tsx,mjs,js}"],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    languageOptions: { ecmaVersion: 2023, sourceType: "module" },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/no-explicit-any": "error",
    },
  },
  {
    files: ["src/ui/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks },
    rules: { "react-hooks/rules-of-hooks": "error", "react-hooks/exhaustive-deps": "warn" },
  },
  {
    files: [
      "src/physics/**/*.ts",
      "src/project/**/*.ts",
      "src/analysis/**/*.ts",
      "src/plot/**/*.ts",
      "src/formats/**/*.ts",
      "src/data/**/*.ts",
    ],
    languageOptions: { globals: {} },
    rules: {
      "no-restricted-imports": ["error", pureCoreFence],
      // The cores run in plain Node: no DOM globals at all.
      "no-restricted-globals": ["error", "window", "document", "navigator", "localStorage", "HTMLElement", "location"],
    },
  },
  // Layers point one way: physics <- project <- analysis <- plot <- formats (file input and output may draw).
  ...layerFences(),
  {
    files: ["bench/**/*.{mjs,js}", "tests/**/*.mjs", ".ci/**/*.mjs"],
    languageOptions: {
      globals: {
        process: "readonly",
        console: "readonly",
        URL: "readonly",
        performance: "readonly",
        setTimeout: "readonly",
        Buffer: "readonly",
      },
    },
  },
);
