import { PLAN_SCHEMA_VERSION, planSchema, type Plan } from './plan-schema';
import type { LengthUnit } from './notation-schema';

/**
 * One upgrade step: turns a document of version `from` into version `from + 1`. Steps are plain
 * functions on plain JSON, applied in order; each is tested with a document of its old version.
 */
export interface PlanUpgradeStep {
  from: number;
  upgrade: (doc: Record<string, unknown>) => Record<string, unknown>;
}

/** The project's upgrade steps, oldest first. Version 1 is the first stored version: none yet. */
export const PLAN_UPGRADES: readonly PlanUpgradeStep[] = [];

/** Result of reading a stored or imported document. */
export type PlanRead = { ok: true; plan: Plan; upgradedFrom: number | null } | { ok: false; issues: { field: string; message: string }[] };

export type DocumentUpgrade = { ok: true; doc: Record<string, unknown>; from: number } | { ok: false; issues: { field: string; message: string }[] };

/**
 * Bring a document of any known version up to `currentVersion` by applying `steps` in order (1 → 2 →
 * ...). A document from a newer Loftbench, without a version, or with a missing step, is refused.
 */
export function documentUpgrade(doc: unknown, steps: readonly PlanUpgradeStep[], currentVersion: number): DocumentUpgrade {
  if (typeof doc !== 'object' || doc === null || Array.isArray(doc)) return { ok: false, issues: [{ field: '', message: 'a plan document must be a JSON object' }] };
  let current = doc as Record<string, unknown>;
  const version = current.schemaVersion;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) {
    return { ok: false, issues: [{ field: 'schemaVersion', message: `schemaVersion must be a whole number from 1 to ${currentVersion}, found ${JSON.stringify(version)}` }] };
  }
  if (version > currentVersion) {
    return { ok: false, issues: [{ field: 'schemaVersion', message: `this document was written by a newer Loftbench (schema ${version}; this one reads up to ${currentVersion})` }] };
  }
  for (let v = version; v < currentVersion; v += 1) {
    const step = steps.find((s) => s.from === v);
    if (!step) return { ok: false, issues: [{ field: 'schemaVersion', message: `no upgrade from schema version ${v}` }] };
    current = { ...step.upgrade(current), schemaVersion: v + 1 };
  }
  return { ok: true, doc: current, from: version };
}

/** Read a stored or imported plan document: upgrade it to the current version, then validate it. */
export function planRead(doc: unknown): PlanRead {
  const upgraded = documentUpgrade(doc, PLAN_UPGRADES, PLAN_SCHEMA_VERSION);
  if (!upgraded.ok) return upgraded;
  const parsed = planSchema.safeParse(upgraded.doc);
  if (!parsed.success) {
    return { ok: false, issues: parsed.error.issues.map((i) => ({ field: i.path.map(String).join('.'), message: i.message })) };
  }
  return { ok: true, plan: parsed.data, upgradedFrom: upgraded.from === PLAN_SCHEMA_VERSION ? null : upgraded.from };
}

/** An empty plan for a new hull: no stations, no lines, skin to the outside, no deck. */
export function planEmpty(unit: LengthUnit = 'mm'): Plan {
  return planSchema.parse({
    schemaVersion: PLAN_SCHEMA_VERSION,
    lines: {
      notation: { unit, precision: unit === 'mm' ? '0.5mm' : '1/16in' },
      stations: [],
      lines: [],
      skin: { offsetsTo: 'outside', defaultThicknessMm: 6 },
    },
    parts: {},
  });
}
