import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { cutListCsv, cutListNesting, cutListPdf, pieceId } from '../../server/exports/cut-list';
import { cutListPiecesFixture } from './exports-fixtures';
import { pdfRead } from './exports-render';

const options = { hullName: 'Petrel', revisionId: 'r12', date: '2025-03-02', units: 'mm' as const, totals: { filletVolumeMl: 2350, glassTapeM: 41.5 } };

describe('cutListNesting', { timeout: 120000 }, () => {
  for (const kerf of [0, 3, 6]) {
    it(`places every piece once, inside its sheet, at least the kerf (${kerf} mm) apart, one ply thickness per sheet`, () => {
      const pieces = cutListPiecesFixture();
      const n = cutListNesting(pieces, { kerfMm: kerf });
      // 1220 x 2440 mm sheets by default (common practice, suppliers' lists)
      for (const g of n.groups) expect(g.nesting.sheet).toEqual({ widthMm: 1220, lengthMm: 2440 });
      expect([...n.placementOf.keys()].sort()).toEqual(pieces.map(pieceId).sort());
      const bySheet = new Map<number, { id: string; x: number; y: number; w: number; l: number; t: number }[]>();
      for (const p of pieces) {
        const pl = n.placementOf.get(pieceId(p))!;
        const sheet = n.sheetOf.get(pieceId(p))!;
        // analytic: inside the sheet
        expect(pl.x).toBeGreaterThanOrEqual(-1e-9);
        expect(pl.y).toBeGreaterThanOrEqual(-1e-9);
        expect(pl.x + pl.widthMm).toBeLessThanOrEqual(1220 + 1e-6);
        expect(pl.y + pl.lengthMm).toBeLessThanOrEqual(2440 + 1e-6);
        // the placed size is the piece's, turned or not
        expect([pl.widthMm, pl.lengthMm].sort()).toEqual([p.widthMm, p.heightMm].sort());
        if (p.grain === 'z') expect(pl.rotated).toBe(false);
        bySheet.set(sheet, [...(bySheet.get(sheet) ?? []), { id: pieceId(p), x: pl.x, y: pl.y, w: pl.widthMm, l: pl.lengthMm, t: p.plyThicknessMm }]);
      }
      for (const list of bySheet.values()) {
        expect(new Set(list.map((q) => q.t)).size).toBe(1);
        for (let i = 0; i < list.length; i++) {
          for (let j = i + 1; j < list.length; j++) {
            const a = list[i]!;
            const b = list[j]!;
            // analytic: boxes apart by at least the kerf along one axis (so they do not overlap)
            const gap = Math.max(b.x - (a.x + a.w), a.x - (b.x + b.w), b.y - (a.y + a.l), a.y - (b.y + b.l));
            expect(gap, `${a.id} and ${b.id}`).toBeGreaterThanOrEqual(kerf - 1e-6);
          }
        }
      }
    });
  }
});

describe('cutListCsv read back with papaparse', { timeout: 120000 }, () => {
  it('has one row per piece with its sheet', () => {
    const pieces = cutListPiecesFixture();
    const n = cutListNesting(pieces);
    const parsed = Papa.parse<Record<string, string>>(cutListCsv(pieces, n, options).toString('utf8'), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toHaveLength(pieces.length);
    const sheets = n.groups.reduce((s, g) => s + g.nesting.sheets.length, 0);
    for (const row of parsed.data) {
      expect(Number(row.sheet)).toBeGreaterThanOrEqual(1);
      expect(Number(row.sheet)).toBeLessThanOrEqual(sheets);
    }
    expect(Number(parsed.data[0]!.width_mm)).toBeCloseTo(pieces[0]!.widthMm, 0);
  });
});

describe('cutListPdf read back with pdfjs-dist', { timeout: 120000 }, () => {
  it('has the table, the totals and one layout page per sheet', async () => {
    const pieces = cutListPiecesFixture();
    const n = cutListNesting(pieces);
    const sheets = n.groups.reduce((s, g) => s + g.nesting.sheets.length, 0);
    const pages = await pdfRead(await cutListPdf(pieces, options));
    const texts = pages.map((p) => p.texts.map((t) => t.str).join(' '));
    const layouts = texts.filter((t) => /^Sheet \d+: /.test(t.trim()));
    expect(layouts).toHaveLength(sheets);
    const all = texts.join(' ');
    // the totals passed in, as written: 2350 ml = 2.35 litres; 41.5 m of tape
    expect(all).toContain('about 2.35 litres');
    expect(all).toContain('about 41.5 m');
    expect(all).toContain(`9 mm ply: ${n.groups[0]!.nesting.sheets.length} sheet`);
    expect(all).toContain('does not certify scantlings');
    for (const p of pieces) expect(all).toContain(p.partName);
  });
});
