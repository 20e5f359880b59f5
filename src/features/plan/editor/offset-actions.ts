import type { Line } from '../../../../shared/geometry/hull-schema';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { cellSet, type CellValue } from './cell-actions';

/**
 * Offsets as points in the section plane, and the edits the drawing makes of them. A cell holds one
 * number along the only direction its line allows, so a point dragged anywhere is taken back onto that
 * direction: across for a waterline (its height is the line's), up and down for a buttock (its
 * half-breadth is the line's), along the diagonal for a diagonal, and anywhere for a point line.
 */

/** A point of a section (mm): half-breadth `y` out from the centreline, height `z` up. */
export interface SectionPlanePoint {
  y: number;
  z: number;
}

/** How an offset point may move: the one direction its cell measures along. */
export type OffsetFreedom = 'across' | 'up' | 'along' | 'free';

export function offsetFreedomOf(line: Line): OffsetFreedom {
  return line.kind === 'waterline' ? 'across' : line.kind === 'buttock' ? 'up' : line.kind === 'diagonal' ? 'along' : 'free';
}

/** Unit direction (y, z) of a diagonal, outboard and down at `angle` (radians below the horizontal). */
export function diagonalDirection(line: { angle: number }): SectionPlanePoint {
  return { y: Math.cos(line.angle), z: -Math.sin(line.angle) };
}

/** Where a cell's value puts the offset in the section plane (mm); null for an empty cell or a value of the wrong shape. */
export function offsetPointOf(line: Line, value: CellValue | undefined): SectionPlanePoint | null {
  if (value === null || value === undefined) return null;
  if (line.kind === 'point') return typeof value === 'object' ? { y: value.y, z: value.z } : null;
  if (typeof value !== 'number') return null;
  if (line.kind === 'waterline') return { y: value, z: line.z };
  if (line.kind === 'buttock') return { y: line.y, z: value };
  const d = diagonalDirection(line);
  return { y: value * d.y, z: line.originZ + value * d.z };
}

/**
 * The cell value that puts the line's offset nearest to `to` (mm) along the direction the line allows,
 * rounded to `stepMm` (0 keeps it as it is). Half-breadths and distances along a diagonal stop at the
 * centreline (0): an offset cannot cross to the other side. null when `to` is not a finite point.
 */
export function offsetValueFor(line: Line, to: SectionPlanePoint, stepMm = 0): CellValue {
  if (!Number.isFinite(to.y) || !Number.isFinite(to.z)) return null;
  const round = (v: number) => (stepMm > 0 ? Math.round(v / stepMm) * stepMm : v);
  // Rounding by a step like 0.1 leaves binary noise (0.30000000000000004): cut it to 6 decimals.
  const clean = (v: number) => Number(round(v).toFixed(6));
  switch (line.kind) {
    case 'waterline':
      return Math.max(0, clean(to.y));
    case 'buttock':
      return clean(to.z);
    case 'diagonal': {
      const d = diagonalDirection(line);
      // Projection of (to - origin) on the diagonal's direction: the nearest point of the diagonal.
      return Math.max(0, clean(to.y * d.y + (to.z - line.originZ) * d.z));
    }
    case 'point':
      return { y: Math.max(0, clean(to.y)), z: clean(to.z) };
  }
}

/**
 * Move the offset of `lineId` at `stationId` to the point nearest `to` (mm) that its cell can hold: one
 * edit whatever the path of the drag, so undo takes it back in one step. A line or station the plan does
 * not have, or a point that is not finite, leaves the plan as it was.
 */
export function offsetMove(plan: Plan, args: { lineId: string; stationId: string; to: SectionPlanePoint; stepMm?: number }): Plan {
  const line = plan.lines.lines.find((l) => l.id === args.lineId);
  if (!line) return plan;
  const value = offsetValueFor(line, args.to, args.stepMm ?? 0);
  if (value === null) return plan;
  return cellSet(plan, { lineId: line.id, stationId: args.stationId, value });
}

/** Clear the offset of a line at a station (the point is taken out of the section). */
export function offsetDelete(plan: Plan, args: { lineId: string; stationId: string }): Plan {
  return cellSet(plan, { lineId: args.lineId, stationId: args.stationId, value: null });
}
