import type { Transaction } from 'sequelize';
import type { HullPin, LibraryDocument, LibraryKind, MovePinInput, PartMovement, PinCompareResponse, PinSaveResponse, TakeIntoHullInput } from '../../shared/api/library';
import type { Role } from '../../shared/api/hulls';
import type { Camber } from '../../shared/geometry/camber-schema';
import type { HullLines } from '../../shared/geometry/hull-schema';
import { hullIssues } from '../../shared/geometry/hull';
import { partsIssues } from '../../shared/geometry/part-schema';
import type { Plan } from '../../shared/geometry/plan-schema';
import { AppError, notFound } from '../errors';
import { LibraryItem, LibraryPin, LibraryRevision, User } from '../models';
import { CUT_PARTS_KNOWN, cutPartIdsOf } from './cut-parts';
import { documentOf, itemForViewer, itemVisibleTo, revisionOfItem, revisionSummaryOf, type Viewer } from './library-access';
import { camberDrawing, documentPart, linesDrawing, movementOf, pinnedPartOf } from './library-movement';
import { noticesResolve } from './notices';
import { planResponseJson, planValidated, revisionSave } from './plans';

/** What a pin route knows of the hull (hullAccess) and of the person. */
export interface PinAccess {
  hullId: number;
  units: 'mm' | 'ftin';
  role: Role;
  latestRevisionId: number | null;
}

type PinRow = LibraryPin & { revision: LibraryRevision; item: LibraryItem; pinner: User };

const pinIncludes = [
  { model: LibraryRevision, as: 'revision' },
  { model: LibraryItem, as: 'item' },
  { model: User, as: 'pinner', attributes: ['displayName'] },
];

async function pinView(pin: PinRow, viewer: Viewer): Promise<HullPin> {
  const visible = await itemVisibleTo(pin.item, viewer);
  const latest = visible && pin.item.latestRevisionId ? await LibraryRevision.findByPk(pin.item.latestRevisionId, { attributes: ['id', 'number'] }) : null;
  const author = await User.findByPk(pin.item.authorId, { attributes: ['displayName'] });
  return {
    id: pin.id,
    hullId: pin.hullId,
    kind: pin.kind,
    itemId: pin.itemId,
    visible,
    itemName: pin.revision.name,
    authorName: author?.displayName ?? '',
    revisionId: pin.revisionId,
    revisionNumber: pin.revision.number,
    latestRevisionId: latest?.id ?? null,
    latestRevisionNumber: latest?.number ?? null,
    pinnedAt: pin.updatedAt.toISOString(),
    pinnedByName: pin.pinner.displayName,
    planRevisionId: pin.planRevisionId,
  };
}

async function pinOfHull(hullId: number, pinId: number, transaction?: Transaction): Promise<PinRow> {
  const pin = (await LibraryPin.findOne({ where: { id: pinId, hullId }, include: pinIncludes, transaction })) as PinRow | null;
  if (!pin) throw notFound('This hull has no such Library pin');
  return pin;
}

/** What the hull took from the Library. */
export async function pinsOf(hullId: number, viewer: Viewer): Promise<HullPin[]> {
  const pins = (await LibraryPin.findAll({ where: { hullId }, include: pinIncludes, order: [['kind', 'ASC']] })) as PinRow[];
  return Promise.all(pins.map((p) => pinView(p, viewer)));
}

async function planAt(access: PinAccess, revisionId: number | null): Promise<Plan> {
  try {
    return JSON.parse(await planResponseJson(access.hullId, revisionId, access.units)).plan as Plan;
  } catch (err) {
    if (err instanceof AppError && err.status === 404) throw new AppError(400, 'no_such_base', `Revision ${revisionId} is not a revision of this hull`, 'baseRevisionId');
    throw err;
  }
}

/**
 * The plan with the document in its place. A camber replaces the deck's camber (thickness and the rest
 * of the deck stay the hull's). Lines replace the stations and the table of offsets, with the x
 * direction and design waterline that go with them; the hull keeps its notation, skin and deck, and its
 * parts must still find their stations and lines in the new table.
 */
export function planWithDocument(plan: Plan, kind: LibraryKind, doc: LibraryDocument): Plan {
  if (kind === 'camber') {
    if (!plan.lines.deck) {
      throw new AppError(409, 'no_deck', 'This hull has no deck set up yet, so there is no camber to replace. Set up the deck (its thickness) under Lines first, then take the camber.');
    }
    return planValidated({ ...plan, lines: { ...plan.lines, deck: { ...plan.lines.deck, camber: doc as Camber } } });
  }
  const from = doc as HullLines;
  const lines: HullLines = { ...plan.lines, stations: from.stations, lines: from.lines, xDirection: from.xDirection, designWaterlineZ: from.designWaterlineZ };
  const lineIssues = hullIssues(lines);
  if (lineIssues.length) {
    const first = lineIssues[0]!;
    throw new AppError(409, 'lines_do_not_fit', `These lines do not fit this hull's skin or deck: ${first.message}`, `lines.${first.field ?? ''}`, true, {
      issues: lineIssues.map((i) => ({ field: `lines.${i.field ?? ''}`, message: i.message })),
    });
  }
  const partIssues = partsIssues(plan.parts, lines);
  if (partIssues.length) {
    const first = partIssues[0]!;
    throw new AppError(409, 'parts_do_not_fit', `The hull's parts do not fit these lines: ${first.message}`, `parts.${first.field ?? ''}`, true, {
      issues: partIssues.map((i) => ({ field: `parts.${i.field ?? ''}`, message: i.message })),
    });
  }
  return planValidated({ ...plan, lines });
}

const kindWords: Record<LibraryKind, string> = { camber: 'camber', lines: 'lines' };

/** Save the plan with the revision in place and point the hull's pin of that kind at it, in one transaction. */
async function saveWithPin(access: PinAccess, viewer: Viewer, item: LibraryItem, revision: LibraryRevision, baseRevisionId: number | null, verb: string): Promise<PinSaveResponse> {
  const doc = documentOf(item.kind, revision.documentJson);
  const base = await planAt(access, baseRevisionId);
  const plan = planWithDocument(base, item.kind, doc);
  const movement = movementOf(base, plan, item.kind, await cutPartIdsOf(access.hullId));
  const summary = `${verb} ${kindWords[item.kind]} "${revision.name}" (revision ${revision.number}) from the Library`;
  const sequelize = LibraryPin.sequelize!;
  const { saved, pinId } = await sequelize.transaction(async (transaction) => {
    const saved = await revisionSave({ hullId: access.hullId, units: access.units, authorId: viewer.id, role: access.role, baseRevisionId, plan, summary }, transaction);
    const existing = await LibraryPin.findOne({ where: { hullId: access.hullId, kind: item.kind }, transaction, lock: transaction.LOCK.UPDATE });
    const values = { itemId: item.id, revisionId: revision.id, planRevisionId: saved.revision.id, pinnedBy: viewer.id };
    const pin = existing ? await existing.update(values, { transaction }) : await LibraryPin.create({ hullId: access.hullId, kind: item.kind, ...values }, { transaction });
    return { saved, pinId: pin.id };
  });
  await noticesResolve(pinId);
  const pin = await pinOfHull(access.hullId, pinId);
  return { pin: await pinView(pin, viewer), revision: saved.revision, movement };
}

/** "Take into hull": a new plan revision with the item's revision in place, and the hull pins that revision. */
export async function pinTake(access: PinAccess, viewer: Viewer, input: TakeIntoHullInput): Promise<PinSaveResponse> {
  const item = await itemForViewer(input.itemId, viewer);
  const revision = await revisionOfItem(item, input.revisionId);
  return saveWithPin(access, viewer, item, revision, input.baseRevisionId, 'Took');
}

/** Move the hull to another revision of what it pins: a new plan revision, the pin follows, the notices are answered. */
export async function pinMove(access: PinAccess, viewer: Viewer, pinId: number, input: MovePinInput): Promise<PinSaveResponse> {
  const pin = await pinOfHull(access.hullId, pinId);
  const item = await itemForViewer(pin.itemId, viewer);
  const revision = await revisionOfItem(item, input.toRevisionId);
  return saveWithPin(access, viewer, item, revision, input.baseRevisionId, 'Moved to');
}

/** The pinned revision against another one, drawn over each other, and how far each part of the hull would move. */
export async function pinCompare(access: PinAccess, viewer: Viewer, pinId: number, toRevisionId: number): Promise<PinCompareResponse> {
  const pin = await pinOfHull(access.hullId, pinId);
  const item = await itemForViewer(pin.itemId, viewer);
  const to = await revisionOfItem(item, toRevisionId);
  const fromDoc = documentOf(item.kind, pin.revision.documentJson);
  const toDoc = documentOf(item.kind, to.documentJson);
  const current = await planAt(access, access.latestRevisionId);
  const target = planWithDocument(current, item.kind, toDoc);
  const movement: PartMovement[] = movementOf(current, target, item.kind, await cutPartIdsOf(access.hullId));
  return {
    pin: await pinView(pin, viewer),
    from: revisionSummaryOf(pin.revision),
    to: revisionSummaryOf(to),
    hullDiffersFromPin: JSON.stringify(pinnedPartOf(current, item.kind)) !== JSON.stringify(documentPart(fromDoc, item.kind)),
    drawing: item.kind === 'camber' ? camberDrawing(fromDoc as Camber, toDoc as Camber, current.lines) : linesDrawing(fromDoc as HullLines, toDoc as HullLines),
    movement,
    movementMethod: 'outline',
    cutPartsKnown: CUT_PARTS_KNOWN,
  };
}
