/**
 * The mapping between hull drawing millimetres and screen pixels, as plain data and free functions so the
 * drawing components, the pointer tools and the tests share one definition of it.
 */

/** Hull drawing coordinates in mm: x to the right (half-breadth, or station x in profile), y UP (height). Screen px: y down. */
export interface Viewport {
  /** Screen px per mm. */
  scale: number;
  /** Screen px where hull (0,0) lands. */
  offsetX: number;
  offsetY: number;
  /**
   * Vertical exaggeration (the fairing view draws heights larger so a bump shows): hull y is multiplied by
   * this before mapping. Absent means 1.
   */
  yScale?: number;
}
export interface Point {
  x: number;
  y: number;
}
export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** The scale range a person can zoom through: from a whole ship on a phone to a fraction of a mm per px. */
export const DEFAULT_ZOOM_LIMITS = { minScale: 0.0005, maxScale: 50 };

/** A drawing of nothing (one point, or a straight line) still needs a size to fit: 1 mm. */
const SMALLEST_EXTENT_MM = 1;

function yScaleOf(v: Viewport): number {
  return v.yScale ?? 1;
}

/** Screen px of a hull point (mm). */
export function toScreen(v: Viewport, p: Point): Point {
  return { x: v.offsetX + p.x * v.scale, y: v.offsetY - p.y * v.scale * yScaleOf(v) };
}

/** Hull point (mm) under a screen point (px). */
export function toHull(v: Viewport, s: Point): Point {
  return { x: (s.x - v.offsetX) / v.scale, y: (v.offsetY - s.y) / (v.scale * yScaleOf(v)) };
}

/** A length in mm as screen px (horizontal, or vertical when `yScale` is 1). */
export function lengthToScreen(v: Viewport, mm: number): number {
  return mm * v.scale;
}

/**
 * The viewport that shows `bounds` (hull mm) as large as fits inside `size` (px) less `marginPx` on every
 * side, centred. `yScale` (default 1) exaggerates heights the way the fairing view draws them.
 */
export function fitViewport(bounds: Bounds, size: { width: number; height: number }, marginPx: number, yScale = 1): Viewport {
  const extentX = Math.max(bounds.maxX - bounds.minX, SMALLEST_EXTENT_MM);
  const extentY = Math.max((bounds.maxY - bounds.minY) * yScale, SMALLEST_EXTENT_MM);
  const roomX = Math.max(size.width - 2 * marginPx, 1);
  const roomY = Math.max(size.height - 2 * marginPx, 1);
  const scale = Math.min(roomX / extentX, roomY / extentY);
  const centreX = (bounds.minX + bounds.maxX) / 2;
  const centreY = ((bounds.minY + bounds.maxY) / 2) * yScale;
  const v: Viewport = { scale, offsetX: size.width / 2 - centreX * scale, offsetY: size.height / 2 + centreY * scale };
  return yScale === 1 ? v : { ...v, yScale };
}

/**
 * Zoom by `factor` keeping the hull point under `screen` (px) where it is; the scale stays within `limits`.
 */
export function zoomAbout(v: Viewport, factor: number, screen: Point, limits: { minScale: number; maxScale: number } = DEFAULT_ZOOM_LIMITS): Viewport {
  if (!Number.isFinite(factor) || factor <= 0) return v;
  const scale = Math.min(Math.max(v.scale * factor, limits.minScale), limits.maxScale);
  const ratio = scale / v.scale;
  return { ...v, scale, offsetX: screen.x - (screen.x - v.offsetX) * ratio, offsetY: screen.y - (screen.y - v.offsetY) * ratio };
}

/** Move the drawing by (dx, dy) screen px. */
export function panBy(v: Viewport, dx: number, dy: number): Viewport {
  return { ...v, offsetX: v.offsetX + dx, offsetY: v.offsetY + dy };
}

/** The smallest box holding every finite point; null when there is none. */
export function boundsOf(points: Iterable<Point>): Bounds | null {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const p of points) {
    if (!Number.isFinite(p.x) || !Number.isFinite(p.y)) continue;
    if (p.x < minX) minX = p.x;
    if (p.x > maxX) maxX = p.x;
    if (p.y < minY) minY = p.y;
    if (p.y > maxY) maxY = p.y;
  }
  return minX === Infinity ? null : { minX, minY, maxX, maxY };
}

/** The box holding both. */
export function boundsUnion(a: Bounds | null, b: Bounds | null): Bounds | null {
  if (!a) return b;
  if (!b) return a;
  return { minX: Math.min(a.minX, b.minX), minY: Math.min(a.minY, b.minY), maxX: Math.max(a.maxX, b.maxX), maxY: Math.max(a.maxY, b.maxY) };
}

/** Hull distance (mm) and angle from horizontal (radians, -π..π, anticlockwise positive) from `a` to `b`. */
export function measureBetween(a: Point, b: Point): { distanceMm: number; angleRad: number } {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  return { distanceMm: Math.hypot(dx, dy), angleRad: Math.atan2(dy, dx) };
}

/** Whether two viewports are the same to a hundredth of a pixel (so a resize that changes nothing is ignored). */
export function viewportEqual(a: Viewport, b: Viewport): boolean {
  return Math.abs(a.scale - b.scale) < 1e-9 && Math.abs(a.offsetX - b.offsetX) < 0.01 && Math.abs(a.offsetY - b.offsetY) < 0.01 && yScaleOf(a) === yScaleOf(b);
}
