import { planSchema, PLAN_SCHEMA_VERSION, type Plan, type PlanInput } from '../../shared/geometry/plan-schema';

/**
 * The demo's plan: an invented 4.9 m hard-chine plywood skiff (keel, chine and sheer as knuckle lines),
 * a ring frame, a bulkhead and a raked transom. Invented for the demo scenario only; it is not a design
 * to build from.
 */
const stations = [
  ['st-0', 'St 0', 350],
  ['st-1', 'St 1', 1000],
  ['st-2', 'St 2', 1650],
  ['st-3', 'St 3', 2300],
  ['st-4', 'St 4', 2950],
  ['st-5', 'St 5', 3600],
  ['st-6', 'St 6', 4250],
  ['st-7', 'St 7', 4900],
] as const;

function pointCells(ys: number[], zs: number[]) {
  return Object.fromEntries(stations.map(([id], i) => [id, { y: ys[i], z: zs[i] }]));
}

const demo: PlanInput = {
  schemaVersion: PLAN_SCHEMA_VERSION,
  lines: {
    notation: { unit: 'mm', precision: '0.5mm' },
    stations: stations.map(([id, name, x]) => ({ id, name, x })),
    lines: [
      { id: 'ln-keel', name: 'Keel', kind: 'point', role: 'keel', knuckle: { fromX: null, toX: null }, cells: pointCells([0, 0, 0, 0, 0, 0, 0, 0], [380, 180, 90, 50, 40, 50, 70, 100]) },
      { id: 'ln-chine', name: 'Chine', kind: 'point', role: 'chine', knuckle: { fromX: null, toX: null }, cells: pointCells([60, 420, 640, 740, 770, 750, 700, 640], [420, 260, 190, 160, 155, 165, 185, 210]) },
      { id: 'ln-sheer', name: 'Sheer', kind: 'point', role: 'sheer', knuckle: { fromX: null, toX: null }, cells: pointCells([80, 560, 800, 900, 930, 910, 860, 800], [1000, 900, 830, 790, 770, 770, 785, 810]) },
    ],
    skin: {
      offsetsTo: 'outside',
      defaultThicknessMm: 6,
      panels: [
        { name: 'Bottom', fromLineId: null, toLineId: 'ln-chine', thicknessMm: 9 },
        { name: 'Sides', fromLineId: 'ln-chine', toLineId: 'ln-sheer', thicknessMm: 6 },
      ],
      sheathingMm: 0,
    },
    deck: { camber: { shape: 'parabola', crown: { kind: 'rise', riseMm: 60, referenceBeamMm: 1860 }, convention: 'one-pattern' }, thicknessMm: 9, beamAt: 'sheer-outside' },
    designWaterlineZ: 280,
  },
  parts: {
    longitudinals: [
      { id: 'lg-chine-log', name: 'Chine log', kind: 'stringer', placement: { by: 'line', lineId: 'ln-chine', girthOffsetMm: 20 }, widthMm: 32, depthMm: 20 },
      { id: 'lg-clamp', name: 'Sheer clamp', kind: 'clamp', placement: { by: 'line', lineId: 'ln-sheer', girthOffsetMm: -25 }, widthMm: 45, depthMm: 20 },
    ],
    parts: [
      {
        id: 'pt-frame-3',
        name: 'Frame 3',
        kind: 'ring-frame',
        stationId: 'st-3',
        thicknessMm: 18,
        layers: [{ thicknessMm: 9, joints: { by: 'count', pieces: 3 } }, { thicknessMm: 9, joints: { by: 'count', pieces: 3 } }],
        ringWidth: { bottomMm: 90, sidesMm: 60, underDeckMm: 70 },
        limbers: [{ girthMm: 60, radiusMm: 15, sides: 'both' }],
      },
      { id: 'pt-bulkhead-5', name: 'Bulkhead 5', kind: 'bulkhead', stationId: 'st-5', thicknessMm: 12, layers: [{ thicknessMm: 12 }] },
      { id: 'pt-transom', name: 'Transom', kind: 'transom', stationId: 'st-7', thicknessMm: 18, layers: [{ thicknessMm: 18 }], rakeRad: (12 * Math.PI) / 180, pivotZ: 100 },
    ],
  },
};

/** The demo plan, parsed (so defaults are filled in as any stored plan has them). */
export function demoPlan(): Plan {
  return planSchema.parse(demo);
}
