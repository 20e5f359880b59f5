import { z } from 'zod';

/** The shop-floor stages of a part, in the order they are usually done. */
export const buildStages = ['patterned', 'cut', 'laminated', 'shaped', 'test-fitted', 'tacked', 'filleted', 'taped', 'glassed'] as const;
export type BuildStage = (typeof buildStages)[number];

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
  /** Which layer (0: on the marked face); null for the whole part. */
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
  moveToleranceMm: z.number({ error: 'moveToleranceMm must be a number' }).min(0.1, 'moveToleranceMm must be at least 0.1 mm').max(100, 'moveToleranceMm must be at most 100 mm'),
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

export interface BuildPartState {
  partId: string;
  name: string;
  /** Stages currently done (the last event of each stage, whole part, is `done`). */
  done: BuildStage[];
  /** The first stage not done, or null when all are. */
  next: BuildStage | null;
  cutRevisionId: number | null;
  /** Set when the latest revision moved the part more than the tolerance since it was cut. */
  flag: { movedMm: number; cutRevisionId: number; latestRevisionId: number } | null;
  photos: number;
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
