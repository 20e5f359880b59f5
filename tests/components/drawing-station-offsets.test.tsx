import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { StationOffsetsPanel } from '../../src/features/plan/components/drawing/station-offsets-panel';
import { createEditorStore } from '../../src/features/plan/editor/editor-store';
import type { Saver } from '../../src/features/plan/editor/saver';
import { PlanEditorContext } from '../../src/features/plan/hooks/use-plan-editor';
import { hull } from './fixtures';
import { smallPlan } from './plan-fixtures';

const mm = { unit: 'mm', decimalComma: false, sixteenthMarks: 'plus-sixteenth', precision: '0.5mm' } as const;

function setUp(readOnly = false) {
  const plan = smallPlan();
  const store = createEditorStore({ plan, baseRevisionId: 4, basePlan: plan, serverPlan: plan });
  const user = userEvent.setup();
  // The panel saves nothing itself (the provider's saver autosaves the store), so no saver is asked for.
  const value = { state: 'ready' as const, hull: hull({ role: readOnly ? 'helper' : 'owner' }), store, saver: null as unknown as Saver, canEditLines: !readOnly, canEditParts: !readOnly };
  render(
    <PlanEditorContext.Provider value={value}>
      <StationOffsetsPanel selection={{ stationId: 'st-2', lineId: null }} onSelect={() => {}} section={null} readOnly={readOnly} notation={mm} />
    </PlanEditorContext.Provider>,
  );
  const cell = (lineId: string) => (store.getState().plan.lines.lines.find((l) => l.id === lineId)!.cells as Record<string, unknown>)['st-2'];
  return { store, user, cell };
}

describe('Station offsets beside the body plan', () => {
  it('puts an exact value typed for a point into the working copy, as the table does, and undo takes it back', async () => {
    const { store, user, cell } = setUp();
    const input = screen.getByLabelText('WL 300 at St 2');
    expect((input as HTMLInputElement).value).toBe('450');
    await user.clear(input);
    await user.type(input, '462.5{Enter}');
    expect(cell('ln-wl')).toBe(462.5);
    expect(store.getState().undo.map((u) => u.label)).toEqual(['WL 300 at St 2']);
    store.getState().undoLast();
    expect(await screen.findByDisplayValue('450')).toBe(screen.getByLabelText('WL 300 at St 2'));
  });

  it('keeps a value that is not a length out of the plan and says which cell and why', async () => {
    const { store, user } = setUp();
    const before = store.getState().plan;
    const input = screen.getByLabelText('Chine height at St 2');
    await user.clear(input);
    await user.type(input, '18O{Enter}');
    expect(store.getState().plan).toBe(before);
    expect(screen.getByText(/^Chine height at St 2: "18O"/)).toBeTruthy();
    expect(screen.getByLabelText('Chine height at St 2').getAttribute('aria-invalid')).toBe('true');
  });

  it('moves the station, refuses an x that is not a length or is taken, and deletes a point', async () => {
    const { store, user, cell } = setUp();
    const x = screen.getByLabelText('St 2 x');
    await user.clear(x);
    await user.type(x, '1250{Enter}');
    expect(store.getState().plan.lines.stations.find((s) => s.id === 'st-2')!.x).toBe(1250);
    const again = screen.getByLabelText('St 2 x');
    await user.clear(again);
    await user.type(again, 'twelve{Enter}');
    expect(screen.getByText(/^Station St 2 x, "twelve": /)).toBeTruthy();
    await user.clear(again);
    await user.type(again, '1800{Enter}');
    expect(screen.getByText('Station St 2 x, "1800": another station is already at 1800.')).toBeTruthy();
    expect(store.getState().plan.lines.stations.find((s) => s.id === 'st-2')!.x).toBe(1250);
    await user.click(screen.getByRole('button', { name: 'Delete Chine at St 2' }));
    expect(cell('ln-chine')).toBeNull();
  });

  it('shows a helper the offsets read-only, with nothing to change them', () => {
    setUp(true);
    expect(screen.getByLabelText('WL 300 at St 2').hasAttribute('readonly')).toBe(true);
    expect(screen.queryByRole('button', { name: /^Delete / })).toBeNull();
  });
});
