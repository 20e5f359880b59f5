import type { SheetLayout } from '../../../../shared/geometry/sheet-layout';

/** Space (px) between sheets and round them. */
export const SHEET_VIEW_GAP_PX = 28;
/** Room (px) above the sheets for their names. */
export const SHEET_VIEW_TOP_PX = 24;
/** Tallest the sheets are drawn (px). */
export const SHEET_VIEW_MAX_HEIGHT_PX = 560;

/**
 * Where sheets and pieces go on the sheet view's stage: every sheet standing up (its length, the face
 * grain, up the screen), side by side, `k` px per mm. Kept apart from the konva drawing so that the
 * browser test can find a piece on the canvas by the same arithmetic.
 */
export function sheetViewScale(layout: Pick<SheetLayout, 'sheet' | 'sheets'>, widthPx: number, maxHeightPx: number = SHEET_VIEW_MAX_HEIGHT_PX) {
  const n = Math.max(layout.sheets.length, 1);
  const { widthMm: W, lengthMm: L } = layout.sheet;
  const gap = SHEET_VIEW_GAP_PX;
  const k = Math.max(0.05, Math.min(maxHeightPx / L, (widthPx - gap * (n + 1)) / (n * W)));
  const sheetLeft = (i: number) => gap + i * (W * k + gap);
  /** Screen position (px from the stage's top left) of a point on sheet i, mm across and along from its lower left corner. */
  const at = (i: number, x: number, y: number) => ({ px: sheetLeft(i) + x * k, py: SHEET_VIEW_TOP_PX + (L - y) * k });
  return { k, W, L, sheetLeft, at, heightPx: SHEET_VIEW_TOP_PX + L * k + gap, widthPx: Math.max(widthPx, sheetLeft(n)) };
}
