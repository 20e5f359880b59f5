import { describe, expect, it } from 'vitest';
import type { Plan } from '../../shared/geometry/plan-schema';
import { cellSet } from '../../src/features/plan/editor/cell-actions';
import { lineAdd, lineReorder } from '../../src/features/plan/editor/line-actions';
import { partUpdate } from '../../src/features/plan/editor/part-actions';
import { planRebase } from '../../src/features/plan/editor/rebase';
import { deckSet, skinSet } from '../../src/features/plan/editor/settings-actions';
import { stationAdd, stationDelete, stationRename } from '../../src/features/plan/editor/station-actions';
import { plan } from './plan-editor-fixtures';

const cellOf = (p: Plan, lineId: string, stationId: string) => (p.lines.lines.find((l) => l.id === lineId)!.cells as Record<string, unknown>)[stationId];
const ok = (result: ReturnType<typeof planRebase>) => {
  if (!result.ok) throw new Error(result.message);
  return result;
};

describe('planRebase: my changes onto the revision saved since', () => {
  it('keeps both people’s changes to different cells', () => {
    const base = plan();
    const mine = cellSet(base, { lineId: 'ln-wl', stationId: 'st-2', value: 466 });
    const theirs = cellSet(base, { lineId: 'ln-wl', stationId: 'st-3', value: 505 });
    const r = ok(planRebase(base, mine, theirs));
    expect([cellOf(r.plan, 'ln-wl', 'st-2'), cellOf(r.plan, 'ln-wl', 'st-3')]).toEqual([466, 505]);
    expect(r.applied.map((c) => c.label)).toEqual(['WL 300 at St 2']);
    expect(r.clashes).toEqual([]);
  });

  it('keeps mine where we both changed the same cell, and lists it', () => {
    const base = plan();
    const mine = cellSet(base, { lineId: 'ln-chine', stationId: 'st-1', value: { y: 310, z: 250 } });
    const theirs = cellSet(base, { lineId: 'ln-chine', stationId: 'st-1', value: { y: 290, z: 255 } });
    const r = ok(planRebase(base, mine, theirs));
    expect(cellOf(r.plan, 'ln-chine', 'st-1')).toEqual({ y: 310, z: 250 });
    expect(r.clashes).toEqual([{ label: 'Chine at St 1', mine: { y: 310, z: 250 }, theirs: { y: 290, z: 255 } }]);
  });

  it('does not count a change we both made alike as a clash', () => {
    const base = plan();
    const same = cellSet(base, { lineId: 'ln-wl', stationId: 'st-1', value: 305 });
    expect(ok(planRebase(base, same, same)).clashes).toEqual([]);
  });

  it('brings my new station and line, and their new station, together', () => {
    const base = plan();
    const mine = lineAdd(stationAdd(base, { name: 'St 4', x: 2400 }), { name: 'WL 150', spec: { kind: 'waterline', z: 150 } });
    const theirs = stationAdd(base, { name: 'St 0', x: 0 });
    const r = ok(planRebase(base, mine, theirs));
    expect(r.plan.lines.stations.map((s) => s.name)).toEqual(['St 0', 'St 1', 'St 2', 'St 3', 'St 4']);
    expect(r.plan.lines.lines.map((l) => l.name)).toEqual(['WL 300', 'Buttock 200', 'Chine', 'WL 150']);
  });

  it('removes a station I deleted, with its cells, even where they changed a cell of it', () => {
    const base = plan();
    const mine = stationDelete(base, { stationId: 'st-3' });
    const theirs = cellSet(base, { lineId: 'ln-wl', stationId: 'st-3', value: 520 });
    const r = ok(planRebase(base, mine, theirs));
    expect(r.plan.lines.stations.map((s) => s.id)).toEqual(['st-1', 'st-2']);
    expect(cellOf(r.plan, 'ln-wl', 'st-3')).toBeUndefined();
  });

  it('drops my cell change at a station they deleted (there is nowhere to put it)', () => {
    const base = plan();
    const mine = cellSet(base, { lineId: 'ln-wl', stationId: 'st-3', value: 520 });
    const theirs = stationDelete(base, { stationId: 'st-3' });
    const r = ok(planRebase(base, mine, theirs));
    expect(cellOf(r.plan, 'ln-wl', 'st-3')).toBeUndefined();
  });

  it('merges settings field by field, and takes an array (the skin panels) whole', () => {
    const base = plan();
    const mine = skinSet(base, { defaultThicknessMm: 9, panels: [] });
    const theirs = stationRename(skinSet(base, { sheathingMm: 1 }), { stationId: 'st-1', name: 'Station 1' });
    const r = ok(planRebase(base, mine, theirs));
    expect(r.plan.lines.skin).toMatchObject({ defaultThicknessMm: 9, sheathingMm: 1, panels: [] });
    expect(r.plan.lines.stations[0]!.name).toBe('Station 1');
  });

  it('takes a deck added in my draft whole', () => {
    const base = plan();
    const deck = { thicknessMm: 9, beamAt: 'sheer-outside' as const, clampWidthMm: 0, camber: { shape: 'parabola' as const, points: [], crown: { kind: 'rise' as const, riseMm: 50, referenceBeamMm: 1600 }, convention: 'one-pattern' as const } };
    const r = ok(planRebase(base, deckSet(base, { deck }), cellSet(base, { lineId: 'ln-wl', stationId: 'st-1', value: 301 })));
    expect(r.plan.lines.deck).toEqual(deck);
    expect(cellOf(r.plan, 'ln-wl', 'st-1')).toBe(301);
  });

  it('applies a change to one field of a part, leaving their change to another field', () => {
    const base = plan();
    const frame = base.parts.parts[0]!;
    const mine = partUpdate(base, { part: { ...frame, name: 'Bulkhead 2' } });
    const theirs = partUpdate(base, { part: { ...frame, filletClearanceMm: 3 } });
    const r = ok(planRebase(base, mine, theirs));
    expect(r.plan.parts.parts[0]).toMatchObject({ name: 'Bulkhead 2', filletClearanceMm: 3 });
  });

  it('keeps my row order', () => {
    const base = plan();
    const r = ok(planRebase(base, lineReorder(base, { lineId: 'ln-chine', toIndex: 0 }), cellSet(base, { lineId: 'ln-wl', stationId: 'st-1', value: 301 })));
    expect(r.plan.lines.lines.map((l) => l.id)).toEqual(['ln-chine', 'ln-wl', 'ln-bt']);
  });
});
