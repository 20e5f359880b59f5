import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import Papa from 'papaparse';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { demoPlan } from '../../server/seed/demo-plan';
import type { ArrangementResponse, ExportIndexResponse, ExportJobStatus, PartDrawingResponse } from '../../shared/api/exports';
import { PAPER_A4, paperCustom, tiledPrintPageCount, tiledPrintPlan } from '../../shared/geometry/tiling';
import { sheetPieceBox } from '../../shared/geometry/sheet-layout';
import { binary, makeUser, signedIn, testServer, type TestServer } from './support';

let server: TestServer;
let owner: TestAgent;
let helper: TestAgent;
let hullId: number;
let revisionId: number;
beforeAll(async () => {
  server = testServer();
  owner = await signedIn(server.app, await makeUser('owner'));
  const helperUser = await makeUser('helper');
  helper = await signedIn(server.app, helperUser);
  hullId = (await owner.post('/api/hulls').send({ name: 'Print shop test', units: 'mm' })).body.hull.id;
  revisionId = (await owner.post(`/api/hulls/${hullId}/plan/revisions`).send({ baseRevisionId: null, plan: demoPlan() })).body.revision.id;
  await owner.post(`/api/hulls/${hullId}/crew`).send({ email: helperUser.email, role: 'helper' });
}, 60000);
afterAll(() => server.close());

/** Pages of a PDF read back with pdfjs-dist (a general-purpose PDF reader). */
const pageCount = async (pdf: Buffer): Promise<number> => (await getDocument({ data: new Uint8Array(pdf), verbosity: 0 }).promise).numPages;

async function jobDone(agent: TestAgent, jobId: string): Promise<ExportJobStatus[]> {
  const seen: ExportJobStatus[] = [];
  for (;;) {
    const res = await agent.get(`/api/hulls/${hullId}/exports/jobs/${jobId}`);
    expect(res.status).toBe(200);
    seen.push(res.body.job);
    if (res.body.job.state !== 'running') return seen;
  }
}

describe('the Print shop preview and the tiled PDF', () => {
  it('counts the same pages from the drawing as the PDF writer puts in the file', async () => {
    const got = await owner.get(`/api/hulls/${hullId}/exports/parts/pt-bulkhead-5/drawing?layer=1`);
    expect(got.status).toBe(200);
    const { drawing } = got.body as PartDrawingResponse;
    for (const [query, paper, orientation] of [
      ['paper=a4&orientation=landscape', PAPER_A4, 'landscape'],
      ['paper=custom&widthMm=250&heightMm=180&orientation=portrait&marginMm=10&overlapMm=20', paperCustom(250, 180), 'portrait'],
    ] as const) {
      const margin = query.includes('marginMm=10') ? 10 : undefined;
      const overlap = query.includes('overlapMm=20') ? 20 : undefined;
      // The preview's count, from the JSON the screen gets and the shared function it runs.
      const shown = tiledPrintPageCount(tiledPrintPlan(drawing, { paper, orientation, marginMm: margin, overlapMm: overlap }));
      expect(shown).toBeGreaterThan(2);
      const pdf = await binary(owner, `/api/hulls/${hullId}/exports/parts/pt-bulkhead-5/template.pdf?${query}`);
      expect(pdf.status).toBe(200);
      expect(await pageCount(pdf.body as Buffer)).toBe(shown);
    }
  });

  it('refuses a paper too small for the check square, naming the field, instead of failing', async () => {
    const res = await owner.get(`/api/hulls/${hullId}/exports/parts/pt-bulkhead-5/template.pdf?paper=custom&widthMm=120&heightMm=120`);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_export', field: 'paper' });
    expect(res.body.error.message).toContain('100 mm check square');
  });
});

describe('export jobs', () => {
  it('reports the pages made as a big tiled PDF is written, then sends the file with that many pages', async () => {
    // Small sheets with no overlap: many pages, so the job is seen part way through.
    const query = { paper: 'custom', widthMm: 130, heightMm: 130, marginMm: 5, overlapMm: 0 };
    const started = await owner.post(`/api/hulls/${hullId}/exports/jobs`).send({ kind: 'tiled-pdf', partId: 'pt-bulkhead-5', query });
    expect(started.status).toBe(202);
    const job = started.body.job as ExportJobStatus;
    expect(job).toMatchObject({ state: 'running', unit: 'pages' });
    expect(job.total).toBeGreaterThan(20);
    const seen = await jobDone(owner, job.id);
    const done = seen.map((s) => s.done);
    expect(done.some((d) => d > 0 && d < job.total)).toBe(true);
    expect(done).toEqual([...done].sort((a, b) => a - b));
    expect(seen.at(-1)).toMatchObject({ state: 'done', done: job.total });

    const file = await binary(owner, `/api/hulls/${hullId}/exports/jobs/${job.id}/file`);
    expect(file.status).toBe(200);
    expect(Number(file.headers['content-length'])).toBe(seen.at(-1)!.bytes);
    expect(await pageCount(file.body as Buffer)).toBe(job.total);
    // Another person on the crew does not see it.
    expect((await helper.get(`/api/hulls/${hullId}/exports/jobs/${job.id}`)).status).toBe(404);
  });

  it('makes the zip in files, and refuses a bad paper before starting', async () => {
    const zip = (await owner.post(`/api/hulls/${hullId}/exports/jobs`).send({ kind: 'zip' })).body.job as ExportJobStatus;
    expect(zip.unit).toBe('files');
    const seen = await jobDone(owner, zip.id);
    expect(seen.at(-1)).toMatchObject({ state: 'done', done: zip.total, total: zip.total });
    const bad = await owner.post(`/api/hulls/${hullId}/exports/jobs`).send({ kind: 'tiled-pdf', partId: 'pt-bulkhead-5', query: { paper: 'custom', widthMm: 120, heightMm: 120 } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('paper');
  });
});

describe('the Downloads index', () => {
  it('lists every export with the revision and the size the download really has', async () => {
    const res = await owner.get(`/api/hulls/${hullId}/exports`);
    expect(res.status).toBe(200);
    const index = res.body as ExportIndexResponse;
    expect(index.revisionId).toBe(revisionId);
    // Demo hull: frame 3 two layers, bulkhead and transom one each: 4 layers x (tiles, roll, DXF), then 7 hull-wide files (DXF mm and in, bevel CSV and PDF, cut list CSV and PDF, zip).
    expect(index.exports).toHaveLength(4 * 3 + 7);
    for (const kind of ['bevels-csv', 'cut-list-pdf', 'zip', 'roll-pdf'] as const) {
      const entry = index.exports.find((e) => e.kind === kind)!;
      expect(entry.revisionId).toBe(revisionId);
      const file = await binary(owner, entry.href);
      expect(file.status).toBe(200);
      expect((file.body as Buffer).length).toBe(entry.bytes);
      expect(file.headers['content-disposition']).toContain(entry.name);
    }
  });
});

describe('the cut list arranged by hand', () => {
  const path = () => `/api/hulls/${hullId}/cut-list/arrangement`;

  it('starts from the automatic arrangement, saves a move that keeps the rules, and the cut list uses it', async () => {
    const auto = (await owner.get(path())).body as ArrangementResponse;
    expect(auto).toMatchObject({ revisionId, byHand: false, note: null });
    expect(auto.layout.placements).toHaveLength(auto.pieces.length);
    // Move the smallest piece to a spot clear of every other: beyond the furthest box along sheet 1... or on a fresh place at the far end.
    const piece = [...auto.pieces].sort((a, b) => a.widthMm * a.heightMm - b.widthMm * b.heightMm)[0]!;
    const pl = auto.layout.placements.find((p) => p.pieceId === piece.id)!;
    const others = auto.layout.placements.filter((p) => p.sheetNo === pl.sheetNo && p.pieceId !== piece.id);
    const byId = new Map(auto.pieces.map((p) => [p.id, p]));
    const topOfOthers = Math.max(0, ...others.map((o) => sheetPieceBox(byId.get(o.pieceId)!, o).y1));
    const size = sheetPieceBox(piece, { ...pl, x: 0, y: 0 });
    const moved = { ...pl, x: 0, y: auto.layout.sheet.lengthMm - size.y1 };
    expect(moved.y).toBeGreaterThan(topOfOthers + auto.layout.kerfMm);
    const layout = { ...auto.layout, placements: auto.layout.placements.map((p) => (p.pieceId === piece.id ? moved : p)) };
    const saved = await owner.put(path()).send({ revisionId, layout });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ byHand: true, note: null });

    const csv = await binary(owner, `/api/hulls/${hullId}/exports/cut-list.csv`);
    const rows = Papa.parse<Record<string, string>>((csv.body as Buffer).toString('utf8').replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true }).data;
    const row = rows.find((r) => `${r.part} / layer ${r.layer} / piece ${r.piece}` === piece.id)!;
    expect(row.arranged).toBe('by hand');
    expect(Number(row.sheet_y_mm)).toBeCloseTo(moved.y, 0);

    // A different sheet asked for: the packer's arrangement, with the reason on the PDF.
    const other = await binary(owner, `/api/hulls/${hullId}/exports/cut-list.csv?sheetWidthMm=1250&sheetLengthMm=2500`);
    const otherRows = Papa.parse<Record<string, string>>((other.body as Buffer).toString('utf8').replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true }).data;
    expect(otherRows.every((r) => r.arranged === 'automatically')).toBe(true);
  });

  it('refuses an overlap naming the placement, and writes nothing', async () => {
    const before = (await owner.get(path())).body as ArrangementResponse;
    const [a, b] = before.layout.placements;
    const clash = { ...before.layout, placements: before.layout.placements.map((p) => (p.pieceId === b!.pieceId ? { ...p, sheetNo: a!.sheetNo, x: a!.x, y: a!.y, rotated: p.rotated } : p)) };
    const bad = await owner.put(path()).send({ revisionId, layout: clash });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('arrangement_refused');
    expect(bad.body.error.field).toMatch(/^layout\.placements\.\d+/);
    expect(bad.body.error.message).toMatch(/overlaps|kerf|ply/);
    expect(((await owner.get(path())).body as ArrangementResponse).layout).toEqual(before.layout);
  });

  it('refuses an arrangement made for an older revision, and a helper may read but not save', async () => {
    const current = (await owner.get(path())).body as ArrangementResponse;
    expect((await helper.get(path())).status).toBe(200);
    expect((await helper.put(path()).send({ revisionId, layout: current.layout })).status).toBe(403);
    expect((await owner.put(path()).send({ revisionId: revisionId + 1000, layout: current.layout })).status).toBe(409);
    const reset = await owner.delete(path());
    expect(reset.body.byHand).toBe(false);
  });
});
