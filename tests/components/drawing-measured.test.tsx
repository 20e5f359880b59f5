import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { useStore } from 'zustand';
import type { MeasuredFrame } from '../../shared/geometry/part-schema';
import type { Plan } from '../../shared/geometry/plan-schema';
import { MeasuredPointsTable } from '../../src/features/plan/components/drawing/measured-points-table';
import { createEditorStore, type EditorStore } from '../../src/features/plan/editor/editor-store';
import { measuredFrameAdd, measuredFrameNew, measuredPointAdd } from '../../src/features/plan/editor/measured-actions';
import { smallPlan } from './plan-fixtures';
import { errorUnder } from './render-app';

const mm = { unit: 'mm', decimalComma: false, sixteenthMarks: 'plus-sixteenth', precision: '0.5mm' } as const;

function Harness({ store, id, readOnly = false }: { store: EditorStore; id: string; readOnly?: boolean }) {
  const plan = useStore(store, (s) => s.plan);
  const frame = plan.parts.parts.find((p) => p.id === id) as MeasuredFrame;
  return <MeasuredPointsTable frame={frame} plan={plan} notation={mm} readOnly={readOnly} apply={(e) => store.getState().apply(e)} />;
}

function setUp(readOnly = false, readings: { y: number; h: number }[] = []) {
  const base = smallPlan();
  const frame = measuredFrameNew(base, { x: 1500, kind: 'offsets' });
  const plan: Plan = readings.reduce((p, r) => measuredPointAdd(p, { partId: frame.id, reading: { ...r, bevel: null } }), measuredFrameAdd(base, { frame }));
  const store = createEditorStore({ plan, baseRevisionId: 4, basePlan: plan, serverPlan: plan });
  const user = userEvent.setup();
  render(<Harness store={store} id={frame.id} readOnly={readOnly} />);
  const points = () => (store.getState().plan.parts.parts.find((p) => p.id === frame.id) as MeasuredFrame).measurement.points;
  return { store, user, points, frame };
}

describe('Measured frame side table', () => {
  it('adds a typed point to the working copy, and undo takes it out again', async () => {
    const { store, user, points } = setUp();
    const form = screen.getByRole('form', { name: 'Add a point' });
    await user.type(within(form).getByLabelText('Offset from centreline (mm)'), '420');
    await user.type(within(form).getByLabelText('Height above reference (mm)'), '-35.5');
    await user.type(within(form).getByLabelText('Bevel reading (°)'), '78');
    await user.click(within(form).getByRole('button', { name: 'Add point' }));
    expect(points()).toHaveLength(1);
    expect(points()[0]).toMatchObject({ y: 420, h: -35.5, bevel: { sense: 'under' } });
    expect((points()[0] as { bevel: { readingRad: number } }).bevel.readingRad).toBeCloseTo((78 * Math.PI) / 180, 12);
    expect(store.getState().undo.map((u) => u.label)).toEqual([expect.stringMatching(/^Add point 1 to /)]);
    expect((screen.getByLabelText('Point 1 offset from centreline (mm)') as HTMLInputElement).value).toBe('420');

    store.getState().undoLast();
    expect(points()).toHaveLength(0);
    expect(await screen.findByText(/No points yet/)).toBeTruthy();
  });

  it('marks a value that is not a length with its reason and writes nothing', async () => {
    const { store, user, points } = setUp();
    const before = store.getState().plan;
    const form = screen.getByRole('form', { name: 'Add a point' });
    const offset = within(form).getByLabelText('Offset from centreline (mm)');
    await user.type(offset, '42O');
    await user.type(within(form).getByLabelText('Height above reference (mm)'), '10');
    await user.click(within(form).getByRole('button', { name: 'Add point' }));
    errorUnder(offset, 'Point 1: The offset from the centreline: "42O"');
    expect(store.getState().plan).toBe(before);
    expect(points()).toHaveLength(0);
    expect(store.getState().undo).toHaveLength(0);
  });

  it('changes a point in its row; a bad value in a row is marked there and the point keeps its value', async () => {
    const { user, points } = setUp();
    const form = screen.getByRole('form', { name: 'Add a point' });
    await user.type(within(form).getByLabelText('Offset from centreline (mm)'), '400');
    await user.type(within(form).getByLabelText('Height above reference (mm)'), '0');
    await user.click(within(form).getByRole('button', { name: 'Add point' }));

    const height = screen.getByLabelText('Point 1 height above reference (mm)');
    await user.clear(height);
    await user.type(height, '12.5{Enter}');
    expect(points()[0]).toMatchObject({ y: 400, h: 12.5 });

    // Tabbing on from a changed cell writes it and leaves the focus in the next cell of the row.
    const offset = screen.getByLabelText('Point 1 offset from centreline (mm)');
    await user.clear(offset);
    await user.type(offset, '410');
    await user.tab();
    expect(points()[0]).toMatchObject({ y: 410, h: 12.5 });
    expect(document.activeElement).toBe(screen.getByLabelText('Point 1 height above reference (mm)'));

    const again = screen.getByLabelText('Point 1 height above reference (mm)');
    await user.clear(again);
    await user.type(again, '1x2');
    await user.tab();
    const marked = screen.getByLabelText('Point 1 height above reference (mm)');
    expect(marked.getAttribute('aria-invalid')).toBe('true');
    expect(document.getElementById(marked.getAttribute('aria-describedby')!)!.textContent).toContain('Point 1: The height above the reference line: "1x2"');
    expect(points()[0]).toMatchObject({ y: 410, h: 12.5 });
  });

  it('refuses a bevel reading on the wrong side of 90° for the sense chosen', async () => {
    const { user, points } = setUp();
    const form = screen.getByRole('form', { name: 'Add a point' });
    await user.type(within(form).getByLabelText('Offset from centreline (mm)'), '400');
    await user.type(within(form).getByLabelText('Height above reference (mm)'), '0');
    await user.click(within(form).getByRole('button', { name: 'Add point' }));
    await user.type(screen.getByLabelText('Point 1 bevel reading (°)'), '80{Enter}');
    expect(points()[0]).toMatchObject({ bevel: { sense: 'under' } });
    await user.selectOptions(screen.getByLabelText('Point 1 bevel sense'), 'standing');
    expect(screen.getByText(/A sliding bevel reading 80° is less than 90°: that is an under bevel, not a standing one/)).toBeTruthy();
    expect(points()[0]).toMatchObject({ bevel: { sense: 'under' } });
  });

  it('read-only: no form to add, the cells cannot be typed into, nothing can be deleted', async () => {
    const { user, store, points } = setUp(true, [{ y: 400, h: 0 }]);
    const before = store.getState().plan;
    expect(screen.queryByRole('form', { name: 'Add a point' })).toBeNull();
    expect(screen.queryByRole('button', { name: /^Delete point/ })).toBeNull();
    const cell = screen.getByLabelText('Point 1 offset from centreline (mm)') as HTMLInputElement;
    await user.type(cell, '5{Enter}');
    expect(cell.value).toBe('400');
    expect(store.getState().plan).toBe(before);
    expect(points()).toEqual([{ y: 400, h: 0, bevel: null }]);
  });
});
