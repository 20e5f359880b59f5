import { describe, expect, it } from 'vitest';
import type { BuildBoardResponse, BuildPartResponse, BuildPartState } from '../../shared/api/build-log';
import type { Role } from '../../shared/api/hulls';
import { apiError, stubApi, type Handlers } from './api-stub';
import { ann, hull, member, sessionOf } from './fixtures';
import { planHandlers } from './plan-fixtures';
import { renderApp, screen } from './render-app';

const frameState = (over: Partial<BuildPartState> = {}): BuildPartState => ({ partId: 'pt-frame-3', name: 'Frame 3', done: [], next: 'patterned', cutRevisionId: null, flag: null, photos: 0, ...over });

function boardOf(parts: BuildPartState[]): BuildBoardResponse {
  return {
    latestRevisionId: 7,
    moveToleranceMm: 1,
    parts,
    material: { estimate: { plySheets: 2, epoxyMl: 400, fillerMl: 250, tapeM: 9.5 }, used: { plySheets: 1, epoxyMl: 0, fillerMl: 0, tapeM: 0 } },
  };
}
const partOf = (state: BuildPartState): BuildPartResponse => ({ state, events: [], photos: [], bevels: [{ side: 'port', edge: 'skin', girthMm: 120, tiltDeg: 12.5, slidingBevelDeg: 77.5, kind: 'under', faceDown: 'aft' }] });

function server(role: Role, state: BuildPartState, more: Handlers = {}) {
  const current = { hull: hull({ id: 3, name: 'Tidewrack', role }) };
  return stubApi({
    'GET /api/session': sessionOf(ann),
    'GET /api/hulls/3': () => ({ body: { hull: current.hull } }),
    'GET /api/hulls/3/crew': { body: { crew: [member(ann, role)] } },
    'GET /api/hulls': () => ({ body: { hulls: [current.hull] } }),
    ...planHandlers(3),
    'GET /api/hulls/3/build-log': { body: boardOf([state, frameState({ partId: 'pt-transom', name: 'Transom' })]) },
    'GET /api/hulls/3/build-log/parts/pt-frame-3': { body: partOf(state) },
    ...more,
  });
}

// Typing into several fields in happy-dom is slow on a busy machine; give each test room (nothing here is timed).
describe('Build log', { timeout: 30000 }, () => {
  it('lets a helper mark the next stage of a part with a note and the material used', async () => {
    const api = server('helper', frameState({ done: ['patterned'], next: 'cut' }), {
      'POST /api/hulls/3/build-log/events': { status: 201, body: { event: {} } },
    });
    const { user } = renderApp('/hulls/3/build-log');
    await user.click(await screen.findByRole('button', { name: /Frame 3/ }));
    expect(await screen.findByText(/guards on, push sticks/)).toBeTruthy();
    await user.type(screen.getByLabelText('Note (optional)'), 'Sheer 2 mm high; planed');
    await user.type(screen.getByLabelText('Ply sheets'), '1');
    await user.click(screen.getByRole('button', { name: 'Mark cut' }));
    expect(api.writes()).toMatchObject([{ method: 'POST', path: '/api/hulls/3/build-log/events', body: { partId: 'pt-frame-3', stage: 'cut', action: 'done', note: 'Sheer 2 mm high; planed', used: { plySheets: 1 } } }]);
    const upload = screen.getByLabelText('Add a photo');
    expect(upload.getAttribute('accept')).toBe('image/*');
    expect(upload.getAttribute('capture')).toBe('environment');
  });

  it('shows the epoxy caution before filleting and the server’s refusal in plain words', async () => {
    server('builder', frameState({ done: ['patterned', 'cut', 'laminated', 'shaped', 'test-fitted', 'tacked'], next: 'filleted' }), {
      'POST /api/hulls/3/build-log/events': apiError(409, 'already_done', 'filleted is already marked done for this part', { field: 'stage' }),
    });
    const { user } = renderApp('/hulls/3/build-log?part=pt-frame-3');
    expect(await screen.findByText(/nitrile gloves and eye protection/)).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Mark filleted' }));
    expect(await screen.findByText('filleted is already marked done for this part')).toBeTruthy();
  });

  it('shows a flagged part on the board, and lets the designer read but not mark', async () => {
    server('designer', frameState({ done: ['cut'], cutRevisionId: 5, flag: { movedMm: 6.2, cutRevisionId: 5, latestRevisionId: 7 } }));
    const { user } = renderApp('/hulls/3/build-log');
    expect(await screen.findByText(/1 cut part moved in a later revision/)).toBeTruthy();
    expect(screen.getByText('Moved 6.2 mm')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: /Frame 3/ }));
    expect(await screen.findByText('Moved 6.2 mm since it was cut')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /^Mark / })).toBeNull();
    expect(screen.getByText(/the owner, builders and helpers keep it/)).toBeTruthy();
  });
});
