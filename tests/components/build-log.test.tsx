import { describe, expect, it } from 'vitest';
import type { BuildBoardResponse, BuildLayerState, BuildPartResponse, BuildPartState, BuildPhoto } from '../../shared/api/build-log';
import type { Notation } from '../../shared/geometry/notation-schema';
import type { Role } from '../../shared/api/hulls';
import { apiError, stubApi, type Handlers } from './api-stub';
import { ann, hull, member, sessionOf, tomas } from './fixtures';
import { planHandlers } from './plan-fixtures';
import { renderApp, screen } from './render-app';

const frameState = (over: Partial<BuildPartState> = {}): BuildPartState => ({ partId: 'pt-frame-3', name: 'Frame 3', done: [], next: 'patterned', cutRevisionId: null, flag: null, photos: 0, layers: [], ...over });
const layer = (index: number, done: BuildLayerState['done'], next: BuildLayerState['next']): BuildLayerState => ({ index, thicknessMm: 9, done, next, cutRevisionId: done.includes('cut') ? 7 : null, flag: null });
const metric: Notation = { unit: 'mm', decimalComma: false, sixteenthMarks: 'plus-sixteenth', precision: '0.5mm' };

function boardOf(parts: BuildPartState[], notation: Notation = metric): BuildBoardResponse {
  return {
    latestRevisionId: 7,
    moveToleranceMm: 1,
    notation,
    parts,
    material: { estimate: { plySheets: 2, epoxyMl: 400, fillerMl: 250, tapeM: 9.5 }, used: { plySheets: 1, epoxyMl: 0, fillerMl: 0, tapeM: 0 } },
  };
}
const partOf = (state: BuildPartState, photos: BuildPhoto[] = []): BuildPartResponse => ({ state, events: [], photos, bevels: [{ side: 'port', edge: 'skin', girthMm: 120, tiltDeg: 12.5, slidingBevelDeg: 77.5, kind: 'under', faceDown: 'aft' }] });

function server(role: Role, state: BuildPartState, more: Handlers = {}, options: { notation?: Notation; photos?: BuildPhoto[] } = {}) {
  const current = { hull: hull({ id: 3, name: 'Tidewrack', role }) };
  return stubApi({
    'GET /api/session': sessionOf(ann),
    'GET /api/hulls/3': () => ({ body: { hull: current.hull } }),
    'GET /api/hulls/3/crew': { body: { crew: [member(ann, role)] } },
    'GET /api/hulls': () => ({ body: { hulls: [current.hull] } }),
    ...planHandlers(3),
    'GET /api/hulls/3/build-log': { body: boardOf([state, frameState({ partId: 'pt-transom', name: 'Transom' })], options.notation) },
    'GET /api/hulls/3/build-log/parts/pt-frame-3': { body: partOf(state, options.photos) },
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

  it('keeps a note typed while the last mark is still being saved, for the next mark', async () => {
    // The answer to the first mark is held back until the second note is typed.
    let answer: (reply: { status: number; body: unknown }) => void = () => undefined;
    const api = server('helper', frameState({ done: ['patterned'], next: 'cut' }), {
      'POST /api/hulls/3/build-log/events': () => new Promise((resolve) => (answer = resolve)),
    });
    const { user } = renderApp('/hulls/3/build-log');
    await user.click(await screen.findByRole('button', { name: /Frame 3/ }));
    await user.type(await screen.findByLabelText('Note (optional)'), 'First note');
    await user.click(screen.getByRole('button', { name: 'Mark cut' }));
    expect(api.writes()).toMatchObject([{ body: { stage: 'cut', note: 'First note' } }]);
    const field = screen.getByLabelText('Note (optional)') as HTMLTextAreaElement;
    await user.clear(field);
    await user.type(field, 'Second note');
    answer({ status: 201, body: { event: {} } });
    await expect.poll(() => api.count('GET', '/api/hulls/3/build-log/parts/pt-frame-3')).toBeGreaterThan(1);
    expect((screen.getByLabelText('Note (optional)') as HTMLTextAreaElement).value).toBe('Second note');
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
    server('designer', frameState({ done: ['cut'], cutRevisionId: 5, flag: { movedMm: 6.2, cutRevisionId: 5, latestRevisionId: 7, layerIndex: null } }));
    const { user } = renderApp('/hulls/3/build-log');
    expect(await screen.findByText(/1 cut part moved in a later revision/)).toBeTruthy();
    expect(screen.getByText('Moved 6.2 mm')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: /Frame 3/ }));
    expect(await screen.findByText('Moved 6.2 mm since it was cut')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /^Mark / })).toBeNull();
    expect(screen.getByText(/the owner, builders and helpers keep it/)).toBeTruthy();
  });

  it('shows a laminated part layer by layer and marks the next stage of one layer', async () => {
    const laminated = frameState({ done: ['patterned'], next: 'cut', cutRevisionId: 7, layers: [layer(0, ['patterned', 'cut'], null), layer(1, ['patterned'], 'cut')] });
    const api = server('helper', laminated, { 'POST /api/hulls/3/build-log/events': { status: 201, body: { event: {} } } });
    const { user } = renderApp('/hulls/3/build-log');
    const card = await screen.findByRole('button', { name: /Frame 3/ });
    // One of the two layers is cut: the board says so instead of showing the part as cut or not.
    expect(card.textContent).toContain('Cut 1/2 layers');
    expect(card.textContent).toContain('Layer 1 · 9 mm');
    expect(card.textContent).toContain('Frame 3 · 2 layers');
    const tally = [...screen.getByRole('list', { name: 'Parts done at each stage' }).querySelectorAll('li')].map((li) => li.textContent);
    expect(tally).toContain('Patterned 1 of 2 · layers 2 of 3');
    expect(tally).toContain('Cut 0 of 2 · layers 1 of 3');
    expect(tally).toContain('Laminated 0 of 2');
    await user.click(card);
    // Layer 2 is at the saw next: its button, and the saw caution; no whole-part Mark for a layer stage.
    expect(await screen.findByText(/guards on, push sticks/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Mark cut' })).toBeNull();
    expect(screen.queryByRole('button', { name: /Mark layer 1/ })).toBeNull();
    await user.click(screen.getByRole('button', { name: 'Mark layer 2 cut' }));
    expect(api.writes()).toMatchObject([{ method: 'POST', body: { partId: 'pt-frame-3', layerIndex: 1, stage: 'cut', action: 'done' } }]);
    await user.click(screen.getByRole('button', { name: 'Reopen layer 1 cut' }));
    expect(api.writes()[1]).toMatchObject({ body: { layerIndex: 0, stage: 'cut', action: 'reopened' } });
  });

  it('sets the movement tolerance in the hull’s units, refusing what the schema refuses before sending', async () => {
    const api = server('owner', frameState(), { 'PUT /api/hulls/3/build-log/settings': { body: { moveToleranceMm: 2.5 } } });
    const { user } = renderApp('/hulls/3/build-log');
    const field = await screen.findByLabelText('Flag a cut part when a new revision moves it more than');
    expect((field as HTMLInputElement).value).toBe('1.0');
    expect(screen.getByText('In millimetres, for example 1.5')).toBeTruthy();
    await user.clear(field);
    await user.type(field, '0.05');
    await user.click(screen.getByRole('button', { name: 'Save tolerance' }));
    expect(await screen.findByText('The movement tolerance must be at least 0.1 mm, found 0.05 mm')).toBeTruthy();
    await user.clear(field);
    await user.type(field, '3-5-2');
    await user.click(screen.getByRole('button', { name: 'Save tolerance' }));
    expect(await screen.findByText(/"3-5-2"/)).toBeTruthy();
    expect(api.writes()).toEqual([]);
    await user.clear(field);
    await user.type(field, '2.5');
    await user.click(screen.getByRole('button', { name: 'Save tolerance' }));
    expect(await screen.findByText(/Saved/)).toBeTruthy();
    expect(api.writes()).toMatchObject([{ method: 'PUT', path: '/api/hulls/3/build-log/settings', body: { moveToleranceMm: 2.5 } }]);
  });

  it('reads the tolerance as feet-inches-eighths in an imperial hull', async () => {
    const imperial: Notation = { unit: 'ftin', decimalComma: false, sixteenthMarks: 'plus-sixteenth', precision: '1/16in' };
    const api = server('builder', frameState(), { 'PUT /api/hulls/3/build-log/settings': { body: { moveToleranceMm: 3.175 } } }, { notation: imperial });
    const { user } = renderApp('/hulls/3/build-log');
    const field = await screen.findByLabelText('Flag a cut part when a new revision moves it more than');
    await user.clear(field);
    await user.type(field, '0-0-1');
    await user.click(screen.getByRole('button', { name: 'Save tolerance' }));
    await screen.findByText(/Saved/);
    // 1/8 in, read by the hull's notation: 3.175 mm.
    expect((api.writes()[0]!.body as { moveToleranceMm: number }).moveToleranceMm).toBeCloseTo(3.175, 6);
  });

  it('shows no tolerance form to a helper, who keeps the log but does not set it', async () => {
    server('helper', frameState());
    renderApp('/hulls/3/build-log');
    await screen.findByRole('button', { name: /Frame 3/ });
    expect(screen.queryByLabelText('Flag a cut part when a new revision moves it more than')).toBeNull();
  });

  it('lets a helper delete their own photo after confirming, and not another’s', async () => {
    const photo = (id: number, uploader: { id: number; displayName: string }): BuildPhoto => ({ id, partId: 'pt-frame-3', stage: 'cut', caption: '', width: 640, height: 480, thumbWidth: 320, thumbHeight: 240, uploader, createdAt: '2026-11-30T10:00:00.000Z' });
    const api = server('helper', frameState({ photos: 2 }), { 'DELETE /api/hulls/3/build-log/photos/11': { status: 204 } }, { photos: [photo(11, ann), photo(12, tomas)] });
    const { user } = renderApp('/hulls/3/build-log?part=pt-frame-3');
    const deletes = await screen.findAllByRole('button', { name: /^Delete photo/ });
    expect(deletes.map((b) => b.getAttribute('aria-label'))).toEqual(['Delete photo: Frame 3, cut, by Ann Marsh']);
    await user.click(deletes[0]!);
    expect(api.writes()).toEqual([]);
    await user.click(screen.getByRole('button', { name: 'Keep' }));
    expect(api.writes()).toEqual([]);
    await user.click(screen.getByRole('button', { name: /^Delete photo/ }));
    await user.click(screen.getByRole('button', { name: 'Delete photo' }));
    expect(api.writes()).toMatchObject([{ method: 'DELETE', path: '/api/hulls/3/build-log/photos/11' }]);
  });
});
