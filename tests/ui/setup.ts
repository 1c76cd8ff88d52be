// Setup for component tests in jsdom: jest-dom matchers, a clean DOM after each test, and the time a findBy or
// waitFor may wait for its condition: a margin, not a measurement (parts of the page load on first use, and the
// first load of a module in a test run includes its transform, a second or more on a busy machine).
import "@testing-library/jest-dom/vitest";
import { afterEach } from "vitest";
import { cleanup, configure } from "@testing-library/react";

configure({ asyncUtilTimeout: 15_000 });

afterEach(() => cleanup());
