import type { PartResult } from '../../../../shared/geometry/frame-types';
import { measuredFrameOutline, measuredFramePoints } from '../../../../shared/geometry/measured';
import type { MeasuredFrame } from '../../../../shared/geometry/part-schema';
import { GeometryInputError, radToDeg } from '../../../../shared/geometry/types';
import type { PartHullEdges } from './part-shapes';
import { boundsOf, boundsUnion, type Bounds, type Point } from './viewport';

/**
 * What the hand-measured frame's drawing shows, as plain data in the section plane seen from aft
 * (view x = y, starboard on the right; view y = height above the baseline): the readings in the order
 * taken with their bevel readings, how they were taken (the level reference line, or the origin and its
 * rays), the frame worked out from them, and, when one side is mirrored, the other side as measured laid
 * over it so the hull's asymmetry shows.
 */

export interface MeasuredReadingMark {
  /** 1-based, as the side table numbers the rows. */
  number: number;
  at: Point;
  /** "78°" as read with the sliding bevel, or null when none was read. */
  bevelText: string | null;
}

export interface MeasuredShapes {
  readings: MeasuredReadingMark[];
  /** The readings joined in order. */
  asMeasured: Point[];
  /** The side not kept, mirrored onto the kept side (null unless a side is mirrored and the other was measured). */
  otherSideMirrored: Point[] | null;
  /** The level line the offsets were measured from (its height, mm), or null. */
  referenceZ: number | null;
  /** The origin of angle-and-distance readings, or null. */
  origin: Point | null;
  /** The frame worked out: the marked face's cut edge and the far face, each a closed loop. */
  cutEdges: Point[][];
  otherFaces: Point[][];
  /** Between the readings (the inside of the skin) and the cut edge: the fillet clearance. */
  filletBands: Point[][];
  /** Largest difference (mm) between the two sides as measured, when one is mirrored. */
  maxAsymmetryMm: number | null;
  asymmetry: { girthMm: number; differenceMm: number }[] | null;
  bounds: Bounds;
}

/** Share of the frame's size left round it when fitting. */
const BOUNDS_PAD_SHARE = 0.12;

const toPoint = (p: { y: number; z: number }): Point => ({ x: p.y, y: p.z });

/** The shapes of a measured frame from its readings and, when it was worked out, its part result. */
export function measuredShapes(frame: MeasuredFrame, result: PartResult | null, hullEdges: PartHullEdges | null): MeasuredShapes {
  const m = frame.measurement;
  const raw = measuredFramePoints(m);
  const readings = raw.map((p, i): MeasuredReadingMark => {
    const b = m.points[i]?.bevel;
    return { number: i + 1, at: toPoint(p), bevelText: b ? `${Number(radToDeg(b.readingRad).toFixed(1))}° ${b.sense}` : null };
  });
  let otherSideMirrored: Point[] | null = null;
  let maxAsymmetryMm: number | null = null;
  let asymmetry: MeasuredShapes['asymmetry'] = null;
  if (frame.symmetry !== 'as-measured') {
    const keep = frame.symmetry === 'mirror-starboard' ? 1 : -1;
    // The side not kept runs out from the centreline, so a reading on the centreline belongs to it too.
    const other = raw.filter((p) => p.y * keep <= 0).map((p) => ({ x: p.y === 0 ? 0 : -p.y, y: p.z }));
    otherSideMirrored = other.length > 1 ? other : null;
    try {
      const out = measuredFrameOutline(frame);
      maxAsymmetryMm = out.maxAsymmetryMm;
      asymmetry = out.asymmetry;
    } catch (e) {
      if (!(e instanceof GeometryInputError)) throw e;
    }
  }
  const part = result?.ok ? result.part : null;
  const layer = part?.layers[0];
  const cutEdges = layer ? layer.regions.map((r) => r.outer.map(toPoint)) : [];
  const otherFaces = part ? part.layers[part.layers.length - 1]!.otherFaceRegions.map((r) => r.outer.map(toPoint)) : [];
  const filletBands = hullEdges ? hullEdges.skin.flatMap((s, i) => (hullEdges.cut[i] ? [[...s.map(toPoint), ...[...hullEdges.cut[i]!].reverse().map(toPoint)]] : [])) : [];
  const origin = m.kind === 'angle-distance' ? toPoint(m.origin) : null;
  const referenceZ = m.kind === 'offsets' ? m.referenceZ : null;
  const all = [...readings.map((r) => r.at), ...cutEdges.flat(), ...otherFaces.flat(), ...(origin ? [origin] : [])].filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y));
  if (referenceZ !== null) all.push({ x: 0, y: referenceZ });
  // An empty frame still needs somewhere to click: a metre either side of the centreline above its reference.
  const base = referenceZ ?? origin?.y ?? 0;
  // Until there are three readings to make a frame, the drawing shows room to click in (a metre either side
  // of the centreline above the reference) rather than closing in on one or two points.
  const room = { minX: -1000, maxX: 1000, minY: base - 200, maxY: base + 1000 };
  const drawn = readings.length >= 3 ? boundsOf(all)! : boundsUnion(room, boundsOf(all))!;
  // Room round the frame for the reference line's ends and the side names drawn past it.
  const padX = BOUNDS_PAD_SHARE * Math.max(drawn.maxX - drawn.minX, 200);
  const padY = BOUNDS_PAD_SHARE * Math.max(drawn.maxY - drawn.minY, 200);
  const bounds = { minX: drawn.minX - padX, maxX: drawn.maxX + padX, minY: drawn.minY - padY, maxY: drawn.maxY + padY };
  return { readings, asMeasured: readings.map((r) => r.at), otherSideMirrored, referenceZ, origin, cutEdges, otherFaces, filletBands, maxAsymmetryMm, asymmetry, bounds };
}
