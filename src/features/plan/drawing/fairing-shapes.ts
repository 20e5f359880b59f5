import type { FairingCurve, FairingView, FairingViewName } from '../../../../shared/geometry/fairing';
import type { CellFlag } from '../editor/lines-check';
import { cellKey, type CellField } from '../editor/types';
import { boundsOf, type Bounds, type Point } from './viewport';

/**
 * What the Fairing view draws for one line in one view, as plain data in true millimetres (x along the
 * hull, y the line's value); the drawing stage stretches y by the exaggeration. Built from fairing.ts
 * `fairingViewOf` and the fairness check's cell flags (editor/lines-check.ts).
 */

/** One line in one view, as the list offers it. */
export interface FairingChoice {
  /** `${lineId}/${piece}/${view}` */
  key: string;
  lineId: string;
  piece: number;
  lineName: string;
  view: FairingViewName;
  /** Which of the line's values the fairness check judged in this view. */
  field: CellField;
}

/** A cell on the curve; `flag` when the fairness check says it stands off the line through the rest. */
export interface FairingCell {
  stationId: string;
  stationName: string;
  at: Point;
  flag: { deviationMm: number; message: string; expected: Point } | null;
}

export interface FairingShapes {
  curve: Point[];
  cells: FairingCell[];
  /** Where the line turns from bending one way to the other. */
  inflections: Point[];
  /** Stations within the line's reach. */
  stations: { id: string; name: string; x: number }[];
  bounds: Bounds;
}

const fieldOf = (curve: FairingCurve): CellField => (curve.kind !== 'point' ? 'value' : curve.view === 'plan' ? 'y' : 'z');

/** Every line in every view it has, plan first, in the order of the table. */
export function fairingChoices(view: FairingView): FairingChoice[] {
  return [...view.plan, ...view.profile].map((c) => ({ key: `${c.lineId}/${c.piece}/${c.view}`, lineId: c.lineId, piece: c.piece, lineName: c.lineName, view: c.view, field: fieldOf(c) }));
}

/**
 * The line the view opens on: the first with a cell the fairness check flags, else the first that is not
 * flat (the keel in plan sits at half-breadth 0 and would show nothing), else the first there is.
 */
export function fairingOpeningChoice(view: FairingView, choices: readonly FairingChoice[], cellFlags: ReadonlyMap<string, ReadonlyMap<string, CellFlag>>, flatMm: number): FairingChoice | null {
  let firstCurved: FairingChoice | null = null;
  for (const choice of choices) {
    const shapes = fairingShapes(view, choice, cellFlags);
    if (!shapes) continue;
    if (shapes.cells.some((c) => c.flag)) return choice;
    if (!firstCurved && shapes.bounds.maxY - shapes.bounds.minY > flatMm) firstCurved = choice;
  }
  return firstCurved ?? choices[0] ?? null;
}

/** The line's value (mm) at x along a polyline running in x; null outside it. */
function valueAt(curve: readonly Point[], x: number): number | null {
  for (let i = 1; i < curve.length; i++) {
    const a = curve[i - 1]!;
    const b = curve[i]!;
    if (x >= a.x && x <= b.x) return b.x === a.x ? a.y : a.y + ((x - a.x) / (b.x - a.x)) * (b.y - a.y);
  }
  return null;
}

/**
 * The shapes of one choice, or null when the view has no such line (any more). The curve's values come
 * from the view divided by its exaggeration, so they are the line's own millimetres again.
 */
export function fairingShapes(view: FairingView, choice: Pick<FairingChoice, 'lineId' | 'piece' | 'view'>, cellFlags: ReadonlyMap<string, ReadonlyMap<string, CellFlag>>): FairingShapes | null {
  const curve = (choice.view === 'plan' ? view.plan : view.profile).find((c) => c.lineId === choice.lineId && c.piece === choice.piece);
  if (!curve) return null;
  const k = view.exaggeration;
  const field = fieldOf(curve);
  const names = new Map(view.stations.map((s) => [s.id, s.name]));
  const flags = cellFlags.get(curve.lineId);
  const points = curve.points.map((p) => ({ x: p.x, y: p.v / k })).filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y));
  const cells = curve.cells.map((c): FairingCell => {
    const at = { x: c.x, y: c.v / k };
    const f = flags?.get(cellKey(c.stationId, field));
    // The deviation is value minus what the rest of the line gives, so the line wants the cell at value - deviation.
    return { stationId: c.stationId, stationName: names.get(c.stationId) ?? c.stationId, at, flag: f ? { deviationMm: f.deviationMm, message: f.message, expected: { x: c.x, y: at.y - f.deviationMm } } : null };
  });
  const inflections = curve.inflectionXs.flatMap((x) => {
    const y = valueAt(points, x);
    return y === null ? [] : [{ x, y }];
  });
  const xMin = points[0]?.x ?? 0;
  const xMax = points[points.length - 1]?.x ?? 0;
  const stations = view.stations.filter((s) => s.x >= xMin - 1e-6 && s.x <= xMax + 1e-6);
  const bounds = boundsOf([...points, ...cells.map((c) => c.at), ...cells.flatMap((c) => (c.flag ? [c.flag.expected] : []))]) ?? { minX: 0, minY: 0, maxX: 1, maxY: 1 };
  return { curve: points, cells, inflections, stations, bounds };
}
