import { z } from 'zod';
import type { GeometryIssue } from './types';

/**
 * The parts cut for a hull as plain JSON: the longitudinals (defined once per hull) and every transverse
 * part (ring frame, bulkhead, partial bulkhead, floor, deck beam, half beam, building mould, raked transom,
 * hand-measured frame). Lengths millimetres, angles radians, ids strings. Every part names its station by
 * `stationId` (the hull's `stations[].id`), except a hand-measured frame, which carries its own x.
 *
 * Range checks that need one field live on the field (zod issue at its path, the value in the message);
 * checks across fields of one part (clearance against ring width, layers against the total thickness) are
 * `partIssues`, run by the schema as well so a stored plan can never hold them; checks against the hull
 * (does the station exist, does the line) are `partsIssues`, which needs the hull's lines.
 */

const id = z.string().min(1).max(64);
const name = z.string().trim().min(1).max(40);
const shown = (v: unknown): string => (typeof v === 'number' ? String(Number(v.toFixed(3))) : String(v));

/** A finite number; `what` names the field in the message. */
const finite = (what: string) =>
  z.number({ error: (iss) => `${what} must be a number, found ${shown(iss.input)}` }).refine(Number.isFinite, {
    error: (iss) => `${what} must be a finite number, found ${shown(iss.input)}`,
  });
/** A length (mm) that may be zero but not negative. */
const nonNegative = (what: string) =>
  finite(what).refine((v) => v >= 0, { error: (iss) => `${what} cannot be negative, found ${shown(iss.input)} mm` });
/** A length (mm) that must be more than zero. */
const positive = (what: string) =>
  finite(what).refine((v) => v > 0, { error: (iss) => `${what} must be more than 0 mm, found ${shown(iss.input)} mm` });

/** Degrees of 45 in radians: the default saw tilt past which a bevel is flagged. */
export const DEFAULT_SAW_TILT_LIMIT_RAD = Math.PI / 4;
/** Default fillet clearance between frame and skin (mm); 1 to 3 mm is common practice. */
export const DEFAULT_FILLET_CLEARANCE_MM = 2;
/** Default plywood sheet (mm): 1220 x 2440, common practice (suppliers' lists). */
export const DEFAULT_SHEET = { widthMm: 1220, lengthMm: 2440 } as const;
/** How far the sum of the layers may differ from the frame's stated thickness (mm) before it is an issue. */
export const LAYER_SUM_TOLERANCE_MM = 0.01;

// ---------------------------------------------------------------------------------------------------
// Longitudinals

/**
 * Where a longitudinal crosses each section:
 * - `line`: at a point line of the hull (`lineId`, e.g. the chine or sheer), moved `girthOffsetMm` along
 *   the girth (positive away from the centreline, toward the sheer);
 * - `height`: where the section reaches height `z` (mm above the baseline);
 * - `girth`: at `girthMm` along the section from the centreline (the keel) toward the sheer;
 * - `half-breadth`: at half-breadth `y` (mm), for a carlin under the deck at the edge of an opening.
 */
export const longitudinalPlacementSchema = z.discriminatedUnion('by', [
  z.object({ by: z.literal('line'), lineId: id, girthOffsetMm: finite('the girth offset from the line').default(0) }),
  z.object({ by: z.literal('height'), z: finite('the height of the longitudinal') }),
  z.object({ by: z.literal('girth'), girthMm: nonNegative('the girth from the centreline') }),
  z.object({ by: z.literal('half-breadth'), y: nonNegative('the half-breadth of the longitudinal') }),
]);
export type LongitudinalPlacement = z.infer<typeof longitudinalPlacementSchema>;

/**
 * A longitudinal, defined once per hull; frames between `fromX` and `toX` (null: from the first / to the
 * last station) are notched for it. Section: `widthMm` along the skin (or the deck), `depthMm` normal to
 * it. `sides`: a pair, one each side, or one on the centreline (hog, keel). `against`: what it lies on,
 * the skin (stringer, clamp, ribband, hog) or the underside of the deck (carlin).
 */
export const longitudinalSchema = z.object({
  id,
  name,
  kind: z.enum(['stringer', 'clamp', 'carlin', 'hog', 'keel', 'ribband']),
  placement: longitudinalPlacementSchema,
  widthMm: positive('the width of the longitudinal'),
  depthMm: positive('the depth of the longitudinal'),
  sides: z.enum(['both', 'centreline']).default('both'),
  against: z.enum(['skin', 'deck']).default('skin'),
  fromX: finite('the start (x) of the longitudinal').nullable().default(null),
  toX: finite('the end (x) of the longitudinal').nullable().default(null),
});
export type Longitudinal = z.infer<typeof longitudinalSchema>;

// ---------------------------------------------------------------------------------------------------
// Layers, joints and sheets

/**
 * Where one layer's joints fall: a number of pieces of about equal girth (the joint positions then chosen
 * to clear the neighbouring layers' joints), or joints at stated girths (mm along the outer edge from the
 * centreline at the bottom, port negative, starboard positive).
 */
export const layerJointsSchema = z.discriminatedUnion('by', [
  z.object({ by: z.literal('count'), pieces: z.number().int().min(1).max(64).default(1) }),
  z.object({ by: z.literal('girth'), girthsMm: z.array(finite('a joint girth')).max(64) }),
]);
export type LayerJoints = z.infer<typeof layerJointsSchema>;

/**
 * One lamination of a frame. Layers are stacked from the marked face: `layers[0]` lies on it.
 * `densityKgPerM3` null: the estimate's default for the material.
 */
export const layerSchema = z.object({
  thicknessMm: positive('the layer thickness'),
  material: z.enum(['plywood', 'timber']).default('plywood'),
  densityKgPerM3: positive('the density').nullable().default(null),
  joints: layerJointsSchema.default({ by: 'count', pieces: 1 }),
});
export type Layer = z.infer<typeof layerSchema>;

/** A plywood sheet (mm): width across, length along the face grain. */
export const sheetSchema = z.object({
  widthMm: positive('the sheet width').default(DEFAULT_SHEET.widthMm),
  lengthMm: positive('the sheet length').default(DEFAULT_SHEET.lengthMm),
});
export type Sheet = z.infer<typeof sheetSchema>;

/**
 * How the layers' pieces are joined: joints of neighbouring layers at least `minStaggerMm` of girth
 * apart; a piece larger than `sheet` (either way round) split at a butt-block joint `buttBlockWidthMm`
 * wide (the block is centred on the joint). Defaults are our choice, not a rule.
 */
export const jointingSchema = z.object({
  minStaggerMm: nonNegative('the minimum joint stagger').default(150),
  buttBlockWidthMm: positive('the butt block width').default(100),
  sheet: sheetSchema.default({ widthMm: DEFAULT_SHEET.widthMm, lengthMm: DEFAULT_SHEET.lengthMm }),
});
export type Jointing = z.infer<typeof jointingSchema>;

// ---------------------------------------------------------------------------------------------------
// Holes, marks, fillets

/**
 * A limber hole: a hole centred on the outer edge `girthMm` along it from the centreline (so half of it
 * is cut from the frame), of `radiusMm`; on both sides (mirrored) or on one (port, starboard).
 */
export const limberSchema = z.object({
  girthMm: nonNegative('the limber girth from the centreline'),
  radiusMm: positive('the limber radius'),
  sides: z.enum(['both', 'port', 'starboard']).default('both'),
});
export type Limber = z.infer<typeof limberSchema>;

const centre = { y: finite('the opening centre y'), z: finite('the opening centre z') };
/**
 * An opening cut through a solid part, centred at (y, z) in the section plane (mm): a circle; a rectangle
 * `widthMm` across (y) by `heightMm` (z) with rounded corners; or a slot (two half circles joined) of
 * overall `lengthMm` and `widthMm`, its length at `angleRad` from the horizontal. `mirror`: also cut
 * the mirror image on the other side of the centreline.
 */
export const openingSchema = z.discriminatedUnion('shape', [
  z.object({ shape: z.literal('circle'), ...centre, radiusMm: positive('the opening radius'), mirror: z.boolean().default(false) }),
  z.object({
    shape: z.literal('rectangle'),
    ...centre,
    widthMm: positive('the opening width'),
    heightMm: positive('the opening height'),
    cornerRadiusMm: nonNegative('the corner radius').default(0),
    mirror: z.boolean().default(false),
  }),
  z.object({
    shape: z.literal('slot'),
    ...centre,
    lengthMm: positive('the slot length'),
    widthMm: positive('the slot width'),
    angleRad: finite('the slot angle').default(0),
    mirror: z.boolean().default(false),
  }),
]);
export type Opening = z.infer<typeof openingSchema>;

/** Bevel marks on the template every `everyMm` of girth; a saw tilt past `sawTiltLimitRad` is warned of. */
export const bevelMarksSchema = z.object({
  everyMm: positive('the bevel mark spacing').default(50),
  sawTiltLimitRad: finite('the saw tilt limit')
    .refine((v) => v > 0 && v < Math.PI / 2, { error: (iss) => `the saw tilt limit must be between 0 and 90 degrees, found ${shown(iss.input)} rad` })
    .default(DEFAULT_SAW_TILT_LIMIT_RAD),
});
export type BevelMarks = z.infer<typeof bevelMarksSchema>;

/**
 * Reference marks drawn on the template: level reference line and set-up line (heights, mm above the
 * baseline; null: not drawn) and the grain direction of the ply's face veneer, along y (across) or z
 * (up); null: no preference (nesting may then turn the piece).
 */
export const templateMarksSchema = z.object({
  levelLineZ: finite('the level line height').nullable().default(null),
  setUpLineZ: finite('the set-up line height').nullable().default(null),
  grain: z.enum(['y', 'z']).nullable().default(null),
});
export type TemplateMarks = z.infer<typeof templateMarksSchema>;

/**
 * The fillet and tape at the frame-skin joint, for the estimate: cove `radiusMm` (null: recommended for
 * the ply thickness and filler), on one or both faces or none; glass tape plies of `tapeWidthMm`.
 */
export const filletSchema = z.object({
  radiusMm: positive('the fillet radius').nullable().default(null),
  filler: z.enum(['high-density', 'low-density']).default('high-density'),
  sides: z.enum(['both', 'one', 'none']).default('both'),
  tapePlies: z.number().int().min(0).max(10).default(0),
  tapeWidthMm: positive('the tape width').default(75),
});
export type Fillet = z.infer<typeof filletSchema>;

// ---------------------------------------------------------------------------------------------------
// Parts

/** Ring widths (mm) of a ring frame: across the bottom, up the sides and under the deck (null: as the sides). */
export const ringWidthSchema = z.object({
  bottomMm: positive('the ring width at the bottom'),
  sidesMm: positive('the ring width at the sides'),
  underDeckMm: positive('the ring width under the deck').nullable().default(null),
});
export type RingWidth = z.infer<typeof ringWidthSchema>;

/** What every part has. `thicknessMm` is the frame's total siding; the layers must add up to it. */
const partBase = {
  id,
  name,
  /** Which face lies on the station line; `auto`: the face toward the largest section (under bevels). */
  markedFace: z.enum(['forward', 'aft', 'auto']).default('auto'),
  thicknessMm: positive('the frame thickness'),
  layers: z.array(layerSchema).max(16),
  filletClearanceMm: nonNegative('the fillet clearance').default(DEFAULT_FILLET_CLEARANCE_MM),
  jointing: jointingSchema.default({ minStaggerMm: 150, buttBlockWidthMm: 100, sheet: { ...DEFAULT_SHEET } }),
  /** Longitudinals to notch for; null: every one whose x range covers the part. */
  longitudinalIds: z.array(id).nullable().default(null),
  limbers: z.array(limberSchema).default([]),
  openings: z.array(openingSchema).default([]),
  bevelMarks: bevelMarksSchema.default({ everyMm: 50, sawTiltLimitRad: DEFAULT_SAW_TILT_LIMIT_RAD }),
  marks: templateMarksSchema.default({ levelLineZ: null, setUpLineZ: null, grain: null }),
  fillet: filletSchema.default({ radiusMm: null, filler: 'high-density', sides: 'both', tapePlies: 0, tapeWidthMm: 75 }),
};
const stationed = { ...partBase, stationId: id };

/**
 * A ring frame: outer edge from the deducted section less the clearance, inner edge `ringWidth` inside
 * it with inner corners rounded to `innerCornerRadiusMm`. The bottom width applies up to `bottomToZ`
 * (mm above baseline; null: up to the lowest chine at the station). `top`: closed under the deck, or open
 * with the arms ending at the sheer.
 */
export const ringFrameSchema = z.object({
  ...stationed,
  kind: z.literal('ring-frame'),
  ringWidth: ringWidthSchema,
  innerCornerRadiusMm: nonNegative('the inner corner radius').default(25),
  bottomToZ: finite('the top of the bottom width').nullable().default(null),
  top: z.enum(['deck', 'open']).default('deck'),
});
/** A bulkhead: solid to the deck (or the sheer), with openings. */
export const bulkheadSchema = z.object({ ...stationed, kind: z.literal('bulkhead') });
/** A partial bulkhead: solid up to `topZ` (mm above the baseline), cut level there. */
export const partialBulkheadSchema = z.object({ ...stationed, kind: z.literal('partial-bulkhead'), topZ: finite('the top of the partial bulkhead') });
/** A floor: the bottom part of a frame only, solid up to `topZ` (mm above the baseline). */
export const floorSchema = z.object({ ...stationed, kind: z.literal('floor'), topZ: finite('the top of the floor') });

/**
 * Taper of a beam toward its ends: depth `endDepthMm` at the end, straight from `fromFraction` of the
 * half-beam (0: from the centreline).
 */
export const beamTaperSchema = z.object({
  endDepthMm: positive('the beam end depth'),
  fromFraction: finite('where the taper starts').refine((v) => v >= 0 && v < 1, {
    error: (iss) => `the taper must start between the centreline (0) and the end (below 1), found ${shown(iss.input)}`,
  }).default(0),
});
/** A deck beam: top to the deck camber (less the deck thickness), `mouldedDepthMm` deep at the centreline. */
export const deckBeamSchema = z.object({
  ...stationed,
  kind: z.literal('deck-beam'),
  mouldedDepthMm: positive('the moulded depth'),
  taper: beamTaperSchema.nullable().default(null),
});
/**
 * A half beam: from the side to its inboard end at half-breadth `inboardYMm` or at a carlin
 * (`carlinId`, a longitudinal of kind carlin); `sides`: a pair, or one side only.
 */
export const halfBeamSchema = z.object({
  ...stationed,
  kind: z.literal('half-beam'),
  mouldedDepthMm: positive('the moulded depth'),
  taper: beamTaperSchema.nullable().default(null),
  inboardEnd: z.discriminatedUnion('by', [
    z.object({ by: z.literal('half-breadth'), yMm: nonNegative('the inboard end half-breadth') }),
    z.object({ by: z.literal('carlin'), carlinId: id }),
  ]),
  sides: z.enum(['both', 'port', 'starboard']).default('both'),
});
/**
 * A building mould: a temporary frame whose edge is the section less the skin and less the depth of the
 * longitudinals it carries (`carriesIds`: stringers or ribbands let over it). No fillet, so no clearance
 * by default.
 */
export const mouldSchema = z.object({
  ...stationed,
  kind: z.literal('mould'),
  filletClearanceMm: nonNegative('the fillet clearance').default(0),
  carriesIds: z.array(id).default([]),
});
/**
 * A flat transom raked `rakeRad` from the vertical (positive: top aft of the bottom), crossing the
 * station's plane at height `pivotZ` (mm above baseline); cut to its true (expanded) shape.
 */
export const transomSchema = z.object({
  ...stationed,
  kind: z.literal('transom'),
  rakeRad: finite('the transom rake').refine((v) => Math.abs(v) < (80 * Math.PI) / 180, {
    error: (iss) => `the transom rake must be less than 80 degrees from the vertical, found ${shown(iss.input)} rad`,
  }),
  pivotZ: finite('the transom pivot height').default(0),
});

/**
 * A sliding bevel reading at a measured point: `readingRad` is the angle between the measured face
 * (into the wood) and the edge, as the tool reads it: 90 deg - b for an under bevel, 90 deg + b for a
 * standing one (common practice). `sense` says which was meant; a reading on the wrong side of 90 deg for
 * its sense is an issue.
 */
export const bevelReadingSchema = z.object({
  readingRad: finite('the bevel reading').refine((v) => v > 0 && v < Math.PI, {
    error: (iss) => `a sliding bevel reads between 0 and 180 degrees, found ${shown(iss.input)} rad`,
  }),
  sense: z.enum(['under', 'standing']),
});
export type BevelReading = z.infer<typeof bevelReadingSchema>;

/**
 * Points of a frame measured on a standing hull, in order along the edge (from one sheer round to the
 * other, or from the centreline to the sheer on one side):
 * - `offsets`: `y` across from the centreline (starboard positive), `h` up from a level reference line
 *   at height `referenceZ` (mm above the baseline);
 * - `angle-distance`: from an `origin` (y, z), each reading on the port or starboard side, `angleRad`
 *   below the horizontal on that side, `distanceMm` along the ray.
 */
export const measurementSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('offsets'),
    referenceZ: finite('the reference line height'),
    points: z.array(z.object({ y: finite('a measured y'), h: finite('a measured height'), bevel: bevelReadingSchema.nullable().default(null) })),
  }),
  z.object({
    kind: z.literal('angle-distance'),
    origin: z.object({ y: finite('the origin y'), z: finite('the origin z') }),
    points: z.array(
      z.object({
        side: z.enum(['port', 'starboard']),
        angleRad: finite('a reading angle').refine((v) => Math.abs(v) <= Math.PI, {
          error: (iss) => `a reading angle must be within 180 degrees of the horizontal, found ${shown(iss.input)} rad`,
        }),
        distanceMm: nonNegative('a reading distance'),
        bevel: bevelReadingSchema.nullable().default(null),
      }),
    ),
  }),
]);
export type Measurement = z.infer<typeof measurementSchema>;

/**
 * A frame measured by hand on a standing hull, at its own `x`. `symmetry`: keep both sides as measured,
 * or keep one side and mirror it (the asymmetry is reported). `measuredFace`: the face the readings were
 * taken on; the other face and each layer follow from the bevels.
 */
export const measuredFrameSchema = z.object({
  ...partBase,
  kind: z.literal('measured-frame'),
  x: finite('the frame x'),
  measurement: measurementSchema,
  symmetry: z.enum(['as-measured', 'mirror-starboard', 'mirror-port']).default('as-measured'),
  measuredFace: z.enum(['forward', 'aft']),
});
export type MeasuredFrame = z.infer<typeof measuredFrameSchema>;

const partUnion = z.discriminatedUnion('kind', [
  ringFrameSchema,
  bulkheadSchema,
  partialBulkheadSchema,
  floorSchema,
  deckBeamSchema,
  halfBeamSchema,
  mouldSchema,
  transomSchema,
  measuredFrameSchema,
]);
type PartShape = z.infer<typeof partUnion>;

/** Any part; parsing also runs `partIssues`, so a parsed part is consistent in itself. */
export const partSchema = partUnion.superRefine((part, ctx) => {
  for (const i of partIssues(part)) ctx.addIssue({ code: 'custom', message: i.message, path: i.path, input: i.value });
});
export type Part = z.infer<typeof partSchema>;
export type PartInput = z.input<typeof partSchema>;
export type PartKind = Part['kind'];
export type RingFrame = z.infer<typeof ringFrameSchema>;
export type Bulkhead = z.infer<typeof bulkheadSchema>;
export type PartialBulkhead = z.infer<typeof partialBulkheadSchema>;
export type Floor = z.infer<typeof floorSchema>;
export type Mould = z.infer<typeof mouldSchema>;
export type DeckBeam = z.infer<typeof deckBeamSchema>;
export type HalfBeam = z.infer<typeof halfBeamSchema>;
export type Transom = z.infer<typeof transomSchema>;

/** The hull's longitudinals and parts; ids must be unique within each list. */
export const partsSchema = z
  .object({ longitudinals: z.array(longitudinalSchema).default([]), parts: z.array(partSchema).default([]) })
  .superRefine((p, ctx) => {
    for (const i of duplicateIdIssues(p)) ctx.addIssue({ code: 'custom', message: i.message, path: i.path, input: i.value });
  });
export type Parts = z.infer<typeof partsSchema>;
export type PartsInput = z.input<typeof partsSchema>;

// ---------------------------------------------------------------------------------------------------
// Validation across fields

/** A problem with one part: a GeometryIssue plus the part's id and the path of the field within it. */
export interface PartIssue extends GeometryIssue {
  partId?: string;
  longitudinalId?: string;
  path: (string | number)[];
}

const label = (p: { id: string; name: string }): string => `part "${p.name}" (${p.id})`;

/**
 * Everything wrong within one part that no single field can tell (empty when consistent): no layers; a
 * layer thicker than the frame; layers not adding up to the frame's thickness (within
 * `LAYER_SUM_TOLERANCE_MM`); a fillet clearance as wide as or wider than a ring width; an inner corner
 * radius more than half the ring width; a bevel reading on the wrong side of 90 deg for its sense.
 */
export function partIssues(part: PartShape): PartIssue[] {
  const out: PartIssue[] = [];
  const add = (code: string, path: (string | number)[], value: unknown, what: string): void => {
    out.push({ code, message: `${label(part)}: ${what}`, partId: part.id, field: path.join('.'), path, value, ...('stationId' in part ? { stationId: part.stationId } : {}) });
  };
  if (part.layers.length === 0) add('part-no-layers', ['layers'], part.layers, 'has no layers; give at least one ply layer');
  let sum = 0;
  part.layers.forEach((layer, i) => {
    sum += layer.thicknessMm;
    // A frame thickness that is not positive is already an issue of its own field; comparing with it adds noise.
    if (part.thicknessMm > 0 && layer.thicknessMm > part.thicknessMm + LAYER_SUM_TOLERANCE_MM) {
      add('layer-thicker-than-frame', ['layers', i, 'thicknessMm'], layer.thicknessMm, `layer ${i + 1} is ${shown(layer.thicknessMm)} mm thick, more than the frame's ${shown(part.thicknessMm)} mm`);
    }
    if (layer.joints.by === 'girth') {
      const g = layer.joints.girthsMm;
      for (let k = 1; k < g.length; k++) {
        if (!(g[k]! > g[k - 1]!)) add('layer-joints-unsorted', ['layers', i, 'joints', 'girthsMm', k], g[k], `layer ${i + 1}'s joints must run in order of girth without repeats: ${shown(g[k])} mm comes after ${shown(g[k - 1])} mm`);
      }
    }
  });
  if (part.thicknessMm > 0 && part.layers.length > 0 && Math.abs(sum - part.thicknessMm) > LAYER_SUM_TOLERANCE_MM) {
    add('layers-sum', ['layers'], sum, `the layers add up to ${shown(sum)} mm but the frame is ${shown(part.thicknessMm)} mm thick`);
  }
  if (part.kind === 'ring-frame') {
    const w = part.ringWidth;
    const widths: [string, number][] = [['bottomMm', w.bottomMm], ['sidesMm', w.sidesMm], ['underDeckMm', w.underDeckMm ?? w.sidesMm]];
    for (const [key, width] of widths) {
      if (part.filletClearanceMm >= width) {
        add('clearance-wider-than-ring', ['filletClearanceMm'], part.filletClearanceMm, `the fillet clearance of ${shown(part.filletClearanceMm)} mm is not less than the ring width (${key}) of ${shown(width)} mm`);
      }
      if (part.innerCornerRadiusMm > width / 2 && key === 'sidesMm') {
        // Radius against the sides width only: the corners are where the sides meet the bottom and deck.
        add('corner-radius-too-large', ['innerCornerRadiusMm'], part.innerCornerRadiusMm, `the inner corner radius of ${shown(part.innerCornerRadiusMm)} mm is more than half the ring width at the sides (${shown(width)} mm)`);
      }
    }
  }
  if (part.kind === 'measured-frame') {
    part.measurement.points.forEach((p, i) => {
      const b = p.bevel;
      if (b === null) return;
      const right = Math.PI / 2;
      if ((b.sense === 'under' && b.readingRad > right + 1e-9) || (b.sense === 'standing' && b.readingRad < right - 1e-9)) {
        const d = shown((b.readingRad * 180) / Math.PI);
        add('bevel-reading-sense', ['measurement', 'points', i, 'bevel'], b, `point ${i + 1}'s sliding bevel reads ${d} degrees, which is ${b.sense === 'under' ? 'more' : 'less'} than 90 for a${b.sense === 'under' ? 'n under' : ' standing'} bevel`);
      }
    });
  }
  return out;
}

function duplicateIdIssues(p: { longitudinals: { id: string }[]; parts: { id: string; name: string }[] }): PartIssue[] {
  const out: PartIssue[] = [];
  const seen = new Set<string>();
  p.longitudinals.forEach((l, i) => {
    if (seen.has(l.id)) out.push({ code: 'duplicate-id', message: `longitudinal id "${l.id}" is used twice`, longitudinalId: l.id, field: `longitudinals.${i}.id`, path: ['longitudinals', i, 'id'], value: l.id });
    seen.add(l.id);
  });
  const parts = new Set<string>();
  p.parts.forEach((part, i) => {
    if (parts.has(part.id)) out.push({ code: 'duplicate-id', message: `${label(part)}: part id "${part.id}" is used twice`, partId: part.id, field: `parts.${i}.id`, path: ['parts', i, 'id'], value: part.id });
    parts.add(part.id);
  });
  return out;
}

/** The parts of a hull's lines that references are checked against. */
export interface PartsHullRefs {
  stations: readonly { id: string }[];
  lines: readonly { id: string; kind: string }[];
}

/**
 * Everything wrong with the parts against the hull (empty when consistent): a duplicate id; a station,
 * line or longitudinal that does not exist; a carlin reference that is not a carlin; a longitudinal
 * placed by a line that is not a point line (sheer, chine, keel). Paths are from the `Parts` root.
 */
export function partsIssues(parts: Parts, hull: PartsHullRefs): PartIssue[] {
  const out = duplicateIdIssues(parts);
  const stations = new Set(hull.stations.map((s) => s.id));
  const lines = new Map(hull.lines.map((l) => [l.id, l.kind]));
  const longs = new Map(parts.longitudinals.map((l) => [l.id, l]));
  parts.longitudinals.forEach((l, i) => {
    if (l.placement.by !== 'line') return;
    const kind = lines.get(l.placement.lineId);
    if (kind !== 'point') {
      const what = kind === undefined ? 'no such line in the hull' : `a ${kind}, not a point line`;
      out.push({ code: 'longitudinal-line', message: `longitudinal "${l.name}" (${l.id}) is placed by line "${l.placement.lineId}": ${what}`, longitudinalId: l.id, lineId: l.placement.lineId, field: `longitudinals.${i}.placement.lineId`, path: ['longitudinals', i, 'placement', 'lineId'], value: l.placement.lineId });
    }
  });
  parts.parts.forEach((part, i) => {
    const at = (path: (string | number)[], code: string, value: unknown, what: string): void => {
      out.push({ code, message: `${label(part)}: ${what}`, partId: part.id, field: ['parts', i, ...path].join('.'), path: ['parts', i, ...path], value });
    };
    if ('stationId' in part && !stations.has(part.stationId)) at(['stationId'], 'part-station', part.stationId, `station "${part.stationId}" is not a station of the hull`);
    (part.longitudinalIds ?? []).forEach((lid, k) => {
      if (!longs.has(lid)) at(['longitudinalIds', k], 'part-longitudinal', lid, `longitudinal "${lid}" does not exist`);
    });
    if (part.kind === 'mould') {
      part.carriesIds.forEach((lid, k) => {
        if (!longs.has(lid)) at(['carriesIds', k], 'part-longitudinal', lid, `longitudinal "${lid}" does not exist`);
      });
    }
    if (part.kind === 'half-beam' && part.inboardEnd.by === 'carlin') {
      const c = longs.get(part.inboardEnd.carlinId);
      if (c?.kind !== 'carlin') at(['inboardEnd', 'carlinId'], 'half-beam-carlin', part.inboardEnd.carlinId, c ? `"${c.name}" is a ${c.kind}, not a carlin` : `carlin "${part.inboardEnd.carlinId}" does not exist`);
    }
  });
  return out;
}

/** The outcome of `partsParse`: the parsed parts, or every issue with the part named in its message. */
export type PartsParse = { ok: true; parts: Parts } | { ok: false; issues: PartIssue[] };

/**
 * Parse stored or submitted parts (plain JSON). On failure every zod issue becomes a `PartIssue` whose
 * message starts with the part or longitudinal it is in (by name and id, read from the raw input where it
 * has them) and whose `field` is the dotted path from the root, e.g.
 * `part "Frame 3" (f3): layers.1.thicknessMm: the layer thickness must be more than 0 mm, found -4 mm`.
 */
export function partsParse(input: unknown): PartsParse {
  // reportInput keeps the offending value on each issue, for the editor to show beside the field.
  const r = partsSchema.safeParse(input, { reportInput: true });
  if (r.success) return { ok: true, parts: r.data };
  const raw = (input ?? {}) as { parts?: unknown; longitudinals?: unknown };
  const issues = r.error.issues.map((iss): PartIssue => {
    const path = iss.path.filter((k): k is string | number => typeof k !== 'symbol');
    const [list, index, ...rest] = path;
    const owner = typeof index === 'number' && (list === 'parts' || list === 'longitudinals') ? entry(raw[list], index) : null;
    const already = iss.message.startsWith('part "');
    const prefix = owner && !already ? `${list === 'parts' ? 'part' : 'longitudinal'} "${owner.name}" (${owner.id}): ${rest.join('.')}: ` : '';
    return {
      code: `schema-${iss.code}`,
      message: prefix + iss.message,
      field: path.join('.'),
      path,
      value: 'input' in iss ? iss.input : undefined,
      ...(owner && list === 'parts' ? { partId: owner.id } : {}),
      ...(owner && list === 'longitudinals' ? { longitudinalId: owner.id } : {}),
    };
  });
  return { ok: false, issues };
}

function entry(list: unknown, index: number): { id: string; name: string } | null {
  if (!Array.isArray(list)) return null;
  const e = list[index] as { id?: unknown; name?: unknown } | undefined;
  if (!e || typeof e !== 'object') return null;
  const idText = typeof e.id === 'string' ? e.id : `#${index + 1}`;
  return { id: idText, name: typeof e.name === 'string' ? e.name : idText };
}
