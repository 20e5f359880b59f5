import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { BEVEL_CSV_FIELDS, bevelTableCsv, bevelTablePdf } from '../../server/exports/bevel-table';
import { bevelRowsOf } from '../../shared/geometry/drawing';
import { ringFrameDrawing } from './exports-fixtures';
import { pdfRead } from './exports-render';

const rows = () => [...bevelRowsOf(ringFrameDrawing()), ...bevelRowsOf(ringFrameDrawing({ title: { partName: 'Frame 5', stationName: '5', layerIndex: 2 } }))];
const options = { hullName: 'Petrel', revisionId: 'r12', date: '2025-03-02', units: 'mm' as const };

describe('bevelTableCsv read back with papaparse', { timeout: 120000 }, () => {
  it('has one row per mark with its numbers and words', () => {
    const r = rows();
    const parsed = Papa.parse<Record<string, string>>(bevelTableCsv(r, options).toString('utf8'), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual([...BEVEL_CSV_FIELDS]);
    expect(parsed.data).toHaveLength(r.length);
    const row = parsed.data[5]!;
    const src = r[5]!;
    // analytic: the row's numbers are the mark's, to 0.1
    expect(Number(row.saw_tilt_deg)).toBeCloseTo(src.sawTiltDeg, 1);
    expect(Number(row.sliding_bevel_deg)).toBeCloseTo(src.slidingBevelDeg, 1);
    expect(Number(row.girth)).toBeCloseTo(src.girthMm, 1);
    expect(row.tilt_direction).toMatch(/^tilt (toward|away from) the centreline$/);
    expect(row.face_down).toBe('aft');
    expect(parsed.data.filter((x) => x.past_saw_limit === 'yes').length).toBe(r.filter((x) => x.overSawLimit).length);
  });

  it('gives the girth in inches for an inch hull', () => {
    // NIST SP 811: 1 in = 25.4 mm
    const r = rows();
    const parsed = Papa.parse<Record<string, string>>(bevelTableCsv(r, { units: 'in' }).toString('utf8'), { header: true, skipEmptyLines: true });
    expect(Number(parsed.data[0]!.girth)).toBeCloseTo(r[0]!.girthMm / 25.4, 3);
    expect(parsed.data[0]!.girth_units).toBe('in');
  });
});

describe('bevelTablePdf read back with pdfjs-dist', { timeout: 120000 }, () => {
  it('lists every mark in large type with the saw caution', async () => {
    const r = rows();
    const pages = await pdfRead(await bevelTablePdf(r, options));
    const texts = pages.flatMap((p) => p.texts);
    const all = texts.map((t) => t.str).join(' ');
    for (const x of r) expect(all).toContain(`${x.sawTiltDeg.toFixed(1)}°`);
    expect(all).toContain('Frame 5, station 5, layer 2');
    expect(all).toContain('PAST LIMIT');
    expect(all).toContain('push sticks');
    // large type for the saw: the cells' capitals 4.2 mm, a font of about 17 pt (our choice; at least 14 pt)
    const cell = texts.find((t) => t.str === 'starboard')!;
    expect(cell.heightPt).toBeGreaterThanOrEqual(14);
    for (const p of pages) {
      // A4 landscape (ISO 216: 841.89 x 595.28 pt)
      expect(Math.abs(p.widthPt - 841.89)).toBeLessThan(0.01);
      expect(Math.abs(p.heightPt - 595.28)).toBeLessThan(0.01);
    }
  });
});

describe('CSV files', { timeout: 120000 }, () => {
  it('start with the UTF-8 byte-order mark (Unicode Standard, ch. 23.8) before the header', () => {
    const buf = bevelTableCsv(rows(), options);
    expect([...buf.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    expect(buf.subarray(3, 7).toString('utf8')).toBe('part');
  });
});
