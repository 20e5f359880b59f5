import { describe, expect, it } from 'vitest';
import { nestingOnSheets } from '../../shared/geometry/nesting';
import {
  type SheetLayout,
  type SheetLayoutPiece,
  sheetBoxGap,
  sheetGrainAllows,
  sheetLayoutIssues,
  sheetLayoutMoveIssues,
  sheetLayoutNewSheetFor,
  sheetLayoutTidied,
  sheetLayoutWith,
  sheetPieceBox,
} from '../../shared/geometry/sheet-layout';

// Two pieces of 6 mm ply on one 1220 x 2440 mm sheet (common practice size), kerf 3 mm.
const pieces: SheetLayoutPiece[] = [
  { id: 'a', widthMm: 400, heightMm: 300, plyThicknessMm: 6, grain: null },
  { id: 'b', widthMm: 200, heightMm: 100, plyThicknessMm: 6, grain: 'z' },
];
const layout = (placements: SheetLayout['placements'], extra: Partial<SheetLayout> = {}): SheetLayout => ({
  sheet: { widthMm: 1220, lengthMm: 2440 },
  kerfMm: 3,
  edgeMarginMm: 0,
  sheets: [{ sheetNo: 1, plyThicknessMm: 6 }, { sheetNo: 2, plyThicknessMm: 6 }],
  placements,
  ...extra,
});
const at = (pieceId: string, x: number, y: number, rotated = false, sheetNo = 1) => ({ pieceId, sheetNo, x, y, rotated });
const codes = (l: SheetLayout) => sheetLayoutIssues(l, pieces).map((i) => i.code);

describe('sheetPieceBox', () => {
  it('swaps across and along for a quarter turn', () => {
    // analytic: a 400 x 300 box at (10, 20) covers x 10..410, y 20..320; turned, x 10..310, y 20..420
    expect(sheetPieceBox(pieces[0]!, at('a', 10, 20))).toEqual({ x0: 10, y0: 20, x1: 410, y1: 320 });
    expect(sheetPieceBox(pieces[0]!, at('a', 10, 20, true))).toEqual({ x0: 10, y0: 20, x1: 310, y1: 420 });
  });
});

describe('sheetBoxGap', () => {
  it('is the clear distance in the direction the boxes are apart, negative for an overlap', () => {
    // analytic: side by side 5 mm apart; one above the other 7 mm apart; overlapping by 10 x 20 mm (the smaller overlap counts)
    expect(sheetBoxGap({ x0: 0, y0: 0, x1: 100, y1: 100 }, { x0: 105, y0: 50, x1: 200, y1: 150 })).toBe(5);
    expect(sheetBoxGap({ x0: 0, y0: 0, x1: 100, y1: 100 }, { x0: 50, y0: 107, x1: 80, y1: 150 })).toBe(7);
    expect(sheetBoxGap({ x0: 0, y0: 0, x1: 100, y1: 100 }, { x0: 90, y0: 80, x1: 200, y1: 200 })).toBe(-10);
  });
});

describe('sheetGrainAllows', () => {
  it('keeps a grain along the sheet', () => {
    // analytic: grain z (up the drawing) lies along the sheet untouched; grain y needs the quarter turn; null either
    expect([sheetGrainAllows({ grain: 'z' }, false), sheetGrainAllows({ grain: 'z' }, true)]).toEqual([true, false]);
    expect([sheetGrainAllows({ grain: 'y' }, false), sheetGrainAllows({ grain: 'y' }, true)]).toEqual([false, true]);
    expect([sheetGrainAllows({ grain: null }, false), sheetGrainAllows({ grain: null }, true)]).toEqual([true, true]);
  });
});

describe('sheetLayoutIssues', () => {
  it('accepts pieces exactly a kerf apart and touching the sheet edges', () => {
    // analytic: a spans x 0..400; b at x 403 is 3 mm (the kerf) clear; b's top at 2440 is on the edge
    expect(codes(layout([at('a', 0, 0), at('b', 403, 2340)]))).toEqual([]);
  });

  it('refuses pieces nearer than the kerf, and overlapping pieces, naming both', () => {
    // analytic: b at x 402 is 2 mm from a; at x 300 it overlaps a by 100 mm
    const near = sheetLayoutIssues(layout([at('a', 0, 0), at('b', 402, 0)]), pieces);
    expect(near).toHaveLength(1);
    expect(near[0]).toMatchObject({ code: 'layout-clash', field: 'placements.1', pieceId: 'b', otherPieceId: 'a' });
    expect(near[0]!.message).toContain('only 2 mm from');
    const over = sheetLayoutIssues(layout([at('a', 0, 0), at('b', 300, 0)]), pieces);
    expect(over[0]!.message).toContain('overlaps');
  });

  it('lets pieces on different sheets share a place', () => {
    // analytic: same position, sheets 1 and 2
    expect(codes(layout([at('a', 0, 0), at('b', 0, 0, false, 2)]))).toEqual([]);
  });

  it('refuses a box past the edge or inside the edge margin, saying by how much', () => {
    // analytic: a at x 830 reaches 1230, 10 mm past a 1220 mm sheet; with a 5 mm margin, x 0 is 5 mm inside it
    const off = sheetLayoutIssues(layout([at('a', 830, 0), at('b', 0, 1000)]), pieces);
    expect(off.map((i) => i.code)).toEqual(['layout-off-sheet']);
    expect(off[0]!.message).toContain('10 mm past the edge');
    expect(codes(layout([at('a', 0, 500), at('b', 500, 1000)], { edgeMarginMm: 5 }))).toEqual(['layout-off-sheet']);
  });

  it('refuses turning a piece whose grain must run along the sheet', () => {
    expect(codes(layout([at('a', 0, 0), at('b', 600, 0, true)]))).toEqual(['layout-grain']);
  });

  it('refuses a piece left out, placed twice, unknown, or on a missing sheet or one of other ply', () => {
    expect(codes(layout([at('a', 0, 0)]))).toEqual(['layout-piece-missing']);
    expect(codes(layout([at('a', 0, 0), at('b', 600, 0), at('a', 0, 1000)]))).toEqual(['layout-piece-twice']);
    expect(codes(layout([at('a', 0, 0), at('b', 600, 0), at('c', 0, 1000)]))).toEqual(['layout-unknown-piece']);
    expect(codes(layout([at('a', 0, 0), at('b', 600, 0, false, 3)]))).toEqual(['layout-no-sheet']);
    const mixed = layout([at('a', 0, 0), at('b', 600, 0, false, 2)], { sheets: [{ sheetNo: 1, plyThicknessMm: 6 }, { sheetNo: 2, plyThicknessMm: 9 }] });
    expect(codes(mixed)).toEqual(['layout-wrong-ply']);
  });

  it('passes the arrangement the packer makes (maxrects-packer read back with the same rules)', () => {
    // reference library: maxrects-packer places boxes at least its padding (the kerf) apart, inside the bin
    const many: SheetLayoutPiece[] = Array.from({ length: 14 }, (_, i) => ({ id: `p${i}`, widthMm: 250 + 37 * i, heightMm: 180 + 23 * (i % 5), plyThicknessMm: 9, grain: null }));
    const n = nestingOnSheets(many, { kerfMm: 4 });
    const auto: SheetLayout = {
      sheet: n.sheet,
      kerfMm: 4,
      edgeMarginMm: 0,
      sheets: n.sheets.map((s) => ({ sheetNo: s.index + 1, plyThicknessMm: 9 })),
      placements: n.sheets.flatMap((s) => s.placements.map((p) => ({ pieceId: p.id, sheetNo: s.index + 1, x: p.x, y: p.y, rotated: p.rotated }))),
    };
    expect(sheetLayoutIssues(auto, many)).toEqual([]);
  });
});

describe('sheetLayoutMoveIssues', () => {
  it('reports only what concerns the moved piece', () => {
    // a already off the sheet; moving b onto a clear place reports nothing, moving it onto a reports the clash
    const l = layout([at('a', 1000, 0), at('b', 0, 1000)]);
    expect(sheetLayoutMoveIssues(l, pieces, at('b', 0, 2000))).toEqual([]);
    expect(sheetLayoutMoveIssues(l, pieces, at('b', 1000, 100)).map((i) => i.code)).toEqual(['layout-clash']);
  });
});

describe('sheetLayoutTidied', () => {
  it('drops empty sheets and numbers the rest from 1, thinnest ply first', () => {
    const l = layout([at('a', 0, 0, false, 3), at('b', 0, 0, false, 1)], {
      sheets: [{ sheetNo: 1, plyThicknessMm: 9 }, { sheetNo: 2, plyThicknessMm: 6 }, { sheetNo: 3, plyThicknessMm: 6 }],
    });
    const t = sheetLayoutTidied(l);
    expect(t.sheets).toEqual([{ sheetNo: 1, plyThicknessMm: 6 }, { sheetNo: 2, plyThicknessMm: 9 }]);
    expect(t.placements.map((p) => [p.pieceId, p.sheetNo])).toEqual([['a', 1], ['b', 2]]);
  });
});

describe('sheetLayoutNewSheetFor', () => {
  it('adds a sheet of the piece’s ply after the last and puts the piece in its corner inside the edge margin', () => {
    // Analytic case: both pieces on sheet 1 of two; b goes to a new sheet 3 at the 10 mm margin corner.
    const l = layout([at('a', 10, 10), at('b', 500, 10)], { edgeMarginMm: 10 });
    const { layout: grown, placement } = sheetLayoutNewSheetFor(l, pieces[1]!, false);
    expect(grown.sheets).toEqual([...l.sheets, { sheetNo: 3, plyThicknessMm: 6 }]);
    expect(placement).toEqual({ pieceId: 'b', sheetNo: 3, x: 10, y: 10, rotated: false });
    expect(sheetLayoutMoveIssues(grown, pieces, placement)).toEqual([]);
    const moved = sheetLayoutWith(grown, placement);
    expect(sheetLayoutIssues(moved, pieces)).toEqual([]);
    // Saved, the empty sheet 2 goes and the new one becomes sheet 2.
    expect(sheetLayoutTidied(moved).placements.map((p) => [p.pieceId, p.sheetNo])).toEqual([['a', 1], ['b', 2]]);
  });

  it('keeps the grain rule: a piece whose grain needs the turn is refused unturned on the new sheet', () => {
    const grainAcross: SheetLayoutPiece = { id: 'c', widthMm: 300, heightMm: 200, plyThicknessMm: 6, grain: 'y' };
    const l = layout([at('a', 0, 0), at('b', 500, 0), at('c', 0, 400, true)]);
    const { layout: grown, placement } = sheetLayoutNewSheetFor(l, grainAcross, false);
    expect(sheetLayoutMoveIssues(grown, [...pieces, grainAcross], placement).map((i) => i.code)).toEqual(['layout-grain']);
  });
});
