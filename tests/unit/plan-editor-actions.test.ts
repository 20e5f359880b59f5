import { describe, expect, it } from 'vitest';
import { planSchema, type Plan } from '../../shared/geometry/plan-schema';
import { cellSet, cellsSet } from '../../src/features/plan/editor/cell-actions';
import { lineAdd, lineDelete, lineReorder, lineUpdate, panelsBoundedBy } from '../../src/features/plan/editor/line-actions';
import { longitudinalAdd, longitudinalDelete, longitudinalUpdate, partAdd, partDelete, partUpdate } from '../../src/features/plan/editor/part-actions';
import { newLongitudinal, newPart, partOfKind } from '../../src/features/plan/editor/part-defaults';
import { camberSet, deckSet, linesSettingsSet, notationSet, skinSet } from '../../src/features/plan/editor/settings-actions';
import { stationAdd, stationDelete, stationMove, stationRename, stationReorder, stationsSortByX } from '../../src/features/plan/editor/station-actions';
import { plan } from './plan-editor-fixtures';

const line = (p: Plan, id: string) => p.lines.lines.find((l) => l.id === id)!;
const ids = <T extends { id: string }>(items: readonly T[]) => items.map((i) => i.id);
/** Every action's result must still be a plan the server accepts. */
const valid = (p: Plan) => expect(planSchema.safeParse(p).success).toBe(true);

describe('cellSet', () => {
  it('sets a waterline cell and leaves the input untouched, sharing the lines it did not change', () => {
    const before = plan();
    const frozen = JSON.stringify(before);
    const after = cellSet(before, { lineId: 'ln-wl', stationId: 'st-2', value: 470 });
    expect(line(after, 'ln-wl').cells['st-2']).toBe(470);
    expect(JSON.stringify(before)).toBe(frozen);
    expect(line(after, 'ln-bt')).toBe(line(before, 'ln-bt'));
    expect(after.parts).toBe(before.parts);
    valid(after);
  });

  it('sets a point cell as a half-breadth and a height together, and clears it with null', () => {
    const after = cellSet(plan(), { lineId: 'ln-chine', stationId: 'st-2', value: { y: 560, z: 180 } });
    expect(line(after, 'ln-chine').cells['st-2']).toEqual({ y: 560, z: 180 });
    expect(line(cellSet(after, { lineId: 'ln-chine', stationId: 'st-1', value: null }), 'ln-chine').cells['st-1']).toBeNull();
  });

  it('gives back the same plan for no change, a value of the wrong shape, an unknown line or station, or NaN', () => {
    const p = plan();
    expect(cellSet(p, { lineId: 'ln-wl', stationId: 'st-1', value: 300 })).toBe(p);
    expect(cellSet(p, { lineId: 'ln-wl', stationId: 'st-1', value: { y: 1, z: 2 } })).toBe(p);
    expect(cellSet(p, { lineId: 'ln-chine', stationId: 'st-1', value: 5 })).toBe(p);
    expect(cellSet(p, { lineId: 'ln-nope', stationId: 'st-1', value: 5 })).toBe(p);
    expect(cellSet(p, { lineId: 'ln-wl', stationId: 'st-9', value: 5 })).toBe(p);
    expect(cellSet(p, { lineId: 'ln-wl', stationId: 'st-1', value: Number.NaN })).toBe(p);
  });
});

describe('cellsSet (a pasted block)', () => {
  it('writes every cell of the block in one new plan', () => {
    const after = cellsSet(plan(), {
      writes: [
        { lineId: 'ln-wl', stationId: 'st-1', value: 310 },
        { lineId: 'ln-wl', stationId: 'st-2', value: 460 },
        { lineId: 'ln-bt', stationId: 'st-3', value: 120 },
      ],
    });
    expect(line(after, 'ln-wl').cells).toEqual({ 'st-1': 310, 'st-2': 460, 'st-3': 500 });
    expect(line(after, 'ln-bt').cells['st-3']).toBe(120);
  });
});

describe('stations', () => {
  it('adds a station in order of x, with an id of its own', () => {
    const after = stationAdd(plan(), { name: 'St 1½', x: 900 });
    expect(after.lines.stations.map((s) => [s.name, s.x])).toEqual([
      ['St 1', 600],
      ['St 1½', 900],
      ['St 2', 1200],
      ['St 3', 1800],
    ]);
    expect(new Set(ids(after.lines.stations)).size).toBe(4);
    valid(after);
  });

  it('never reuses an id: a second station of the same name gets its own', () => {
    const once = stationAdd(plan(), { name: 'St 4', x: 2400 });
    const twice = stationAdd(once, { name: 'St 4', x: 3000 });
    expect(ids(twice.lines.stations).slice(-2)).toEqual(['st-st-4', 'st-st-4-2']);
  });

  it('renames and moves a station; its offsets stay with it', () => {
    const after = stationMove(stationRename(plan(), { stationId: 'st-2', name: ' St 2A ' }), { stationId: 'st-2', x: 1250 });
    expect(after.lines.stations[1]).toEqual({ id: 'st-2', name: 'St 2A', x: 1250 });
    expect(line(after, 'ln-wl').cells['st-2']).toBe(450);
    expect(stationRename(plan(), { stationId: 'st-2', name: '  ' }).lines.stations[1]!.name).toBe('St 2');
  });

  it('reorders the columns, and sorts them back by x', () => {
    const moved = stationReorder(plan(), { stationId: 'st-3', toIndex: 0 });
    expect(ids(moved.lines.stations)).toEqual(['st-3', 'st-1', 'st-2']);
    expect(ids(stationsSortByX(moved).lines.stations)).toEqual(['st-1', 'st-2', 'st-3']);
    const p = plan();
    expect(stationsSortByX(p)).toBe(p);
  });

  it('deletes a station with its offsets in every line', () => {
    const after = stationDelete(plan(), { stationId: 'st-1' });
    expect(ids(after.lines.stations)).toEqual(['st-2', 'st-3']);
    for (const l of after.lines.lines) expect(Object.keys(l.cells)).not.toContain('st-1');
    valid(after);
  });
});

describe('lines', () => {
  it('adds a line of each kind with its fixed value; sheer, chine and keel as knuckles', () => {
    let p = plan();
    p = lineAdd(p, { name: 'WL 150', spec: { kind: 'waterline', z: 150 } });
    p = lineAdd(p, { name: 'Buttock 400', spec: { kind: 'buttock', y: 400 } });
    p = lineAdd(p, { name: 'Diagonal A', spec: { kind: 'diagonal', originZ: 600, angle: Math.PI / 6 } });
    p = lineAdd(p, { name: 'Sheer', spec: { kind: 'point', role: 'sheer' } });
    const added = p.lines.lines.slice(-4);
    expect(added.map((l) => [l.name, l.kind, l.knuckle !== null])).toEqual([
      ['WL 150', 'waterline', false],
      ['Buttock 400', 'buttock', false],
      ['Diagonal A', 'diagonal', false],
      ['Sheer', 'point', true],
    ]);
    expect(added[0]).toMatchObject({ z: 150, cells: {} });
    expect(added[2]).toMatchObject({ originZ: 600, angle: Math.PI / 6 });
    valid(p);
  });

  it('renames a line and changes its fixed value, but never its kind', () => {
    const p = plan();
    const after = lineUpdate(p, { lineId: 'ln-wl', name: 'WL 320', spec: { kind: 'waterline', z: 320 } });
    expect(line(after, 'ln-wl')).toMatchObject({ name: 'WL 320', z: 320, cells: line(p, 'ln-wl').cells });
    expect(lineUpdate(p, { lineId: 'ln-wl', spec: { kind: 'buttock', y: 5 } })).toBe(p);
    expect(lineUpdate(p, { lineId: 'ln-wl', name: 'WL 300' })).toBe(p);
  });

  it('reorders the rows', () => {
    expect(ids(lineReorder(plan(), { lineId: 'ln-chine', toIndex: 0 }).lines.lines)).toEqual(['ln-chine', 'ln-wl', 'ln-bt']);
  });

  it('deletes a line and the skin panels bounded by it, and says which those are', () => {
    const p = plan();
    expect(panelsBoundedBy(p, 'ln-chine')).toEqual(['Bottom']);
    const after = lineDelete(p, { lineId: 'ln-chine' });
    expect(ids(after.lines.lines)).toEqual(['ln-wl', 'ln-bt']);
    expect(after.lines.skin.panels).toEqual([]);
    expect(lineDelete(after, { lineId: 'ln-chine' })).toBe(after);
  });
});

describe('settings', () => {
  it('changes the notation, skin, deck and camber, and x direction and design waterline', () => {
    let p = notationSet(plan(), { unit: 'ftin', precision: '1/16in' });
    p = skinSet(p, { defaultThicknessMm: 9, sheathingMm: 1 });
    p = deckSet(p, { deck: { thicknessMm: 9, beamAt: 'sheer-outside', clampWidthMm: 0, camber: { shape: 'parabola', points: [], crown: { kind: 'rise', riseMm: 50, referenceBeamMm: 1600 }, convention: 'one-pattern' } } });
    p = camberSet(p, { camber: { shape: 'arc', points: [], crown: { kind: 'percent-of-beam', percent: 3 }, convention: 'scaled' } });
    p = linesSettingsSet(p, { xDirection: 'forward', designWaterlineZ: 280 });
    expect(p.lines.notation).toMatchObject({ unit: 'ftin', precision: '1/16in', decimalComma: false });
    expect(p.lines.skin).toMatchObject({ defaultThicknessMm: 9, sheathingMm: 1, offsetsTo: 'outside' });
    expect(p.lines.deck?.camber).toMatchObject({ shape: 'arc', convention: 'scaled', crown: { kind: 'percent-of-beam', percent: 3 } });
    expect(p.lines.deck?.thicknessMm).toBe(9);
    expect([p.lines.xDirection, p.lines.designWaterlineZ]).toEqual(['forward', 280]);
    valid(p);
  });

  it('gives back the same plan when a setting is set to what it is, and no camber without a deck', () => {
    const p = plan();
    expect(notationSet(p, { unit: 'mm' })).toBe(p);
    expect(skinSet(p, { defaultThicknessMm: 6 })).toBe(p);
    expect(camberSet(p, { camber: { shape: 'arc', points: [], crown: { kind: 'percent-of-beam', percent: 3 }, convention: 'scaled' } })).toBe(p);
  });
});

describe('parts and longitudinals', () => {
  it('adds a part of each kind with the hull’s defaults, valid against the shared schema', () => {
    let p = plan();
    for (const kind of ['ring-frame', 'bulkhead', 'partial-bulkhead', 'floor', 'deck-beam', 'half-beam', 'mould', 'transom'] as const) {
      const part = newPart(p, kind)!;
      p = partAdd(p, { part });
    }
    expect(p.parts.parts).toHaveLength(10);
    expect(new Set(ids(p.parts.parts)).size).toBe(10);
    // The first new part takes the first station without a part.
    expect(p.parts.parts[2]).toMatchObject({ kind: 'ring-frame', stationId: 'st-1', name: 'Ring frame St 1' });
    // A floor's top starts at the chine's height at its station when there is one.
    const floor = partOfKind(plan(), 'floor', { id: 'pt-x', name: 'Floor', stationId: 'st-1', thicknessMm: 12, layers: [{ thicknessMm: 12, material: 'plywood', densityKgPerM3: null, joints: { by: 'count', pieces: 1 } }] });
    expect(floor).toMatchObject({ kind: 'floor', topZ: 250 });
    valid(p);
  });

  it('updates a part by id, and deletes it', () => {
    const p = plan();
    const frame = p.parts.parts[0]!;
    const after = partUpdate(p, { part: { ...frame, name: 'Bulkhead 2', thicknessMm: 15, layers: [{ ...frame.layers[0]!, thicknessMm: 15 }] } });
    expect(after.parts.parts[0]).toMatchObject({ name: 'Bulkhead 2', thicknessMm: 15 });
    expect(partUpdate(p, { part: frame })).toBe(p);
    expect(ids(partDelete(after, { partId: 'pt-1' }).parts.parts)).toEqual(['pt-2']);
  });

  it('adds, updates and deletes a longitudinal; deleting takes it off every part’s notches and every mould', () => {
    const p = plan();
    const added = longitudinalAdd(p, { longitudinal: newLongitudinal(p) });
    expect(added.parts.longitudinals[1]).toMatchObject({ name: 'Stringer 2', placement: { by: 'line', lineId: 'ln-chine' } });
    const changed = longitudinalUpdate(added, { longitudinal: { ...added.parts.longitudinals[0]!, widthMm: 35 } });
    expect(changed.parts.longitudinals[0]!.widthMm).toBe(35);
    const gone = longitudinalDelete(changed, { longitudinalId: 'lg-1' });
    expect(ids(gone.parts.longitudinals)).toEqual([added.parts.longitudinals[1]!.id]);
    expect(gone.parts.parts[0]!.longitudinalIds).toEqual([]);
    expect(gone.parts.parts[1]).toMatchObject({ kind: 'mould', carriesIds: [] });
    valid(gone);
  });
});
