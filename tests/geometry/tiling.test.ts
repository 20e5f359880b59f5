import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  PAPER_A3,
  PAPER_A4,
  PAPER_LETTER,
  PAPER_TABLOID,
  pageSizeMm,
  paperCustom,
  segmentMeetsBox,
  tileColumnLetters,
  tileGrid,
  tileHasContent,
  tileName,
  tilesWithContent,
  TILED_INTRO_PAGES,
  tiledPrintPageCount,
  tiledPrintPlan,
} from '../../shared/geometry/tiling';
import type { TemplateDrawing } from '../../shared/geometry/drawing';
import { GeometryInputError } from '../../shared/geometry/types';

const PT_PER_MM = 72 / 25.4;
const box = (minY: number, minZ: number, maxY: number, maxZ: number) => ({ minY, minZ, maxY, maxZ });
const lines = (paths: TemplateDrawing['paths']): Pick<TemplateDrawing, 'paths' | 'checkDimension' | 'centres'> => ({ paths, checkDimension: null, centres: [] });

describe('paper sizes', () => {
  it('are the published sizes', () => {
    // ISO 216: A4 210 x 297 mm = 595.28 x 841.89 pt, A3 297 x 420 mm = 841.89 x 1190.55 pt (1 pt = 1/72 in, ISO 32000-1 8.3.2)
    expect(PAPER_A4.widthMm * PT_PER_MM).toBeCloseTo(595.28, 2);
    expect(PAPER_A4.heightMm * PT_PER_MM).toBeCloseTo(841.89, 2);
    expect(PAPER_A3.widthMm * PT_PER_MM).toBeCloseTo(841.89, 2);
    expect(PAPER_A3.heightMm * PT_PER_MM).toBeCloseTo(1190.55, 2);
    // ANSI/ASME Y14.1: US Letter 612 x 792 pt, Tabloid 792 x 1224 pt
    expect(PAPER_LETTER.widthMm * PT_PER_MM).toBeCloseTo(612, 9);
    expect(PAPER_LETTER.heightMm * PT_PER_MM).toBeCloseTo(792, 9);
    expect(PAPER_TABLOID.widthMm * PT_PER_MM).toBeCloseTo(792, 9);
    expect(PAPER_TABLOID.heightMm * PT_PER_MM).toBeCloseTo(1224, 9);
  });

  it('turns for landscape and stores a custom size portrait', () => {
    // analytic
    expect(pageSizeMm(PAPER_A4, 'landscape')).toEqual({ widthMm: 297, heightMm: 210 });
    expect(paperCustom(500, 300)).toMatchObject({ widthMm: 300, heightMm: 500 });
  });
});

describe('tileName', () => {
  it('letters the columns from the left and numbers the rows from the top', () => {
    // analytic (spreadsheet convention): column 2 row 3 is B3; after Z comes AA
    expect(tileName(2, 1)).toBe('B3');
    expect(tileName(0, 0)).toBe('A1');
    expect(tileColumnLetters(25)).toBe('Z');
    expect(tileColumnLetters(26)).toBe('AA');
    expect(tileColumnLetters(27 * 26 - 1)).toBe('ZZ');
  });
});

describe('tileGrid', () => {
  it('lays the fewest windows that cover the extents, a step of printable less overlap apart', () => {
    // analytic: A4 portrait, 5 mm margin: printable 200 x 287; overlap 10: step 190 x 277.
    // 1000 x 600 mm: columns ceil(990 / 190) = 6, rows ceil(590 / 277) = 3.
    const g = tileGrid(box(-500, 0, 500, 600), { paper: PAPER_A4, orientation: 'portrait', marginMm: 5, overlapMm: 10, paddingMm: 0 });
    expect([g.cols, g.rows]).toEqual([6, 3]);
    expect([g.printableWidthMm, g.printableHeightMm, g.stepYMm, g.stepZMm]).toEqual([200, 287, 190, 277]);
    expect(g.tiles.map((t) => t.name).slice(0, 7)).toEqual(['A1', 'B1', 'C1', 'D1', 'E1', 'F1', 'A2']);
    for (const t of g.tiles) {
      expect(t.window.maxY - t.window.minY).toBeCloseTo(200, 9);
      expect(t.window.maxZ - t.window.minZ).toBeCloseTo(287, 9);
    }
    // neighbours share exactly the overlap (analytic)
    const at = (r: number, c: number) => g.tiles[r * g.cols + c]!.window;
    expect(at(0, 0).maxY - at(0, 1).minY).toBeCloseTo(10, 9);
    expect(at(0, 0).minZ - at(1, 0).maxZ).toBeCloseTo(-10, 9);
    // the grid is centred on the extents (analytic: 6 x 190 + 10 = 1150 wide, 3 x 277 + 10 = 841 high)
    expect(g.covered).toEqual({ minY: -575, maxY: 575, minZ: 300 - 420.5, maxZ: 300 + 420.5 });
    expect(g.tiles[1]!.neighbours).toEqual({ left: 'A1', right: 'C1', above: null, below: 'B2' });
  });

  it('gives exactly n windows to extents that fill n, not n + 1', () => {
    // analytic: 3 x 190 + 10 = 580 mm wide fills three A4 windows to the millimetre
    const g = tileGrid(box(0, 0, 580, 100), { paper: PAPER_A4, orientation: 'portrait', marginMm: 5, overlapMm: 10, paddingMm: 0 });
    expect(g.cols).toBe(3);
    const h = tileGrid(box(0, 0, 580.01, 100), { paper: PAPER_A4, orientation: 'portrait', marginMm: 5, overlapMm: 10, paddingMm: 0 });
    expect(h.cols).toBe(4);
  });

  it('covers any extents with neighbours overlapping by the overlap, and no fewer windows would do', () => {
    fc.assert(
      fc.property(
        fc.record({ y: fc.double({ min: -3000, max: 3000, noNaN: true }), z: fc.double({ min: -3000, max: 3000, noNaN: true }), w: fc.double({ min: 0, max: 4000, noNaN: true }), h: fc.double({ min: 0, max: 3000, noNaN: true }) }),
        fc.constantFrom(PAPER_A4, PAPER_A3, PAPER_LETTER, PAPER_TABLOID),
        fc.constantFrom('portrait' as const, 'landscape' as const),
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.double({ min: 0, max: 40, noNaN: true }),
        (e, paper, orientation, margin, overlap) => {
          const ext = box(e.y, e.z, e.y + e.w, e.z + e.h);
          const g = tileGrid(ext, { paper, orientation, marginMm: margin, overlapMm: overlap, paddingMm: 0 });
          const eps = 1e-6;
          // union covers the extents (analytic): the covered box contains them and is the union of the windows
          expect(g.covered.minY).toBeLessThanOrEqual(ext.minY + eps);
          expect(g.covered.maxY).toBeGreaterThanOrEqual(ext.maxY - eps);
          expect(g.covered.minZ).toBeLessThanOrEqual(ext.minZ + eps);
          expect(g.covered.maxZ).toBeGreaterThanOrEqual(ext.maxZ - eps);
          for (let r = 0; r < g.rows; r++) {
            for (let c = 0; c < g.cols; c++) {
              const w = g.tiles[r * g.cols + c]!.window;
              if (c + 1 < g.cols) expect(w.maxY - g.tiles[r * g.cols + c + 1]!.window.minY).toBeCloseTo(overlap, 6);
              if (r + 1 < g.rows) expect(g.tiles[(r + 1) * g.cols + c]!.window.maxZ - w.minZ).toBeCloseTo(overlap, 6);
            }
          }
          // minimal (analytic): one column fewer would not reach across
          if (g.cols > 1) expect((g.cols - 1) * g.stepYMm + overlap).toBeLessThan(e.w + eps);
          if (g.rows > 1) expect((g.rows - 1) * g.stepZMm + overlap).toBeLessThan(e.h + eps);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('refuses margins that leave nothing printable and overlaps as wide as half a sheet', () => {
    expect(() => tileGrid(box(0, 0, 10, 10), { paper: PAPER_A4, orientation: 'portrait', marginMm: 105 })).toThrow(GeometryInputError);
    expect(() => tileGrid(box(0, 0, 10, 10), { paper: PAPER_A4, orientation: 'portrait', marginMm: 5, overlapMm: 100 })).toThrow(/overlap/);
  });
});

describe('segmentMeetsBox', () => {
  it('finds a segment crossing, inside, touching or missing the box', () => {
    const b = box(0, 0, 10, 10);
    // analytic
    expect(segmentMeetsBox({ y: -5, z: 5 }, { y: 15, z: 5 }, b)).toBe(true);
    expect(segmentMeetsBox({ y: 2, z: 2 }, { y: 3, z: 3 }, b)).toBe(true);
    expect(segmentMeetsBox({ y: 10, z: -5 }, { y: 10, z: 15 }, b)).toBe(true);
    // passes the corner (0, 10) on the outside: at y = 0 it is at z = 11.06
    expect(segmentMeetsBox({ y: -5, z: 6 }, { y: 4, z: 15.1 }, b)).toBe(false);
    expect(segmentMeetsBox({ y: 11, z: -1 }, { y: 20, z: 20 }, b)).toBe(false);
  });
});

describe('tileHasContent and tilesWithContent', () => {
  it('counts a line in the window, not a loop round it', () => {
    const around = { kind: 'circle' as const, role: 'outer-cut' as const, centre: { y: 0, z: 0 }, radiusMm: 100 };
    // analytic: a 20 mm box at the centre of a 100 mm radius circle has no line in it
    expect(tileHasContent(box(-10, -10, 10, 10), lines([around]))).toBe(false);
    expect(tileHasContent(box(90, -10, 110, 10), lines([around]))).toBe(true);
  });

  it('leaves out tiles crossed only by reference lines when asked', () => {
    const level = { kind: 'polyline' as const, role: 'level-line' as const, closed: false, points: [{ y: -1000, z: 0 }, { y: 1000, z: 0 }] };
    const d = lines([level]);
    expect(tileHasContent(box(-10, -10, 10, 10), d)).toBe(true);
    expect(tileHasContent(box(-10, -10, 10, 10), d, 'reference-only')).toBe(false);
  });

  it('keeps the grid numbering when empty tiles are left out', () => {
    // analytic: a ring (two circles, r 500 and 440) over a 6 x 6 grid of 190 mm steps: the middle tiles are empty
    const ring = lines([
      { kind: 'circle', role: 'outer-cut', centre: { y: 0, z: 0 }, radiusMm: 500 },
      { kind: 'circle', role: 'inner-cut', centre: { y: 0, z: 0 }, radiusMm: 440 },
    ]);
    const g = tileGrid(box(-500, -500, 500, 500), { paper: PAPER_A4, orientation: 'portrait', marginMm: 5, overlapMm: 10, paddingMm: 0 });
    const kept = tilesWithContent(g, ring);
    expect(kept.length).toBeLessThan(g.tiles.length);
    const centre = g.tiles.find((t) => t.window.minY < 0 && t.window.maxY > 0 && t.window.minZ < 0 && t.window.maxZ > 0)!;
    expect(kept.map((t) => t.name)).not.toContain(centre.name);
    // names are those of the full grid (the map matches)
    for (const t of kept) expect(t.name).toBe(tileName(t.row, t.col));
  });
});

describe('tiledPrintPlan', () => {
  it('counts the assembly map and the sheets with something on them, and refuses a paper too small for the check square', () => {
    // analytic: a 150 x 150 mm square outline (one closed cut loop) on A4 portrait with no margin, overlap or padding fits one sheet: 2 pages
    const square = { title: { hullName: 'H', partName: 'Square', partKind: 'bulkhead', stationName: '', layerIndex: 1, layerCount: 1, plyThicknessMm: 6, face: 'aft' as const, revisionId: '1', date: '2025-01-01', units: 'mm' as const, filletClearanceMm: null }, paths: [{ kind: 'polyline' as const, role: 'outer-cut' as const, points: [{ y: 0, z: 0 }, { y: 150, z: 0 }, { y: 150, z: 150 }, { y: 0, z: 150 }], closed: true }], labels: [], bevelMarks: [], centres: [], checkDimension: null };
    const plan = tiledPrintPlan(square, { paper: PAPER_A4, orientation: 'portrait', marginMm: 0, overlapMm: 0, paddingMm: 0 });
    expect(plan.grid.tiles).toHaveLength(1);
    expect(tiledPrintPageCount(plan)).toBe(TILED_INTRO_PAGES + 1);
    // analytic: 120 mm paper less 2 x 6.35 mm margins leaves 107.3 mm, under the 112 mm the check square needs
    expect(() => tiledPrintPlan(square, { paper: paperCustom(120, 120), orientation: 'portrait' })).toThrow(/at least 112 mm/);
  });
});
