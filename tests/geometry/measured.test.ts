import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { measuredEdgeAtDepth, measuredFrameOutline, measuredFramePoints } from '../../shared/geometry/measured';
import { type MeasuredFrame, type PartInput, measurementSchema, partSchema } from '../../shared/geometry/part-schema';
import { polygonArea, polygonSignedArea } from '../../shared/geometry/polygon';
import { GeometryInputError, type SectionPoint, degToRad } from '../../shared/geometry/types';
import { expectClose, expectPointClose } from './helpers';

type MeasuredInput = Extract<PartInput, { kind: 'measured-frame' }>;
const frame = (over: Partial<MeasuredInput> & Pick<MeasuredInput, 'measurement'>): MeasuredFrame => {
  const parsed = partSchema.parse({ kind: 'measured-frame', id: 'm1', name: 'Frame 4 as built', x: 2400, measuredFace: 'forward', thicknessMm: 18, layers: [{ thicknessMm: 18 }], ...over });
  if (parsed.kind !== 'measured-frame') throw new Error('fixture is a measured frame');
  return parsed;
};
/** A sliding bevel reading for bevel b (degrees): 90 - b under, 90 + b standing (common practice, REFERENCES.md). */
const reading = (bDeg: number, sense: 'under' | 'standing') => ({ readingRad: degToRad(sense === 'under' ? 90 - bDeg : 90 + bDeg), sense });
const offsets = (points: { y: number; h: number; bevel?: ReturnType<typeof reading> | null }[], referenceZ = 0) => ({ kind: 'offsets' as const, referenceZ, points });
const samePointSet = (a: SectionPoint[], b: SectionPoint[], tol: number): void => {
  expect(a).toHaveLength(b.length);
  for (const p of b) expect(a.some((q) => Math.hypot(q.y - p.y, q.z - p.z) <= tol), `point (${p.y}, ${p.z}) present`).toBe(true);
};

describe('measuredFramePoints', () => {
  it('reads a circle of radius R from its centre back onto the circle', () => {
    const R = 600;
    const origin = { y: 0, z: 800 };
    const points = [
      ...[0, 10, 20, 30, 40, 50, 60, 70, 80].map((a) => ({ side: 'port' as const, angleRad: degToRad(a), distanceMm: R, bevel: null })),
      ...[90, 80, 70, 60, 50, 40, 30, 20, 10, 0].map((a) => ({ side: 'starboard' as const, angleRad: degToRad(a), distanceMm: R, bevel: null })),
    ];
    const out = measuredFrameOutline(frame({ measurement: { kind: 'angle-distance', origin, points } }));
    // analytic: every point R from the centre
    for (const p of out.outline) expectClose(Math.hypot(p.y - origin.y, p.z - origin.z), R, 1e-9);
    // analytic: angle 90 below the horizontal is straight down; 0 on the starboard side is level, to starboard
    expect(out.outline.some((p) => Math.abs(p.y) < 1e-9 && Math.abs(p.z - 200) < 1e-9)).toBe(true);
    expect(out.outline.some((p) => Math.abs(p.y - 600) < 1e-9 && Math.abs(p.z - 800) < 1e-9)).toBe(true);
    // analytic: the half circle closed across its diameter is 18 triangles of angle 10 deg about the centre
    expectClose(polygonArea(out.outline), 9 * R * R * Math.sin(degToRad(10)), 1e-6);
    expect(polygonSignedArea(out.outline)).toBeGreaterThan(0);
  });

  it('reproduces a trapezoid from offsets and from angle-and-distance readings of the same corners', () => {
    const corners = [{ y: -400, z: 400 }, { y: -250, z: 100 }, { y: 250, z: 100 }, { y: 400, z: 400 }];
    const byOffsets = measuredFramePoints(measurementSchema.parse(offsets(corners.map((c) => ({ y: c.y, h: c.z - 100, bevel: null })), 100)));
    corners.forEach((c, i) => expectPointClose({ y: byOffsets[i]!.y, z: byOffsets[i]!.z }, c, 1e-12, `offset ${i}`));
    // analytic: the readings are computed here from the corners' geometry about an origin above the hull
    const origin = { y: 30, z: 500 };
    const readings = corners.map((c) => {
      const dy = c.y - origin.y;
      return { side: dy >= 0 ? ('starboard' as const) : ('port' as const), angleRad: Math.atan2(origin.z - c.z, Math.abs(dy)), distanceMm: Math.hypot(dy, c.z - origin.z), bevel: null };
    });
    const out = measuredFrameOutline(frame({ measurement: { kind: 'angle-distance', origin, points: readings } }));
    samePointSet(out.outline, corners, 1e-9);
    // analytic: (top + bottom) / 2 * height
    expectClose(polygonArea(out.outline), ((800 + 500) / 2) * 300, 1e-6);
  });

  it('turns a sliding bevel reading into a signed bevel: reading - 90 deg', () => {
    const pts = measuredFramePoints(measurementSchema.parse(offsets([{ y: 0, h: 0, bevel: reading(17, 'under') }, { y: 1, h: 0, bevel: reading(17, 'standing') }, { y: 2, h: 0 }])));
    // common practice: a sliding bevel reads 90 - b (under) or 90 + b (standing)
    expectClose(pts[0]!.bevelRad!, degToRad(-17), 1e-12);
    expectClose(pts[1]!.bevelRad!, degToRad(17), 1e-12);
    expect(pts[2]!.bevelRad).toBeNull();
  });
});

// A box section, invented fixture: port side at y = -520, starboard at +500, bottom at z = 0, sides 400 high.
const boxAsymmetric = offsets([{ y: -520, h: 400 }, { y: -520, h: 0 }, { y: 500, h: 0 }, { y: 500, h: 400 }]);

describe('measuredFrameOutline: symmetry', () => {
  it('keeps an asymmetric measurement asymmetric', () => {
    const out = measuredFrameOutline(frame({ measurement: boxAsymmetric }));
    // analytic: the points as read
    samePointSet(out.outline, [{ y: -520, z: 400 }, { y: -520, z: 0 }, { y: 500, z: 0 }, { y: 500, z: 400 }], 1e-12);
    expect(out.asymmetry).toBeNull();
    expectClose(polygonArea(out.outline), 1020 * 400, 1e-6);
  });

  it('mirrors the starboard side and reports how far port differs at each girth', () => {
    const out = measuredFrameOutline(frame({ measurement: boxAsymmetric, symmetry: 'mirror-starboard' }));
    // analytic: the starboard half mirrored
    samePointSet(out.outline, [{ y: -500, z: 400 }, { y: -500, z: 0 }, { y: 0, z: 0 }, { y: 500, z: 0 }, { y: 500, z: 400 }], 1e-9);
    for (const p of out.outline) expect(out.outline.some((q) => Math.abs(q.y + p.y) < 1e-9 && Math.abs(q.z - p.z) < 1e-9)).toBe(true);
    // analytic: along the bottom (girth <= 500) the sides agree; up the side port is 20 mm further out,
    // so a point g - 500 up the side is min(20, g - 500) from it
    expect(out.asymmetry!.map((a) => a.girthMm)).toEqual([0, 50, 100, 150, 200, 250, 300, 350, 400, 450, 500, 550, 600, 650, 700, 750, 800, 850, 900]);
    for (const a of out.asymmetry!) expectClose(a.differenceMm, a.girthMm <= 500 ? 0 : Math.min(20, a.girthMm - 500), 1e-9, `girth ${a.girthMm}`);
    expectClose(out.maxAsymmetryMm!, 20, 1e-9);
    // the same readings taken starboard to port give the same frame
    const reversed = { ...boxAsymmetric, points: [...boxAsymmetric.points].reverse() };
    const again = measuredFrameOutline(frame({ measurement: reversed, symmetry: 'mirror-starboard' }));
    samePointSet(again.outline, out.outline, 1e-9);
    expect(again.asymmetry).toEqual(out.asymmetry);
    expect(polygonSignedArea(measuredFrameOutline(frame({ measurement: reversed })).outline)).toBeGreaterThan(0);
    const port = measuredFrameOutline(frame({ measurement: boxAsymmetric, symmetry: 'mirror-port' }));
    expectClose(polygonArea(port.outline), 1040 * 400, 1e-6);
  });

  it('mirrors a side measured alone from the keel, with nothing to compare', () => {
    const out = measuredFrameOutline(frame({ measurement: offsets([{ y: 0, h: 0 }, { y: 500, h: 0 }, { y: 500, h: 400 }]), symmetry: 'mirror-starboard' }));
    // analytic
    samePointSet(out.outline, [{ y: -500, z: 400 }, { y: -500, z: 0 }, { y: 0, z: 0 }, { y: 500, z: 0 }, { y: 500, z: 400 }], 1e-12);
    expect(out.asymmetry).toBeNull();
  });

  it('refuses to mirror a side that was not measured, too few points, and points out of order', () => {
    const one = offsets([{ y: 0, h: 0 }, { y: 500, h: 0 }, { y: 500, h: 400 }]);
    expect(() => measuredFrameOutline(frame({ measurement: one, symmetry: 'mirror-port' }))).toThrow(/port side is to be mirrored but no point was measured/);
    expect(() => measuredFrameOutline(frame({ measurement: offsets([{ y: 0, h: 0 }, { y: 1, h: 1 }]) }))).toThrow(GeometryInputError);
    const crossed = offsets([{ y: -500, h: 400 }, { y: 500, h: 0 }, { y: -500, h: 0 }, { y: 500, h: 400 }]);
    expect(() => measuredFrameOutline(frame({ measurement: crossed }))).toThrow(/crosses itself/);
  });
});

// Starboard side points mid-height on a vertical side: the edge normal there is level, outward +y.
const withBevels = (b: ReturnType<typeof reading> | null, mid: ReturnType<typeof reading> | null = b) =>
  offsets([{ y: -500, h: 400, bevel: b }, { y: -500, h: 0, bevel: b }, { y: 500, h: 0, bevel: b }, { y: 500, h: 200, bevel: mid }, { y: 500, h: 400, bevel: b }]);
const midSide = (loop: SectionPoint[]): SectionPoint => loop.find((p) => Math.abs(p.z - 200) < 1e-6)!;

describe('measuredFrameOutline: bevels and layers', () => {
  it('moves the other face in by t tan(b) for an under bevel and out for a standing one', () => {
    // derived (REFERENCES.md): s = 18 mm at 17 deg removes 5.50 mm
    const under = measuredFrameOutline(frame({ measurement: withBevels(reading(17, 'under')) }));
    expectClose(500 - midSide(under.otherFace).y, 5.5, 0.005);
    expectClose(500 - midSide(under.otherFace).y, 18 * Math.tan(degToRad(17)), 1e-9);
    expectClose(midSide(under.otherFace).z, 200, 1e-9);
    const standing = measuredFrameOutline(frame({ measurement: withBevels(reading(17, 'standing')) }));
    expectClose(midSide(standing.otherFace).y - 500, 5.5, 0.005);
    // analytic: under bevels throughout leave the far face the smaller
    expect(polygonArea(under.otherFace)).toBeLessThan(polygonArea(under.outline));
    expect(polygonArea(standing.otherFace)).toBeGreaterThan(polygonArea(standing.outline));
  });

  it('fills a missing reading along the girth between its neighbours', () => {
    const out = measuredFrameOutline(frame({ measurement: withBevels(reading(10, 'under'), null) }));
    // analytic: the unread mid-side point lies between two readings of 10 deg, so it takes 10
    expectClose(500 - midSide(out.otherFace).y, 18 * Math.tan(degToRad(10)), 1e-9);
    const mixed = offsets([{ y: -500, h: 400, bevel: reading(20, 'under') }, { y: -500, h: 0, bevel: reading(20, 'under') }, { y: 500, h: 0, bevel: reading(10, 'under') }, { y: 500, h: 200 }, { y: 500, h: 400, bevel: reading(20, 'under') }]);
    // analytic: halfway in girth between 10 and 20 deg is 15 deg
    expectClose(500 - midSide(measuredFrameOutline(frame({ measurement: mixed })).otherFace).y, 18 * Math.tan(degToRad(15)), 1e-9);
  });

  it('gives each layer its faces at its own depth, stacked from the marked face', () => {
    const b = reading(17, 'under');
    const out = measuredFrameOutline(frame({ measurement: withBevels(b), layers: [{ thicknessMm: 9 }, { thicknessMm: 9 }] }));
    // analytic: auto marks the larger face, here the measured one; layer 2 from 9 to 18 mm deep
    expect(out.markedFace).toBe('forward');
    expect(out.layers.map((l) => [l.nearDepthMm, l.farDepthMm])).toEqual([[0, 9], [9, 18]]);
    expectClose(500 - midSide(out.layers[1]!.near).y, 9 * Math.tan(degToRad(17)), 1e-9);
    expectClose(500 - midSide(out.layers[1]!.far).y, 18 * Math.tan(degToRad(17)), 1e-9);
    expect(out.layers.every((l) => l.cutTo === 'near')).toBe(true);
    // analytic: standing bevels make the other face larger; auto marks it, and the stack starts there
    const st = measuredFrameOutline(frame({ measurement: withBevels(reading(17, 'standing')), layers: [{ thicknessMm: 6 }, { thicknessMm: 12 }] }));
    expect(st.markedFace).toBe('aft');
    expect(st.layers.map((l) => [l.nearDepthMm, l.farDepthMm])).toEqual([[12, 18], [0, 12]]);
    expect(st.layers.every((l) => l.cutTo === 'far')).toBe(true);
  });

  it('mitres a corner so both edges beside it move by depth * tan(b) and stay parallel (analytic)', () => {
    fc.assert(
      fc.property(fc.double({ min: 20, max: 140, noNaN: true }), fc.double({ min: 1, max: 40, noNaN: true }), (turnDeg, bDeg) => {
        // A bottom edge run to starboard, then turning up by `turnDeg` at (0, 0); outward is to the right.
        // Up to 140 degrees: beyond about 151 the mitre limit clips the corner (next test).
        const t = degToRad(turnDeg);
        const bevelRad = degToRad(bDeg);
        const edge = [{ y: -300, z: 0 }, { y: 0, z: 0 }, { y: 300 * Math.cos(t), z: 300 * Math.sin(t) }].map((p) => ({ ...p, bevelRad }));
        const move = 18 * Math.tan(bevelRad);
        const corner = measuredEdgeAtDepth(edge, 18)[1]!;
        // analytic: the moved corner is `move` from both edge lines (the bottom z = 0 and the turned side)
        expectClose(-corner.z, move, 1e-9);
        const distanceFromSide = corner.y * Math.sin(t) - corner.z * Math.cos(t);
        expectClose(distanceFromSide, move, 1e-9);
      }),
    );
  });

  it('clips the mitre of a needle-sharp corner at four times the move', () => {
    // analytic: a 170-degree turn would put the mitred point 1/cos(85 deg) = 11.5 moves away
    const t = degToRad(170);
    const edge = [{ y: -300, z: 0 }, { y: 0, z: 0 }, { y: 300 * Math.cos(t), z: 300 * Math.sin(t) }].map((p) => ({ ...p, bevelRad: degToRad(20) }));
    const corner = measuredEdgeAtDepth(edge, 18)[1]!;
    expectClose(Math.hypot(corner.y, corner.z), 4 * 18 * Math.tan(degToRad(20)), 1e-9);
  });

  it('moves a straight edge parallel to itself by depth * tan(b) for any bevel (analytic)', () => {
    fc.assert(
      fc.property(fc.double({ min: -40, max: 40, noNaN: true }), fc.double({ min: 0, max: 50, noNaN: true }), (bDeg, depth) => {
        const edge = [0, 100, 200, 300].map((y) => ({ y, z: 0, bevelRad: degToRad(bDeg) }));
        // a bottom edge run port to starboard: outward is down (-z)
        const moved = measuredEdgeAtDepth(edge, depth);
        for (let i = 1; i < 3; i++) expectPointClose(moved[i]!, { y: edge[i]!.y, z: -depth * Math.tan(degToRad(bDeg)) }, 1e-9);
      }),
    );
  });
});
