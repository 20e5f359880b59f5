import { planSchema, PLAN_SCHEMA_VERSION, type Plan } from '../../shared/geometry/plan-schema';

// Invented offsets for the editor's tests; nothing to build a boat from.
export function plan(): Plan {
  return planSchema.parse({
    schemaVersion: PLAN_SCHEMA_VERSION,
    lines: {
      notation: { unit: 'mm', precision: '0.5mm' },
      stations: [
        { id: 'st-1', name: 'St 1', x: 600 },
        { id: 'st-2', name: 'St 2', x: 1200 },
        { id: 'st-3', name: 'St 3', x: 1800 },
      ],
      lines: [
        { id: 'ln-wl', name: 'WL 300', kind: 'waterline', z: 300, cells: { 'st-1': 300, 'st-2': 450, 'st-3': 500 } },
        { id: 'ln-bt', name: 'Buttock 200', kind: 'buttock', y: 200, cells: { 'st-1': 400, 'st-2': 250 } },
        { id: 'ln-chine', name: 'Chine', kind: 'point', role: 'chine', knuckle: { fromX: null, toX: null }, cells: { 'st-1': { y: 300, z: 250 }, 'st-2': null } },
      ],
      skin: { offsetsTo: 'outside', defaultThicknessMm: 6, panels: [{ name: 'Bottom', fromLineId: null, toLineId: 'ln-chine', thicknessMm: 9 }] },
    },
    parts: {
      longitudinals: [{ id: 'lg-1', name: 'Chine log', kind: 'stringer', placement: { by: 'line', lineId: 'ln-chine' }, widthMm: 30, depthMm: 20 }],
      parts: [
        { id: 'pt-1', name: 'Frame 1', kind: 'bulkhead', stationId: 'st-2', thicknessMm: 12, layers: [{ thicknessMm: 12 }], longitudinalIds: ['lg-1'] },
        { id: 'pt-2', name: 'Mould 3', kind: 'mould', stationId: 'st-3', thicknessMm: 18, layers: [{ thicknessMm: 18 }], carriesIds: ['lg-1'] },
      ],
    },
  });
}

export const mm = { unit: 'mm', decimalComma: false, sixteenthMarks: 'plus-sixteenth', precision: '0.5mm' } as const;
export const ftin = { unit: 'ftin', decimalComma: false, sixteenthMarks: 'plus-sixteenth', precision: '1/16in' } as const;
