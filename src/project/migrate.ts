// Schema versions and the migration chain: a registry of steps, each turning a version-n project object
// into a version-(n+1) one, so every file or link ever written keeps opening after the schema changes.
import { isPlainObject } from "./json";
import { PROJECT_VERSION } from "./types";

/** Version of the project schema this build writes (and the newest it reads). */
export const CURRENT_VERSION: number = PROJECT_VERSION;

/** One step: a plain JSON object of version n in, a plain JSON object of version n + 1 out (never mutate the input). */
export type Migration = (old: Record<string, unknown>) => Record<string, unknown>;

/**
 * MIGRATIONS[n] upgrades version n to n + 1. Version 1 is the first released schema, so the registry is empty;
 * when version 2 comes, add `1: (v1) => ({ ...v1, version: 2, … })`, a golden v2 link and file under
 * tests/project/golden/v2, and keep the v1 goldens (they must still decode, now through the new step).
 */
export const MIGRATIONS: Readonly<Record<number, Migration>> = {};

export type MigrateResult =
  | { ok: true; value: Record<string, unknown>; fromVersion: number }
  | { ok: false; reason: "not-object" | "no-version" | "future" | "failed"; version?: number; error: string };

export interface MigrateOpts {
  /** Steps to use (tests pass their own chain). @default MIGRATIONS */
  registry?: Readonly<Record<number, Migration>>;
  /** Version to migrate to. @default CURRENT_VERSION */
  target?: number;
}

/**
 * Bring a parsed project object to the current schema version. Checks only the version field; the content
 * is validated afterwards by the schema. Never throws.
 * @param raw a parsed project object (any version, untrusted)
 */
export function migrate(raw: unknown, opts: MigrateOpts = {}): MigrateResult {
  const registry = opts.registry ?? MIGRATIONS;
  const target = opts.target ?? CURRENT_VERSION;
  if (!isPlainObject(raw))
    return { ok: false, reason: "not-object", error: "this is not an axband project (expected an object)" };
  const version = raw.version;
  if (typeof version !== "number" || !Number.isInteger(version) || version < 1) {
    return { ok: false, reason: "no-version", error: "this is not an axband project (no valid version number)" };
  }
  if (version > target) {
    return {
      ok: false,
      reason: "future",
      version,
      error: `it was made by a newer version of axband (format v${version}); this version reads formats up to v${target}. Reload the page to get the newest axband, or ask the sender for a file from an older version`,
    };
  }
  let value = raw;
  for (let v = version; v < target; v++) {
    const step = Object.hasOwn(registry, v) ? registry[v] : undefined;
    if (!step) return { ok: false, reason: "failed", version, error: `no migration from format v${v} to v${v + 1}` };
    try {
      const next = step(value);
      if (!isPlainObject(next) || next.version !== v + 1) {
        return {
          ok: false,
          reason: "failed",
          version,
          error: `the migration from format v${v} did not produce format v${v + 1}`,
        };
      }
      value = next;
    } catch (e) {
      return {
        ok: false,
        reason: "failed",
        version,
        error: `it could not be upgraded from format v${v} (${e instanceof Error ? e.message : String(e)})`,
      };
    }
  }
  return { ok: true, value, fromVersion: version };
}
