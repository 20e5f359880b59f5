import { partSchema, longitudinalSchema, type Longitudinal, type Part, type PartInput, type PartKind } from '../../../../shared/geometry/part-schema';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { idFor } from './ids';

/** The kinds of part a builder adds from the frames screen (a hand-measured frame comes from its own screen). */
export const addableKinds = ['ring-frame', 'bulkhead', 'partial-bulkhead', 'floor', 'deck-beam', 'half-beam', 'mould', 'transom'] as const satisfies readonly PartKind[];
export type AddableKind = (typeof addableKinds)[number];

export const partKindLabels: Record<PartKind, string> = {
  'ring-frame': 'Ring frame',
  bulkhead: 'Bulkhead',
  'partial-bulkhead': 'Partial bulkhead',
  floor: 'Floor',
  'deck-beam': 'Deck beam',
  'half-beam': 'Half beam',
  mould: 'Building mould',
  transom: 'Transom',
  'measured-frame': 'Measured frame',
};

/** Height of a point line at a station (mm), or null when it has no value there. */
function heightAt(plan: Plan, role: 'chine' | 'sheer', stationId: string): number | null {
  const line = plan.lines.lines.find((l) => l.kind === 'point' && l.role === role);
  const cell = line?.kind === 'point' ? line.cells[stationId] : null;
  return cell ? cell.z : null;
}

/**
 * The fields a part of `kind` needs, filled from the hull where it can tell (the station's chine or design
 * waterline for the top of a floor or partial bulkhead) and otherwise with a plain starting value the
 * builder replaces with the designer's scantlings. `keep` carries over what the part had when its kind
 * changes.
 */
export function partOfKind(plan: Plan, kind: AddableKind, keep: { id: string; name: string; stationId: string; thicknessMm: number; layers: Part['layers'] } & Partial<Part>): Part {
  const common = {
    id: keep.id,
    name: keep.name,
    stationId: keep.stationId,
    markedFace: keep.markedFace ?? 'auto',
    thicknessMm: keep.thicknessMm,
    layers: keep.layers,
    filletClearanceMm: keep.filletClearanceMm,
    longitudinalIds: keep.longitudinalIds ?? null,
    limbers: keep.limbers ?? [],
    openings: keep.openings ?? [],
    bevelMarks: keep.bevelMarks,
  };
  const topZ = Math.round(heightAt(plan, 'chine', keep.stationId) ?? plan.lines.designWaterlineZ ?? 300);
  const input: PartInput = (() => {
    switch (kind) {
      case 'ring-frame':
        return { ...common, kind, ringWidth: { bottomMm: 75, sidesMm: 50, underDeckMm: null } };
      case 'bulkhead':
        return { ...common, kind };
      case 'partial-bulkhead':
      case 'floor':
        return { ...common, kind, topZ };
      case 'deck-beam':
        return { ...common, kind, mouldedDepthMm: 40 };
      case 'half-beam':
        return { ...common, kind, mouldedDepthMm: 40, inboardEnd: { by: 'half-breadth', yMm: 300 } };
      case 'mould':
        return { ...common, kind, filletClearanceMm: 0 };
      case 'transom':
        return { ...common, kind, rakeRad: 0, pivotZ: 0 };
    }
  })();
  return partSchema.parse(input);
}

/** A new part of `kind` at the first station that has no part yet (or the first station), 12 mm in one layer. */
export function newPart(plan: Plan, kind: AddableKind): Part | null {
  const stations = plan.lines.stations;
  if (stations.length === 0) return null;
  const used = new Set(plan.parts.parts.map((p) => ('stationId' in p ? p.stationId : '')));
  const station = stations.find((s) => !used.has(s.id)) ?? stations[0]!;
  const name = `${partKindLabels[kind]} ${station.name}`.slice(0, 40);
  const id = idFor('pt', name, plan.parts.parts.map((p) => p.id));
  return partOfKind(plan, kind, { id, name, stationId: station.id, thicknessMm: 12, layers: [{ thicknessMm: 12, material: 'plywood', densityKgPerM3: null, joints: { by: 'count', pieces: 1 } }] });
}

/** A new stringer on the hull's chine (or at a height when there is no chine yet). */
export function newLongitudinal(plan: Plan): Longitudinal {
  const chine = plan.lines.lines.find((l) => l.kind === 'point' && l.role === 'chine');
  const name = `Stringer ${plan.parts.longitudinals.length + 1}`;
  return longitudinalSchema.parse({
    id: idFor('lg', name, plan.parts.longitudinals.map((l) => l.id)),
    name,
    kind: 'stringer',
    placement: chine ? { by: 'line', lineId: chine.id, girthOffsetMm: 0 } : { by: 'height', z: 300 },
    widthMm: 25,
    depthMm: 20,
  });
}
