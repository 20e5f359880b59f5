import { z } from 'zod';
import { camberSchema, type Camber } from '../geometry/camber-schema';
import { hullLinesSchema, type HullLines } from '../geometry/hull-schema';
import type { RevisionSummary } from './plan';

/**
 * The Library: camber curves and lines a designer publishes, each publication an immutable revision;
 * a hull takes one in ("Take into hull"), pinning that revision, and hears of newer ones (notices).
 */

export const libraryKinds = ['camber', 'lines'] as const;
export const libraryKindSchema = z.enum(libraryKinds);
export type LibraryKind = z.infer<typeof libraryKindSchema>;

/** private: the author only; shared: the author and the people named by e-mail; public: every account. */
export const visibilities = ['private', 'shared', 'public'] as const;
export const visibilitySchema = z.enum(visibilities);
export type Visibility = z.infer<typeof visibilitySchema>;

const email = z.email({ message: 'Enter a valid e-mail address' }).max(254);

/** Who may see an item. The named people are kept while the item is private or public, used only when shared. */
export const sharingSchema = z
  .object({
    visibility: visibilitySchema,
    shareWith: z
      .array(email.transform((e) => e.trim().toLowerCase()))
      .max(100, { message: 'Share with at most 100 people; make it public instead' })
      .default([])
      .transform((list) => [...new Set(list)]),
  })
  .superRefine((s, ctx) => {
    if (s.visibility === 'shared' && s.shareWith.length === 0) {
      ctx.addIssue({ code: 'custom', path: ['shareWith'], message: 'Name at least one person (by e-mail) to share with, or choose private or public' });
    }
  });
export type SharingInput = z.input<typeof sharingSchema>;

const revisionText = {
  name: z.string().trim().min(1, { message: 'Give it a name' }).max(120),
  notes: z.string().trim().max(4000).default(''),
  /** The rules that go with it: where it applies, how it is measured, what to check before cutting. */
  rules: z.string().trim().max(4000).default(''),
};

/** One publication of a camber curve (shape, crown, convention, the designer's own points). */
export const camberRevisionSchema = z.object({ ...revisionText, document: camberSchema });
/** One publication of lines: stations and the table of offsets (the hull's lines document). */
export const linesRevisionSchema = z.object({ ...revisionText, document: hullLinesSchema });
export const revisionSchemas = { camber: camberRevisionSchema, lines: linesRevisionSchema } as const;
export type CamberRevisionInput = z.input<typeof camberRevisionSchema>;
export type LinesRevisionInput = z.input<typeof linesRevisionSchema>;

/** Body of POST /api/library: a new item with its first revision. */
export const publishItemSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('camber'), sharing: sharingSchema, revision: camberRevisionSchema }),
  z.object({ kind: z.literal('lines'), sharing: sharingSchema, revision: linesRevisionSchema }),
]);
export type PublishItemInput = z.input<typeof publishItemSchema>;

/**
 * Body of POST /api/library/:itemId/revisions: a new revision on top of `baseRevisionId` (the latest
 * the author saw; anything else is 409). The document is checked against the item's kind.
 */
export const newRevisionSchemas = {
  camber: camberRevisionSchema.extend({ baseRevisionId: z.number().int().positive() }),
  lines: linesRevisionSchema.extend({ baseRevisionId: z.number().int().positive() }),
} as const;
export type NewRevisionInput = (CamberRevisionInput | LinesRevisionInput) & { baseRevisionId: number };

/** Body of PATCH /api/library/:itemId: change who may see it (revisions are never changed). */
export const updateSharingSchema = z.object({ sharing: sharingSchema });

/** A revision as listed. */
export interface LibraryRevisionSummary {
  id: number;
  itemId: number;
  /** 1 for the first publication, then 2, 3... */
  number: number;
  name: string;
  notes: string;
  rules: string;
  createdAt: string;
}

export type LibraryDocument = Camber | HullLines;

/** GET /api/library/:itemId/revisions/:revisionId: one revision with its curve or lines. */
export interface LibraryRevision extends LibraryRevisionSummary {
  kind: LibraryKind;
  document: LibraryDocument;
}

/** An item as listed: its latest revision and who wrote it. */
export interface LibraryItemSummary {
  id: number;
  kind: LibraryKind;
  visibility: Visibility;
  authorId: number;
  authorName: string;
  /** The item is the signed-in person's own. */
  mine: boolean;
  latest: LibraryRevisionSummary;
  revisionCount: number;
  updatedAt: string;
}

/** GET /api/library/:itemId. `shareWith` only for the author. */
export interface LibraryItemDetail extends LibraryItemSummary {
  revisions: LibraryRevisionSummary[];
  latestDocument: LibraryDocument;
  shareWith: string[] | null;
}

// ---------------------------------------------------------------------------------------------------
// Pins: a hull that took an item in

/** Body of POST /api/hulls/:hullId/pins: take this revision into the hull, as a new plan revision on `baseRevisionId`. */
export const takeIntoHullSchema = z.object({
  itemId: z.number().int().positive(),
  revisionId: z.number().int().positive(),
  baseRevisionId: z.number().int().positive().nullable(),
});
export type TakeIntoHullInput = z.infer<typeof takeIntoHullSchema>;

/** Body of POST /api/hulls/:hullId/pins/:pinId/move: move the hull to a newer (or any) revision of the pinned item. */
export const movePinSchema = z.object({
  toRevisionId: z.number().int().positive(),
  baseRevisionId: z.number().int().positive().nullable(),
});
export type MovePinInput = z.infer<typeof movePinSchema>;

/** What a hull took from the Library: one camber and one set of lines at most. */
export interface HullPin {
  id: number;
  hullId: number;
  kind: LibraryKind;
  itemId: number;
  /** False when the author has since hidden the item from the person asking: only the pinned revision's name is shown. */
  visible: boolean;
  itemName: string;
  authorName: string;
  revisionId: number;
  revisionNumber: number;
  /** The item's newest revision (null when not visible). */
  latestRevisionId: number | null;
  latestRevisionNumber: number | null;
  pinnedAt: string;
  pinnedByName: string;
  /** The plan revision that taking (or moving) made. */
  planRevisionId: number | null;
}

/** POST /api/hulls/:hullId/pins and .../move. */
export interface PinSaveResponse {
  pin: HullPin;
  revision: RevisionSummary;
  movement: PartMovement[];
}

/** How far one part would move (or moved) between the hull's plan and the plan with the other revision. */
export interface PartMovement {
  partId: string;
  partName: string;
  partKind: string;
  stationName: string | null;
  /** Station x (mm). */
  x: number | null;
  /** Largest movement (mm) of the part's outline (or, when the part cannot be worked out, of the hull at its station); null when unknown. */
  moveMm: number | null;
  /** Where the largest movement is, in the part's template coordinates (mm: y across, z up). */
  atY: number | null;
  atZ: number | null;
  /** Why there is no figure, or what the figure covers. */
  note: string | null;
  /** Already cut, from the build log (none until the build log exists). */
  cut: boolean;
}

/** The two camber curves over the pattern's half-beam (mm), heights above the beam ends. */
export interface CamberDrawing {
  kind: 'camber';
  halfBeamMm: number;
  before: { y: number; z: number }[];
  after: { y: number; z: number }[];
}

/** The two body plans: the section (starboard half) at every station, before and after. */
export interface LinesDrawing {
  kind: 'lines';
  stations: { name: string; x: number; before: { y: number; z: number }[] | null; after: { y: number; z: number }[] | null }[];
}

/** GET /api/hulls/:hullId/pins/:pinId/compare?to=: the pinned revision against another, and what it would do to the hull. */
export interface PinCompareResponse {
  pin: HullPin;
  from: LibraryRevisionSummary;
  to: LibraryRevisionSummary;
  /** The hull's latest plan no longer has exactly the pinned revision (someone changed it since). */
  hullDiffersFromPin: boolean;
  drawing: CamberDrawing | LinesDrawing;
  movement: PartMovement[];
  /** 'outline': each part's own outline (a part's `note` says when it fell back to the deck line or hull section). */
  movementMethod: 'outline';
  /** Whether the build log says which parts are cut (false until the build log exists). */
  cutPartsKnown: boolean;
}

// ---------------------------------------------------------------------------------------------------
// Notices

/** A newer revision of something a hull of mine pinned (GET /api/notices). */
export interface Notice {
  id: number;
  hullId: number;
  hullName: string;
  pinId: number;
  itemId: number;
  itemName: string;
  kind: LibraryKind;
  authorName: string;
  pinnedRevisionNumber: number;
  newRevisionId: number;
  newRevisionNumber: number;
  createdAt: string;
}

export interface NoticesResponse {
  notices: Notice[];
}
