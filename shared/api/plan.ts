import { z } from 'zod';
import { planSchema, type Plan } from '../geometry/plan-schema';
import type { PlanChange } from '../geometry/plan-compare';
import { lengthUnitSchema, sixteenthMarksSchema } from '../geometry/notation-schema';

const revisionId = z.number().int().positive().nullable();

/** Body of POST /api/hulls/:hullId/plan/revisions: save the plan as a new revision on top of `baseRevisionId`. */
export const savePlanSchema = z.object({
  baseRevisionId: revisionId,
  plan: planSchema,
  summary: z.string().trim().max(500).optional(),
});
export type SavePlanInput = z.input<typeof savePlanSchema>;

/** Body of PUT /api/hulls/:hullId/plan/draft: the autosave. */
export const saveDraftSchema = z.object({ baseRevisionId: revisionId, plan: planSchema });
export type SaveDraftInput = z.input<typeof saveDraftSchema>;

/** Body of POST /api/hulls/:hullId/plan/revisions/:revisionId/restore. */
export const restoreRevisionSchema = z.object({ baseRevisionId: revisionId });

/** Body of POST /api/hulls/:hullId/copy: "save my change as a copy of the hull" after a conflict. */
export const copyHullSchema = z.object({ name: z.string().trim().min(1).max(120), plan: planSchema.optional() });

/** Body of PATCH /api/hulls/:hullId: rename. */
export const renameHullSchema = z.object({ name: z.string().trim().min(1, { message: 'Give the hull a name' }).max(120) });

/**
 * Form fields of POST /api/hulls/:hullId/plan/import/offsets (multipart, the CSV in field `file`).
 * The units and notation are a required choice: a table of offsets is never guessed.
 */
export const importOffsetsFieldsSchema = z.object({
  baseRevisionId: z.union([z.literal(''), z.coerce.number().int().positive()]).transform((v) => (v === '' ? null : v)),
  unit: lengthUnitSchema,
  decimalComma: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  sixteenthMarks: sixteenthMarksSchema.default('plus-sixteenth'),
});

/** Body of POST /api/hulls/:hullId/plan/import/json. */
export const importPlanJsonSchema = z.object({ baseRevisionId: revisionId, document: z.unknown() });

/** A saved revision as listed in the history. */
export interface RevisionSummary {
  id: number;
  hullId: number;
  baseRevisionId: number | null;
  authorId: number;
  authorName: string;
  summary: string;
  createdAt: string;
  bytes: number;
}

/** GET /api/hulls/:hullId/plan and GET .../plan/revisions/:id. `revision` is null before the first save. */
export interface PlanResponse {
  revision: RevisionSummary | null;
  plan: Plan;
}

/** GET /api/hulls/:hullId/plan/draft. */
export interface DraftResponse {
  draft: { baseRevisionId: number | null; plan: Plan; updatedAt: string } | null;
}

/** GET /api/hulls/:hullId/plan/compare?from=&to= */
export interface CompareResponse {
  from: number;
  to: number;
  changes: PlanChange[];
}

/** One bad cell of an imported CSV: where it is (1-based row and column) and what is wrong. */
export interface CsvCellIssue {
  row: number;
  column: number;
  columnName: string;
  field: string;
  value: string;
  message: string;
}
