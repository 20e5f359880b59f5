import { waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { HullPin, LibraryItemDetail, PinCompareResponse } from '../../shared/api/library';
import type { Camber } from '../../shared/geometry/camber-schema';
import { apiError, stubApi } from './api-stub';
import { ann, hull, sessionOf, tomas } from './fixtures';
import { planHandlers, revision, smallPlan } from './plan-fixtures';
import { errorUnder, renderApp, screen } from './render-app';

const signedIn = { 'GET /api/session': sessionOf(ann) };
const camber = (riseMm: number): Camber => ({ shape: 'parabola', points: [], crown: { kind: 'rise', riseMm, referenceBeamMm: 1860 }, convention: 'one-pattern' });

/** An invented item: Tomas's deck camber, two revisions, shared with Ann. */
function item(overrides: Partial<LibraryItemDetail> = {}): LibraryItemDetail {
  const r = (id: number, number: number) => ({ id, itemId: 5, number, name: 'Dory deck camber', notes: number === 2 ? 'More crown.' : '', rules: 'Rise at the widest beam.', createdAt: '2025-05-02T10:00:00.000Z' });
  return {
    id: 5,
    kind: 'camber',
    visibility: 'shared',
    authorId: tomas.id,
    authorName: tomas.displayName,
    mine: false,
    latest: r(12, 2),
    revisionCount: 2,
    updatedAt: '2025-05-02T10:00:00.000Z',
    revisions: [r(12, 2), r(11, 1)],
    latestDocument: camber(80),
    shareWith: null,
    ...overrides,
  };
}

describe('publishing a camber curve', () => {
  it('says under each field what is missing, and sends nothing', async () => {
    const api = stubApi(signedIn);
    const { user } = renderApp('/library/new');
    await user.click(await screen.findByRole('button', { name: 'Publish' }));
    errorUnder(screen.getByLabelText('Rise (mm)'), 'Enter the rise in mm');
    errorUnder(screen.getByLabelText('At a beam of (mm)'), 'Enter the beam in mm');
    await user.type(screen.getByLabelText('Rise (mm)'), 'sixty');
    await user.type(screen.getByLabelText('At a beam of (mm)'), '1860');
    await user.click(screen.getByRole('button', { name: 'Publish' }));
    errorUnder(screen.getByLabelText('Rise (mm)'), '“sixty” is not one');
    errorUnder(screen.getByLabelText('Name'), 'Give it a name');
    expect(api.writes()).toEqual([]);
  });

  it('checks own points with the same rules as the server: the curve starts at the full crown', async () => {
    const api = stubApi(signedIn);
    const { user } = renderApp('/library/new');
    await user.type(await screen.findByLabelText('Name'), 'Own curve');
    await user.selectOptions(screen.getByLabelText('Shape'), 'Own points');
    await user.type(screen.getByLabelText('Rise (mm)'), '50');
    await user.type(screen.getByLabelText('At a beam of (mm)'), '1800');
    await user.clear(screen.getByLabelText('Own points'));
    await user.type(screen.getByLabelText('Own points'), '0, 0.9{Enter}0.5 0.7{Enter}1, 0');
    await user.click(screen.getByRole('button', { name: 'Publish' }));
    errorUnder(screen.getByLabelText('Own points'), 'its first point is t = 0, h = 0.9');
    await user.clear(screen.getByLabelText('Own points'));
    await user.type(screen.getByLabelText('Own points'), '0, 1{Enter}half, 0.7');
    await user.click(screen.getByRole('button', { name: 'Publish' }));
    errorUnder(screen.getByLabelText('Own points'), 'Line 2: give two numbers');
    expect(api.writes()).toEqual([]);
  });

  it('sends the curve as the shared schema has it, shared with the people named, then opens the item', async () => {
    const published = item({ id: 9, mine: true, authorId: ann.id, authorName: ann.displayName, latest: { ...item().latest, id: 30, itemId: 9, number: 1, name: 'Skiff deck camber' }, revisions: [], revisionCount: 1, latestDocument: camber(60), shareWith: ['tomas.reed@example.test'] });
    const api = stubApi({ ...signedIn, 'POST /api/library': { status: 201, body: { item: published } }, 'GET /api/library/9': { body: { item: published } } });
    const { user, here } = renderApp('/library/new');
    await user.type(await screen.findByLabelText('Name'), 'Skiff deck camber');
    await user.type(screen.getByLabelText('Rise (mm)'), '60');
    await user.type(screen.getByLabelText('At a beam of (mm)'), '1860');
    await user.type(screen.getByLabelText('Rules that go with it'), 'Rise at the widest beam.');
    await user.selectOptions(screen.getByLabelText('Visibility'), 'Shared with the people I name');
    await user.type(screen.getByLabelText('Share with'), 'not-an-address');
    await user.click(screen.getByRole('button', { name: 'Publish' }));
    errorUnder(screen.getByLabelText('Share with'), '“not-an-address” is not an e-mail address');
    expect(api.writes()).toEqual([]);

    await user.clear(screen.getByLabelText('Share with'));
    await user.type(screen.getByLabelText('Share with'), 'Tomas.Reed@example.test');
    // The curve is drawn as typed.
    expect(screen.getByRole('img', { name: 'The camber pattern as typed' })).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Publish' }));

    expect(await screen.findByRole('heading', { name: 'Skiff deck camber', level: 1 })).toBeTruthy();
    expect(here()).toBe('/library/9');
    expect(api.writes()).toMatchObject([
      {
        method: 'POST',
        path: '/api/library',
        headers: { 'x-csrf-token': 'token-1' },
        body: {
          kind: 'camber',
          sharing: { visibility: 'shared', shareWith: ['Tomas.Reed@example.test'] },
          revision: { name: 'Skiff deck camber', notes: '', rules: 'Rise at the widest beam.', document: camber(60) },
        },
      },
    ]);
  });

  it('puts the server’s complaint under the field it names', async () => {
    stubApi({ ...signedIn, 'POST /api/library': apiError(400, 'invalid_document', 'revision.document.crown.riseMm: too high for this beam', { field: 'revision.document.crown.riseMm' }) });
    const { user, here } = renderApp('/library/new');
    await user.type(await screen.findByLabelText('Name'), 'Skiff deck camber');
    await user.type(screen.getByLabelText('Rise (mm)'), '60');
    await user.type(screen.getByLabelText('At a beam of (mm)'), '1860');
    await user.click(screen.getByRole('button', { name: 'Publish' }));
    await screen.findByText('revision.document.crown.riseMm: too high for this beam');
    errorUnder(screen.getByLabelText('Rise (mm)'), 'too high for this beam');
    expect(here()).toBe('/library/new');
  });
});

describe('taking an item into a hull', () => {
  const hulls = [hull({ id: 3, name: 'Tidewrack', role: 'builder' }), hull({ id: 4, name: 'Sam’s pram', role: 'helper' }), hull({ id: 6, name: 'Old punt', role: 'owner', archived: true })];

  it('offers only hulls I may change, asks for one, then takes the chosen revision on the hull’s latest', async () => {
    const pin: HullPin = { id: 2, hullId: 3, kind: 'camber', itemId: 5, visible: true, itemName: 'Dory deck camber', authorName: tomas.displayName, revisionId: 11, revisionNumber: 1, latestRevisionId: 12, latestRevisionNumber: 2, pinnedAt: '2025-05-03T09:00:00.000Z', pinnedByName: ann.displayName, planRevisionId: 8 };
    const api = stubApi({
      ...signedIn,
      'GET /api/library/5': { body: { item: item() } },
      'GET /api/hulls': { body: { hulls } },
      ...planHandlers(3, { plan: smallPlan(), revision: revision(7) }),
      'POST /api/hulls/3/pins': { status: 201, body: { pin, revision: revision(8), movement: [] } },
    });
    const { user } = renderApp('/library/5');
    const form = (await screen.findByRole('heading', { name: 'Take into hull' })).closest('form')!;
    const hullSelect = within(form).getByLabelText('Hull') as HTMLSelectElement;
    await waitFor(() => expect([...hullSelect.options].map((o) => o.textContent)).toEqual(['Choose a hull…', 'Tidewrack']));
    await user.click(within(form).getByRole('button', { name: 'Take into hull' }));
    errorUnder(within(form).getByLabelText('Hull'), 'Choose the hull to take it into');
    expect(api.writes()).toEqual([]);

    await user.selectOptions(hullSelect, 'Tidewrack');
    await user.selectOptions(within(form).getByLabelText('Revision'), 'Revision 1');
    await user.click(within(form).getByRole('button', { name: 'Take into hull' }));
    expect(await screen.findByText('Taken into Tidewrack.')).toBeTruthy();
    expect(api.writes()).toMatchObject([{ method: 'POST', path: '/api/hulls/3/pins', body: { itemId: 5, revisionId: 11, baseRevisionId: 7 } }]);
    expect(screen.getByRole('link', { name: 'See what the hull took from the Library' }).getAttribute('href')).toBe('/hulls/3/library');
  });

  it('says plainly when the hull has no deck to take a camber', async () => {
    stubApi({
      ...signedIn,
      'GET /api/library/5': { body: { item: item() } },
      'GET /api/hulls': { body: { hulls } },
      ...planHandlers(3, { revision: null }),
      'POST /api/hulls/3/pins': apiError(409, 'no_deck', 'This hull has no deck set up yet, so there is no camber to replace.'),
    });
    const { user } = renderApp('/library/5');
    const form = (await screen.findByRole('heading', { name: 'Take into hull' })).closest('form')!;
    await waitFor(() => expect((within(form).getByLabelText('Hull') as HTMLSelectElement).options).toHaveLength(2));
    await user.selectOptions(within(form).getByLabelText('Hull'), 'Tidewrack');
    await user.click(within(form).getByRole('button', { name: 'Take into hull' }));
    expect((await within(form).findByRole('alert')).textContent).toContain('no deck set up yet');
  });
});

describe('notices and the comparison', () => {
  const notice = { id: 9, hullId: 3, hullName: 'Tidewrack', pinId: 2, itemId: 5, itemName: 'Dory deck camber', kind: 'camber' as const, authorName: tomas.displayName, pinnedRevisionNumber: 1, newRevisionId: 12, newRevisionNumber: 2, createdAt: '2025-05-04T08:00:00.000Z' };

  it('shows the count in the header and lists the notice; Stay dismisses it', async () => {
    let open = [notice];
    const api = stubApi({
      ...signedIn,
      'GET /api/notices': () => ({ body: { notices: open } }),
      'POST /api/notices/9/dismiss': () => {
        open = [];
        return { status: 204 };
      },
    });
    const { user } = renderApp('/notices');
    expect(await screen.findByRole('link', { name: 'Notices: 1 new' })).toBeTruthy();
    const card = (await screen.findByText(/follows revision 1/)).closest('li')!;
    expect(card.textContent).toContain('revision 2 of the camber curve Dory deck camber');
    expect(within(card).getByRole('link', { name: 'Compare and decide' }).getAttribute('href')).toBe('/hulls/3/library/2/compare?to=12&notice=9');
    await user.click(within(card).getByRole('button', { name: 'Stay on revision 1' }));
    await screen.findByText(/Nothing new/);
    expect(screen.getByRole('link', { name: 'Notices' })).toBeTruthy();
    expect(api.writes()).toMatchObject([{ method: 'POST', path: '/api/notices/9/dismiss' }]);
  });

  function compareResponse(): PinCompareResponse {
    const pin: HullPin = { id: 2, hullId: 3, kind: 'camber', itemId: 5, visible: true, itemName: 'Dory deck camber', authorName: tomas.displayName, revisionId: 11, revisionNumber: 1, latestRevisionId: 12, latestRevisionNumber: 2, pinnedAt: '2025-05-03T09:00:00.000Z', pinnedByName: ann.displayName, planRevisionId: 8 };
    const curve = (rise: number) => [-930, 0, 930].map((y) => ({ y, z: y === 0 ? rise : 0 }));
    return {
      pin,
      from: { ...item().revisions[1]! },
      to: { ...item().revisions[0]! },
      hullDiffersFromPin: false,
      drawing: { kind: 'camber', halfBeamMm: 930, before: curve(60), after: curve(80) },
      movement: [
        { partId: 'pt-1', partName: 'Frame 3', partKind: 'ring-frame', stationName: 'St 3', x: 2300, moveMm: 18.7274, atY: 0, atZ: 836.2, note: 'outline of the marked face', cut: true },
        { partId: 'pt-3', partName: 'Bulkhead 5', partKind: 'bulkhead', stationName: 'St 5', x: 3600, moveMm: 19.1, atY: -0.2, atZ: 840.6, note: 'deck line at the station, as the part itself could not be worked out', cut: false },
        { partId: 'pt-2', partName: 'Floor 2', partKind: 'floor', stationName: 'St 2', x: 1650, moveMm: 0.01, atY: 400, atZ: 190, note: 'outline of the marked face', cut: false },
      ],
      movementMethod: 'outline',
      cutPartsKnown: true,
    };
  }

  it('draws both curves, lists how far each part would move, and moves the hull on its latest revision', async () => {
    const data = compareResponse();
    const api = stubApi({
      ...signedIn,
      'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Tidewrack', role: 'builder' }) } },
      ...planHandlers(3, { plan: smallPlan(), revision: revision(8) }),
      'GET /api/hulls/3/pins/2/compare': { body: data },
      'POST /api/hulls/3/pins/2/move': { status: 201, body: { pin: { ...data.pin, revisionId: 12, revisionNumber: 2 }, revision: revision(9), movement: data.movement } },
    });
    const { user } = renderApp('/hulls/3/library/2/compare?to=12&notice=9');
    expect(await screen.findByRole('heading', { name: 'Dory deck camber: revision 1 → revision 2' })).toBeTruthy();
    expect(screen.getByRole('img', { name: 'Dory deck camber: revision 1 and revision 2 drawn over each other' })).toBeTruthy();
    const table = screen.getByRole('table', { name: 'How far each part would move' });
    const rows = within(table).getAllByRole('row').slice(1).map((r) => [...r.children].map((c) => c.textContent));
    expect(rows).toEqual([
      ['Frame 3', 'St 3', '18.7 mm', 'on the centreline, 836 mm up', 'Cut already'],
      ['Bulkhead 5', 'St 5', '19.1 mm', 'on the centreline, 841 mm up; deck line at the station, as the part itself could not be worked out', 'Not yet'],
      ['Floor 2', 'St 2', 'does not move', 'outline of the marked face', 'Not yet'],
    ]);
    expect(screen.getByText('A part that is cut already would move.').closest('[role="status"]')?.textContent).toContain('Frame 3 by 18.7 mm');
    expect(screen.getByRole('button', { name: 'Stay on revision 1' })).toBeTruthy();

    await user.click(screen.getByRole('button', { name: 'Move the hull to revision 2' }));
    expect(await screen.findByText('The hull now follows revision 2.')).toBeTruthy();
    expect(api.writes().filter((w) => w.path.includes('/pins/'))).toMatchObject([{ method: 'POST', path: '/api/hulls/3/pins/2/move', body: { toRevisionId: 12, baseRevisionId: 8 } }]);
  });

  it('lets a helper look but not move', async () => {
    stubApi({
      ...signedIn,
      'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Tidewrack', role: 'helper' }) } },
      ...planHandlers(3, { plan: smallPlan(), revision: revision(8) }),
      'GET /api/hulls/3/pins/2/compare': { body: { ...compareResponse(), cutPartsKnown: false, movement: compareResponse().movement.map((m) => ({ ...m, cut: false })) } },
    });
    renderApp('/hulls/3/library/2/compare?to=12');
    const table = await screen.findByRole('table', { name: 'How far each part would move' });
    expect(within(table).getAllByText('Not known')).toHaveLength(3);
    expect(screen.getByText(/The build log does not tell which parts are cut/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Move the hull/ })).toBeNull();
    expect(screen.getByText(/Only the hull’s owner, builder or designer can move it/)).toBeTruthy();
  });
});
