import { z } from 'zod';

/**
 * How the crown of the deck is given: a rise at a reference beam, a percentage of the beam, or a rise per
 * foot of beam (inches per foot, the usual way in imperial specifications).
 */
export const crownSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('rise'), riseMm: z.number().nonnegative(), referenceBeamMm: z.number().positive() }),
  z.object({ kind: z.literal('percent-of-beam'), percent: z.number().nonnegative().max(50) }),
  z.object({ kind: z.literal('per-foot'), inchesPerFoot: z.number().nonnegative().max(6) }),
]);
export type Crown = z.infer<typeof crownSchema>;

/**
 * A designer's own camber curve, normalised: t from 0 at the centreline to 1 at the beam's edge, h the
 * rise as a fraction of the crown, 1 at t = 0 falling to 0 at t = 1.
 */
export const customCamberPointSchema = z.object({ t: z.number().min(0).max(1), h: z.number().min(-0.5).max(1.5) });

/**
 * The deck's camber: shape, crown and convention. `one-pattern`: one curve cut for the widest (reference)
 * beam serves every station, each taking its middle part; `scaled`: the curve scaled to each station's beam.
 */
export const camberSchema = z.object({
  shape: z.enum(['arc', 'parabola', 'custom']).default('parabola'),
  points: z.array(customCamberPointSchema).default([]),
  crown: crownSchema,
  convention: z.enum(['one-pattern', 'scaled']).default('one-pattern'),
});
export type Camber = z.infer<typeof camberSchema>;
