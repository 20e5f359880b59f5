import { beforeAll, describe, expect, it } from 'vitest';
import { tiledPdf, tiledPdfStream } from '../../server/exports/tiled-pdf';
import { type TemplateDrawing, drawingAsSeen } from '../../shared/geometry/drawing';
import type { Bounds } from '../../shared/geometry/polygon';
import { PAPER_A3, PAPER_A4, PAPER_LETTER, PAPER_TABLOID, type PaperSize, type TilingOptions, paperCustom } from '../../shared/geometry/tiling';
import type { SectionPoint } from '../../shared/geometry/types';
import { rectangleDrawing, ringFrameDrawing } from './exports-fixtures';
import { ensurePdftoppm, isBlack, isSquareBlue, isSquareGreen, pdfRead, pdfRender, peakCentre, pixelBox, profile, type Rgb } from './exports-render';

const DPI = 300;
/** Pixels to millimetres at 300 dpi (1 in = 25.4 mm, NIST SP 811): 100 mm = 1181.1 px. */
const mmOf = (px: number): number => (px * 25.4) / DPI;
const pxOf = (mm: number): number => (mm * DPI) / 25.4;
const PT = 72 / 25.4;

beforeAll(() => ensurePdftoppm(), 120000);

/**
 * The tile grid worked out here, apart from shared/geometry/tiling.ts: the fewest windows of the
 * printable size (paper less the margin all round) that, a step of printable-less-overlap apart, span the
 * padded extents, centred on them. Counted by adding windows until they reach, not by its formula.
 */
function gridHere(ext: Bounds, paper: PaperSize, orientation: 'portrait' | 'landscape', margin: number, overlap: number, pad: number) {
  const [pageW, pageH] = orientation === 'portrait' ? [paper.widthMm, paper.heightMm] : [paper.heightMm, paper.widthMm];
  const pw = pageW - 2 * margin;
  const ph = pageH - 2 * margin;
  const W = ext.maxY - ext.minY + 2 * pad;
  const H = ext.maxZ - ext.minZ + 2 * pad;
  let cols = 1;
  while (cols * (pw - overlap) + overlap < W - 1e-9) cols++;
  let rows = 1;
  while (rows * (ph - overlap) + overlap < H - 1e-9) rows++;
  const gw = cols * (pw - overlap) + overlap;
  const gh = rows * (ph - overlap) + overlap;
  const left = (ext.minY + ext.maxY) / 2 - gw / 2;
  const top = (ext.minZ + ext.maxZ) / 2 + gh / 2;
  const windows: { name: string; w: Bounds }[] = [];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      const minY = left + c * (pw - overlap);
      const maxZ = top - r * (ph - overlap);
      windows.push({ name: `${String.fromCharCode(65 + c)}${r + 1}`, w: { minY, maxY: minY + pw, maxZ, minZ: maxZ - ph } });
    }
  }
  return { cols, rows, pw, ph, pageW, pageH, windows };
}

/** Points every `step` mm along every line of the drawing, bulged segments on their arcs (Autodesk DXF Reference, bulge = tan(angle / 4)). */
function samples(d: TemplateDrawing, step = 0.2): SectionPoint[] {
  const out: SectionPoint[] = [];
  const seg = (a: SectionPoint, b: SectionPoint, bulge: number): void => {
    const c = Math.hypot(b.y - a.y, b.z - a.z);
    if (!bulge) {
      const n = Math.max(1, Math.ceil(c / step));
      for (let i = 0; i <= n; i++) out.push({ y: a.y + ((b.y - a.y) * i) / n, z: a.z + ((b.z - a.z) * i) / n });
      return;
    }
    const theta = 4 * Math.atan(bulge);
    const r = c / (2 * Math.sin(Math.abs(theta) / 2));
    const mid = { y: (a.y + b.y) / 2, z: (a.z + b.z) / 2 };
    const h = Math.sqrt(Math.max(0, r * r - (c / 2) ** 2)) * Math.sign(bulge) * (Math.abs(theta) > Math.PI ? -1 : 1);
    const centre = { y: mid.y - ((b.z - a.z) / c) * h, z: mid.z + ((b.y - a.y) / c) * h };
    const a0 = Math.atan2(a.z - centre.z, a.y - centre.y);
    const n = Math.max(1, Math.ceil((r * Math.abs(theta)) / step));
    for (let i = 0; i <= n; i++) out.push({ y: centre.y + r * Math.cos(a0 + (theta * i) / n), z: centre.z + r * Math.sin(a0 + (theta * i) / n) });
  };
  for (const p of d.paths) {
    if (p.kind !== 'polyline') throw new Error('fixture has polylines only');
    const n = p.points.length;
    for (let i = 0; i < (p.closed ? n : n - 1); i++) seg(p.points[i]!, p.points[(i + 1) % n]!, p.bulges?.[i] ?? 0);
  }
  if (d.checkDimension) seg(d.checkDimension.from, d.checkDimension.to, 0);
  for (const c of d.centres) out.push(c.at);
  return out;
}

const inside = (p: SectionPoint, w: Bounds): boolean => p.y >= w.minY && p.y <= w.maxY && p.z >= w.minZ && p.z <= w.maxZ;

/** The sheet's name on each page: the largest text of the form letters-and-number (the name in the check square). */
function sheetNames(pages: Awaited<ReturnType<typeof pdfRead>>): string[] {
  return pages.slice(1).map((p) => {
    const names = p.texts.filter((t) => /^[A-Z]+\d+$/.test(t.str.trim())).sort((a, b) => b.heightPt - a.heightPt);
    return names[0]?.str.trim() ?? '?';
  });
}

/** A page's text, each run of white space as one space: where a paragraph's lines break depends on the font's widths, not on the words checked. */
const pageText = (p: { texts: { str: string }[] }): string => p.texts.map((t) => t.str).join(' ').replace(/\s+/g, ' ');

describe('tiledPdf page sizes read back with pdfjs-dist', { timeout: 120000 }, () => {
  const cases: [string, PaperSize, 'portrait' | 'landscape', number, number][] = [
    // ISO 216 (A4 210 x 297 mm = 595.28 x 841.89 pt; A3 297 x 420 mm = 841.89 x 1190.55 pt); ANSI/ASME Y14.1 (Letter 612 x 792, Tabloid 792 x 1224 pt)
    ['A4 portrait', PAPER_A4, 'portrait', 595.28, 841.89],
    ['A4 landscape', PAPER_A4, 'landscape', 841.89, 595.28],
    ['A3 portrait', PAPER_A3, 'portrait', 841.89, 1190.55],
    ['US Letter portrait', PAPER_LETTER, 'portrait', 612, 792],
    ['Tabloid landscape', PAPER_TABLOID, 'landscape', 1224, 792],
    // analytic: 250 x 350 mm at 72 / 25.4 pt per mm (ISO 32000-1, 8.3.2)
    ['custom 250 x 350', paperCustom(250, 350), 'portrait', 250 * PT, 350 * PT],
  ];
  for (const [label, paper, orientation, w, h] of cases) {
    it(`makes every page ${label}`, async () => {
      const pages = await pdfRead(await tiledPdf(rectangleDrawing(150, 100), { paper, orientation }));
      expect(pages.length).toBeGreaterThanOrEqual(2);
      for (const p of pages) {
        expect(Math.abs(p.widthPt - w)).toBeLessThan(0.01);
        expect(Math.abs(p.heightPt - h)).toBeLessThan(0.01);
      }
    });
  }
});

describe('tiledPdf sheets against a grid worked out independently', { timeout: 120000 }, () => {
  const opts: TilingOptions = { paper: PAPER_A4, orientation: 'portrait', marginMm: 6.35, overlapMm: 15, paddingMm: 5 };
  const cases: [string, TilingOptions, 'empty' | 'reference-only'][] = [
    ['A4 portrait', opts, 'empty'],
    ['A3 landscape', { ...opts, paper: PAPER_A3, orientation: 'landscape', overlapMm: 20 }, 'empty'],
    ['A4, reference-only tiles left out', { ...opts, leaveOut: 'reference-only' }, 'reference-only'],
  ];
  for (const [label, o, leaveOut] of cases) {
    it(`prints one page per sheet with a line on it, named as on the grid, covering the whole part (${label})`, async () => {
      const d = ringFrameDrawing();
      const seen = drawingAsSeen(d);
      const pts = samples(seen);
      const counted = leaveOut === 'empty' ? pts : samples({ ...seen, paths: seen.paths.filter((p) => !['centreline', 'level-line', 'waterline', 'set-up-line'].includes(p.role)) });
      const ext = pts.reduce((b, p) => ({ minY: Math.min(b.minY, p.y), maxY: Math.max(b.maxY, p.y), minZ: Math.min(b.minZ, p.z), maxZ: Math.max(b.maxZ, p.z) }), { minY: Infinity, maxY: -Infinity, minZ: Infinity, maxZ: -Infinity });
      const g = gridHere(ext, o.paper, o.orientation, o.marginMm!, o.overlapMm!, o.paddingMm!);
      // A sheet is printed when any sampled point of a line lies on it.
      const expected = g.windows.filter((w) => counted.some((p) => inside(p, w.w)));
      const pages = await pdfRead(await tiledPdf(d, o));
      // one assembly map, then the printed sheets in grid order
      expect(pages).toHaveLength(1 + expected.length);
      expect(sheetNames(pages)).toEqual(expected.map((w) => w.name));
      // leaving out reference-only sheets prints fewer than the sheets some line crosses
      if (leaveOut === 'reference-only') expect(expected.length).toBeLessThan(g.windows.filter((w) => pts.some((p) => inside(p, w.w))).length);
      // the printed sheets between them hold every point of every line that counts (union covers the part)
      for (const p of counted) expect(expected.some((w) => inside(p, w.w))).toBe(true);
      pages.slice(1).forEach((p, i) => expect(pageText(p)).toContain(`sheet ${i + 1} of ${expected.length}`));
    });
  }

  it('puts the title, the check words and the cautions on the pages', async () => {
    const pages = await pdfRead(await tiledPdf(ringFrameDrawing(), { paper: PAPER_A3, orientation: 'landscape' }));
    const first = pageText(pages[0]!);
    for (const words of ['PRINT AT ACTUAL SIZE (100 %)', 'push sticks', 'eye and hearing protection', 'ISO 12215', 'does not certify scantlings', 'Epoxy']) expect(first).toContain(words);
    for (const p of pages.slice(1)) {
      const t = pageText(p);
      for (const words of ['Measure this square: it must be exactly 100 mm.', "not 'fit to page'", 'Test hull "Petrel" 5.8 m', 'Frame 4 (ring frame), station 4', 'Layer 1 of 2, 9 mm ply', 'AFT face', 'Revision r12, 2025-03-02']) expect(t).toContain(words);
    }
  });

  it('streams the same pages and reports progress to the end', async () => {
    const d = ringFrameDrawing({ halfBreadthMm: 300, depthMm: 250 });
    const seen: [number, number][] = [];
    const stream = tiledPdfStream(d, opts, (done, total) => seen.push([done, total]));
    const chunks: Buffer[] = [];
    for await (const c of stream) chunks.push(c as Buffer);
    const streamed = await pdfRead(Buffer.concat(chunks));
    const whole = await pdfRead(await tiledPdf(d, opts));
    expect(streamed).toHaveLength(whole.length);
    expect(seen[seen.length - 1]).toEqual([whole.length, whole.length]);
    expect(seen.map((s) => s[0])).toEqual(whole.map((_, i) => i + 1));
  });
});

describe('tiledPdf rendered by poppler pdftoppm at 300 dpi', { timeout: 120000 }, () => {
  /** Side (mm) of the check square on an image, from the box of its colour: outside edge to outside edge. */
  const squareSide = (img: Rgb, match: (r: number, g: number, b: number) => boolean): { w: number; h: number } => {
    const b = pixelBox(img, match);
    expect(b, 'check square found').not.toBeNull();
    return { w: mmOf(b!.x1 - b!.x0 + 1), h: mmOf(b!.y1 - b!.y0 + 1) };
  };

  it('prints a 100 mm check square on every sheet, measured within 0.2 mm', async () => {
    const buf = await tiledPdf(ringFrameDrawing({ halfBreadthMm: 260, depthMm: 240, ringWidthMm: 50, pointsPerSide: 60 }), { paper: PAPER_A4, orientation: 'portrait' });
    const pages = await pdfRead(buf);
    const images = pdfRender(buf, DPI, { first: 2 });
    expect(images).toHaveLength(pages.length - 1);
    expect(images.length).toBeGreaterThanOrEqual(3);
    for (const img of images) {
      // at 300 dpi, 100 mm = 1181.1 px (1 in = 25.4 mm, NIST SP 811)
      const s = squareSide(img, isSquareBlue);
      expect(Math.abs(s.w - 100)).toBeLessThanOrEqual(0.2);
      expect(Math.abs(s.h - 100)).toBeLessThanOrEqual(0.2);
    }
  });

  it('adds a 4 in square for an inch hull, measured within 0.2 mm', async () => {
    const buf = await tiledPdf(rectangleDrawing(150, 100, { title: { units: 'in' } }), { paper: PAPER_LETTER, orientation: 'portrait' });
    const [img] = pdfRender(buf, DPI, { first: 2, last: 2 });
    const mm = squareSide(img!, isSquareBlue);
    const inch = squareSide(img!, isSquareGreen);
    expect(Math.abs(mm.w - 100)).toBeLessThanOrEqual(0.2);
    expect(Math.abs(mm.h - 100)).toBeLessThanOrEqual(0.2);
    // NIST SP 811: 4 in = 101.6 mm
    expect(Math.abs(inch.w - 101.6)).toBeLessThanOrEqual(0.2);
    expect(Math.abs(inch.h - 101.6)).toBeLessThanOrEqual(0.2);
  });

  it('overlaps neighbouring sheets by the overlap chosen and draws the part at full size', async () => {
    // analytic: on A4 portrait, 6.35 mm margin, 15 mm overlap and 5 mm padding, a 300 x 400 mm rectangle takes
    // 2 x 2 sheets (310 in 197.3 + 182.3, 410 in 284.3 + 269.3), with its centreline and the level line at
    // mid-height inside the middle overlaps.
    const overlap = 15;
    const margin = 6.35;
    const buf = await tiledPdf(rectangleDrawing(300, 400, { lines: true }), { paper: PAPER_A4, orientation: 'portrait', marginMm: margin, overlapMm: overlap, paddingMm: 5 });
    const pages = await pdfRead(buf);
    expect(sheetNames(pages)).toEqual(['A1', 'B1', 'A2', 'B2']);
    const [a1, b1, a2] = pdfRender(buf, DPI, { first: 2, last: 4 });
    const grey = (r: number, g: number, b: number): boolean => r > 120 && r < 190 && Math.abs(r - g) < 12 && Math.abs(r - b) < 12;
    const colsBlack = (img: Rgb) => profile(img, 'columns', isBlack);
    const rowsBlack = (img: Rgb) => profile(img, 'rows', isBlack);
    const near = (p: Int32Array, mm: number, min = 500) => peakCentre(p, Math.round(pxOf(mm - 8)), Math.round(pxOf(mm + 8)), min);
    const W = 210;
    const H = 297;
    // The printable edges as printed: the grey trim border, measured.
    const edges = (img: Rgb) => {
      const c = profile(img, 'columns', grey);
      const r = profile(img, 'rows', grey);
      return { left: mmOf(near(c, margin, 300)!), right: mmOf(near(c, W - margin, 300)!), top: mmOf(near(r, margin, 300)!), bottom: mmOf(near(r, H - margin, 300)!) };
    };
    const eA1 = edges(a1!);
    const eB1 = edges(b1!);
    const eA2 = edges(a2!);
    // The centreline (y = 0) on A1 (near its right edge) and on B1 (near its left edge); the level line on A1 and A2.
    const gw = 2 * (W - 2 * margin - overlap) + overlap;
    const gh = 2 * (H - 2 * margin - overlap) + overlap;
    const clA1 = mmOf(near(colsBlack(a1!), margin + gw / 2)!);
    const clB1 = mmOf(near(colsBlack(b1!), margin + gw / 2 - (W - 2 * margin - overlap))!);
    const llA1 = mmOf(near(rowsBlack(a1!), margin + gh / 2)!);
    const llA2 = mmOf(near(rowsBlack(a2!), margin + gh / 2 - (H - 2 * margin - overlap))!);
    // Overlap = what A1 shows right of the centreline plus what B1 shows left of it (analytic).
    expect(Math.abs(eA1.right - clA1 + (clB1 - eB1.left) - overlap)).toBeLessThanOrEqual(0.2);
    expect(Math.abs(eA1.bottom - llA1 + (llA2 - eA2.top) - overlap)).toBeLessThanOrEqual(0.2);
    // Full size: the rectangle's left edge (y = -150) and its top (z = 400) where the grid puts them on A1 ...
    const leftEdge = mmOf(near(colsBlack(a1!), margin + gw / 2 - 150)!);
    const topEdge = mmOf(near(rowsBlack(a1!), margin + (gh / 2 - 200))!);
    expect(Math.abs(leftEdge - (eA1.left + gw / 2 - 150))).toBeLessThanOrEqual(0.2);
    expect(Math.abs(topEdge - (eA1.top + gh / 2 - 200))).toBeLessThanOrEqual(0.2);
    // ... and its width across two sheets: 300 mm from the left edge on A1 to the right edge on B1.
    const rightEdgeB1 = mmOf(near(colsBlack(b1!), eB1.left + (gw / 2 - (W - 2 * margin - overlap)) + 150)!);
    expect(Math.abs(clA1 - leftEdge + (rightEdgeB1 - clB1) - 300)).toBeLessThanOrEqual(0.2);
  });
});
