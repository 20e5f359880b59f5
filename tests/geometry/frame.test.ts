import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { frameOfPart, framesOfPlan } from '../../shared/geometry/frame';
import { hullBuild } from '../../shared/geometry/hull';
import { pieceFitsSheet } from '../../shared/geometry/pieces';
import { filletCrossSectionMm2 } from '../../shared/geometry/estimate';
import { planSchema } from '../../shared/geometry/plan-schema';
import { polygonArea, polygonPerimeter } from '../../shared/geometry/polygon';
import { sectionAt } from '../../shared/geometry/section';
import { CHORD_TOLERANCE_MM, type SectionPoint } from '../../shared/geometry/types';
import { demoPlan } from '../../server/seed/demo-plan';
import { chineHull, evenStations, range, roundHull } from './analytic-hulls';
import { built, expectAllFinite, expectProperRegions, longitudinalOf, partOf } from './frame-fixtures';
import { expectClose } from './helpers';

const DEG = Math.PI / 180;
const radiusError = (pts: readonly SectionPoint[], zc: number, R: number, zMax: number): number => {
  let worst = 0;
  pts.forEach((p, i) => {
    const q = pts[(i + 1) % pts.length]!;
    if (p.z > zMax || q.z > zMax) return;
    worst = Math.max(worst, Math.abs(Math.hypot(p.y, p.z - zc) - R), Math.abs(Math.hypot((p.y + q.y) / 2, (p.z + q.z) / 2 - zc) - R));
  });
  return worst;
};

describe('frameOfPart: circular cylinder', () => {
  // Analytic: cylinder R = 1000 about (0, 1100), skin 9 mm, clearance 2 mm (the schema's default), no deck: the
  // frame's edge is the circle R - 11 up to the level line at the sheer, z = 1100 - R cos 110 deg. Prismatic:
  // every bevel is 0 and both faces are the same. Budget 0.05 mm (the chord tolerance).
  const R = 1000;
  const zc = 1100;
  const zTop = zc - R * Math.cos(110 * DEG);
  const hull = hullBuild(roundHull({ xs: evenStations(0, 6000, 10), radius: () => R, centreZ: zc, sheerAngle: 110 * DEG, waterlineZs: range(200, 1400, 100), buttockYs: range(100, 900, 100), skinMm: 9 }));
  const bulkhead = built(frameOfPart(hull, partOf({ id: 'b', name: 'Bulkhead 4', kind: 'bulkhead', stationId: 'st4', thicknessMm: 12, layers: [{ thicknessMm: 12 }] })));

  it('cuts a bulkhead to the circle R - t - c and the level top', () => {
    const outer = bulkhead.layers[0]!.regions[0]!.outer;
    expect(radiusError(outer, zc, R - 11, zTop - 1)).toBeLessThanOrEqual(CHORD_TOLERANCE_MM);
    for (const p of outer) if (p.z > zTop - 1e-6) expectClose(p.z, zTop, 1e-6, 'top');
    // Analytic: the other face is the same circle (bevel 0), 12 mm along x.
    expect(radiusError(bulkhead.layers[0]!.otherFaceRegions[0]!.outer, zc, R - 11, zTop - 1)).toBeLessThanOrEqual(CHORD_TOLERANCE_MM);
    expect(Math.abs(bulkhead.otherFaceX - bulkhead.markedFaceX)).toBeCloseTo(12, 12);
    for (const m of bulkhead.bevelMarks) expect(m.kind).toBe('square');
    expectProperRegions(bulkhead.layers[0]!.regions, 'bulkhead');
  });

  it('cuts a ring frame whose inner edge is the circle R - t - c - w', () => {
    const ring = built(frameOfPart(hull, partOf({ id: 'r', name: 'Frame 4', kind: 'ring-frame', stationId: 'st4', thicknessMm: 18, layers: [{ thicknessMm: 9 }, { thicknessMm: 9 }], ringWidth: { bottomMm: 70, sidesMm: 70 }, innerCornerRadiusMm: 0 })));
    for (const layer of ring.layers) {
      const hole = layer.regions[0]!.holes[0]!;
      expect(radiusError(hole, zc, R - 11 - 70, zTop - 71)).toBeLessThanOrEqual(CHORD_TOLERANCE_MM);
      for (const p of hole) if (p.z > zTop - 70 - 1e-6) expectClose(p.z, zTop - 70, 1e-6, 'under the top bar');
      expectProperRegions([...layer.regions, ...layer.otherFaceRegions], `layer ${layer.index}`);
    }
    // Analytic: one check dimension across the widest part, the centre's height: 2 (R - 11).
    expectClose(ring.checkDimension!.lengthMm, 2 * (R - 11), 2 * CHORD_TOLERANCE_MM, 'check dimension');
    expectClose(ring.checkDimension!.from.z, zc, 1, 'at the centre height');
  });

  it('measures the fillet, tape and mass from the shapes (estimate.ts)', () => {
    const part = partOf({ id: 'b', name: 'Bulkhead 4', kind: 'bulkhead', stationId: 'st4', thicknessMm: 12, layers: [{ thicknessMm: 12 }], fillet: { radiusMm: 15, tapePlies: 1 } });
    const g = built(frameOfPart(hull, part));
    // Analytic: the fillets run along the edge against the skin, both sides: the arc of radius R - 11 from the keel
    // up to where it meets the level top at the sheer's height.
    const joint = 2 * (R - 11) * (Math.PI / 2 + Math.asin((zTop - zc) / (R - 11)));
    // Derived (REFERENCES.md): cove r^2 (1 - pi/4) = 48.29 mm^2 at r = 15; clearance 2 mm x 12 mm filled once.
    expectClose(filletCrossSectionMm2(15), 48.29, 0.005, 'cove r = 15');
    expectClose(g.estimate.fillet!.volumeMl, (joint * (2 * 48.2854 + 2 * 12)) / 1000, 0.05, 'fillet ml');
    expectClose(g.estimate.tape!.lengthMm, 2 * joint, 1, 'tape, both faces, one ply');
    // Common practice: okoume 450 kg/m^3. Mass = area x thickness x density (mm^3 to m^3: 1e-9).
    const area = polygonArea(g.layers[0]!.regions[0]!.outer);
    expectClose(g.estimate.massKg!, area * 12 * 450 * 1e-9, 1e-9, 'mass');
    expectClose(g.estimate.layers[0]!.perimeterMm, polygonPerimeter(g.layers[0]!.regions[0]!.outer), 1e-6, 'perimeter');
  });

  it('takes the published fillet radius for 6 mm ply when none is given (Gougeon 2005, fig. 11-18)', () => {
    const thin = hullBuild(roundHull({ xs: evenStations(0, 6000, 10), radius: () => R, centreZ: zc, sheerAngle: 110 * DEG, waterlineZs: range(200, 1400, 100), buttockYs: range(100, 900, 100), skinMm: 6 }));
    const g = built(frameOfPart(thin, partOf({ id: 'b', name: 'B', kind: 'bulkhead', stationId: 'st4', thicknessMm: 12, layers: [{ thicknessMm: 12 }] })));
    // Published: 6 mm ply, high-density filler: 22 mm; derived cove 103.87 mm^2.
    expect(g.estimate.fillet!.radiusMm).toBe(22);
    expectClose(g.estimate.fillet!.coveMm2PerFace, 103.87, 0.005, 'cove r = 22');
  });
});

describe('frameOfPart: cone (layers at their own x)', () => {
  // Analytic: R(x) = 1000 - k x with k = tan 17 deg about a fixed centre, skin 9 mm, clearance 2 mm. The frame's
  // edge is the circle R(x) - 11 sqrt(1 + k^2) (deduction.test.ts), bevelled 17 deg all round. Each layer is the
  // section at its own x: 18 mm along x the radius is 18 k smaller, which is the wood a bevel of 17 deg removes
  // across 18 mm: s tan(b) = 5.50 mm (REFERENCES.md, derived).
  const k = Math.tan(17 * DEG);
  const zc = 1100;
  const R = (x: number): number => 1000 - k * x;
  // Lines that cross every station (none runs out where the cone narrows), as the section tests have them.
  const hull = hullBuild(roundHull({ xs: evenStations(0, 1200, 12), radius: R, centreZ: zc, sheerAngle: 100 * DEG, waterlineZs: range(500, 1200, 50), buttockYs: range(50, 450, 50), skinMm: 9 }));
  const set = 11 * Math.sqrt(1 + k * k);
  const part = partOf({ id: 'c', name: 'Frame 6', kind: 'bulkhead', stationId: 'st6', thicknessMm: 36, layers: [{ thicknessMm: 18 }, { thicknessMm: 18 }], bevelMarks: { everyMm: 50 } });
  const g = built(frameOfPart(hull, part));

  it('marks the face toward the larger section and stacks the layers toward the smaller one', () => {
    // Analytic: the cone shrinks as x grows, so the larger section is toward smaller x: x grows aft, so forward.
    expect(g.markedFace).toBe('forward');
    expect(g.markedFaceFrom).toBe('auto');
    expect(g.thicknessDirection).toBe(1);
    expect(g.layers.map((l) => [l.faceX, l.otherFaceX])).toEqual([[600, 618], [618, 636]]);
  });

  it('gives each face the circle of its own x, 18 tan 17 deg = 5.50 mm apart', () => {
    const zMax = zc + 100;
    for (const layer of g.layers) {
      expect(radiusError(layer.regions[0]!.outer, zc, R(layer.faceX) - set, zMax), `layer ${layer.index} near`).toBeLessThanOrEqual(CHORD_TOLERANCE_MM);
      expect(radiusError(layer.otherFaceRegions[0]!.outer, zc, R(layer.otherFaceX) - set, zMax), `layer ${layer.index} far`).toBeLessThanOrEqual(CHORD_TOLERANCE_MM);
      expect(layer.largerFace).toBe('near');
    }
    // REFERENCES.md (derived): 18 mm at 17 deg removes 5.50 mm.
    expectClose(R(600) - R(618), 5.5, 0.005, 's tan b');
  });

  it('bevels 17 deg under all round the hull edge, every 50 mm of girth, both sides', () => {
    const hullMarks = g.bevelMarks.filter((m) => m.edge === 'hull');
    expect(hullMarks.length).toBeGreaterThan(40);
    for (const m of hullMarks) {
      expectClose(m.bevelDeg, 17, 0.05, `bevel at girth ${m.girthMm}`);
      expect(m.kind).toBe('under');
      // Common practice: a sliding bevel reads 90 - b for an under bevel; removed across the 36 mm siding 36 tan b.
      expectClose(m.slidingBevelDeg, 73, 0.05, 'sliding bevel');
      expectClose(m.removedMm, 36 * k, 0.02, 'removed');
      expect(m.overLimit).toBe(false);
    }
    const star = hullMarks.filter((m) => m.side === 'starboard' && !m.corner).map((m) => m.girthMm);
    const port = hullMarks.filter((m) => m.side === 'port' && !m.corner).map((m) => m.girthMm);
    expect(star.slice(0, 4)).toEqual([0, 50, 100, 150]);
    expect(port.slice(0, 4)).toEqual([0, -50, -100, -150]);
  });

  it('warns where the tilt passes the saw limit', () => {
    const steep = partOf({ ...part, bevelMarks: { everyMm: 50, sawTiltLimitRad: 15 * DEG } });
    const s = built(frameOfPart(hull, steep));
    expect(s.bevelMarks.filter((m) => m.edge === 'hull').every((m) => m.overLimit)).toBe(true);
    const w = s.warnings.find((x) => x.code === 'bevel-past-saw-limit');
    expect(w?.message).toMatch(/15\.0 degrees/);
    expect(w?.partId).toBe('c');
  });
});

describe('frameOfPart: flat bottom, flared sides', () => {
  // Analytic: bottom z = 0 to the chine y = 600, side y = 600 + 0.2 z to the sheer at z = 500, bottom 12 mm,
  // sides 9 mm, clearance 2 mm, prismatic: the frame's bottom z = 14, side y - 0.2 z = 600 - 11 sqrt(1.04).
  const f = 0.2;
  const k = Math.sqrt(1 + f * f);
  const lines = chineHull({ xs: evenStations(0, 3000, 6), chineY: () => 600, flare: f, sheerZ: 500, waterlineZs: [100, 300], bottomMm: 12, sideMm: 9 });
  const hull = hullBuild(lines);
  const sideLine = (p: SectionPoint): number => Math.abs(Math.abs(p.y) - f * p.z - (600 - 11 * k)) / k;

  it('puts limbers on the outer edge at their girth from the centreline, both sides', () => {
    const g = built(frameOfPart(hull, partOf({ id: 'f', name: 'Floor 3', kind: 'floor', stationId: 'st3', topZ: 200, thicknessMm: 12, layers: [{ thicknessMm: 12 }], limbers: [{ girthMm: 150, radiusMm: 20 }] })));
    // Analytic: 150 mm along the bottom edge (z = 14) from the centreline.
    expect(g.limbers.map((l) => [l.side, l.centre.y, l.centre.z, l.girthMm])).toEqual([
      ['port', -150, 14, -150],
      ['starboard', 150, 14, 150],
    ]);
    // The cut follows a circle of radius 20 about each centre (within the chord tolerance, never inside it).
    const outer = g.layers[0]!.regions[0]!.outer;
    const around = outer.filter((p) => Math.hypot(p.y - 150, p.z - 14) < 25 && p.z > 14 + 1e-3);
    expect(around.length).toBeGreaterThan(8);
    for (const p of around) {
      const d = Math.hypot(p.y - 150, p.z - 14);
      expect(d).toBeGreaterThanOrEqual(20 - 1e-3);
      expect(d).toBeLessThanOrEqual(20 + CHORD_TOLERANCE_MM + 1e-3);
    }
    // The floor is cut level at 200 mm, the rest lies on the bottom and side lines.
    for (const p of outer) if (Math.hypot(Math.abs(p.y) - 150, p.z - 14) > 21) expect(Math.min(Math.abs(p.z - 14), Math.abs(p.z - 200), sideLine(p))).toBeLessThanOrEqual(1e-3);
    expectProperRegions(g.layers[0]!.regions, 'floor');
  });

  it('cuts a deck beam to the camber less the deck, its depth plumb below, tapered to the ends', () => {
    // Analytic: parabolic camber, 50 mm rise over a 2000 mm reference beam, one pattern: at the station (half-beam
    // 700 at the sheer) the deck top is z = 500 + 50 (700^2 - y^2) / 1000^2. Deck 9 mm + clearance 2 mm set in
    // normal to it (a parallel curve); depth 80 mm at the centreline, straight to 40 mm at the side from half-way.
    const decked = hullBuild({ ...lines, deck: { camber: { shape: 'parabola', crown: { kind: 'rise', riseMm: 50, referenceBeamMm: 2000 } }, thicknessMm: 9 } });
    const g = built(frameOfPart(decked, partOf({ id: 'd', name: 'Beam 3', kind: 'deck-beam', stationId: 'st3', thicknessMm: 40, layers: [{ thicknessMm: 40, material: 'timber', densityKgPerM3: 500 }], mouldedDepthMm: 80, taper: { endDepthMm: 40, fromFraction: 0.5 } })));
    const deckZ = (y: number): number => 500 + (50 * (700 * 700 - y * y)) / 1e6;
    const deckDistance = (p: SectionPoint): number => {
      // Distance from p to the parabola, by golden-section search on y near p.
      let a = p.y - 30;
      let b = p.y + 30;
      const d = (y: number): number => Math.hypot(p.y - y, p.z - deckZ(y));
      for (let i = 0; i < 80; i++) {
        const m1 = b - (b - a) * 0.618;
        const m2 = a + (b - a) * 0.618;
        if (d(m1) < d(m2)) b = m2;
        else a = m1;
      }
      return d((a + b) / 2);
    };
    const outer = g.layers[0]!.regions[0]!.outer;
    const hb = outer.reduce((m, p) => Math.max(m, p.y), 0);
    const depth = (y: number): number => (Math.abs(y) <= hb / 2 ? 80 : 80 - (40 * (Math.abs(y) - hb / 2)) / (hb / 2));
    let top = 0;
    let bottom = 0;
    for (const p of outer) {
      const onTop = Math.abs(deckDistance(p) - 11) <= CHORD_TOLERANCE_MM;
      const onBottom = Math.abs(deckDistance({ y: p.y, z: p.z + depth(p.y) }) - 11) <= 0.1;
      const onSide = sideLine(p) <= 1e-3;
      expect(onTop || onBottom || onSide, `(${p.y.toFixed(2)}, ${p.z.toFixed(2)})`).toBe(true);
      if (onTop) top++;
      if (onBottom) bottom++;
    }
    expect(top).toBeGreaterThan(10);
    expect(bottom).toBeGreaterThan(10);
    // Analytic: at the centreline the beam's top is the crown less 11 mm and its bottom 80 mm below.
    const centre = outer.filter((p) => Math.abs(p.y) < 1e-9).map((p) => p.z).sort((a, b) => a - b);
    expectClose(centre[1]!, deckZ(0) - 11, 1e-6, 'top at the centreline');
    expectClose(centre[0]!, deckZ(0) - 11 - 80, 1e-6, 'bottom at the centreline');
    // Mass from area x thickness x the stated density.
    expectClose(g.estimate.massKg!, polygonArea(outer) * 40 * 500 * 1e-9, 1e-9, 'beam mass');
  });

  it('cuts a pair of half beams from the side in to a carlin', () => {
    const decked = hullBuild({ ...lines, deck: { camber: { shape: 'parabola', crown: { kind: 'rise', riseMm: 50, referenceBeamMm: 2000 } }, thicknessMm: 9 } });
    const carlin = longitudinalOf({ id: 'cl', name: 'Carlin', kind: 'carlin', placement: { by: 'half-breadth', y: 300 }, widthMm: 50, depthMm: 40, against: 'deck' });
    const g = built(frameOfPart(decked, partOf({ id: 'h', name: 'Half beams 3', kind: 'half-beam', stationId: 'st3', thicknessMm: 30, layers: [{ thicknessMm: 30 }], mouldedDepthMm: 60, inboardEnd: { by: 'carlin', carlinId: 'cl' }, longitudinalIds: [] }), [carlin]));
    const regions = g.layers[0]!.regions;
    expect(regions).toHaveLength(2);
    // Analytic: each ends at the carlin's outboard face, 300 + 25 mm out, with a plumb end cut.
    const ys = regions.map((r) => Math.min(...r.outer.map((p) => Math.abs(p.y))));
    for (const y of ys) expectClose(y, 325, 1e-6, 'inboard end');
    expect(regions.map((r) => Math.sign(r.outer[0]!.y)).sort()).toEqual([-1, 1]);
    expectProperRegions(regions, 'half beams');
  });

  it('sets a building mould in by the skin and the depth of the stringers it carries', () => {
    const ribband = longitudinalOf({ id: 'rb', name: 'Ribband', kind: 'ribband', placement: { by: 'girth', girthMm: 300 }, widthMm: 45, depthMm: 19 });
    const g = built(frameOfPart(hull, partOf({ id: 'm', name: 'Mould 3', kind: 'mould', stationId: 'st3', thicknessMm: 18, layers: [{ thicknessMm: 18 }], carriesIds: ['rb'] }), [ribband]));
    // Analytic: no clearance on a mould (schema default 0): the bottom at 12 + 19, the side 9 + 19 in normal to it.
    const outer = g.layers[0]!.regions[0]!.outer;
    for (const p of outer) {
      const side = Math.abs(Math.abs(p.y) - f * p.z - (600 - 28 * k)) / k;
      expect(Math.min(Math.abs(p.z - 31), Math.abs(p.z - 500), side), `(${p.y}, ${p.z})`).toBeLessThanOrEqual(1e-6);
    }
    // A mould carries no fillet and is not notched for what it carries.
    expect(g.estimate.fillet).toBeNull();
    expect(g.notches).toHaveLength(0);
  });
});

describe('frameOfPart: notches', () => {
  // Analytic: a box (flat bottom z = 0, vertical sides at y = 600, prismatic) with a stringer run along a line on
  // the bottom that moves out 0.1 mm per mm of x: y = 100 + 0.1 x. Skin 12 mm, clearance 2 mm. The stringer
  // (40 x 20) crosses every station at atan(0.1); the surface does not move (rate 0), so tan(phi) = 0.1
  // (notch.ts's note) and the notch is 40 / cos(atan 0.1) = 40 sqrt(1.01) along the edge, its floor 12 + 20 mm
  // above the moulded bottom, 20 - 2 below the frame's edge.
  const xs = evenStations(0, 3000, 6);
  const base = chineHull({ xs, chineY: () => 600, flare: 0, sheerZ: 500, waterlineZs: [100, 300], bottomMm: 12, sideMm: 12 });
  const lines = { ...base, lines: [...base.lines, { id: 'run', name: 'Stringer line', kind: 'point' as const, role: 'other' as const, cells: Object.fromEntries(xs.map((x, i) => [`st${i}`, { y: 100 + 0.1 * x, z: 0 }])) }] };
  const hull = hullBuild(lines);
  const stringer = longitudinalOf({ id: 's', name: 'Bottom stringer', kind: 'stringer', placement: { by: 'line', lineId: 'run' }, widthMm: 40, depthMm: 20 });
  const part = partOf({ id: 'n', name: 'Bulkhead 3', kind: 'bulkhead', stationId: 'st3', thicknessMm: 24, layers: [{ thicknessMm: 12 }, { thicknessMm: 12 }] });
  const g = built(frameOfPart(hull, part, [stringer]));

  it('cuts each face where the stringer is at that face, widened by the crossing angle', () => {
    expect(g.notches.map((n) => n.side)).toEqual(['starboard', 'port']);
    const n = g.notches[0]!;
    expectClose(n.crossingAngleRad, Math.atan(0.1), 1e-9, 'crossing angle');
    expectClose(n.widthMm, 40 * Math.sqrt(1.01), 1e-9, 'width along the edge');
    expectClose(n.depthMm, 18, 1e-9, 'depth below the edge');
    for (const layer of g.layers) {
      for (const [x, regions] of [[layer.faceX, layer.regions], [layer.otherFaceX, layer.otherFaceRegions]] as const) {
        const yc = 100 + 0.1 * x;
        const outer = regions[0]!.outer;
        // Analytic: the notch's sides at yc +- 20 sqrt(1.01), floor at z = 32, the frame's bottom at z = 14.
        const floor = outer.filter((p) => Math.abs(p.z - 32) < 1e-3 && p.y > 0).map((p) => p.y).sort((a, b) => a - b);
        expect(floor, `face at x = ${x}`).toHaveLength(2);
        expectClose(floor[0]!, yc - 20 * Math.sqrt(1.01), 2e-3, 'inboard side');
        expectClose(floor[1]!, yc + 20 * Math.sqrt(1.01), 2e-3, 'outboard side');
      }
    }
    // The notch centre on the template: on the skin's inside (z = 12), at the marked face's x.
    expectClose(g.marks.notchCentres[0]!.y, 100 + 0.1 * g.markedFaceX, 1e-9, 'centre y');
    expectClose(g.marks.notchCentres[0]!.z, 12, 1e-9, 'centre z');
  });

  it('refuses a notch deeper than a ring frame is wide, naming the longitudinal', () => {
    const deep = longitudinalOf({ ...stringer, depthMm: 60 });
    const r = frameOfPart(hull, partOf({ id: 'rf', name: 'Frame 3', kind: 'ring-frame', stationId: 'st3', thicknessMm: 12, layers: [{ thicknessMm: 12 }], ringWidth: { bottomMm: 50, sidesMm: 50 } }), [deep]);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.issues[0]!.code).toBe('notch-wider-than-part');
    expect(r.issues[0]!.message).toMatch(/^part "Frame 3" \(rf\): the notch for stringer "Bottom stringer" \(s\) is 58\.0 mm deep/);
    expect(r.issues[0]!.partId).toBe('rf');
  });

  it('refuses a notch that cuts a part in two', () => {
    // A floor 30 mm high over a 20 mm stringer notch 40 mm long cuts... not through; a 60 mm deep stringer does.
    const deep = longitudinalOf({ ...stringer, depthMm: 60 });
    const r = frameOfPart(hull, partOf({ id: 'fl', name: 'Floor 3', kind: 'floor', stationId: 'st3', topZ: 50, thicknessMm: 12, layers: [{ thicknessMm: 12 }] }), [deep]);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues.map((i) => i.code)).toEqual(['notch-wider-than-part']);
  });
});

describe('frameOfPart: layers, joints and sheets', () => {
  const R = 1000;
  const hull = hullBuild(roundHull({ xs: evenStations(0, 6000, 10), radius: () => R, centreZ: 1100, sheerAngle: 110 * DEG, waterlineZs: range(200, 1400, 100), buttockYs: range(100, 900, 100), skinMm: 9 }));

  it('staggers the joints of neighbouring layers by at least the stated distance', () => {
    const part = partOf({
      id: 'r',
      name: 'Frame 4',
      kind: 'ring-frame',
      stationId: 'st4',
      thicknessMm: 27,
      layers: [{ thicknessMm: 9, joints: { by: 'count', pieces: 3 } }, { thicknessMm: 9, joints: { by: 'count', pieces: 3 } }, { thicknessMm: 9, joints: { by: 'count', pieces: 4 } }],
      ringWidth: { bottomMm: 80, sidesMm: 80 },
      jointing: { minStaggerMm: 200 },
    });
    const g = built(frameOfPart(hull, part));
    const perimeter = polygonPerimeter(g.layers[0]!.regions[0]!.outer);
    const gap = (a: number, b: number): number => {
      const d = Math.abs(a - b) % perimeter;
      return Math.min(d, perimeter - d);
    };
    expect(g.layers.map((l) => l.pieces.joints.length)).toEqual([3, 3, 4]);
    for (let i = 0; i + 1 < g.layers.length; i++) {
      for (const a of g.layers[i]!.pieces.joints) for (const b of g.layers[i + 1]!.pieces.joints) expect(gap(a.girthMm, b.girthMm), `layers ${i} and ${i + 1}`).toBeGreaterThanOrEqual(200 - 1e-6);
    }
    // Each layer's pieces add up to the layer (less the joint cuts, 2 micrometres wide).
    for (const l of g.layers) {
      const pieces = l.pieces.pieces.reduce((a, p) => a + polygonArea(p.outer) - p.holes.reduce((h, q) => h + polygonArea(q), 0), 0);
      const whole = polygonArea(l.regions[0]!.outer) - polygonArea(l.regions[0]!.holes[0]!);
      expectClose(pieces, whole, 5, `layer ${l.index} pieces`);
    }
  });

  it('splits a piece larger than the sheet at a butt block, every piece fitting the sheet', () => {
    // Analytic: the bulkhead is about 1980 x 1330 mm; a 1220 x 1220 sheet cannot hold it either way round.
    const part = partOf({ id: 'b', name: 'Bulkhead 4', kind: 'bulkhead', stationId: 'st4', thicknessMm: 12, layers: [{ thicknessMm: 12 }], jointing: { sheet: { widthMm: 1220, lengthMm: 1220 } } });
    const g = built(frameOfPart(hull, part));
    const p = g.layers[0]!.pieces;
    expect(p.pieces.length).toBeGreaterThan(1);
    for (const piece of p.pieces) expect(pieceFitsSheet(piece, { widthMm: 1220, lengthMm: 1220 })).toBe(true);
    expect(p.buttJoints.length).toBeGreaterThan(0);
    expect(p.buttBlocks.length).toBe(p.buttJoints.length);
  });
});

describe('frameOfPart: clear errors naming the part, field and value', () => {
  const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 6), chineY: () => 600, flare: 0.2, sheerZ: 500, waterlineZs: [100, 300], bottomMm: 12, sideMm: 9 }));
  const ring = { id: 'r1', name: 'Frame 2', kind: 'ring-frame' as const, stationId: 'st2', thicknessMm: 18, layers: [{ thicknessMm: 18 }], ringWidth: { bottomMm: 60, sidesMm: 40 }, innerCornerRadiusMm: 10 };

  it('a clearance as large as the ring width', () => {
    // The schema refuses it; a part built in code reaches frameOfPart all the same and is refused there too.
    const part = { ...partOf(ring), filletClearanceMm: 45 };
    const r = frameOfPart(hull, part);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const i = r.issues.find((x) => x.code === 'clearance-wider-than-ring')!;
    expect(i).toMatchObject({ partId: 'r1', field: 'filletClearanceMm', value: 45 });
    expect(i.message).toBe('part "Frame 2" (r1): the fillet clearance of 45 mm is not less than the ring width (sidesMm) of 40 mm');
  });

  it('a layer thicker than the station spacing', () => {
    // Stations are 500 mm apart: 600 mm of frame would reach past the next one. The hull is prismatic, so the
    // marked face is the one toward the middle of its length (x = 1500): the frame runs from x = 1000 toward station 1.
    const r = frameOfPart(hull, partOf({ ...ring, thicknessMm: 610, layers: [{ thicknessMm: 10 }, { thicknessMm: 600 }] }));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.issues[0]).toMatchObject({ code: 'thicker-than-station-spacing', field: 'layers.1.thicknessMm', path: ['layers', 1, 'thicknessMm'], value: 600, partId: 'r1' });
    expect(r.issues[0]!.message).toMatch(/^part "Frame 2" \(r1\): layer 2 reaches 610 mm from the marked face on station 2, past the next station 1 500\.0 mm away$/);
  });

  it('a station that does not exist', () => {
    const r = frameOfPart(hull, partOf({ ...ring, stationId: 'st99' }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues).toEqual([{ code: 'part-station', message: 'part "Frame 2" (r1): station "st99" is not a station of the hull', partId: 'r1', stationId: 'st99', field: 'stationId', path: ['stationId'], value: 'st99' }]);
  });

  it('a hull that does not reach the other face', () => {
    // The last station is at x = 3000; marking the forward face there sends the frame aft, past the lines.
    const r = frameOfPart(hull, partOf({ ...ring, stationId: 'st6', markedFace: 'forward' }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'hull-does-not-reach', field: 'thicknessMm', value: 18 });
    // Left to itself (auto) the frame is marked on its aft face instead and said so.
    const auto = built(frameOfPart(hull, partOf({ ...ring, stationId: 'st6' })));
    expect(auto.otherFaceX).toBe(2982);
  });
});

describe('framesOfPlan', () => {
  it('builds every part of the demo skiff, each loop proper, no number out of place', () => {
    const out = framesOfPlan(demoPlan());
    expect(out.hullIssues).toEqual([]);
    expect(out.planIssues).toEqual([]);
    expect(out.parts.map((p) => [p.partId, p.ok])).toEqual([['pt-frame-3', true], ['pt-bulkhead-5', true], ['pt-transom', true]]);
    for (const r of out.parts) {
      const g = built(r);
      for (const l of g.layers) expectProperRegions([...l.regions, ...l.otherFaceRegions, ...l.pieces.pieces], `${g.partId} layer ${l.index}`);
      expectAllFinite(g, g.partId);
      expect(JSON.parse(JSON.stringify(g))).toEqual(g);
    }
    // The hull's totals are the sums of the parts'.
    const parts = out.parts.map((r) => built(r));
    expectClose(out.estimate.massKg, parts.reduce((a, p) => a + p.estimate.massKg!, 0), 1e-9, 'mass');
    expect(out.estimate.parts).toBe(3);
  });

  it('still builds the other parts when one cannot be built', () => {
    const plan = demoPlan();
    const broken = planSchema.parse({ ...plan, parts: { ...plan.parts, parts: plan.parts.parts.map((p) => (p.id === 'pt-frame-3' ? { ...p, stationId: 'st-1', ringWidth: { bottomMm: 900, sidesMm: 900 } } : p)) } });
    const out = framesOfPlan(broken);
    expect(out.parts.map((p) => p.ok)).toEqual([false, true, true]);
    const failed = out.parts[0]!;
    if (!failed.ok) {
      expect(failed.issues[0]!.code).toBe('ring-too-wide');
      expect(failed.issues[0]!.message).toMatch(/^part "Frame 3" \(pt-frame-3\): the ring widths leave no/);
    }
    expect(out.estimate.parts).toBe(2);
  });
});


// ---------------------------------------------------------------------------------------------------
// Property tests (fast-check): random hulls from the analytic families and random valid parts on them.

const hullArb = fc.oneof(
  fc.record({
    family: fc.constant('chine' as const),
    chineY: fc.double({ min: 300, max: 900, noNaN: true }),
    taper: fc.double({ min: -0.04, max: 0.04, noNaN: true }),
    flare: fc.double({ min: -0.1, max: 0.5, noNaN: true }),
    sheerZ: fc.double({ min: 350, max: 900, noNaN: true }),
    bottomMm: fc.integer({ min: 0, max: 15 }),
    sideMm: fc.integer({ min: 0, max: 12 }),
    rise: fc.option(fc.integer({ min: 0, max: 60 }), { nil: null }),
  }),
  fc.record({
    family: fc.constant('round' as const),
    R0: fc.double({ min: 600, max: 1200, noNaN: true }),
    k: fc.double({ min: -0.03, max: 0.03, noNaN: true }),
    sheerDeg: fc.double({ min: 100, max: 115, noNaN: true }),
    skinMm: fc.integer({ min: 0, max: 12 }),
  }),
);
type HullSpec = typeof hullArb extends fc.Arbitrary<infer T> ? T : never;

function hullOfSpec(h: HullSpec) {
  const xs = evenStations(0, 4000, 8);
  if (h.family === 'chine') {
    const lines = chineHull({ xs, chineY: (x) => h.chineY - h.taper * (x - 2000), flare: h.flare, sheerZ: h.sheerZ, waterlineZs: [Math.round(h.sheerZ / 3), Math.round((2 * h.sheerZ) / 3)], bottomMm: h.bottomMm, sideMm: h.sideMm });
    const widest = h.chineY + Math.abs(h.taper) * 2000 + Math.max(0, h.flare) * h.sheerZ;
    return hullBuild(h.rise === null ? lines : { ...lines, deck: { camber: { shape: 'parabola', crown: { kind: 'rise', riseMm: h.rise, referenceBeamMm: 2 * widest + 200 } }, thicknessMm: 9 } });
  }
  const rMin = h.R0 - Math.abs(h.k) * 4000;
  const zc = h.R0 + 200;
  const R = (x: number): number => h.R0 - h.k * (x - 2000);
  return hullBuild(roundHull({ xs, radius: R, centreZ: zc, sheerAngle: h.sheerDeg * DEG, waterlineZs: range(Math.round(zc - 0.75 * rMin), Math.round(zc + 0.15 * rMin), 50), buttockYs: range(50, Math.round(0.6 * rMin), 50), skinMm: h.skinMm }));
}

const layersArb = fc.array(fc.constantFrom(6, 9, 12), { minLength: 1, maxLength: 3 });
const partArb = fc.record({
  kind: fc.constantFrom('ring-frame', 'bulkhead', 'floor', 'partial-bulkhead', 'mould', 'deck-beam'),
  station: fc.integer({ min: 1, max: 7 }),
  layers: layersArb,
  clearance: fc.double({ min: 0, max: 3, noNaN: true }),
  bottom: fc.integer({ min: 40, max: 120 }),
  sides: fc.integer({ min: 30, max: 100 }),
  underDeck: fc.option(fc.integer({ min: 30, max: 100 }), { nil: null }),
  radiusFraction: fc.double({ min: 0, max: 0.45, noNaN: true }),
  top: fc.constantFrom('deck' as const, 'open' as const),
  topFraction: fc.double({ min: 0.2, max: 0.8, noNaN: true }),
  limber: fc.option(fc.record({ girth: fc.integer({ min: 20, max: 200 }), radius: fc.integer({ min: 5, max: 20 }) }), { nil: null }),
  stringers: fc.array(fc.record({ girth: fc.integer({ min: 100, max: 600 }), width: fc.integer({ min: 20, max: 40 }), depth: fc.integer({ min: 10, max: 25 }) }), { maxLength: 2 }),
  marked: fc.constantFrom('auto' as const, 'forward' as const, 'aft' as const),
});
type PartSpec = typeof partArb extends fc.Arbitrary<infer T> ? T : never;

function partOfSpec(p: PartSpec, hull: ReturnType<typeof hullOfSpec>) {
  const st = hull.stations[p.station]!;
  const s = sectionAt(hull, st.x)!;
  const zs = s.vertices.map((v) => v.z);
  const zLow = Math.min(...zs);
  const zHigh = Math.max(...zs);
  const base = {
    id: 'p',
    name: 'Random part',
    stationId: st.id,
    markedFace: p.marked,
    thicknessMm: p.layers.reduce((a, t) => a + t, 0),
    layers: p.layers.map((t) => ({ thicknessMm: t })),
    filletClearanceMm: p.clearance,
    limbers: p.limber ? [{ girthMm: p.limber.girth, radiusMm: p.limber.radius }] : [],
  };
  const widths = [p.bottom, p.sides, p.underDeck ?? p.sides];
  switch (p.kind) {
    case 'ring-frame':
      return partOf({ ...base, kind: 'ring-frame', ringWidth: { bottomMm: p.bottom, sidesMm: p.sides, underDeckMm: p.underDeck }, innerCornerRadiusMm: Math.floor(p.radiusFraction * Math.min(...widths)), top: p.top });
    case 'floor':
    case 'partial-bulkhead':
      return partOf({ ...base, kind: p.kind, topZ: zLow + p.topFraction * (zHigh - zLow) });
    case 'deck-beam':
      return partOf({ ...base, kind: 'deck-beam', limbers: [], mouldedDepthMm: 40 + 40 * p.topFraction, taper: { endDepthMm: 30, fromFraction: 0.5 } });
    default:
      return partOf({ ...base, kind: p.kind });
  }
}

/** Codes a random valid part may still be refused with: the geometry of that hull cannot take it (never a crash). */
const GEOMETRY_REFUSALS = new Set(['ring-too-wide', 'notch-wider-than-part', 'hole-through-part', 'limber-wider-than-ring', 'hull-does-not-reach', 'limber-off-edge', 'beam-misses-side', 'top-below-keel', 'part-cut-away']);

describe('frameOfPart: properties over random hulls and parts (fast-check)', () => {
  it('every loop is closed and simple, holes inside their outer loop, no NaN anywhere; refusals are clear', () => {
    fc.assert(
      fc.property(hullArb, partArb, (h, p) => {
        const hull = hullOfSpec(h);
        const part = partOfSpec(p, hull);
        const longs = p.stringers.map((s, i) => longitudinalOf({ id: `s${i}`, name: `Stringer ${i + 1}`, kind: 'stringer', placement: { by: 'girth', girthMm: s.girth }, widthMm: s.width, depthMm: s.depth }));
        const r = frameOfPart(hull, part, longs);
        if (!r.ok) {
          expect(r.issues.length).toBeGreaterThan(0);
          for (const i of r.issues) {
            expect(GEOMETRY_REFUSALS.has(i.code), `${i.code}: ${i.message}`).toBe(true);
            expect(i.message.startsWith('part "Random part" (p): ')).toBe(true);
            expect(i.partId).toBe('p');
          }
          return;
        }
        const g = r.part;
        for (const l of g.layers) expectProperRegions([...l.regions, ...l.otherFaceRegions, ...l.pieces.pieces], `layer ${l.index}`);
        expectAllFinite(g);
        expect(g.bevelMarks.length).toBeGreaterThan(0);
      }),
      { numRuns: 40, seed: 20240611 },
    );
  }, 120_000);

  it('refuses a clearance as large as the narrowest ring width, naming the field and value', () => {
    fc.assert(
      fc.property(fc.integer({ min: 20, max: 80 }), fc.integer({ min: 0, max: 30 }), (w, extra) => {
        const hull = hullOfSpec({ family: 'chine', chineY: 600, taper: 0, flare: 0.2, sheerZ: 500, bottomMm: 9, sideMm: 6, rise: null });
        const part = { ...partOf({ id: 'p', name: 'Ring', kind: 'ring-frame', stationId: 'st4', thicknessMm: 12, layers: [{ thicknessMm: 12 }], ringWidth: { bottomMm: w + 50, sidesMm: w }, innerCornerRadiusMm: 0 }), filletClearanceMm: w + extra };
        const r = frameOfPart(hull, part);
        expect(r.ok).toBe(false);
        if (!r.ok) expect(r.issues.find((i) => i.code === 'clearance-wider-than-ring')).toMatchObject({ field: 'filletClearanceMm', value: w + extra, partId: 'p' });
      }),
      { numRuns: 20, seed: 7 },
    );
  });

  it('refuses a notch at least as deep as the ring, and a frame thicker than the station spacing', () => {
    fc.assert(
      fc.property(fc.integer({ min: 30, max: 80 }), fc.integer({ min: 0, max: 40 }), fc.integer({ min: 1, max: 200 }), (w, over, thick) => {
        const hull = hullOfSpec({ family: 'chine', chineY: 600, taper: 0, flare: 0.2, sheerZ: 500, bottomMm: 9, sideMm: 6, rise: null });
        const ring = { id: 'p', name: 'Ring', kind: 'ring-frame' as const, stationId: 'st4', thicknessMm: 12, layers: [{ thicknessMm: 12 }], ringWidth: { bottomMm: w, sidesMm: w }, innerCornerRadiusMm: 0, filletClearanceMm: 2 };
        // Depth below the frame's edge (depth - clearance) at least the ring width: it would cut the frame through.
        const lg = longitudinalOf({ id: 's', name: 'Deep', kind: 'stringer', placement: { by: 'girth', girthMm: 300 }, widthMm: 30, depthMm: w + 2 + over });
        const r = frameOfPart(hull, partOf(ring), [lg]);
        expect(r.ok).toBe(false);
        if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'notch-wider-than-part', partId: 'p' });
        // Stations are 500 mm apart: a frame of 500 + thick mm passes the next.
        const t = 500 + thick;
        const r2 = frameOfPart(hull, partOf({ ...ring, thicknessMm: t, layers: [{ thicknessMm: t }] }));
        expect(r2.ok).toBe(false);
        if (!r2.ok) expect(r2.issues[0]).toMatchObject({ code: 'thicker-than-station-spacing', field: 'layers.0.thicknessMm', value: t });
      }),
      { numRuns: 20, seed: 11 },
    );
  });
});
