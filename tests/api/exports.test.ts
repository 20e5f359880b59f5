import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import DxfParser from 'dxf-parser';
import JSZip from 'jszip';
import { demoPlan } from '../../server/seed/demo-plan';
import { binary, makeUser, signedIn, testServer, type TestServer } from './support';

let server: TestServer;
let owner: TestAgent;
let hullId: number;
beforeAll(async () => {
  server = testServer();
  owner = await signedIn(server.app, await makeUser('owner'));
  hullId = (await owner.post('/api/hulls').send({ name: 'Export test', units: 'mm' })).body.hull.id;
});
afterAll(() => server.close());

describe('exports from the stored plan', () => {
  it('refuses to export before a revision is saved, saying why', async () => {
    const res = await owner.get(`/api/hulls/${hullId}/exports/hull.dxf`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('nothing_saved');
  });

  it('writes a DXF whose closed cut profiles are the part geometry, in mm and in inches', async () => {
    await owner.post(`/api/hulls/${hullId}/plan/revisions`).send({ baseRevisionId: null, plan: demoPlan() });
    const part = (await owner.get(`/api/hulls/${hullId}/parts/pt-frame-3`)).body.result.part;
    const loops = part.layers[0].regions.reduce((n: number, r: { holes: unknown[] }) => n + 1 + r.holes.length, 0);

    const mm = await binary(owner, `/api/hulls/${hullId}/exports/parts/pt-frame-3/template.dxf?layer=1&units=mm`);
    expect(mm.status).toBe(200);
    expect(mm.headers['content-disposition']).toMatch(/frame-3-layer-1-mm-r\d+\.dxf/);
    // Read back with dxf-parser (a general-purpose DXF reader from the registry).
    const dxf = new DxfParser().parseSync((mm.body as Buffer).toString('utf8'))!;
    expect(dxf.header.$INSUNITS).toBe(4); // Autodesk DXF Reference, HEADER: 4 = millimetres
    const cuts = dxf.entities.filter((e) => e.layer === 'OUTER_CUT' || e.layer === 'INNER_CUT');
    expect(cuts).toHaveLength(loops);
    expect(cuts.every((e) => e.type === 'LWPOLYLINE' && (e as { shape?: boolean }).shape === true)).toBe(true);

    const inch = await binary(owner, `/api/hulls/${hullId}/exports/parts/pt-frame-3/template.dxf?layer=1&units=in`);
    const dxfIn = new DxfParser().parseSync((inch.body as Buffer).toString('utf8'))!;
    expect(dxfIn.header.$INSUNITS).toBe(1); // 1 = inches
    const xs = (d: typeof dxf) => d.entities.filter((e) => e.layer === 'OUTER_CUT').flatMap((e) => (e as unknown as { vertices: { x: number }[] }).vertices.map((v) => v.x));
    // 1 in = 25.4 mm exactly (NIST SP 811): the inch file is the millimetre file divided by 25.4.
    xs(dxfIn).forEach((x, i) => expect(x).toBeCloseTo(xs(dxf)[i] / 25.4, 6));
  });

  it('writes a tiled PDF for the chosen paper, and a zip of everything', async () => {
    const pdf = await binary(owner, `/api/hulls/${hullId}/exports/parts/pt-bulkhead-5/template.pdf?paper=a3&orientation=landscape`);
    expect(pdf.status).toBe(200);
    expect((pdf.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
    const { getDocument } = await import('pdfjs-dist/legacy/build/pdf.mjs');
    const doc = await getDocument({ data: new Uint8Array(pdf.body as Buffer) }).promise;
    const page = await doc.getPage(2);
    // ISO 216: A3 is 297 x 420 mm = 841.89 x 1190.55 pt; landscape puts the long side across.
    const [x0, y0, x1, y1] = page.view;
    expect(x1 - x0).toBeCloseTo(1190.55, 1);
    expect(y1 - y0).toBeCloseTo(841.89, 1);

    const zip = await binary(owner, `/api/hulls/${hullId}/exports/all.zip`);
    const names = Object.keys((await JSZip.loadAsync(zip.body as Buffer)).files).sort();
    expect(names.filter((n) => n.startsWith('patterns/')).length).toBe(4); // frame 3: two layers; bulkhead and transom: one each
    expect(names.some((n) => /bevel-table-r\d+\.csv$/.test(n))).toBe(true);
    expect(names.some((n) => n.includes('cut-list'))).toBe(true);
  });

  it('names the layer when it does not exist', async () => {
    const res = await owner.get(`/api/hulls/${hullId}/exports/parts/pt-bulkhead-5/template.pdf?layer=3`);
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('layer');
  });
});
