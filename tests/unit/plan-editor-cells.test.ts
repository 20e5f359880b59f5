import { describe, expect, it } from 'vitest';
import { cellEntriesApply, cellLabel, clipboardBlock, pendingOf, pendingPrune } from '../../src/features/plan/editor/cell-entry';
import type { CellRef } from '../../src/features/plan/editor/types';
import { stationDelete } from '../../src/features/plan/editor/station-actions';
import { ftin, mm, plan } from './plan-editor-fixtures';

const ref = (lineId: string, stationId: string, field: CellRef['field'] = 'value'): CellRef => ({ lineId, stationId, field });
const start = () => ({ plan: plan(), pending: {} });
const cellOf = (state: ReturnType<typeof start>, lineId: string, stationId: string) => (state.plan.lines.lines.find((l) => l.id === lineId)!.cells as Record<string, unknown>)[stationId];

describe('cellEntriesApply', () => {
  it('reads typed text in the notation and writes it into the plan', () => {
    const s = cellEntriesApply(start(), [{ ref: ref('ln-wl', 'st-2'), text: ' 462.5 ' }], mm);
    expect(cellOf(s, 'ln-wl', 'st-2')).toBe(462.5);
    expect(s.pending).toEqual({});
  });

  it('reads feet-inches-eighths with a sixteenth mark as the trade writes it (3-5-2+ = 3 ft 5 5/16 in)', () => {
    const s = cellEntriesApply(start(), [{ ref: ref('ln-wl', 'st-2'), text: '3-5-2+' }], ftin);
    expect(cellOf(s, 'ln-wl', 'st-2')).toBeCloseTo((3 * 12 + 5 + 5 / 16) * 25.4, 9);
  });

  it('keeps a value that is not a length as typed, with where and why, and leaves the plan as it was', () => {
    const before = start();
    const s = cellEntriesApply(before, [{ ref: ref('ln-wl', 'st-2'), text: '4O0' }], mm);
    expect(s.plan).toBe(before.plan);
    expect(pendingOf(s.pending, ref('ln-wl', 'st-2'))).toEqual({ kind: 'error', text: '4O0', message: 'WL 300 at St 2: "4O0": this is not a length (expected millimetres like 1049.5)' });
    // Put right, the mark goes.
    const fixed = cellEntriesApply(s, [{ ref: ref('ln-wl', 'st-2'), text: '400' }], mm);
    expect(fixed.pending).toEqual({});
    expect(cellOf(fixed, 'ln-wl', 'st-2')).toBe(400);
  });

  it('clears a cell with empty text', () => {
    expect(cellOf(cellEntriesApply(start(), [{ ref: ref('ln-wl', 'st-1'), text: '' }], mm), 'ln-wl', 'st-1')).toBeNull();
  });

  it('changes one half of a point line’s cell, keeping the other', () => {
    const s = cellEntriesApply(start(), [{ ref: ref('ln-chine', 'st-1', 'z'), text: '260' }], mm);
    expect(cellOf(s, 'ln-chine', 'st-1')).toEqual({ y: 300, z: 260 });
  });

  it('holds one half of an empty point cell until the other half comes, then writes both', () => {
    const half = cellEntriesApply(start(), [{ ref: ref('ln-chine', 'st-2', 'z'), text: '180' }], mm);
    expect(cellOf(half, 'ln-chine', 'st-2')).toBeNull();
    expect(pendingOf(half.pending, ref('ln-chine', 'st-2', 'z'))).toMatchObject({ kind: 'incomplete', text: '180', mm: 180 });
    expect(pendingOf(half.pending, ref('ln-chine', 'st-2', 'z'))!.message).toBe('Chine height at St 2: this height waits for the half-breadth at St 2; the point goes into the plan when both are filled in');
    const whole = cellEntriesApply(half, [{ ref: ref('ln-chine', 'st-2', 'y'), text: '560' }], mm);
    expect(cellOf(whole, 'ln-chine', 'st-2')).toEqual({ y: 560, z: 180 });
    expect(whole.pending).toEqual({});
  });

  it('takes a pasted height row and half-breadth row together into whole points', () => {
    const s = cellEntriesApply(
      start(),
      [
        { ref: ref('ln-chine', 'st-2', 'z'), text: '180' },
        { ref: ref('ln-chine', 'st-3', 'z'), text: '170' },
        { ref: ref('ln-chine', 'st-2', 'y'), text: '560' },
        { ref: ref('ln-chine', 'st-3', 'y'), text: '600' },
      ],
      mm,
    );
    expect([cellOf(s, 'ln-chine', 'st-2'), cellOf(s, 'ln-chine', 'st-3')]).toEqual([
      { y: 560, z: 180 },
      { y: 600, z: 170 },
    ]);
    expect(s.pending).toEqual({});
  });

  it('clearing one half of a point takes the point out of the plan but keeps the other half in the tab', () => {
    const s = cellEntriesApply(start(), [{ ref: ref('ln-chine', 'st-1', 'z'), text: '' }], mm);
    expect(cellOf(s, 'ln-chine', 'st-1')).toBeNull();
    expect(pendingOf(s.pending, ref('ln-chine', 'st-1', 'y'))).toMatchObject({ kind: 'incomplete', text: '300', mm: 300 });
  });

  it('ignores a cell of a line or station not in the plan', () => {
    const before = start();
    expect(cellEntriesApply(before, [{ ref: ref('ln-x', 'st-1'), text: '5' }], mm)).toEqual(before);
    expect(cellEntriesApply(before, [{ ref: ref('ln-wl', 'st-9'), text: '5' }], mm)).toEqual(before);
  });
});

describe('pendingPrune', () => {
  it('drops text typed for a station that is gone', () => {
    const s = cellEntriesApply(start(), [{ ref: ref('ln-wl', 'st-3'), text: 'abc' }, { ref: ref('ln-bt', 'st-1'), text: 'x' }], mm);
    const pruned = pendingPrune(stationDelete(s.plan, { stationId: 'st-3' }), s.pending);
    expect(Object.keys(pruned)).toEqual(['ln-bt']);
    expect(pendingPrune(s.plan, s.pending)).toBe(s.pending);
  });
});

describe('clipboardBlock', () => {
  it('splits a spreadsheet’s copy into rows and cells, dropping the trailing line break', () => {
    expect(clipboardBlock('1\t2\t3\r\n4\t5\t6\r\n')).toEqual([
      ['1', '2', '3'],
      ['4', '5', '6'],
    ]);
    expect(clipboardBlock('7')).toEqual([['7']]);
    expect(clipboardBlock('1\t\t3\n')).toEqual([['1', '', '3']]);
  });
});

describe('cellLabel', () => {
  it('names a cell as a person says it', () => {
    expect(cellLabel({ name: 'WL 300' }, 'value', { name: 'St 4' })).toBe('WL 300 at St 4');
    expect(cellLabel({ name: 'Sheer' }, 'y', { name: 'St 2' })).toBe('Sheer half-breadth at St 2');
  });
});
