import { describe, expect, it } from 'vitest';
import { cutListNesting, cutListNestingOfLayout, cutListPdf, pieceId } from '../../server/exports/cut-list';
import { layoutOfNesting, layoutPiecesOf } from '../../server/services/cut-list-arrangement';
import { sheetLayoutIssues, sheetLayoutTidied, sheetPieceSize } from '../../shared/geometry/sheet-layout';
import { cutListPiecesFixture } from './exports-fixtures';
import { pdfRead } from './exports-render';

const options = { hullName: 'Petrel', revisionId: 'r12', date: '2025-03-02', units: 'mm' as const, totals: { filletVolumeMl: 2350, glassTapeM: 41.5 } };

describe('cutListNestingOfLayout', { timeout: 120000 }, () => {
  it('reads the packer arrangement back unchanged, so an unchanged hand arrangement prints as the automatic one', () => {
    const pieces = cutListPiecesFixture();
    const auto = cutListNesting(pieces);
    const layout = layoutOfNesting(auto);
    // The packer's arrangement keeps every rule (maxrects-packer read back with the shared checks).
    expect(sheetLayoutIssues(layout, layoutPiecesOf(pieces))).toEqual([]);
    const back = cutListNestingOfLayout(pieces, sheetLayoutTidied(layout));
    for (const p of pieces) {
      expect(back.placementOf.get(pieceId(p))).toEqual(auto.placementOf.get(pieceId(p)));
      expect(back.sheetOf.get(pieceId(p))).toBe(auto.sheetOf.get(pieceId(p)));
    }
    expect(back.groups.map((g) => [g.plyThicknessMm, g.firstSheetNo, g.nesting.sheets.length])).toEqual(auto.groups.map((g) => [g.plyThicknessMm, g.firstSheetNo, g.nesting.sheets.length]));
    // Yield of each sheet: the pieces' true area over the sheet's, as the packer worked it out.
    back.groups.forEach((g, i) => g.nesting.sheets.forEach((s, j) => expect(s.yield).toBeCloseTo(auto.groups[i]!.nesting.sheets[j]!.yield, 12)));
  });

  it('prints a piece where the builder put it, and says the arrangement is by hand', async () => {
    const pieces = cutListPiecesFixture();
    const layout = layoutOfNesting(cutListNesting(pieces));
    // Move the last piece of sheet 1 to a sheet of its own ply added for it, 10 mm across and 20 mm along from the corner.
    const mine = layout.placements.filter((p) => p.sheetNo === 1).at(-1)!;
    const piece = pieces.find((p) => pieceId(p) === mine.pieceId)!;
    const size = sheetPieceSize(piece, mine.rotated);
    const spare = Math.max(...layout.sheets.map((s) => s.sheetNo)) + 1;
    const moved = { ...mine, sheetNo: spare, x: 10, y: 20 };
    const changed = sheetLayoutTidied({
      ...layout,
      sheets: [...layout.sheets, { sheetNo: spare, plyThicknessMm: piece.plyThicknessMm }],
      placements: layout.placements.map((p) => (p.pieceId === mine.pieceId ? moved : p)),
    });
    expect(sheetLayoutIssues(changed, layoutPiecesOf(pieces))).toEqual([]);
    const n = cutListNestingOfLayout(pieces, changed);
    expect(n.placementOf.get(mine.pieceId)).toMatchObject({ x: 10, y: 20, widthMm: size.acrossMm, lengthMm: size.alongMm });
    // Tidied: the added sheet is numbered right after the other sheets of its ply.
    const sameply = changed.sheets.filter((s) => s.plyThicknessMm === piece.plyThicknessMm).map((s) => s.sheetNo);
    expect(n.sheetOf.get(mine.pieceId)).toBe(Math.max(...sameply));
    const all = (await pdfRead(await cutListPdf(pieces, { ...options, nesting: n }))).map((p) => p.texts.map((t) => t.str).join(' ')).join(' ');
    expect(all).toContain('Arranged by hand on the sheet view');
    expect(all).toContain('at 10, 20');
  });
});
