import {
  type DrawingPathRole,
  type TemplateDrawing,
  TILT_DIRECTION_WORDS,
  degreesLabel,
  drawingPathBounds,
  drawingPathPoints,
  lengthLabel,
} from '../../shared/geometry/drawing';
import type { Bounds } from '../../shared/geometry/polygon';
import type { SectionPoint } from '../../shared/geometry/types';
import { type Doc, dashMm, pt, textAt, textWidthMm } from './pdf-common';

/**
 * A template drawing put on a PDF page: the paths in their line styles, the labels, bevel marks, notch
 * and limber centres and the check dimension, clipped to a window. Full size (scale 1) on the tiles and
 * the roll; reduced, lines only, on the assembly map. The drawing is already the view as seen
 * (`drawingAsSeen`): y to the right, z up, mm.
 */

/** A window of the drawing placed on the page. */
export interface PageWindow {
  /** The part of the drawing shown (mm, as seen). */
  window: Bounds;
  /** Where the window's top-left corner lies on the page (mm from the page's top-left corner). */
  leftMm: number;
  topMm: number;
  /** Page millimetres per drawing millimetre: 1 at full size. */
  scale: number;
}

/** Line style of a role: width (mm on paper), dash pattern (mm, empty for solid), grey level. */
export interface LineStyle {
  widthMm: number;
  dashMm: number[];
  color: string;
  /** The words for it in the legend. */
  legend: string;
}

/**
 * Line styles: the cut line solid and heavy, the other face dashed, the centreline long dash and dot,
 * reference lines thin and told apart by their dashes (our choice of weights and dashes).
 */
export const LINE_STYLES: Readonly<Record<DrawingPathRole, LineStyle>> = {
  'outer-cut': { widthMm: 0.5, dashMm: [], color: 'black', legend: 'Cut line (cut to the centre of the heavy line)' },
  'inner-cut': { widthMm: 0.5, dashMm: [], color: 'black', legend: 'Inner cut (inner edge, openings, limbers)' },
  'other-face': { widthMm: 0.25, dashMm: [3, 2], color: 'black', legend: 'Other face of the part (its outline on the far side)' },
  centreline: { widthMm: 0.2, dashMm: [12, 2, 2, 2], color: 'black', legend: 'Centreline' },
  'level-line': { widthMm: 0.2, dashMm: [], color: 'black', legend: 'Level reference line' },
  waterline: { widthMm: 0.2, dashMm: [8, 2], color: 'black', legend: 'Design waterline (DWL)' },
  'set-up-line': { widthMm: 0.2, dashMm: [6, 1.5, 1, 1.5], color: 'black', legend: 'Set-up line' },
  grain: { widthMm: 0.25, dashMm: [], color: 'black', legend: 'Face grain of the ply (arrow)' },
  notch: { widthMm: 0.3, dashMm: [], color: 'black', legend: 'Notch outline' },
  mark: { widthMm: 0.2, dashMm: [], color: 'black', legend: 'Marks' },
};

/** Drawing order: cut lines last, on top of everything else. */
const ROLE_ORDER: readonly DrawingPathRole[] = ['mark', 'grain', 'centreline', 'level-line', 'waterline', 'set-up-line', 'notch', 'other-face', 'inner-cut', 'outer-cut'];

/** Capital height (mm) of the bevel mark readings on the pattern. */
export const BEVEL_TEXT_MM = 1.8;
/** Length (mm) of the bevel tick drawn into the part from the edge. */
export const BEVEL_TICK_MM = 8;

/** A path flattened once per document, with its box. */
interface PreparedPath {
  role: DrawingPathRole;
  points: SectionPoint[];
  closed: boolean;
  bounds: Bounds;
}

/** A drawing made ready to be put on many pages: paths flattened once. */
export interface PreparedDrawing {
  drawing: TemplateDrawing;
  paths: PreparedPath[];
}

/** Flattens the drawing's arcs once for all the pages it goes on. */
export function drawingPrepared(drawing: TemplateDrawing): PreparedDrawing {
  const paths = drawing.paths.map((p) => {
    const { points, closed } = drawingPathPoints(p);
    return { role: p.role, points, closed, bounds: drawingPathBounds(p) };
  });
  paths.sort((a, b) => ROLE_ORDER.indexOf(a.role) - ROLE_ORDER.indexOf(b.role));
  return { drawing, paths };
}

const grow = (b: Bounds, by: number): Bounds => ({ minY: b.minY - by, maxY: b.maxY + by, minZ: b.minZ - by, maxZ: b.maxZ + by });
const meets = (a: Bounds, b: Bounds): boolean => a.minY <= b.maxY && b.minY <= a.maxY && a.minZ <= b.maxZ && b.minZ <= a.maxZ;
const around = (p: SectionPoint, r: number): Bounds => ({ minY: p.y - r, maxY: p.y + r, minZ: p.z - r, maxZ: p.z + r });

/** Page position (mm) of a drawing point in a window. */
export function pageOf(w: PageWindow, p: SectionPoint): { x: number; y: number } {
  return { x: w.leftMm + (p.y - w.window.minY) * w.scale, y: w.topMm + (w.window.maxZ - p.z) * w.scale };
}

function setLine(doc: Doc, style: LineStyle, widthMm = style.widthMm): void {
  doc.lineWidth(pt(widthMm)).strokeColor(style.color).lineJoin('round').lineCap('butt');
  dashMm(doc, style.dashMm);
}

/**
 * Strokes one flattened path, only the runs of segments that come near the window (the rest would be
 * clipped anyway): a 2000-point loop crossing a corner of a sheet costs that corner, not the loop.
 */
function strokePath(doc: Doc, w: PageWindow, path: PreparedPath, near: Bounds): void {
  const pts = path.points;
  const n = pts.length;
  if (n === 0) return;
  const segments = path.closed ? n : n - 1;
  let open = false;
  let all = true;
  const to = (p: SectionPoint, move: boolean): void => {
    const q = pageOf(w, p);
    if (move) doc.moveTo(pt(q.x), pt(q.y));
    else doc.lineTo(pt(q.x), pt(q.y));
  };
  for (let i = 0; i < segments; i++) {
    const a = pts[i]!;
    const b = pts[(i + 1) % n]!;
    // A box test is enough: a short segment whose box meets the window is drawn and clipped.
    if (!((a.y < near.minY && b.y < near.minY) || (a.y > near.maxY && b.y > near.maxY) || (a.z < near.minZ && b.z < near.minZ) || (a.z > near.maxZ && b.z > near.maxZ))) {
      if (!open) to(a, true);
      to(b, false);
      open = true;
    } else {
      open = false;
      all = false;
    }
  }
  if (n === 1) {
    to(pts[0]!, true);
    to(pts[0]!, false);
  }
  if (all && path.closed) doc.closePath();
  doc.stroke();
}

/** An arrowhead (filled) at `tip` pointing along `dir` (unit, page mm). */
function arrowhead(doc: Doc, tip: { x: number; y: number }, dir: { x: number; y: number }, lengthMm: number, widthMm: number): void {
  const bx = tip.x - dir.x * lengthMm;
  const by = tip.y - dir.y * lengthMm;
  doc
    .moveTo(pt(tip.x), pt(tip.y))
    .lineTo(pt(bx - dir.y * (widthMm / 2)), pt(by + dir.x * (widthMm / 2)))
    .lineTo(pt(bx + dir.y * (widthMm / 2)), pt(by - dir.x * (widthMm / 2)))
    .closePath()
    .fill('black');
}

/** Options of `drawDrawing`. */
export interface DrawOptions {
  /** Lines only (the reduced assembly map): no text, no marks, thin lines. */
  linesOnly?: boolean;
}

/**
 * Puts the drawing's window on the page, clipped to it. Full size: every line style, the grain arrow, bevel
 * ticks and readings, centre crosses, labels and the check dimension. Lines only: cut lines and the other
 * face, thin, for a map.
 */
export function drawDrawing(doc: Doc, prepared: PreparedDrawing, w: PageWindow, options: DrawOptions = {}): void {
  const d = prepared.drawing;
  const win = w.window;
  const widthMm = (win.maxY - win.minY) * w.scale;
  const heightMm = (win.maxZ - win.minZ) * w.scale;
  // Lines a little outside the window still show half their width inside it.
  const near = grow(win, 2 / w.scale);
  doc.save();
  doc.rect(pt(w.leftMm), pt(w.topMm), pt(widthMm), pt(heightMm)).clip();
  for (const p of prepared.paths) {
    if (!meets(p.bounds, near)) continue;
    if (options.linesOnly && !['outer-cut', 'inner-cut', 'other-face', 'centreline'].includes(p.role)) continue;
    const style = LINE_STYLES[p.role];
    setLine(doc, style, options.linesOnly ? Math.min(style.widthMm, 0.3) : style.widthMm);
    strokePath(doc, w, p, near);
    if (p.role === 'grain' && p.points.length >= 2 && !options.linesOnly) grainArrows(doc, w, p.points[0]!, p.points[p.points.length - 1]!);
  }
  doc.undash();
  if (!options.linesOnly) {
    drawCentres(doc, w, d, near);
    drawBevelMarks(doc, w, d, near);
    drawCheckDimension(doc, w, d, near);
    drawLabels(doc, w, d, near);
  }
  doc.restore();
}

function grainArrows(doc: Doc, w: PageWindow, a: SectionPoint, b: SectionPoint): void {
  const pa = pageOf(w, a);
  const pb = pageOf(w, b);
  const len = Math.hypot(pb.x - pa.x, pb.y - pa.y);
  if (len === 0) return;
  const dir = { x: (pb.x - pa.x) / len, y: (pb.y - pa.y) / len };
  // The grain runs both ways: a head at each end.
  arrowhead(doc, pb, dir, 5, 3);
  arrowhead(doc, pa, { x: -dir.x, y: -dir.y }, 5, 3);
}

function drawCentres(doc: Doc, w: PageWindow, d: TemplateDrawing, near: Bounds): void {
  doc.lineWidth(pt(0.2)).strokeColor('black').undash();
  for (const c of d.centres) {
    if (!meets(around(c.at, 40), near)) continue;
    const p = pageOf(w, c.at);
    const r = 3;
    doc.moveTo(pt(p.x - r), pt(p.y)).lineTo(pt(p.x + r), pt(p.y)).moveTo(pt(p.x), pt(p.y - r)).lineTo(pt(p.x), pt(p.y + r)).stroke();
    doc.circle(pt(p.x), pt(p.y), pt(1)).stroke();
    textAt(doc, `${c.kind === 'notch' ? 'notch' : 'limber'}: ${c.label}`, p.x + 2, p.y - 1.5, { capMm: 1.6 });
  }
}

/** The reading printed at a bevel mark: number, tilt and kind; tilt direction and face down; a warning past the saw's limit. */
export function bevelMarkLines(m: TemplateDrawing['bevelMarks'][number]): string[] {
  if (m.kind === 'square') return [`${m.markNo}: square`];
  const lines = [`${m.markNo}: ${degreesLabel(m.sawTiltDeg)} ${m.kind} (bevel reads ${degreesLabel(m.slidingBevelDeg)})`, `${TILT_DIRECTION_WORDS[m.tiltDirection]}, ${m.largerFace ?? 'either'} face down`];
  if (m.overSawLimit) lines.push('PAST THE SAW LIMIT: cut by hand or in two passes');
  return lines;
}

function drawBevelMarks(doc: Doc, w: PageWindow, d: TemplateDrawing, near: Bounds): void {
  for (const m of d.bevelMarks) {
    if (!meets(around(m.at, 90), near)) continue;
    const a = pageOf(w, m.at);
    // Page direction of the inward normal (page y runs down).
    const dir = { x: m.inward.y, y: -m.inward.z };
    doc.lineWidth(pt(0.3)).strokeColor('black').undash();
    doc.moveTo(pt(a.x), pt(a.y)).lineTo(pt(a.x + dir.x * BEVEL_TICK_MM), pt(a.y + dir.y * BEVEL_TICK_MM)).stroke();
    // The reading runs inward from the tick, turned so that it never reads upside down.
    const angle = (Math.atan2(-dir.y, dir.x) * 180) / Math.PI;
    const readable = dir.x >= -1e-9;
    const rot = readable ? angle : angle + 180;
    const start = { x: a.x + dir.x * (BEVEL_TICK_MM + 1.5), y: a.y + dir.y * (BEVEL_TICK_MM + 1.5) };
    const lines = bevelMarkLines(m);
    const lineGap = BEVEL_TEXT_MM * 1.6;
    // Lines stacked across the reading's direction, centred on the tick.
    const across = { x: -dir.y, y: dir.x };
    lines.forEach((text, i) => {
      const off = (i - (lines.length - 1) / 2) * lineGap + BEVEL_TEXT_MM / 2;
      const sign = readable ? 1 : -1;
      const o = { x: start.x + across.x * off * sign, y: start.y + across.y * off * sign };
      textAt(doc, text, o.x, o.y, { capMm: BEVEL_TEXT_MM, align: readable ? 'start' : 'end', rotationDeg: rot, bold: i === 0, color: m.overSawLimit && i === 2 ? '#b00000' : 'black' });
    });
  }
}

function drawCheckDimension(doc: Doc, w: PageWindow, d: TemplateDrawing, near: Bounds): void {
  const cd = d.checkDimension;
  if (!cd) return;
  const box: Bounds = { minY: Math.min(cd.from.y, cd.to.y), maxY: Math.max(cd.from.y, cd.to.y), minZ: Math.min(cd.from.z, cd.to.z), maxZ: Math.max(cd.from.z, cd.to.z) };
  if (!meets(grow(box, 20), near)) return;
  const a = pageOf(w, cd.from);
  const b = pageOf(w, cd.to);
  const len = Math.hypot(b.x - a.x, b.y - a.y);
  if (len === 0) return;
  const dir = { x: (b.x - a.x) / len, y: (b.y - a.y) / len };
  const n = { x: -dir.y, y: dir.x };
  doc.lineWidth(pt(0.2)).strokeColor('black').undash();
  doc.moveTo(pt(a.x), pt(a.y)).lineTo(pt(b.x), pt(b.y)).stroke();
  for (const p of [a, b]) doc.moveTo(pt(p.x - n.x * 4), pt(p.y - n.y * 4)).lineTo(pt(p.x + n.x * 4), pt(p.y + n.y * 4)).stroke();
  arrowhead(doc, b, dir, 4, 1.6);
  arrowhead(doc, a, { x: -dir.x, y: -dir.y }, 4, 1.6);
  const units = d.title.units;
  const text = `CHECK ${lengthLabel(cd.lengthMm, units)}${units === 'in' ? ` (${lengthLabel(cd.lengthMm, 'mm')})` : ''} between the end ticks`;
  let angle = (Math.atan2(-dir.y, dir.x) * 180) / Math.PI;
  if (angle > 90) angle -= 180;
  if (angle < -90) angle += 180;
  // Set just off the line, on the side above it as read.
  const up = { x: Math.sin((angle * Math.PI) / 180) * -1, y: -Math.cos((angle * Math.PI) / 180) };
  const off = 1.2;
  // Text is put at a few places along a long dimension so that every sheet it crosses says what it is.
  const spacing = 150;
  const count = Math.max(1, Math.floor(len / spacing));
  const tw = textWidthMm(doc, text, 2);
  for (let i = 0; i < count; i++) {
    const t = count === 1 ? 0.5 : (i + 0.5) / count;
    const p = { x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t };
    if (count === 1 || tw < spacing - 10) textAt(doc, text, p.x + up.x * off, p.y + up.y * off, { capMm: 2, align: 'centre', rotationDeg: angle, bold: true });
  }
}

function drawLabels(doc: Doc, w: PageWindow, d: TemplateDrawing, near: Bounds): void {
  for (const l of d.labels) {
    const reach = l.text.length * l.heightMm * 1.2 + l.heightMm * 2;
    if (!meets(around(l.anchor, reach), near)) continue;
    const p = pageOf(w, l.anchor);
    textAt(doc, l.text, p.x, p.y, { capMm: l.heightMm * w.scale, align: l.align, rotationDeg: l.rotationDeg, bold: l.purpose === 'station' || l.purpose === 'face' });
  }
}
