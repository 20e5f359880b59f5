import { z } from 'zod';
import { notationSchema } from './notation-schema';
import { camberSchema } from './camber-schema';

/**
 * The hull's lines as plain data: stations, the table of offsets, skin and deck. All lengths millimetres,
 * angles radians. Cells are keyed by station id so that moving a station keeps its offsets with it.
 */

const id = z.string().min(1).max(64);
const finite = z.number().refine(Number.isFinite, { message: 'must be a finite number' });
const length = finite;
const thickness = finite.refine((n) => n >= 0, { message: 'thickness cannot be negative' });

/** A station: a named transverse plane at x (mm from the datum, increasing aft or forward as the hull states). */
export const stationSchema = z.object({ id, name: z.string().trim().min(1).max(40), x: length });
export type Station = z.infer<typeof stationSchema>;

/** Where a line is a knuckle (a corner in every section it crosses); null ends mean "from the first / to the last station". */
export const knuckleSchema = z.object({
  fromX: length.nullable().default(null),
  toX: length.nullable().default(null),
});

const lineBase = {
  id,
  name: z.string().trim().min(1).max(40),
  /** Corner in every section it crosses, between fromX and toX; null when the line is smooth. */
  knuckle: knuckleSchema.nullable().default(null),
};

/** A waterline: a fixed height z (mm); cells are half-breadths (mm). */
export const waterlineSchema = z.object({
  ...lineBase,
  kind: z.literal('waterline'),
  z: length,
  cells: z.record(z.string(), length.nullable()),
});
/** A buttock: a fixed half-breadth y (mm); cells are heights (mm). */
export const buttockSchema = z.object({
  ...lineBase,
  kind: z.literal('buttock'),
  y: length,
  cells: z.record(z.string(), length.nullable()),
});
/**
 * A diagonal: a fixed straight line in the section plane, from a point on the centreline at height
 * `originZ` (mm) going outboard and down at `angle` (radians below the horizontal); cells are distances
 * (mm) from that point along the line.
 */
export const diagonalSchema = z.object({
  ...lineBase,
  kind: z.literal('diagonal'),
  originZ: length,
  angle: finite,
  cells: z.record(z.string(), length.nullable()),
});
/** A point line (sheer, chine, keel/rabbet, any other): each cell a half-breadth and a height (mm). */
export const pointLineSchema = z.object({
  ...lineBase,
  kind: z.literal('point'),
  role: z.enum(['sheer', 'chine', 'keel', 'other']),
  cells: z.record(z.string(), z.object({ y: length, z: length }).nullable()),
});

export const lineSchema = z.discriminatedUnion('kind', [waterlineSchema, buttockSchema, diagonalSchema, pointLineSchema]);
export type Line = z.infer<typeof lineSchema>;
export type Waterline = z.infer<typeof waterlineSchema>;
export type Buttock = z.infer<typeof buttockSchema>;
export type Diagonal = z.infer<typeof diagonalSchema>;
export type PointLine = z.infer<typeof pointLineSchema>;

/**
 * A skin panel: the band of the section between two point lines (null `fromLineId` = the keel or
 * centreline, null `toLineId` = the sheer) and its skin thickness (mm).
 */
export const skinPanelSchema = z.object({
  name: z.string().trim().min(1).max(40),
  fromLineId: id.nullable(),
  toLineId: id.nullable(),
  thicknessMm: thickness,
});

/** Skin: whether offsets are to the outside or the inside of it, its thickness per panel, and sheathing (mm). */
export const skinSchema = z.object({
  offsetsTo: z.enum(['outside', 'inside']).default('outside'),
  defaultThicknessMm: thickness,
  panels: z.array(skinPanelSchema).default([]),
  sheathingMm: thickness.default(0),
});
export type Skin = z.infer<typeof skinSchema>;

/** The deck: camber, thickness, and where the beam at a station is measured. */
export const deckSchema = z.object({
  camber: camberSchema,
  thicknessMm: thickness,
  /** `sheer-outside`: the beam is the sheer's half-breadth outside the skin; `inside-clamp`: inside the clamp. */
  beamAt: z.enum(['sheer-outside', 'inside-clamp']).default('sheer-outside'),
  /** Width of the clamp (mm), used when beamAt is inside-clamp. */
  clampWidthMm: thickness.default(0),
});
export type Deck = z.infer<typeof deckSchema>;

/** The hull's lines: everything the surface is built from. */
export const hullLinesSchema = z.object({
  notation: notationSchema,
  stations: z.array(stationSchema),
  lines: z.array(lineSchema),
  skin: skinSchema,
  deck: deckSchema.nullable().default(null),
  /**
   * Which way x increases: toward the stern (`aft`, stations counted from the bow) or toward the bow.
   * Needed to say which face of a frame is forward, and so whether a bevel is under or standing.
   */
  xDirection: z.enum(['aft', 'forward']).default('aft'),
  /** Height (mm above baseline) of the design waterline, drawn on templates. */
  designWaterlineZ: length.nullable().default(null),
});
export type HullLines = z.infer<typeof hullLinesSchema>;
export type HullLinesInput = z.input<typeof hullLinesSchema>;
