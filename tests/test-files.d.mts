// Types of tests/test-files.mjs for vite.config.ts.
export function mockingUiTests(): string[];
export function aloneBrowserTests(): string[];
