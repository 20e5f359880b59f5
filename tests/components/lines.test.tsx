import { waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Role } from '../../shared/api/hulls';
import type { Plan } from '../../shared/geometry/plan-schema';
import { apiError, stubApi, type Handlers } from './api-stub';
import { ann, hull, sessionOf } from './fixtures';
import { descriptionOf, renderApp, screen } from './render-app';
import { planHandlers, revision, smallPlan } from './plan-fixtures';

/** Hull 3 with the small plan saved as revision 4, Ann in `role`. */
function linesServer(role: Role = 'owner', more: Handlers = {}, plan: Plan = smallPlan()) {
  return stubApi({
    'GET /api/session': sessionOf(ann),
    'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Tidewrack', role }) } },
    ...planHandlers(3, { plan, revision: revision(4) }),
    ...more,
  });
}

const cell = (name: string) => screen.getByRole('gridcell', { name });
/** What the cell shows as its value (without a fairness mark under it). */
const cellText = (name: string) => cell(name).querySelector('[data-cell-value]')?.textContent?.trim() ?? null;

async function openLines(role: Role = 'owner', more: Handlers = {}, plan?: Plan) {
  const api = linesServer(role, more, plan);
  const view = renderApp('/hulls/3/lines');
  await screen.findByRole('grid', { name: 'Table of offsets' });
  return { api, ...view };
}

describe('Lines: the table of offsets', () => {
  it('shows stations as columns and lines as rows, point lines as a height row and a half-breadth row', async () => {
    await openLines();
    const grid = screen.getByRole('grid', { name: 'Table of offsets' });
    expect(within(grid).getAllByRole('columnheader').map((h) => h.getAttribute('aria-label') ?? h.textContent)).toEqual([
      'Line \\ station',
      'St 1, x 600',
      'St 2, x 1200',
      'St 3, x 1800',
      'St 4, x 2400',
    ]);
    expect(within(grid).getAllByRole('rowheader').map((h) => h.textContent)).toEqual(['WL 300 Waterline · height 300', 'Chine height', 'Chine half-breadth']);
    expect(cellText('WL 300 at St 2')).toBe('450');
    expect(cellText('Chine height at St 2')).toBe('180');
    expect(cellText('Chine half-breadth at St 2')).toBe('560');
    expect(cellText('Chine height at St 3')).toBe('');
    // One cell of the grid is in the tab order: the active one.
    expect(within(grid).getAllByRole('gridcell').filter((c) => c.tabIndex === 0)).toHaveLength(1);
  });
});

describe('Lines: typing into cells', () => {
  it('takes a good value into the plan, and keeps a bad one as typed, marked with the reason, out of the plan', async () => {
    const { user } = await openLines();
    const undo = screen.getByRole('button', { name: 'Undo' }) as HTMLButtonElement;
    expect(undo.disabled).toBe(true);

    await user.click(cell('WL 300 at St 2'));
    await user.keyboard('4x5{Enter}');

    const bad = cell('WL 300 at St 2');
    expect(bad.getAttribute('aria-invalid')).toBe('true');
    expect(bad.textContent).toContain('4x5');
    expect(descriptionOf(bad)).toContain('WL 300 at St 2: "4x5": this is not a length (expected millimetres like 1049.5)');
    // The reason is on the page too, not only for screen readers.
    expect(screen.getByRole('heading', { name: 'One cell is not in the plan yet' })).toBeTruthy();
    // Not in the plan: nothing to undo, nothing to save.
    expect(undo.disabled).toBe(true);
    expect(screen.getByTestId('save-status').textContent).toBe('Revision 4 saved');
    // Enter moved down a row.
    expect(document.activeElement).toBe(cell('Chine height at St 2'));

    // Put right, it goes in and the mark goes.
    await user.click(cell('WL 300 at St 2'));
    await user.keyboard('{F2}{Control>}a{/Control}470{Enter}');
    expect(cellText('WL 300 at St 2')).toBe('470');
    expect(cell('WL 300 at St 2').getAttribute('aria-invalid')).toBeNull();
    expect(screen.getByRole('button', { name: 'Undo: WL 300 at St 2' })).toBeTruthy();
  });

  it('moves with the arrow keys and Tab, cancels with Escape, and clears with Delete', async () => {
    const { user } = await openLines();
    await user.click(cell('WL 300 at St 1'));
    await user.keyboard('{ArrowRight}{ArrowRight}{ArrowDown}');
    expect(document.activeElement).toBe(cell('Chine height at St 3'));
    await user.keyboard('{Shift>}{Tab}{/Shift}');
    expect(document.activeElement).toBe(cell('Chine height at St 2'));

    await user.keyboard('999{Escape}');
    expect(cellText('Chine height at St 2')).toBe('180');
    expect(document.activeElement).toBe(cell('Chine height at St 2'));

    await user.keyboard('{ArrowUp}{Delete}');
    expect(cellText('WL 300 at St 2')).toBe('');
    expect(screen.getByRole('button', { name: 'Undo: Clear WL 300 at St 2' })).toBeTruthy();
  });

  it('fills a 3 × 2 block pasted from a spreadsheet, from the active cell', async () => {
    const { user } = await openLines();
    await user.click(cell('WL 300 at St 2'));
    await user.paste('401\t402\t403\r\n171\t172\t173\r\n');

    expect(['WL 300 at St 2', 'WL 300 at St 3', 'WL 300 at St 4'].map(cellText)).toEqual(['401', '402', '403']);
    expect(['Chine height at St 2', 'Chine height at St 3', 'Chine height at St 4'].map(cellText)).toEqual(['171', '172', '173']);
    expect(cellText('WL 300 at St 1')).toBe('300');
    // St 3 and St 4 have no chine half-breadth yet: those heights wait for it, marked, out of the plan.
    expect(descriptionOf(cell('Chine height at St 3'))).toContain('waits for the half-breadth');
    expect(cell('Chine height at St 3').getAttribute('aria-invalid')).toBeNull();
    expect(screen.getByRole('button', { name: 'Undo: Paste 2 × 3 cells' })).toBeTruthy();

    // The half-breadths pasted next complete the points.
    await user.click(cell('Chine half-breadth at St 3'));
    await user.paste('610\t620');
    expect(descriptionOf(cell('Chine height at St 3'))).toBe('');
    expect(cellText('Chine height at St 3')).toBe('172');
  });

  it('undoes and redoes with Ctrl+Z and Ctrl+Shift+Z (and Ctrl+Y)', async () => {
    const { user } = await openLines();
    await user.click(cell('WL 300 at St 1'));
    await user.keyboard('222{Tab}333{Enter}');
    expect([cellText('WL 300 at St 1'), cellText('WL 300 at St 2')]).toEqual(['222', '333']);

    await user.keyboard('{Control>}z{/Control}');
    expect([cellText('WL 300 at St 1'), cellText('WL 300 at St 2')]).toEqual(['222', '450']);
    await user.keyboard('{Control>}z{/Control}');
    expect([cellText('WL 300 at St 1'), cellText('WL 300 at St 2')]).toEqual(['300', '450']);
    // Back where the revision was: nothing to save.
    expect(screen.getByTestId('save-status').textContent).toBe('Revision 4 saved');

    await user.keyboard('{Control>}{Shift>}z{/Shift}{/Control}');
    expect(cellText('WL 300 at St 1')).toBe('222');
    await user.keyboard('{Control>}y{/Control}');
    expect(cellText('WL 300 at St 2')).toBe('333');
    expect((screen.getByRole('button', { name: 'Redo' }) as HTMLButtonElement).disabled).toBe(true);
  });

  it('shows a helper the table read-only: no editing, no paste, no import, and says so', async () => {
    const { user, api } = await openLines('helper');
    const grid = screen.getByRole('grid', { name: 'Table of offsets' });
    expect(grid.getAttribute('aria-readonly')).toBe('true');
    expect(within(grid).getAllByRole('gridcell').every((c) => c.getAttribute('aria-readonly') === 'true')).toBe(true);
    expect(screen.getByText(/As a helper on this hull you can read the lines/)).toBeTruthy();

    await user.click(cell('WL 300 at St 2'));
    await user.keyboard('999{Enter}{F2}');
    await user.paste('1\t2');
    expect(within(grid).queryAllByRole('textbox')).toEqual([]);
    expect(cellText('WL 300 at St 2')).toBe('450');
    expect(cellText('WL 300 at St 3')).toBe('500');
    expect(screen.queryByRole('button', { name: /Save revision/ })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Import offsets' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Add station' })).toBeNull();
    // A helper leaves no draft, so none is asked for.
    expect(api.count('GET', '/api/hulls/3/plan/draft')).toBe(0);
    expect(api.writes()).toEqual([]);
  });
});

/** Six stations of a fair waterline, with one figure misread at St 4 (425 where the line runs at about 470). */
function planWithMisread(): Plan {
  const p = smallPlan();
  const xs = [600, 1200, 1800, 2400, 3000, 3600];
  const fair = (x: number) => 500 - (x - 2400) ** 2 / 7200;
  return {
    ...p,
    lines: {
      ...p.lines,
      stations: xs.map((x, i) => ({ id: `st-${i + 1}`, name: `St ${i + 1}`, x })),
      lines: [{ id: 'ln-wl', name: 'WL 300', kind: 'waterline', z: 300, knuckle: null, cells: Object.fromEntries(xs.map((x, i) => [`st-${i + 1}`, i === 3 ? 425 : Math.round(fair(x))])) }],
    },
  };
}

describe('Lines: checks', () => {
  it('marks a cell the fairness check flags with its deviation, and lists it below the table', async () => {
    await openLines('owner', {}, planWithMisread());
    await waitFor(() => expect(cell('WL 300 at St 4').textContent).toMatch(/−\d+\.\d mm/));
    const flagged = cell('WL 300 at St 4');
    expect(cellText('WL 300 at St 4')).toBe('425');
    expect(descriptionOf(flagged)).toContain('WL 300 at station St 4: 425 mm stands');
    expect(screen.getByRole('heading', { name: 'Fairness check' })).toBeTruthy();
    // Its neighbours are not blamed for it.
    expect(cell('WL 300 at St 3').getAttribute('aria-describedby')).toBeNull();
    expect(cell('WL 300 at St 5').getAttribute('aria-describedby')).toBeNull();
  });

  it('says plainly why the hull cannot be built from the table', async () => {
    const { user } = await openLines();
    // A waterline with a negative half-breadth.
    await user.click(cell('WL 300 at St 3'));
    await user.keyboard('-20{Enter}');
    const box = (await screen.findByRole('heading', { name: 'The hull cannot be built from this table yet' })).closest('section')!;
    expect(box.textContent).toContain('line WL 300, station St 3: half-breadth -20 mm is negative');
  });
});

describe('Lines: stations and lines', () => {
  it('adds a station with the next name and position offered, and refuses a position already taken', async () => {
    const { user } = await openLines();
    const form = screen.getByRole('heading', { name: 'Add a station' }).parentElement!;
    expect((within(form).getByLabelText('Station name') as HTMLInputElement).value).toBe('St 4');
    expect((within(form).getByLabelText('Position x') as HTMLInputElement).value).toBe('3000');
    await user.click(within(form).getByRole('button', { name: 'Add station' }));
    expect(await screen.findByRole('columnheader', { name: 'St 4, x 3000' })).toBeTruthy();

    const again = screen.getByRole('heading', { name: 'Add a station' }).parentElement!;
    await user.clear(within(again).getByLabelText('Position x'));
    await user.type(within(again).getByLabelText('Position x'), '1200');
    await user.click(within(again).getByRole('button', { name: 'Add station' }));
    expect(within(again).getByText(/St 2 is already at x 1200/)).toBeTruthy();
  });

  it('deletes a station only after asking in the page, and undo brings it back with its offsets', async () => {
    const { user } = await openLines();
    await user.click(screen.getByRole('button', { name: 'Delete St 2' }));
    expect(screen.getByText('Delete St 2 and every offset at it? Undo brings it back.')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Keep' }));
    expect(screen.getByRole('columnheader', { name: 'St 2, x 1200' })).toBeTruthy();

    await user.click(screen.getByRole('button', { name: 'Delete St 2' }));
    await user.click(screen.getByRole('button', { name: 'Yes, delete St 2' }));
    expect(screen.queryByRole('columnheader', { name: 'St 2, x 1200' })).toBeNull();
    await user.click(screen.getByRole('button', { name: 'Undo: Delete St 2' }));
    expect(cellText('WL 300 at St 2')).toBe('450');
  });

  it('adds a buttock with its half-breadth, named from it, and reorders the rows', async () => {
    const { user } = await openLines();
    const form = screen.getByRole('heading', { name: 'Add a line' }).parentElement!;
    await user.selectOptions(within(form).getByLabelText('Kind of line'), 'buttock');
    await user.type(within(form).getByLabelText('Half-breadth of the buttock'), '200');
    await user.click(within(form).getByRole('button', { name: 'Add line' }));
    expect(await screen.findByRole('gridcell', { name: 'Buttock 200 at St 1' })).toBeTruthy();
    expect(screen.getByRole('rowheader', { name: 'Buttock 200 Buttock · half-breadth 200' })).toBeTruthy();

    await user.click(screen.getByRole('button', { name: 'Move Buttock 200 up' }));
    const grid = screen.getByRole('grid');
    expect(within(grid).getAllByRole('rowheader').map((h) => h.textContent?.split(' ')[0])).toEqual(['WL', 'Buttock', 'Chine', 'Chine']);
  });
});

describe('Lines: units', () => {
  it('shows and reads the table in feet-inches-eighths when switched, storing millimetres', async () => {
    const { user, api } = await openLines();
    await user.click(screen.getByRole('radio', { name: 'Feet-inches-eighths' }));
    // 500 mm is 1 ft 7 11/16 in: five eighths and a sixteenth.
    expect(cellText('WL 300 at St 3')).toBe('1-7-5+');
    await user.click(cell('WL 300 at St 3'));
    await user.keyboard('1-8-0+{Enter}');
    expect(cellText('WL 300 at St 3')).toBe('1-8-0+');
    await user.click(screen.getByRole('radio', { name: 'Millimetres' }));
    expect(cellText('WL 300 at St 3')).toBe('509.5');
    await waitFor(() => expect(api.count('PUT', '/api/hulls/3/plan/draft')).toBe(1), { timeout: 4000 });
    const sent = api.calls.find((c) => c.method === 'PUT')!.body as { plan: Plan };
    expect(sent.plan.lines.lines[0]!.cells['st-3']).toBeCloseTo((20 + 1 / 16) * 25.4, 9);
    expect(sent.plan.lines.notation.unit).toBe('mm');
  });
});

describe('Lines: import', () => {
  it('requires the units before sending anything: a table is never guessed', async () => {
    const { user, api } = await openLines('owner', {
      'POST /api/hulls/3/plan/import/offsets': apiError(400, 'bad_offsets', 'Nothing was imported: row 3, column 7 (St 2), "4O0": ...', {}),
    });
    const file = new File(['line,kind,fixed,angle,knuckle,St 1,St 2\n'], 'offsets.csv', { type: 'text/csv' });
    await user.upload(screen.getByLabelText('CSV file'), file);
    await user.click(screen.getByRole('button', { name: 'Import offsets' }));
    expect(await screen.findByText('Choose the units the file is written in: a table is never guessed')).toBeTruthy();
    expect(api.writes()).toEqual([]);
  });

  it('shows each bad cell of a refused file', async () => {
    stubApi({
      'GET /api/session': sessionOf(ann),
      'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Tidewrack' }) } },
      ...planHandlers(3, { plan: smallPlan(), revision: revision(4) }),
      'POST /api/hulls/3/plan/import/offsets': {
        status: 400,
        body: {
          error: {
            code: 'bad_offsets',
            message: 'Nothing was imported',
            field: 'file',
            cells: [{ row: 3, column: 7, columnName: 'St 2', field: 'half-breadth at St 2', value: '4O0', message: '"4O0": this is not a length (expected millimetres like 1049.5)' }],
          },
        },
      },
    });
    const { user } = renderApp('/hulls/3/lines');
    await screen.findByRole('grid');
    await user.upload(screen.getByLabelText('CSV file'), new File(['x'], 'offsets.csv', { type: 'text/csv' }));
    await user.click(screen.getByRole('radio', { name: /^Millimetres 1049.5/ }));
    await user.click(screen.getByRole('button', { name: 'Import offsets' }));
    const table = await screen.findByRole('table', { name: 'Cells of the file that could not be read' });
    expect(within(table).getAllByRole('row').slice(1).map((r) => [...r.children].map((c) => c.textContent))).toEqual([['3', 'St 2 (7)', '4O0', '"4O0": this is not a length (expected millimetres like 1049.5)']]);
  });
});
