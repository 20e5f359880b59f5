import { beforeAll, describe, expect, it } from 'vitest';
import { PDF_MAX_PAGE_MM, rollPdf, rollPdfPlan } from '../../server/exports/roll-pdf';
import { GeometryInputError } from '../../shared/geometry/types';
import { rectangleDrawing, ringFrameDrawing } from './exports-fixtures';
import { ensurePdftoppm, isSquareBlue, pdfRead, pdfRender, pixelBox } from './exports-render';

const PT = 72 / 25.4;
beforeAll(() => ensurePdftoppm(), 120000);

describe('rollPdf read back with pdfjs-dist', { timeout: 120000 }, () => {
  it('makes one page as wide as the roll and as long as the part needs', async () => {
    const d = rectangleDrawing(800, 1200, { lines: true });
    const pages = await pdfRead(await rollPdf(d, { rollWidthMm: 914, marginMm: 10, paddingMm: 5 }));
    expect(pages).toHaveLength(1);
    // analytic: 914 mm wide; long 1200 + 2 x 5 padding + 2 x 10 margin + the 118 mm title band (ISO 32000-1: 1 pt = 1/72 in)
    expect(Math.abs(pages[0]!.widthPt - 914 * PT)).toBeLessThan(0.01);
    expect(Math.abs(pages[0]!.heightPt - (1200 + 10 + 20 + 118) * PT)).toBeLessThan(0.01);
    expect(pages[0]!.texts.map((t) => t.str).join(' ')).toContain('PRINT AT ACTUAL SIZE');
  });

  it('splits a part longer than 200 in into overlapping pages each within the PDF limit', async () => {
    // ISO 32000-1, 8.3.2: a page is at most 14,400 units (200 in = 5080 mm) without UserUnit
    const d = rectangleDrawing(700, 9000);
    const plan = rollPdfPlan(d, { rollWidthMm: 914 });
    const pages = await pdfRead(await rollPdf(d, { rollWidthMm: 914 }));
    expect(pages.length).toBe(2);
    for (const p of pages) expect(p.heightPt).toBeLessThanOrEqual(14400 + 1e-6);
    // analytic: the windows along the roll overlap by the overlap and between them span the part
    const [a, b] = plan.printed.map((t) => t.window);
    expect(a!.minZ - b!.maxZ).toBeCloseTo(-25, 6);
    expect(b!.minZ).toBeLessThanOrEqual(0 - 5 + 1e-6);
    expect(a!.maxZ).toBeGreaterThanOrEqual(9000 + 5 - 1e-6);
    expect(PDF_MAX_PAGE_MM).toBeCloseTo(5080, 9);
  });

  it('turns a part wider than the roll to lie along it', async () => {
    // analytic: 2400 x 150 mm is wider than 610 - 20 but 160 mm fits across: turned, one page
    const plan = rollPdfPlan(rectangleDrawing(2400, 150), { rollWidthMm: 610 });
    expect(plan.turned).toBe(true);
    expect(plan.printed).toHaveLength(1);
    const pages = await pdfRead(await rollPdf(rectangleDrawing(2400, 150), { rollWidthMm: 610 }));
    expect(Math.abs(pages[0]!.widthPt - 610 * PT)).toBeLessThan(0.01);
    expect(Math.abs(pages[0]!.heightPt - (2410 + 20 + 118) * PT)).toBeLessThan(0.01);
    expect(rollPdfPlan(rectangleDrawing(2400, 150), { rollWidthMm: 610, turn: 'never' }).printed.length).toBeGreaterThan(1);
  });

  it('prints the 100 mm check square on the roll, measured on a 300 dpi render within 0.2 mm', async () => {
    const buf = await rollPdf(ringFrameDrawing(), { rollWidthMm: 1067 });
    // Only the title band is rendered (a 1067 mm x 2 m page at 300 dpi would be 700 MB): pdftoppm -x -y -W -H crops it.
    const [img] = pdfRender(buf, 300, { first: 1, last: 1, crop: { x: 0, y: 0, w: 1800, h: 1800 } });
    const box = pixelBox(img!, isSquareBlue)!;
    // at 300 dpi, 100 mm = 1181.1 px (NIST SP 811: 1 in = 25.4 mm)
    expect(Math.abs(((box.x1 - box.x0 + 1) * 25.4) / 300 - 100)).toBeLessThanOrEqual(0.2);
    expect(Math.abs(((box.y1 - box.y0 + 1) * 25.4) / 300 - 100)).toBeLessThanOrEqual(0.2);
  });

  it('refuses a roll too narrow for the title band and a page past the PDF limit', () => {
    expect(() => rollPdfPlan(rectangleDrawing(100, 100), { rollWidthMm: 250 })).toThrow(GeometryInputError);
    expect(() => rollPdfPlan(rectangleDrawing(100, 100), { rollWidthMm: 914, maxPageLengthMm: 6000 })).toThrow(/5080/);
  });
});
