/**
 * Export benchmarks (vitest bench: they report, never gate). A large hull: 60 synthetic parts of about
 * 2000 segments each (the part builder is not finished). Each writer runs beside a baseline in the same
 * run: pdfkit alone writing the same pages with every segment of the part on each (no clipping, no text),
 * and makerjs alone writing the same loops (ConnectTheDots + toDXF). Target: at most 1.3 times each.
 */
import { afterAll, bench, describe } from 'vitest';
import PDFDocument from 'pdfkit';
import makerjs from 'makerjs';
import { tiledPdf, tiledPdfPlan } from '../../server/exports/tiled-pdf';
import { dxfOfDrawings } from '../../server/exports/dxf';
import { drawingAsSeen } from '../../shared/geometry/drawing';
import { PAPER_A3, type TilingOptions } from '../../shared/geometry/tiling';
import { drawingSegments, syntheticDrawing } from '../unit/exports-fixtures';

const PARTS = 60;
const drawings = Array.from({ length: PARTS }, (_, i) => syntheticDrawing(i, 2000));
const tiling: TilingOptions = { paper: PAPER_A3, orientation: 'landscape' };
const pagesOf = drawings.map((d) => tiledPdfPlan(d, tiling)).map((p) => p.introPages + p.printed.length);
const sizes: Record<string, number> = {};
const PT = 72 / 25.4;

/** pdfkit alone: the same number of pages, each stroking every segment of the part once. */
function pdfkitBaseline(i: number): Promise<Buffer> {
  const d = drawingAsSeen(drawings[i]!);
  const doc = new PDFDocument({ autoFirstPage: false, margin: 0, compress: true });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  for (let p = 0; p < pagesOf[i]!; p++) {
    doc.addPage({ size: [420 * PT, 297 * PT], margin: 0 });
    for (const path of d.paths) {
      if (path.kind !== 'polyline') continue;
      path.points.forEach((q, k) => (k === 0 ? doc.moveTo(q.y * PT, -q.z * PT) : doc.lineTo(q.y * PT, -q.z * PT)));
      if (path.closed) doc.closePath();
      doc.stroke();
    }
  }
  doc.end();
  return done;
}

/** makerjs alone: every polyline of every part as a ConnectTheDots model on its layer, written by toDXF. */
function makerjsBaseline(): string {
  const models: Record<string, makerjs.IModel> = {};
  drawings.forEach((raw, i) => {
    const d = drawingAsSeen(raw);
    d.paths.forEach((p, k) => {
      if (p.kind !== 'polyline') return;
      const m: makerjs.IModel = new makerjs.models.ConnectTheDots(p.closed, p.points.map((q) => [q.y + i * 3000, q.z]));
      m.layer = p.role;
      models[`${i}-${k}`] = m;
    });
  });
  return makerjs.exporter.toDXF({ models }, { usePOLYLINE: true, units: makerjs.unitType.Millimeter });
}

describe(`tiled PDF of ${PARTS} parts (${drawings.reduce((s, d) => s + drawingSegments(d), 0)} segments, ${pagesOf.reduce((a, b) => a + b, 0)} A3 pages)`, () => {
  bench('Loftbench tiledPdf', async () => {
    let bytes = 0;
    for (const d of drawings) bytes += (await tiledPdf(d, tiling)).length;
    sizes['tiled PDF (ours)'] = bytes;
  }, { iterations: 2, warmupIterations: 0, time: 0 });
  bench('baseline: pdfkit alone, same pages and segments', async () => {
    let bytes = 0;
    for (let i = 0; i < drawings.length; i++) bytes += (await pdfkitBaseline(i)).length;
    sizes['tiled PDF (pdfkit baseline)'] = bytes;
  }, { iterations: 2, warmupIterations: 0, time: 0 });
});

describe(`DXF of ${PARTS} parts in one file`, () => {
  bench('Loftbench dxfOfDrawings', () => {
    sizes['DXF (ours)'] = dxfOfDrawings(drawings, { units: 'mm' }).length;
  }, { iterations: 5, warmupIterations: 1, time: 0 });
  bench('baseline: makerjs alone, same loops', () => {
    sizes['DXF (makerjs baseline)'] = makerjsBaseline().length;
  }, { iterations: 5, warmupIterations: 1, time: 0 });
});

afterAll(() => {
  for (const [k, v] of Object.entries(sizes)) console.log(`${k}: ${(v / 1e6).toFixed(2)} MB`);
});
