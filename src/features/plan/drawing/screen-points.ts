import { toScreen, type Point, type Viewport } from './viewport';

/** Hull points (mm) as the flat [x0, y0, x1, y1, ...] screen px list a konva Line takes. */
export function screenPoints(view: Viewport, pts: readonly Point[]): number[] {
  const out: number[] = [];
  for (const p of pts) {
    const s = toScreen(view, p);
    out.push(s.x, s.y);
  }
  return out;
}
