import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { type Nesting, type NestingPiece, nestingOnSheets, nestingPiecesOfShapes, nestingPlacedShape } from '../../shared/geometry/nesting';
import { type Shape, polygonBounds, polygonSignedArea, shapeArea } from '../../shared/geometry/polygon';
import { GeometryInputError } from '../../shared/geometry/types';
import { expectClose } from './helpers';

// The packing itself is maxrects-packer's (reference library); these tests check what we promise of its
// output independently: every piece once, inside its sheet, no two closer than the kerf, grain kept.
function checkNesting(n: Nesting, pieces: readonly NestingPiece[], margin = 0): void {
  const placed = n.sheets.flatMap((s) => s.placements.map((p) => ({ ...p, sheet: s.index })));
  expect(placed.map((p) => p.id).sort()).toEqual(pieces.map((p) => p.id).sort());
  const eps = 1e-6;
  for (const p of placed) {
    const piece = pieces.find((q) => q.id === p.id)!;
    // analytic: the placed size is the piece's, turned when rotated
    expect([p.widthMm, p.lengthMm]).toEqual(p.rotated ? [piece.heightMm, piece.widthMm] : [piece.widthMm, piece.heightMm]);
    if (piece.grain === 'z') expect(p.rotated).toBe(false);
    if (piece.grain === 'y') expect(p.rotated).toBe(true);
    expect(p.x).toBeGreaterThanOrEqual(margin - eps);
    expect(p.y).toBeGreaterThanOrEqual(margin - eps);
    expect(p.x + p.widthMm).toBeLessThanOrEqual(n.sheet.widthMm - margin + eps);
    expect(p.y + p.lengthMm).toBeLessThanOrEqual(n.sheet.lengthMm - margin + eps);
  }
  for (let i = 0; i < placed.length; i++) {
    for (let j = i + 1; j < placed.length; j++) {
      const a = placed[i]!;
      const b = placed[j]!;
      if (a.sheet !== b.sheet) continue;
      const gapX = Math.max(b.x - (a.x + a.widthMm), a.x - (b.x + b.widthMm));
      const gapY = Math.max(b.y - (a.y + a.lengthMm), a.y - (b.y + b.lengthMm));
      expect(Math.max(gapX, gapY), `${a.id} and ${b.id} at least the kerf apart`).toBeGreaterThanOrEqual(n.kerfMm - eps);
    }
  }
  const used = pieces.reduce((s, p) => s + (p.areaMm2 ?? p.widthMm * p.heightMm), 0);
  expectClose(n.usedAreaMm2, used, 1e-6);
  expectClose(n.yield, used / (n.sheets.length * n.sheet.widthMm * n.sheet.lengthMm), 1e-12);
}

describe('nestingOnSheets', () => {
  it('fills a sheet exactly with four quarters when there is no kerf', () => {
    const pieces = ['a', 'b', 'c', 'd'].map((id) => ({ id, widthMm: 610, heightMm: 1220 }));
    const n = nestingOnSheets(pieces, { kerfMm: 0 });
    checkNesting(n, pieces);
    // analytic: 4 x 610 x 1220 = 1220 x 2440, common practice sheet (REFERENCES.md, Plywood)
    expect(n.sheets).toHaveLength(1);
    expectClose(n.yield, 1, 1e-12);
  });

  it('keeps the kerf between pieces: two 610 mm pieces no longer sit side by side on 1220', () => {
    const pieces = ['a', 'b', 'c', 'd'].map((id) => ({ id, widthMm: 610, heightMm: 1220 }));
    const n = nestingOnSheets(pieces, { kerfMm: 3 });
    checkNesting(n, pieces);
    // analytic: 610 + 3 + 610 > 1220 and 1220 + 3 + 1220 > 2440 either way round, so one per column
    expect(n.sheets.length).toBeGreaterThanOrEqual(2);
  });

  it('places any set of pieces once each, inside the sheet and a kerf apart', () => {
    const piece = fc.record({
      widthMm: fc.double({ min: 10, max: 1200, noNaN: true }),
      heightMm: fc.double({ min: 10, max: 1200, noNaN: true }),
      grain: fc.constantFrom<'y' | 'z' | null>('y', 'z', null),
    });
    fc.assert(
      fc.property(fc.array(piece, { minLength: 1, maxLength: 25 }), fc.double({ min: 0, max: 6, noNaN: true }), fc.constantFrom(0, 10), (raw, kerf, margin) => {
        const pieces = raw.map((p, i) => ({ ...p, id: `p${i}` }));
        const n = nestingOnSheets(pieces, { kerfMm: kerf, edgeMarginMm: margin });
        checkNesting(n, pieces, margin);
        // analytic: never fewer sheets than the area needs
        expect(n.sheets.length).toBeGreaterThanOrEqual(Math.ceil(n.usedAreaMm2 / (1220 * 2440) - 1e-9));
      }),
      { numRuns: 150 },
    );
  });

  it('turns a piece only when its grain allows', () => {
    const long = [{ id: 'wide', widthMm: 2000, heightMm: 600 }];
    // analytic: 2000 across will not go on 1220, so it is turned along the sheet
    const n = nestingOnSheets(long);
    expect(n.sheets[0]!.placements[0]!.rotated).toBe(true);
    checkNesting(n, long);
    expect(() => nestingOnSheets([{ ...long[0]!, grain: 'z' }])).toThrow(/does not fit a 1220 x 2440 mm sheet with its grain \(z\) along the sheet/);
    const locked = [{ id: 'beam', widthMm: 2000, heightMm: 150, grain: 'y' as const }];
    checkNesting(nestingOnSheets(locked), locked);
  });

  it('uses the sheet asked for and says clearly when a piece is bigger than it', () => {
    const piece = [{ id: 'transom', widthMm: 1200, heightMm: 2480 }];
    expect(() => nestingOnSheets(piece)).toThrow(GeometryInputError);
    expect(() => nestingOnSheets(piece)).toThrow(/piece transom \(1200 x 2480 mm\) does not fit a 1220 x 2440 mm sheet either way round; split it at a butt block first/);
    // common practice (REFERENCES.md, Plywood): 1220 x 2500 sheets
    const n = nestingOnSheets(piece, { sheet: { widthMm: 1220, lengthMm: 2500 } });
    checkNesting(n, piece);
    expect(() => nestingOnSheets(piece, { sheet: { widthMm: 1220, lengthMm: 2500 }, edgeMarginMm: 15 })).toThrow(/inside a 15 mm margin/);
    expect(() => nestingOnSheets(piece, { kerfMm: -1 })).toThrow(/kerfMm must be a finite length of 0 or more/);
    expect(() => nestingOnSheets([{ id: 'x', widthMm: Number.NaN, heightMm: 1 }])).toThrow(/piece x/);
  });

  it('gives no sheets for no pieces', () => {
    const n = nestingOnSheets([]);
    expect(n.sheets).toEqual([]);
    expect(n.yield).toBe(0);
  });
});

describe('nestingPiecesOfShapes and nestingPlacedShape', () => {
  const l: Shape = { outer: [{ y: 100, z: 50 }, { y: 700, z: 50 }, { y: 700, z: 250 }, { y: 300, z: 250 }, { y: 300, z: 1250 }, { y: 100, z: 1250 }], holes: [] };

  it('size a piece by its box and count its true area', () => {
    const [p] = nestingPiecesOfShapes([{ id: 'knee', shape: l, grain: 'z' }]);
    // analytic: 600 x 1200 box; area 600 x 200 + 200 x 1000
    expect(p).toEqual({ id: 'knee', widthMm: 600, heightMm: 1200, areaMm2: 320000, grain: 'z' });
  });

  it('move a piece onto its sheet, turned a quarter turn without mirroring it', () => {
    for (const rotated of [false, true]) {
      const placement = { id: 'knee', x: 20, y: 40, widthMm: rotated ? 1200 : 600, lengthMm: rotated ? 600 : 1200, rotated };
      const moved = nestingPlacedShape(l, placement);
      const b = polygonBounds(moved.outer)!;
      // analytic: the box lands on the placement; area and direction are kept (a turn, not a flip)
      expectClose(b.minY, 20, 1e-9);
      expectClose(b.minZ, 40, 1e-9);
      expectClose(b.maxY, 20 + placement.widthMm, 1e-9);
      expectClose(b.maxZ, 40 + placement.lengthMm, 1e-9);
      expectClose(shapeArea(moved), shapeArea(l), 1e-9);
      expect(Math.sign(polygonSignedArea(moved.outer))).toBe(Math.sign(polygonSignedArea(l.outer)));
    }
  });
});
