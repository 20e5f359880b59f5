import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { demoPlan } from '../../server/seed/demo-plan';
import { makeUser, signedIn, testServer, type TestServer } from './support';

let server: TestServer;
let owner: TestAgent;
beforeAll(async () => {
  server = testServer();
  owner = await signedIn(server.app, await makeUser('owner'));
});
afterAll(() => server.close());

async function newHull() {
  return (await owner.post('/api/hulls').send({ name: 'Import test', units: 'mm' })).body.hull.id as number;
}

const revisionCount = async (hullId: number) => {
  const [rows] = await server.sequelize.query('SELECT COUNT(*) AS n FROM plan_revisions WHERE hull_id = ?', { replacements: [hullId] });
  return Number((rows as { n: number }[])[0].n);
};

function importCsv(hullId: number, csv: string | Buffer, fields: Record<string, string>, name = 'offsets.csv') {
  let req = owner.post(`/api/hulls/${hullId}/plan/import/offsets`);
  for (const [k, v] of Object.entries({ baseRevisionId: '', ...fields })) req = req.field(k, v);
  return req.attach('file', Buffer.isBuffer(csv) ? csv : Buffer.from(csv, 'utf8'), name);
}

/** A table of 30 waterlines × 20 stations (600 cells), every value a plain number of millimetres. */
function bigTable(sep: string, badAt?: { line: number; station: number; text: string }) {
  const stations = Array.from({ length: 20 }, (_, i) => `S${i}`);
  const rows = [['line', 'kind', 'fixed', 'angle', 'knuckle', ...stations], ['Station position', 'x', '', '', '', ...stations.map((_, i) => String(i * 250))]];
  for (let l = 0; l < 30; l += 1) {
    const cells = stations.map((_, i) => String(300 + l * 10 + i));
    if (badAt && badAt.line === l) cells[badAt.station] = badAt.text;
    rows.push([`WL ${100 + l * 20}`, 'waterline', String(100 + l * 20), '', '', ...cells]);
  }
  return rows.map((r) => r.join(sep)).join('\n');
}

describe('CSV import of a table of offsets', () => {
  it('imports a comma-separated millimetre table as a new revision', async () => {
    const hullId = await newHull();
    const res = await importCsv(hullId, bigTable(','), { unit: 'mm' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const plan = (await owner.get(`/api/hulls/${hullId}/plan`)).body.plan;
    expect(plan.lines.stations).toHaveLength(20);
    expect(plan.lines.lines).toHaveLength(30);
    expect(plan.lines.lines[2]).toMatchObject({ kind: 'waterline', name: 'WL 140', z: 140 });
    expect(plan.lines.lines[2].cells[plan.lines.stations[5].id]).toBe(325);
  });

  it('names the one bad cell among six hundred, and writes nothing', async () => {
    const hullId = await newHull();
    const res = await importCsv(hullId, bigTable(',', { line: 17, station: 11, text: '4O5' }), { unit: 'mm' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_offsets');
    expect(res.body.error.cells).toHaveLength(1);
    // Row 20 of the file: header, station row, then WL rows 0..17. Column 17: five fixed columns, then S11.
    expect(res.body.error.cells[0]).toMatchObject({ row: 20, column: 17, columnName: 'S11', value: '4O5' });
    expect(res.body.error.message).toContain('row 20, column 17 (S11)');
    expect(await revisionCount(hullId)).toBe(0);
  });

  it('reads semicolon-separated files with a decimal comma and a byte-order mark', async () => {
    const hullId = await newHull();
    const csv = '\uFEFF' + 'line;kind;fixed;angle;knuckle;A;B;C\nStation position;x;;;;0;500,5;1000\nWL 200;waterline;200;;;310,25;402,5;388\n';
    const res = await importCsv(hullId, csv, { unit: 'mm', decimalComma: 'true' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const plan = (await owner.get(`/api/hulls/${hullId}/plan`)).body.plan;
    expect(plan.lines.stations.map((s: { x: number }) => s.x)).toEqual([0, 500.5, 1000]);
    expect(Object.values(plan.lines.lines[0].cells)).toEqual([310.25, 402.5, 388]);
  });

  it('reads a tab-separated feet-inches-eighths table with point lines, the notation chosen by the person', async () => {
    const hullId = await newHull();
    const csv = [
      ['line', 'kind', 'fixed', 'angle', 'knuckle', 'St 1', 'St 2'],
      ['Station position', 'x', '', '', '', '2-0-0', '4-0-0'],
      ['Chine', 'chine height', '', '', 'yes', '0-6-4', '0-5-2+'],
      ['Chine', 'chine half-breadth', '', '', 'yes', '1-3-4', '1-8-0'],
    ]
      .map((r) => r.join('\t'))
      .join('\n');
    const res = await importCsv(hullId, csv, { unit: 'ftin', sixteenthMarks: 'plus-sixteenth' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const plan = (await owner.get(`/api/hulls/${hullId}/plan`)).body.plan;
    const chine = plan.lines.lines[0];
    expect(chine).toMatchObject({ kind: 'point', role: 'chine', knuckle: { fromX: null, toX: null } });
    // 1-3-4 = 15.5 in = 393.7 mm (REFERENCES.md: notation, common practice; 1 in = 25.4 mm exactly, NIST SP 811).
    expect(chine.cells['st-st-1'].y).toBeCloseTo(393.7, 9);
    // 0-5-2+ = 5 2/8 in + 1/16 in = 5.3125 in = 134.9375 mm (derived).
    expect(chine.cells['st-st-2'].z).toBeCloseTo(134.9375, 9);
  });

  it('refuses a 5 MB file with a clear message', async () => {
    const hullId = await newHull();
    const huge = Buffer.alloc(5 * 1024 * 1024, 'a,');
    const res = await importCsv(hullId, huge, { unit: 'mm' });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('file_too_large');
    expect(res.body.error.message).toMatch(/larger than 2 MB/);
    expect(await revisionCount(hullId)).toBe(0);
  });

  it('requires the units: a table is never guessed', async () => {
    const hullId = await newHull();
    const res = await owner.post(`/api/hulls/${hullId}/plan/import/offsets`).field('baseRevisionId', '').attach('file', Buffer.from(bigTable(',')), 'offsets.csv');
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('unit');
  });
});

describe('exports and re-imports', () => {
  it('exports the table as CSV that re-imports to the same lines and stations', async () => {
    const hullId = await newHull();
    const first = (await owner.post(`/api/hulls/${hullId}/plan/revisions`).send({ baseRevisionId: null, plan: demoPlan() })).body.revision.id;
    const csv = await owner.get(`/api/hulls/${hullId}/plan/export/offsets.csv`).buffer(true);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const res = await importCsv(hullId, csv.text, { unit: 'mm', baseRevisionId: String(first) }, 'exported.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const after = (await owner.get(`/api/hulls/${hullId}/plan`)).body.plan;
    expect(after.lines.stations).toEqual(demoPlan().lines.stations);
    expect(after.lines.lines).toEqual(demoPlan().lines.lines);
    expect(res.body.changes).toEqual([]);
  });

  it('exports the whole plan as JSON that re-imports exactly', async () => {
    const source = await newHull();
    await owner.post(`/api/hulls/${source}/plan/revisions`).send({ baseRevisionId: null, plan: demoPlan() });
    const exported = (await owner.get(`/api/hulls/${source}/plan/export/plan.json`)).body;
    expect(exported.schemaVersion).toBe(1);
    const target = await newHull();
    const res = await owner.post(`/api/hulls/${target}/plan/import/json`).send({ baseRevisionId: null, document: exported });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const reimported = (await owner.get(`/api/hulls/${target}/plan/export/plan.json`)).body;
    expect(reimported).toStrictEqual(exported);
  });

  it('refuses a JSON document from a newer schema, naming the field', async () => {
    const hullId = await newHull();
    const res = await owner.post(`/api/hulls/${hullId}/plan/import/json`).send({ baseRevisionId: null, document: { ...demoPlan(), schemaVersion: 99 } });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('document.schemaVersion');
    expect(res.body.error.message).toMatch(/newer Loftbench/);
  });
});
