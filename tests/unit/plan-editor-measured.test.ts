import { describe, expect, it } from 'vitest';
import { measuredFramePoints } from '../../shared/geometry/measured';
import { partSchema, type MeasuredFrame } from '../../shared/geometry/part-schema';
import { measuredShapes } from '../../src/features/plan/drawing/measured-shapes';
import { planSchema, type Plan } from '../../shared/geometry/plan-schema';
import {
  bevelSenseOf,
  measuredEntry,
  measuredFrameAdd,
  measuredFrameNew,
  measuredInsertIndex,
  measuredPointAdd,
  measuredPointDelete,
  measuredPointSet,
  measuredReadingOf,
  measuredReadingPoint,
  measuredSettingsSet,
} from '../../src/features/plan/editor/measured-actions';
import { ftin, mm, plan } from './plan-editor-fixtures';

const frameOf = (p: Plan, id: string) => p.parts.parts.find((q) => q.id === id) as MeasuredFrame;
const valid = (p: Plan) => expect(planSchema.safeParse(p).success).toBe(true);
const deg = (d: number) => (d * Math.PI) / 180;

function withFrame(kind: 'offsets' | 'angle-distance' = 'offsets'): { p: Plan; id: string } {
  const base = plan();
  const frame = measuredFrameNew(base, { x: 1500, kind });
  return { p: measuredFrameAdd(base, { frame }), id: frame.id };
}

describe('measuredFrameNew and measuredFrameAdd', () => {
  it('makes a valid measured frame with a new id and adds it, leaving the input plan untouched', () => {
    const base = plan();
    const frozen = JSON.stringify(base);
    const frame = measuredFrameNew(base, { x: 1500, kind: 'offsets' });
    const next = measuredFrameAdd(base, { frame });
    expect(frame.kind).toBe('measured-frame');
    expect(base.parts.parts.map((q) => q.id)).not.toContain(frame.id);
    expect(frameOf(next, frame.id).x).toBe(1500);
    expect(JSON.stringify(base)).toBe(frozen);
    valid(next);
    // Adding it again changes nothing: the id is taken.
    expect(measuredFrameAdd(next, { frame })).toBe(next);
  });
});

describe('measuredEntry', () => {
  it('reads a typed point in the hull notation and appends it', () => {
    const { p, id } = withFrame();
    const r = measuredEntry(p, { partId: id, index: 0, texts: { y: '420', h: '-35.5' } }, mm);
    expect(r.ok).toBe(true);
    const next = (r as { plan: Plan }).plan;
    expect(frameOf(next, id).measurement.points).toEqual([{ y: 420, h: -35.5, bevel: null }]);
    valid(next);
  });

  it('reads feet-inches-eighths as the Lines table does (3-5-2+ is 3 ft 5 5/16 in: notation.ts)', () => {
    const { p, id } = withFrame();
    const r = measuredEntry(p, { partId: id, index: 0, texts: { y: '1-0-0', h: '3-5-2+' } }, ftin);
    expect(r.ok).toBe(true);
    const point = frameOf((r as { plan: Plan }).plan, id).measurement.points[0] as { y: number; h: number };
    expect(point.y).toBeCloseTo(12 * 25.4, 9);
    expect(point.h).toBeCloseTo((3 * 12 + 5 + 5 / 16) * 25.4, 9);
  });

  it('names the point, the field and the text that cannot be read, and gives no plan', () => {
    const { p, id } = withFrame();
    const r = measuredEntry(p, { partId: id, index: 0, texts: { y: '42O', h: '' } }, mm);
    expect(r.ok).toBe(false);
    const errors = (r as { errors: Record<string, string> }).errors;
    expect(errors.y).toMatch(/^Point 1: The offset from the centreline: "42O"/);
    expect(errors.h).toBe('Point 1: Enter the height above the reference line');
  });

  it('changes one field of an existing point and keeps the others', () => {
    const { p, id } = withFrame();
    const one = measuredPointAdd(p, { partId: id, reading: { y: 400, h: 10, bevel: null } });
    const r = measuredEntry(one, { partId: id, index: 0, texts: { h: '12.5' } }, mm);
    expect(frameOf((r as { plan: Plan }).plan, id).measurement.points[0]).toEqual({ y: 400, h: 12.5, bevel: null });
  });

  it('takes a bevel reading in degrees, stores radians, and reads its sense from which side of 90 it is (common practice)', () => {
    const { p, id } = withFrame();
    const r = measuredEntry(p, { partId: id, index: 0, texts: { y: '400', h: '0', bevel: '78' } }, mm);
    const b = (frameOf((r as { plan: Plan }).plan, id).measurement.points[0] as { bevel: { readingRad: number; sense: string } }).bevel;
    expect(b.readingRad).toBeCloseTo(deg(78), 12);
    expect(b.sense).toBe('under');
    expect(bevelSenseOf(101)).toBe('standing');
  });

  it('refuses a bevel reading on the wrong side of 90 for the sense given, and one outside 0 to 180', () => {
    const { p, id } = withFrame();
    const wrong = measuredEntry(p, { partId: id, index: 0, texts: { y: '400', h: '0', bevel: '101', sense: 'under' } }, mm);
    expect(wrong.ok).toBe(false);
    expect((wrong as { errors: Record<string, string> }).errors.sense).toMatch(/101° is more than 90°/);
    const out = measuredEntry(p, { partId: id, index: 0, texts: { y: '400', h: '0', bevel: '190' } }, mm);
    expect((out as { errors: Record<string, string> }).errors.bevel).toMatch(/190° must be more than 0° and less than 180°/);
  });

  it('reads angle-and-distance readings, in degrees, and refuses a negative distance', () => {
    const { p, id } = withFrame('angle-distance');
    const r = measuredEntry(p, { partId: id, index: 0, texts: { side: 'port', angle: '30', distance: '500' } }, mm);
    const point = frameOf((r as { plan: Plan }).plan, id).measurement.points[0] as { side: string; angleRad: number; distanceMm: number };
    expect(point.side).toBe('port');
    expect(point.angleRad).toBeCloseTo(deg(30), 12);
    expect(point.distanceMm).toBe(500);
    const neg = measuredEntry(p, { partId: id, index: 0, texts: { side: 'port', angle: '30', distance: '-5' } }, mm);
    expect((neg as { errors: Record<string, string> }).errors.distance).toMatch(/cannot be negative/);
  });
});

describe('measuredPointSet, measuredPointDelete, measuredSettingsSet', () => {
  it('replaces and deletes readings, and gives the same plan for no change or a wrong index', () => {
    const { p, id } = withFrame();
    const two = measuredPointAdd(measuredPointAdd(p, { partId: id, reading: { y: -400, h: 300, bevel: null } }), { partId: id, reading: { y: 400, h: 300, bevel: null } });
    expect(measuredPointSet(two, { partId: id, index: 0, reading: { y: -400, h: 300, bevel: null } })).toBe(two);
    const moved = measuredPointSet(two, { partId: id, index: 0, reading: { y: -410, h: 300, bevel: null } });
    expect(frameOf(moved, id).measurement.points[0]).toEqual({ y: -410, h: 300, bevel: null });
    expect(measuredPointDelete(moved, { partId: id, index: 5 })).toBe(moved);
    expect(frameOf(measuredPointDelete(moved, { partId: id, index: 0 }), id).measurement.points).toEqual([{ y: 400, h: 300, bevel: null }]);
    // A reading of the other kind is not the frame's: nothing changes.
    expect(measuredPointAdd(two, { partId: id, reading: { side: 'port', angleRad: 0, distanceMm: 1, bevel: null } })).toBe(two);
  });

  it('changes the reference height, the symmetry and the x, and nothing when they are as they were', () => {
    const { p, id } = withFrame();
    const same = measuredSettingsSet(p, { partId: id, x: 1500 });
    expect(same).toBe(p);
    const next = measuredSettingsSet(p, { partId: id, referenceZ: 150, symmetry: 'mirror-port', x: 1490 });
    const f = frameOf(next, id);
    expect(f.measurement.kind === 'offsets' && f.measurement.referenceZ).toBe(150);
    expect(f.symmetry).toBe('mirror-port');
    expect(f.x).toBe(1490);
    valid(next);
  });
});

describe('measuredReadingOf and measuredReadingPoint', () => {
  it('are inverses, and agree with measured.ts measuredFramePoints', () => {
    const angle = { kind: 'angle-distance' as const, origin: { y: 50, z: 800 }, points: [] };
    const offsets = { kind: 'offsets' as const, referenceZ: 200, points: [] };
    for (const m of [angle, offsets]) {
      for (const p of [{ y: 420, z: 150 }, { y: -300, z: 900 }, { y: 50, z: 100 }]) {
        const reading = measuredReadingOf(m, p);
        const back = measuredReadingPoint(m, reading);
        expect(back.y).toBeCloseTo(p.y, 9);
        expect(back.z).toBeCloseTo(p.z, 9);
        const viaGeometry = measuredFramePoints({ ...m, points: [reading] } as never)[0]!;
        expect(viaGeometry.y).toBeCloseTo(p.y, 9);
        expect(viaGeometry.z).toBeCloseTo(p.z, 9);
      }
    }
  });
});

describe('measuredInsertIndex', () => {
  it('puts a point between the neighbours it lengthens the edge least between, or at the nearer end', () => {
    const edge = [{ y: -500, z: 400 }, { y: -400, z: 0 }, { y: 400, z: 0 }, { y: 500, z: 400 }];
    expect(measuredInsertIndex(edge, { y: 0, z: -5 })).toBe(2);
    expect(measuredInsertIndex(edge, { y: 520, z: 500 })).toBe(4);
    expect(measuredInsertIndex(edge, { y: -520, z: 500 })).toBe(0);
    expect(measuredInsertIndex([], { y: 0, z: 0 })).toBe(0);
  });
});

describe('measuredShapes', () => {
  // Analytic case: a V frame read from a level line at 200 mm, its starboard side 10 mm wider at the top
  // than its port side. Mirroring starboard, the port side laid over it stands 10 mm off at the top.
  const frame = (symmetry: MeasuredFrame['symmetry']) =>
    partSchema.parse({
      id: 'm', name: 'M', kind: 'measured-frame', x: 1000, measuredFace: 'aft', thicknessMm: 12, layers: [{ thicknessMm: 12 }], filletClearanceMm: 0, symmetry,
      measurement: { kind: 'offsets', referenceZ: 200, points: [{ y: -400, h: 300 }, { y: 0, h: -200 }, { y: 410, h: 300 }] },
    }) as MeasuredFrame;

  it('numbers the readings at their section-plane points (measured.ts) and keeps both sides as measured', () => {
    const s = measuredShapes(frame('as-measured'), null, null);
    expect(s.readings.map((r) => [r.number, r.at.x, r.at.y])).toEqual([[1, -400, 500], [2, 0, 0], [3, 410, 500]]);
    expect(s.referenceZ).toBe(200);
    expect(s.otherSideMirrored).toBeNull();
    expect(s.maxAsymmetryMm).toBeNull();
  });

  it('lays the side not kept over the kept one, mirrored, and reports how far they differ', () => {
    const s = measuredShapes(frame('mirror-starboard'), null, null);
    expect(s.otherSideMirrored).toEqual([{ x: 400, y: 500 }, { x: 0, y: 0 }]);
    // The asymmetry is measured.ts's own: the largest distance from the kept side to the other mirrored.
    // The kept side's top (410, 500) lies past the end of the other side's line from (0, 0) to (400, 500)
    // (its projection on that line is 646.6 mm along a 640.3 mm line), so the nearest point is that end: 10 mm.
    expect(s.maxAsymmetryMm).toBeCloseTo(10, 6);
  });
});
