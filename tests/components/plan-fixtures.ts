import type { RevisionSummary } from '../../shared/api/plan';
import { planSchema, PLAN_SCHEMA_VERSION, type Plan } from '../../shared/geometry/plan-schema';
import { planEmpty } from '../../shared/geometry/plan';
import type { Handlers, Reply } from './api-stub';

// Invented offsets for the tests: four stations, a waterline and a chine; nothing to build a boat from.
export function smallPlan(): Plan {
  return planSchema.parse({
    schemaVersion: PLAN_SCHEMA_VERSION,
    lines: {
      notation: { unit: 'mm', precision: '0.5mm' },
      stations: [
        { id: 'st-1', name: 'St 1', x: 600 },
        { id: 'st-2', name: 'St 2', x: 1200 },
        { id: 'st-3', name: 'St 3', x: 1800 },
        { id: 'st-4', name: 'St 4', x: 2400 },
      ],
      lines: [
        // On one parabola, so the fairness check has nothing to say about it.
        { id: 'ln-wl', name: 'WL 300', kind: 'waterline', z: 300, cells: { 'st-1': 300, 'st-2': 450, 'st-3': 500, 'st-4': 450 } },
        { id: 'ln-chine', name: 'Chine', kind: 'point', role: 'chine', knuckle: { fromX: null, toX: null }, cells: { 'st-1': { y: 300, z: 250 }, 'st-2': { y: 560, z: 180 }, 'st-3': null, 'st-4': null } },
      ],
      skin: { offsetsTo: 'outside', defaultThicknessMm: 6 },
    },
    parts: {},
  });
}

export function revision(id: number, overrides: Partial<RevisionSummary> = {}): RevisionSummary {
  return { id, hullId: 3, baseRevisionId: id > 1 ? id - 1 : null, authorId: 1, authorName: 'Ann Marsh', summary: `Revision ${id}`, createdAt: '2025-04-11T16:40:00.000Z', bytes: 2000, ...overrides };
}

/** The plan routes of hull `hullId` as the server answers them: a latest revision (or none) and no draft unless given. */
export function planHandlers(hullId: number, options: { plan?: Plan; revision?: RevisionSummary | null; draft?: { baseRevisionId: number | null; plan: Plan; updatedAt: string } | null } = {}): Handlers {
  const plan = options.plan ?? planEmpty('mm');
  const latest: Reply = { body: { revision: options.revision === undefined ? null : options.revision, plan } };
  return {
    [`GET /api/hulls/${hullId}/plan`]: latest,
    [`GET /api/hulls/${hullId}/plan/draft`]: { body: { draft: options.draft ?? null } },
    [`PUT /api/hulls/${hullId}/plan/draft`]: { body: { draft: { updatedAt: '2025-04-12T08:30:00.000Z' } } },
  };
}
