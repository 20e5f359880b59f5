import { waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Role } from '../../shared/api/hulls';
import type { PartsResponse } from '../../shared/api/parts';
import { planSchema, type Plan } from '../../shared/geometry/plan-schema';
import { apiError, stubApi, type Handlers } from './api-stub';
import { ann, hull, sessionOf } from './fixtures';
import { planHandlers, revision, smallPlan } from './plan-fixtures';
import { errorUnder, renderApp, screen } from './render-app';

function framesPlan(): Plan {
  const p = smallPlan();
  return planSchema.parse({
    ...p,
    parts: {
      longitudinals: [{ id: 'lg-chine', name: 'Chine log', kind: 'stringer', placement: { by: 'line', lineId: 'ln-chine' }, widthMm: 30, depthMm: 20 }],
      parts: [
        { id: 'pt-2', name: 'Frame 2', kind: 'ring-frame', stationId: 'st-2', thicknessMm: 18, layers: [{ thicknessMm: 9 }, { thicknessMm: 9 }], ringWidth: { bottomMm: 80, sidesMm: 55 } },
        { id: 'pt-4', name: 'Transom', kind: 'transom', stationId: 'st-4', thicknessMm: 18, layers: [{ thicknessMm: 18 }], rakeRad: (10 * Math.PI) / 180 },
      ],
    },
  });
}

const results: PartsResponse = {
  revisionId: 4,
  results: [
    {
      partId: 'pt-2',
      name: 'Frame 2',
      kind: 'ring-frame',
      stationName: 'St 2',
      ok: true,
      issues: [],
      warnings: [{ code: 'saw-tilt', message: 'The saw tilt reaches 47° near the chine, past the 45° limit' }],
      layers: [
        { index: 0, thicknessMm: 9, areaMm2: 152_000, perimeterMm: 3_400, pieces: 3 },
        { index: 1, thicknessMm: 9, areaMm2: 151_000, perimeterMm: 3_380, pieces: 3 },
      ],
      massKg: 1.75,
      bevelRangeDeg: [2.5, 47],
    },
  ],
};

function framesServer(role: Role, parts: Handlers[string] = apiError(404, 'not_found', 'No such API route: GET /api/hulls/3/parts')) {
  return stubApi({
    'GET /api/session': sessionOf(ann),
    'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Tidewrack', role }) } },
    ...planHandlers(3, { plan: framesPlan(), revision: revision(4) }),
    'GET /api/hulls/3/parts': parts,
  });
}

async function openFrames(role: Role = 'builder', parts?: Handlers[string]) {
  const api = framesServer(role, parts);
  const view = renderApp('/hulls/3/frames');
  await screen.findByRole('heading', { name: 'Frames', level: 2 });
  return { api, ...view };
}

describe('Frames', () => {
  it('lists the parts with kind, station and layers, and says quietly when there are no results yet', async () => {
    await openFrames();
    const list = screen.getByRole('region', { name: 'Parts' });
    const rows = within(list).getAllByRole('row').slice(1).map((r) => [...r.children].map((c) => c.textContent));
    expect(rows).toEqual([
      ['Frame 2', 'Ring frame', 'St 2', '2 × 9 mm', '—'],
      ['Transom', 'Transom', 'St 4', '1 × 18 mm', '—'],
    ]);
    expect(await screen.findByText(/Results not available yet/)).toBeTruthy();
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('shows the server’s results beside the form: area, mass, bevel range and warnings', async () => {
    await openFrames('builder', { body: results });
    const panel = (await screen.findByRole('heading', { name: 'Results' })).closest('section')!;
    await within(panel).findByText('Computed');
    expect(panel.textContent).toContain('0.303 m²');
    expect(panel.textContent).toContain('1.75 kg');
    expect(panel.textContent).toContain('2.5° to 47°');
    expect(panel.textContent).toContain('The saw tilt reaches 47° near the chine');
    const list = screen.getByRole('region', { name: 'Parts' });
    expect(within(list).getByText('1 warning')).toBeTruthy();
    expect(within(list).getByText('Not saved yet')).toBeTruthy();
  });

  it('checks the part with the shared schema: layers that do not add up are refused with the reason', async () => {
    const { user } = await openFrames();
    const thickness = screen.getByLabelText('Frame thickness (mm)');
    await user.clear(thickness);
    await user.type(thickness, '21');
    await user.click(screen.getByRole('button', { name: 'Apply changes' }));
    const alerts = await screen.findAllByRole('alert');
    expect(alerts.map((a) => a.textContent).join(' ')).toContain('the layers add up to 18 mm but the frame is 21 mm thick');
    expect(screen.queryByRole('button', { name: /^Undo: / })).toBeNull();

    await user.click(screen.getByRole('button', { name: 'Add a layer' }));
    await user.clear(screen.getByLabelText('Layer 3 thickness (mm)'));
    await user.type(screen.getByLabelText('Layer 3 thickness (mm)'), '3');
    await user.click(screen.getByRole('button', { name: 'Apply changes' }));
    expect(await screen.findByRole('button', { name: 'Undo: Change Frame 2' })).toBeTruthy();
    expect(within(screen.getByRole('region', { name: 'Parts' })).getByText('9 + 9 + 3 mm')).toBeTruthy();

    // Undo takes the part back, and the form with it.
    await user.click(screen.getByRole('button', { name: 'Undo: Change Frame 2' }));
    await waitFor(() => expect((screen.getByLabelText('Frame thickness (mm)') as HTMLInputElement).value).toBe('18'));
    expect(screen.queryByLabelText('Layer 3 thickness (mm)')).toBeNull();
  });

  it('names a field that is not a number under it', async () => {
    const { user } = await openFrames();
    await user.clear(screen.getByLabelText('Ring width at the bottom (mm)'));
    await user.type(screen.getByLabelText('Ring width at the bottom (mm)'), '8O');
    await user.click(screen.getByRole('button', { name: 'Apply changes' }));
    errorUnder(screen.getByLabelText('Ring width at the bottom (mm)'), 'the ring width at the bottom (mm) must be a number, found "8O"');
  });

  it('shows the transom’s rake in degrees and stores radians', async () => {
    const { user, api } = await openFrames();
    await user.click(screen.getByRole('button', { name: 'Transom' }));
    const rake = (await screen.findByLabelText('Rake from the vertical (degrees)')) as HTMLInputElement;
    expect(rake.value).toBe('10');
    await user.clear(rake);
    await user.type(rake, '14');
    await user.click(screen.getByRole('button', { name: 'Apply changes' }));
    await screen.findByRole('button', { name: 'Undo: Change Transom' });
    // The autosave carries the plan as stored.
    await waitFor(() => expect(api.count('PUT', '/api/hulls/3/plan/draft')).toBe(1), { timeout: 4000 });
    const sent = api.calls.find((c) => c.method === 'PUT')!.body as { plan: Plan };
    const transom = sent.plan.parts.parts.find((p) => p.id === 'pt-4')!;
    expect(transom.kind === 'transom' && transom.rakeRad).toBeCloseTo((14 * Math.PI) / 180, 12);
  });

  it('adds a part at the first station without one, and deletes one after asking', async () => {
    const { user } = await openFrames();
    await user.selectOptions(screen.getByLabelText('Kind of part'), 'Bulkhead');
    await user.click(screen.getByRole('button', { name: 'Add part' }));
    const list = screen.getByRole('region', { name: 'Parts' });
    expect(await within(list).findByText('Bulkhead St 1')).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'Bulkhead St 1', level: 3 })).toBeTruthy();

    await user.click(screen.getByRole('button', { name: 'Delete part' }));
    await user.click(screen.getByRole('button', { name: 'Yes, delete Bulkhead St 1' }));
    expect(within(list).queryByText('Bulkhead St 1')).toBeNull();
  });

  it('shows a designer the parts read-only: the parts are the builder’s', async () => {
    const { user } = await openFrames('designer');
    expect(screen.getByText(/The parts are the builder's: as designer you can read them here but not change them/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Apply changes' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Add part' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Add a longitudinal' })).toBeNull();
    const thickness = screen.getByLabelText('Frame thickness (mm)') as HTMLInputElement;
    await user.type(thickness, '5');
    expect(thickness.value).toBe('18');
  });

  it('shows a helper the parts read-only too', async () => {
    const { api, user } = await openFrames('helper');
    expect(screen.getByText(/As a helper on this hull you can read the parts/)).toBeTruthy();
    const thickness = screen.getByLabelText('Frame thickness (mm)') as HTMLInputElement;
    await user.type(thickness, '5');
    expect(thickness.value).toBe('18');
    expect(screen.queryByRole('button', { name: 'Apply changes' })).toBeNull();
    expect(api.writes()).toEqual([]);
  });

  it('edits the longitudinals in a section of their own', async () => {
    const { user } = await openFrames();
    const section = screen.getByRole('heading', { name: 'Longitudinals' }).closest('section')!;
    expect(section.textContent).toContain('Chine log');
    expect(section.textContent).toContain('Stringer, on Chine, 30 × 20 mm');
    await user.click(within(section).getByRole('button', { name: 'Change Chine log' }));
    await user.selectOptions(within(section).getByLabelText('Placed by'), 'At a height');
    await user.type(within(section).getByLabelText('Height (mm above the baseline)'), '240');
    await user.click(within(section).getByRole('button', { name: 'Save longitudinal' }));
    expect(section.textContent).toContain('Stringer, at height 240 mm, 30 × 20 mm');
  });
});
