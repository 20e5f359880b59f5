import { afterEach, describe, expect, it, vi } from 'vitest';
import { waitFor, within } from '@testing-library/react';
import type { ExportIndexResponse, ExportJobStatus } from '../../shared/api/exports';
import { ann, hull, sessionOf } from './fixtures';
import { planHandlers } from './plan-fixtures';
import { stubApi, takeUnexpectedCalls, type Handlers } from './api-stub';
import { renderApp, screen } from './render-app';

afterEach(() => {
  vi.restoreAllMocks();
  expect(takeUnexpectedCalls()).toEqual([]);
});

const index: ExportIndexResponse = {
  revisionId: 7,
  exports: [
    { name: 'tidewrack-frame-3-layer-1-a4-portrait-tiles-r7.pdf', kind: 'tiled-pdf', label: 'Frame 3, layer 1 of 2: tiled PDF, A4 portrait', href: '/api/hulls/3/exports/parts/pt-frame-3/template.pdf?layer=1', revisionId: 7, bytes: 81234, problem: null, partId: 'pt-frame-3', layer: 1 },
    { name: 'tidewrack-bevel-table-r7.csv', kind: 'bevels-csv', label: 'Bevel table, CSV', href: '/api/hulls/3/exports/bevels.csv', revisionId: 7, bytes: 912, problem: null },
    { name: null, kind: 'cut-list-pdf', label: 'Cut list and material, PDF', href: '/api/hulls/3/exports/cut-list.pdf', revisionId: 7, bytes: null, problem: 'piece Frame 3 / layer 1 / piece 1 (2500 x 900 mm) does not fit a 1220 x 2440 mm sheet' },
    { name: 'tidewrack-everything-r7.zip', kind: 'zip', label: 'Everything, one zip', href: '/api/hulls/3/exports/all.zip', revisionId: 7, bytes: 2_345_678, problem: null },
  ],
};

function server(more: Handlers = {}) {
  return stubApi({
    'GET /api/session': sessionOf(ann),
    'GET /api/hulls/3': { body: { hull: hull({ id: 3, name: 'Tidewrack', role: 'builder' }) } },
    ...planHandlers(3),
    'GET /api/hulls/3/exports': { body: index },
    ...more,
  });
}

describe('Downloads', () => {
  it('lists every export with its file, the revision it is made from and its size', async () => {
    server();
    renderApp('/hulls/3/downloads');
    const table = await screen.findByRole('table', { name: 'Exports of this hull' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows.map((r) => within(r).getAllByRole('cell').slice(0, 3).map((c) => c.textContent))).toEqual([
      ['tidewrack-frame-3-layer-1-a4-portrait-tiles-r7.pdf', '7', '81.2 kB'],
      ['tidewrack-bevel-table-r7.csv', '7', '912 B'],
      ['—', '7', '—'],
      ['tidewrack-everything-r7.zip', '7', '2.35 MB'],
    ]);
    expect(within(rows[1]!).getByRole('link', { name: 'Download Bevel table, CSV' }).getAttribute('href')).toBe('/api/hulls/3/exports/bevels.csv');
    // A file that cannot be made says why, and offers nothing to download.
    expect(within(rows[2]!).getByText(/Cannot be made: piece Frame 3 .* does not fit/)).toBeTruthy();
    expect(within(rows[2]!).queryByRole('link')).toBeNull();
    expect(screen.getByText('Check the calibration square before cutting')).toBeTruthy();
  });

  it('makes the zip in the background, shows its progress only once it has taken a second, then downloads it', { timeout: 15000 }, async () => {
    const clicked: string[] = [];
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicked.push(this.getAttribute('href') ?? '');
    });
    const status = (over: Partial<ExportJobStatus>): ExportJobStatus => ({ id: 'job-1', state: 'running', done: 0, total: 11, unit: 'files', fileName: 'tidewrack-everything-r7.zip', bytes: null, error: null, ...over });
    let polls = 0;
    let finished = false;
    const api = server({
      'POST /api/hulls/3/exports/jobs': { status: 202, body: { job: status({}) } },
      // The server's job moves a file per poll and stays running until the test lets it finish.
      'GET /api/hulls/3/exports/jobs/job-1': () => {
        polls += 1;
        return { body: { job: finished ? status({ state: 'done', done: 11, bytes: 2_345_678 }) : status({ done: Math.min(polls, 10) }) } };
      },
    });
    const view = renderApp('/hulls/3/downloads');
    const table = await screen.findByRole('table', { name: 'Exports of this hull' });
    const zipRow = within(table).getAllByRole('row').at(-1)!;
    const started = Date.now();
    await view.user.click(within(zipRow).getByRole('button', { name: 'Download' }));
    expect(api.calls.find((c) => c.method === 'POST')?.body).toEqual({ kind: 'zip' });

    // Under a second: polled, but no bar yet.
    await waitFor(() => expect(polls).toBeGreaterThan(0));
    if (Date.now() - started < 900) expect(within(zipRow).queryByRole('progressbar')).toBeNull();
    const bar = await within(zipRow).findByRole('progressbar', {}, { timeout: 3000 });
    expect(Date.now() - started).toBeGreaterThanOrEqual(1000);
    expect(Number(bar.getAttribute('max'))).toBe(11);
    expect(Number(bar.getAttribute('value'))).toBeGreaterThan(0);
    expect(within(zipRow).getByText(/Making tidewrack-everything-r7\.zip: \d+ of 11 files/)).toBeTruthy();
    expect(clicked).toEqual([]);

    finished = true;
    await within(zipRow).findByText(/Made tidewrack-everything-r7\.zip \(2\.35 MB\)/, {}, { timeout: 3000 });
    expect(within(zipRow).queryByRole('progressbar')).toBeNull();
    expect(clicked).toEqual(['/api/hulls/3/exports/jobs/job-1/file']);
  });

  it('says so when the server has lost the job (a restart), stops asking, and lets it be started again', { timeout: 15000 }, async () => {
    const status: ExportJobStatus = { id: 'job-1', state: 'running', done: 2, total: 11, unit: 'files', fileName: 'tidewrack-everything-r7.zip', bytes: null, error: null };
    let polls = 0;
    let lost = false;
    const api = server({
      'POST /api/hulls/3/exports/jobs': { status: 202, body: { job: status } },
      'GET /api/hulls/3/exports/jobs/job-1': () => {
        polls += 1;
        if (!lost) return { body: { job: status } };
        return { status: 404, body: { error: { code: 'not_found', message: 'No such export: it was made more than 10 minutes ago, or the server has restarted since it was started. Start it again.' } } };
      },
    });
    const view = renderApp('/hulls/3/downloads');
    const table = await screen.findByRole('table', { name: 'Exports of this hull' });
    const zipRow = within(table).getAllByRole('row').at(-1)!;
    const button = within(zipRow).getByRole('button', { name: 'Download' });
    await view.user.click(button);
    await waitFor(() => expect(polls).toBeGreaterThan(1));
    expect(button.getAttribute('aria-busy')).toBe('true');

    lost = true;
    await within(zipRow).findByText(/the server has restarted since it was started\. Start it again\./, {}, { timeout: 3000 });
    expect(within(zipRow).getByText('Lost track of the file')).toBeTruthy();
    await waitFor(() => expect(button.getAttribute('aria-busy')).toBeNull());
    expect((button as HTMLButtonElement).disabled).toBe(false);
    // No more asking once the server has said it does not know the job.
    const heard = polls;
    await new Promise((r) => setTimeout(r, 1000));
    expect(polls).toBe(heard);

    lost = false;
    await view.user.click(button);
    await waitFor(() => expect(api.calls.filter((c) => c.method === 'POST')).toHaveLength(2));
    await waitFor(() => expect(within(zipRow).queryByText('Lost track of the file')).toBeNull());
  });
});
