import { z } from 'zod';
import type { Notation } from '../geometry/notation-schema';

/** The shop-floor stages of a part, in the order they are usually done. */
export const buildStages = ['patterned', 'cut', 'laminated', 'shaped', 'test-fitted', 'tacked', 'filleted', 'taped', 'glassed'] as const;
export type BuildStage = (typeof buildStages)[number];

/**
 * Stages done layer by layer on a laminated part (more than one layer). Each lamination is traced from its
 * own pattern onto its own stock and cut on its own, often on different days and from different sheets,
 * so each is marked by itself; from glue-up on there is one piece, so laminating and everything after it
 * are the part's as a whole (common practice). A single-layer part is marked as a whole throughout.
 */
export const layerStages: readonly BuildStage[] = ['patterned', 'cut'];

/** Stages where epoxy is handled: the UI shows the epoxy caution beside them. */
export const epoxyStages: readonly BuildStage[] = ['laminated', 'tacked', 'filleted', 'taped', 'glassed'];
/** Stages at the saw or router: the UI shows the saw caution beside them. */
export const sawStages: readonly BuildStage[] = ['cut', 'shaped'];

/** Default distance (mm) a later revision may move a cut part before it is flagged. */
export const DEFAULT_MOVE_TOLERANCE_MM = 1;

/** Photos: largest file accepted, and how many in one upload. */
export const PHOTO_MAX_BYTES = 12 * 1024 * 1024;
export const PHOTO_MAX_FILES = 4;

const usedAmount = (what: string) => z.number({ error: `${what} must be a number` }).min(0, `${what} cannot be negative`).max(100000, `${what} is too large`);

/** Mark a stage done or reopen it; both are new events, nothing earlier is changed. */
export const buildEventSchema = z.strictObject({
  partId: z.string().trim().min(1, 'Choose a part').max(64),
  /** Which layer (0: on the marked face) for a layer stage of a laminated part; null for the whole part. */
  layerIndex: z.number().int().min(0).max(20).nullable().default(null),
  stage: z.enum(buildStages, { error: 'Choose one of the stages' }),
  action: z.enum(['done', 'reopened'], { error: 'action must be done or reopened' }),
  note: z.string().trim().max(2000, 'Keep the note under 2000 characters').default(''),
  used: z
    .strictObject({
      plySheets: usedAmount('Ply sheets').optional(),
      epoxyMl: usedAmount('Epoxy (ml)').optional(),
      fillerMl: usedAmount('Filler (ml)').optional(),
      tapeM: usedAmount('Glass tape (m)').optional(),
    })
    .default({}),
});
export type BuildEventInput = z.input<typeof buildEventSchema>;

export const buildSettingsSchema = z.strictObject({
  moveToleranceMm: z
    .number({ error: 'The movement tolerance must be a number of millimetres' })
    .min(0.1, 'The movement tolerance must be at least 0.1 mm')
    .max(100, 'The movement tolerance must be at most 100 mm'),
});

export const photoFieldsSchema = z.strictObject({
  stage: z.union([z.enum(buildStages, { error: 'stage must be one of the stages' }), z.literal('')]).default(''),
  caption: z.string().trim().max(500).default(''),
});

export interface BuildEvent {
  id: number;
  partId: string;
  layerIndex: number | null;
  stage: BuildStage;
  action: 'done' | 'reopened';
  note: string;
  revisionId: number | null;
  used: { plySheets: number; epoxyMl: number; fillerMl: number; tapeM: number };
  author: { id: number; displayName: string };
  createdAt: string;
}

export interface BuildPhoto {
  id: number;
  partId: string;
  stage: BuildStage | null;
  caption: string;
  width: number;
  height: number;
  thumbWidth: number;
  thumbHeight: number;
  uploader: { id: number; displayName: string };
  createdAt: string;
}

/** How far the latest revision moved a cut part (or one cut layer) since the revision it was cut from. */
export interface BuildFlag {
  movedMm: number;
  cutRevisionId: number;
  latestRevisionId: number;
  /** The layer whose outline moved most (laminated parts), null for a single-layer part. */
  layerIndex: number | null;
}

/** One lamination of a laminated part and its layer stages. */
export interface BuildLayerState {
  index: number;
  thicknessMm: number;
  /** Layer stages done for this layer. */
  done: BuildStage[];
  /** The first layer stage not done for this layer, or null once it is patterned and cut. */
  next: BuildStage | null;
  cutRevisionId: number | null;
  flag: BuildFlag | null;
}

export interface BuildPartState {
  partId: string;
  name: string;
  /** Stages currently done; a layer stage of a laminated part counts once every layer has it. */
  done: BuildStage[];
  /** The first stage not done, or null when all are. */
  next: BuildStage | null;
  /** The revision it was cut from; for a laminated part the oldest any of its layers was cut from. */
  cutRevisionId: number | null;
  /** Set when the latest revision moved the part (or a cut layer) more than the tolerance since it was cut. */
  flag: BuildFlag | null;
  photos: number;
  /** One entry per layer of a laminated part; empty for a single-layer part, which is marked as a whole. */
  layers: BuildLayerState[];
}

export interface MaterialFigures {
  plySheets: number;
  epoxyMl: number;
  fillerMl: number;
  tapeM: number;
}

export interface BuildBoardResponse {
  latestRevisionId: number | null;
  moveToleranceMm: number;
  /** How the hull's lengths are typed and shown (the latest plan's), for the tolerance field. */
  notation: Notation;
  parts: BuildPartState[];
  /** Estimates from the cut list (ply sheets counted as 1220 x 2440 mm faces), and what has been recorded. */
  material: { estimate: MaterialFigures; used: MaterialFigures };
}

export interface BevelRow {
  side: string;
  edge: string;
  girthMm: number;
  tiltDeg: number;
  slidingBevelDeg: number;
  kind: 'under' | 'standing' | 'square';
  faceDown: string | null;
}

export interface BuildPartResponse {
  state: BuildPartState;
  events: BuildEvent[];
  photos: BuildPhoto[];
  bevels: BevelRow[];
}
