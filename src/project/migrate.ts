// Schema versions and the migration chain: a registry of steps, each turning a version-n project object
// into a version-(n+1) one, so every file or link ever written keeps opening after the schema changes.
import { isPlainObject } from "./json";
import { kindOfRange } from "./model-kind";
import { isRationalText } from "./rational-text";
import { PROJECT_VERSION } from "./types";

/** Version of the project schema this build writes (and the newest it reads). */
export const CURRENT_VERSION: number = PROJECT_VERSION;

/** One step: a plain JSON object of version n in, a plain JSON object of version n + 1 out (never mutate the input). */
export type Migration = (old: Record<string, unknown>) => Record<string, unknown>;

/**
 * v1 → v2: models gain a kind. A v1 model drew one line when both ends had the same value and the continuous
 * interval otherwise, so it becomes "line" or "interval" (no members; set fields at their defaults), and
 * draws exactly what it drew. Models whose E/N is unreadable are left for the restore step to report.
 */
function v1ToV2(v1: Record<string, unknown>): Record<string, unknown> {
  const models = Array.isArray(v1.models) ? v1.models.map(modelV1ToV2) : v1.models;
  return { ...v1, version: 2, models };
}

function modelV1ToV2(m: unknown): unknown {
  if (typeof m !== "object" || m === null || Array.isArray(m)) return m;
  const r = m as Record<string, unknown>;
  const min = r.eOverNMin;
  const max = r.eOverNMax ?? min;
  const readable = typeof min === "string" && typeof max === "string" && isRationalText(min) && isRationalText(max);
  return {
    ...r,
    ...(readable ? { kind: kindOfRange(min, max) } : {}),
    members: [],
    setDraw: "extremes",
    setShare: 0.68,
  };
}

/**
 * MIGRATIONS[n] upgrades version n to n + 1. Every step keeps its golden links and files under
 * tests/project/golden/vN, which must still decode through the chain.
 */
export const MIGRATIONS: Readonly<Record<number, Migration>> = { 1: v1ToV2 };

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
