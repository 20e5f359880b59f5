import { z } from 'zod';
import { hullLinesSchema } from './hull-schema';
import { partsSchema } from './part-schema';

/**
 * The plan document of a hull: its lines (stations, offsets, skin, deck) and its parts (frames, layers,
 * longitudinals, notches). One schema validates it in the editor, on the server before every write, and
 * on every load after the upgrades below.
 */
export const PLAN_SCHEMA_VERSION = 1;

export const planSchema = z.object({
  schemaVersion: z.literal(PLAN_SCHEMA_VERSION),
  lines: hullLinesSchema,
  parts: partsSchema,
});
export type Plan = z.infer<typeof planSchema>;
export type PlanInput = z.input<typeof planSchema>;
