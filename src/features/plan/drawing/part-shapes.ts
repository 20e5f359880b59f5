import { degreesLabel, drawingPathPoints, drawingViewMirrored } from '../../../../shared/geometry/drawing';
import type { PartGeometry, PartLevelLine } from '../../../../shared/geometry/frame-types';
import { radToDeg, type SectionPoint } from '../../../../shared/geometry/types';
import { boundsOf, type Bounds, type Point } from './viewport';

/**
 * What the Part view draws, as plain data: every line of one computed part (frame.ts `PartGeometry`) in
 * the view's millimetres with a style key, so the drawing is decided (and tested) without a canvas and the
 * konva component only strokes what it is given.
 *
 * The view is the marked face as the builder looks at it, the way the printed template is laid out
 * (drawing.ts `drawingViewMirrored`): the forward face is seen from forward, so starboard is on the left.
 * View x is then -y for a forward face and y for an aft face; view y is the template's z (up).
 */

/** How a line is drawn; the component maps each to a stroke, dash and fill. */
export type PartStyle =
  /** The outline of the chosen layer at its marked side: the line that is cut. */
  | 'cut-edge'
  /** The other layers' outlines, thin. */
  | 'layer-edge'
  /** Inner edge of a ring frame, openings (cut too). */
  | 'inner-edge'
  /** The chosen layer's far face (where the bevel ends): dashed. */
  | 'other-face'
  /** The moulded section (the line the offsets describe). */
  | 'moulded'
  /** Band between the moulded section and the inside of the skin (filled). */
  | 'skin-band'
  /** Band between the inside of the skin and the cut edge: the fillet clearance (filled). */
  | 'fillet-band'
  /** The top of the deck across the station, with its camber. */
  | 'deck-top'
  | 'centreline'
  | 'level-line'
  | 'waterline'
  | 'set-up-line'
  | 'grain'
  | 'limber'
  | 'dimension';

export interface PartPolyline {
  style: PartStyle;
  points: Point[];
  closed: boolean;
}

/** A bevel mark: a tick into the part from `at`, and its reading. */
export interface PartBevelTick {
  markNo: number;
  at: Point;
  /** Unit vector into the part (view axes). */
  inward: Point;
  /** Saw tilt from square (degrees). */
  sawTiltDeg: number;
  /** "12.5°", and the plain warning when past the saw's limit. */
  text: string;
  overLimit: boolean;
}

export type PartLabelStyle = 'line' | 'dimension' | 'notch' | 'limber' | 'note';

export interface PartLabel {
  at: Point;
  text: string;
  style: PartLabelStyle;
  align: 'start' | 'centre' | 'end';
  /** Degrees anticlockwise (a vertical dimension reads up the page). */
  rotationDeg: number;
}

/** The centre of a notch or a limber hole, marked with a cross. */
export interface PartCentre {
  kind: 'notch' | 'limber';
  at: Point;
  label: string;
}

/**
 * The hull's own lines at the part's marked face, in template coordinates: each a run along the edge
 * (the component computes them from the hull; see `part-hull-edges.ts`). `moulded` to `skin` is the
 * deducted skin, `skin` to `cut` the fillet clearance.
 */
export interface PartHullEdges {
  moulded: SectionPoint[][];
  skin: SectionPoint[][];
  cut: SectionPoint[][];
  /** The deck's top across the station (camber), or null without a deck. */
  deckTop: SectionPoint[] | null;
  /** Rise (mm) of the deck's camber from the beam end to the centreline, or null. */
  camberRiseMm: number | null;
}

export interface PartShapesOptions {
  /** The layer drawn as the cut edge (0: the layer on the marked face). */
  layerIndex?: number;
  /** Draw the overall width and height and the check dimension. */
  dimensions?: boolean;
  /** A length as the hull's notation writes it, with its unit. */
  lengthText: (mm: number) => string;
}

export interface PartShapes {
  polylines: PartPolyline[];
  bevels: PartBevelTick[];
  centres: PartCentre[];
  labels: PartLabel[];
  /** Everything drawn (mm, view axes), for fitting. */
  bounds: Bounds;
  mirrored: boolean;
  /** "Seen from forward, looking aft: starboard on the left." */
  viewWords: string;
  /** View x of starboard: +1 (right) or -1 (left). */
  starboardSign: 1 | -1;
  /** Lines and marks left out because a coordinate was not a finite number (0 when all were drawn). */
  notDrawn: number;
  overLimit: { count: number; limitDeg: number; maxDeg: number };
}

const finitePoint = (p: SectionPoint): boolean => Number.isFinite(p.y) && Number.isFinite(p.z);

/** Room left right of the drawing for the reference lines' labels, as a share of its width. */
const LABEL_ROOM_SHARE = 0.3;
/** Where a label sits off the end of a reference line (mm beyond its end). */
const LINE_LABEL_GAP_MM = 20;

/** Every shape of one part, ready to stroke. */
export function partShapes(part: PartGeometry, hullEdges: PartHullEdges | null, options: PartShapesOptions): PartShapes {
  const mirrored = drawingViewMirrored({ face: part.markedFace });
  const sign: 1 | -1 = mirrored ? -1 : 1;
  const at = (p: SectionPoint): Point => ({ x: sign * p.y, y: p.z });
  const run = (pts: readonly SectionPoint[]): Point[] => pts.map(at);
  const polylines: PartPolyline[] = [];
  const labels: PartLabel[] = [];
  let dropped = 0;
  const add = (style: PartStyle, pts: readonly SectionPoint[], closed: boolean) => {
    if (pts.length < 2) return;
    // A point that is not a number is never drawn (it would throw the whole line off the page); it is counted.
    if (!pts.every(finitePoint)) {
      dropped += 1;
      return;
    }
    polylines.push({ style, points: run(pts), closed });
  };
  const chosen = Math.min(Math.max(options.layerIndex ?? 0, 0), Math.max(part.layers.length - 1, 0));

  // Under everything: the bands, so the edges stroke over them.
  if (hullEdges) {
    hullEdges.moulded.forEach((m, i) => {
      const s = hullEdges.skin[i];
      if (s && s.length > 1 && m.length > 1) add('skin-band', [...m, ...[...s].reverse()], true);
    });
    hullEdges.skin.forEach((s, i) => {
      const c = hullEdges.cut[i];
      if (c && c.length > 1 && s.length > 1) add('fillet-band', [...s, ...[...c].reverse()], true);
    });
    for (const m of hullEdges.moulded) add('moulded', m, false);
    if (hullEdges.deckTop) add('deck-top', hullEdges.deckTop, false);
  }

  part.layers.forEach((layer, i) => {
    if (i === chosen) return;
    for (const r of layer.regions) add('layer-edge', r.outer, true);
  });
  const layer = part.layers[chosen];
  if (layer) {
    for (const r of layer.otherFaceRegions) {
      add('other-face', r.outer, true);
      for (const h of r.holes) add('other-face', h, true);
    }
    for (const r of layer.regions) {
      add('cut-edge', r.outer, true);
      for (const h of r.holes) add('inner-edge', h, true);
    }
  }

  const m = part.marks;
  add('centreline', [m.centreline.from, m.centreline.to], false);
  const level = (style: PartStyle, line: PartLevelLine | null, words: string) => {
    if (!line) return;
    add(style, [line.from, line.to], false);
    // The label goes past the end that is on the right of the view, so it never sits on the part.
    const ends = [at(line.from), at(line.to)].sort((a, b) => a.x - b.x);
    labels.push({ at: { x: ends[1]!.x + LINE_LABEL_GAP_MM, y: ends[1]!.y }, text: words, style: 'line', align: 'start', rotationDeg: 0 });
  };
  // The level line defaults to the design waterline: then one label says both, rather than two on top of each other.
  const onDwl = m.designWaterline !== null && Math.abs(m.designWaterline.heightMm - m.levelLine.heightMm) < 0.5;
  level('level-line', m.levelLine, `${onDwl ? 'Level line on the DWL' : 'Level line'} ${options.lengthText(m.levelLine.heightMm)} above base`);
  if (!onDwl) level('waterline', m.designWaterline, m.designWaterline ? `DWL ${options.lengthText(m.designWaterline.heightMm)}` : '');
  else if (m.designWaterline) add('waterline', [m.designWaterline.from, m.designWaterline.to], false);
  level('set-up-line', m.setUpLine, m.setUpLine ? `Set-up line ${options.lengthText(m.setUpLine.heightMm)}` : '');
  if (m.grain) add('grain', [m.grain.from, m.grain.to], false);

  for (const limber of part.limbers) {
    add('limber', drawingPathPoints({ kind: 'circle', role: 'inner-cut', centre: limber.centre, radiusMm: limber.radiusMm }, Math.max(limber.radiusMm / 200, 0.05)).points, true);
  }
  const centres: PartCentre[] = [
    ...part.notches.map((n): PartCentre => ({ kind: 'notch', at: at(n.centre), label: n.name })),
    ...part.limbers.map((l): PartCentre => ({ kind: 'limber', at: at(l.centre), label: `Limber r ${options.lengthText(l.radiusMm)}` })),
  ].filter((c) => Number.isFinite(c.at.x) && Number.isFinite(c.at.y));

  const limitDeg = radToDeg(part.bevelSummary.sawTiltLimitRad);
  const bevels: PartBevelTick[] = part.bevelMarks.filter((b) => finitePoint(b) && Number.isFinite(b.bevelDeg)).map((b, i) => {
    const inward = { x: -sign * b.ny, y: -b.nz };
    const tilt = b.bevelDeg as number;
    return { markNo: i + 1, at: at(b), inward, sawTiltDeg: tilt, text: b.overLimit ? `${degreesLabel(tilt)} past saw limit` : degreesLabel(tilt), overLimit: b.overLimit };
  });

  if (hullEdges?.deckTop && hullEdges.camberRiseMm !== null) {
    // Over the crown, where the camber is measured to.
    const crown = hullEdges.deckTop.reduce((best, p) => (p.z > best.z ? p : best), hullEdges.deckTop[0]!);
    labels.push({ at: { x: at(crown).x, y: crown.z + 3 * LINE_LABEL_GAP_MM }, text: `Deck camber ${options.lengthText(hullEdges.camberRiseMm)} rise`, style: 'note', align: 'centre', rotationDeg: 0 });
  }
  // The dimensions' room is always part of the bounds, so turning them on and off never moves the drawing.
  const dims = dimensionsOf(part, at, options.lengthText);
  if (options.dimensions) {
    polylines.push(...dims.polylines);
    labels.push(...dims.labels);
  }

  const all = [...polylines.flatMap((p) => p.points), ...dims.polylines.flatMap((p) => p.points), ...bevels.map((b) => b.at), ...centres.map((c) => c.at)];
  const drawn = boundsOf(all) ?? { minX: -1, minY: -1, maxX: 1, maxY: 1 };
  // Labels are text on the screen, not millimetres: leave room for them beside the drawing when fitting.
  const room = LABEL_ROOM_SHARE * (drawn.maxX - drawn.minX);
  const bounds = { ...drawn, maxX: drawn.maxX + room };
  const maxDeg = bevels.reduce((best, b) => Math.max(best, b.sawTiltDeg), 0);
  return {
    polylines,
    bevels,
    centres,
    labels,
    bounds,
    mirrored,
    viewWords: mirrored ? 'Seen from forward, looking aft, as the template is marked: starboard on the left.' : 'Seen from aft, looking forward, as the template is marked: starboard on the right.',
    starboardSign: sign,
    notDrawn: dropped + part.bevelMarks.length - bevels.length,
    overLimit: { count: part.bevelSummary.overLimit, limitDeg, maxDeg },
  };
}

/** Overall width below the part, overall height beside it, and the check dimension where it lies. */
function dimensionsOf(part: PartGeometry, at: (p: SectionPoint) => Point, lengthText: (mm: number) => string): { polylines: PartPolyline[]; labels: PartLabel[] } {
  const polylines: PartPolyline[] = [];
  const labels: PartLabel[] = [];
  const b = part.bounds;
  const width = b.maxY - b.minY;
  const height = b.maxZ - b.minZ;
  // Dimension lines stand off the part by a share of its size, so they clear it at any scale.
  const gap = 0.08 * Math.max(width, height, 1);
  const tick = gap / 4;
  const corners = [at({ y: b.minY, z: b.minZ }), at({ y: b.maxY, z: b.maxZ })];
  const left = Math.min(corners[0]!.x, corners[1]!.x);
  const right = Math.max(corners[0]!.x, corners[1]!.x);
  const dim = (points: Point[]) => polylines.push({ style: 'dimension', points, closed: false });
  const below = b.minZ - gap;
  dim([{ x: left, y: below }, { x: right, y: below }]);
  dim([{ x: left, y: below - tick }, { x: left, y: b.minZ }]);
  dim([{ x: right, y: below - tick }, { x: right, y: b.minZ }]);
  labels.push({ at: { x: (left + right) / 2, y: below - tick }, text: `Overall width ${lengthText(width)}`, style: 'dimension', align: 'centre', rotationDeg: 0 });
  // The height goes on the left: the reference lines' labels take the right.
  const side = left - gap;
  dim([{ x: side, y: b.minZ }, { x: side, y: b.maxZ }]);
  dim([{ x: left, y: b.minZ }, { x: side - tick, y: b.minZ }]);
  dim([{ x: left, y: b.maxZ }, { x: side - tick, y: b.maxZ }]);
  labels.push({ at: { x: side - tick, y: (b.minZ + b.maxZ) / 2 }, text: `Overall height ${lengthText(height)}`, style: 'dimension', align: 'centre', rotationDeg: 90 });
  const check = part.checkDimension;
  if (check) {
    const from = at(check.from);
    const to = at(check.to);
    dim([from, to]);
    dim([{ x: from.x, y: from.y - tick }, { x: from.x, y: from.y + tick }]);
    dim([{ x: to.x, y: to.y - tick }, { x: to.x, y: to.y + tick }]);
    // Under the line, inside the part, clear of the bevel readings along the edge.
    labels.push({ at: { x: (from.x + to.x) / 2, y: (from.y + to.y) / 2 - 1.5 * tick }, text: `Check ${lengthText(check.lengthMm)}`, style: 'dimension', align: 'centre', rotationDeg: 0 });
  }
  return { polylines, labels };
}

/**
 * The items whose labels can be shown without overlapping: in order, each kept when its screen point is at
 * least `minGapPx` from every one kept before; items `always` keeps (a bevel past the saw's limit) are
 * kept whatever their neighbours.
 */
export function labelsThinned<T>(items: readonly T[], screenOf: (item: T) => Point, minGapPx: number, always: (item: T) => boolean = () => false): T[] {
  const kept: { item: T; p: Point }[] = [];
  const firm = items.filter(always).map((item) => ({ item, p: screenOf(item) }));
  for (const item of items) {
    if (always(item)) {
      kept.push({ item, p: screenOf(item) });
      continue;
    }
    const p = screenOf(item);
    const clear = [...kept, ...firm].every((k) => Math.hypot(k.p.x - p.x, k.p.y - p.y) >= minGapPx);
    if (clear) kept.push({ item, p });
  }
  return kept.map((k) => k.item);
}
