import { describe, expect, it } from 'vitest';
import { frameOfPart } from '../../shared/geometry/frame';
import { measuredEdgeCleared } from '../../shared/geometry/frame-measured';
import { hullBuild } from '../../shared/geometry/hull';
import type { PartInput } from '../../shared/geometry/part-schema';
import { polygonArea } from '../../shared/geometry/polygon';
import { type SectionPoint, degToRad } from '../../shared/geometry/types';
import { chineHull, evenStations } from './analytic-hulls';
import { built, expectProperRegions, longitudinalOf, partOf } from './frame-fixtures';
import { expectClose } from './helpers';

// A hull for the part's context only (x direction, design waterline); a measured frame takes nothing else from it.
const hull = hullBuild(chineHull({ xs: evenStations(0, 4000, 8), chineY: () => 600, flare: 0.2, sheerZ: 500, waterlineZs: [100, 300], bottomMm: 12, sideMm: 9 }));
type Measured = Extract<PartInput, { kind: 'measured-frame' }>;
const measured = (over: Partial<Measured> & Pick<Measured, 'measurement'>) =>
  partOf({ kind: 'measured-frame', id: 'm', name: 'Frame 7 as built', x: 2500, measuredFace: 'forward', thicknessMm: 18, layers: [{ thicknessMm: 18 }], filletClearanceMm: 0, ...over });
/** A sliding bevel reading for bevel b (degrees): 90 - b under, 90 + b standing (common practice, REFERENCES.md). */
const reading = (bDeg: number, sense: 'under' | 'standing') => ({ readingRad: degToRad(sense === 'under' ? 90 - bDeg : 90 + bDeg), sense });
/** Points every `step` mm along a polyline (ends included), for readings taken along straight runs. */
function along(corners: SectionPoint[], step: number): SectionPoint[] {
  const out: SectionPoint[] = [];
  for (let i = 0; i + 1 < corners.length; i++) {
    const a = corners[i]!;
    const b = corners[i + 1]!;
    const n = Math.max(1, Math.round(Math.hypot(b.y - a.y, b.z - a.z) / step));
    for (let k = 0; k < n; k++) out.push({ y: a.y + ((b.y - a.y) * k) / n, z: a.z + ((b.z - a.z) * k) / n });
  }
  out.push(corners[corners.length - 1]!);
  return out;
}
// Invented fixture: a V-bottomed section measured at its corners (port sheer, port chine, keel, starboard chine, starboard sheer).
const corners = [{ y: -700, z: 600 }, { y: -560, z: 120 }, { y: 0, z: 0 }, { y: 560, z: 120 }, { y: 700, z: 600 }];

describe('measured frames as parts', () => {
  it('reproduces the shape read as angles and distances from an origin', () => {
    // Analytic: each reading is computed here from the corner's geometry about the origin (0, 800).
    const origin = { y: 0, z: 800 };
    const points = corners.map((c) => ({ side: c.y < 0 ? ('port' as const) : ('starboard' as const), angleRad: Math.atan2(origin.z - c.z, Math.abs(c.y - origin.y)), distanceMm: Math.hypot(c.y - origin.y, c.z - origin.z), bevel: null }));
    const g = built(frameOfPart(hull, measured({ measurement: { kind: 'angle-distance', origin, points } })));
    const outer = g.layers[0]!.regions[0]!.outer;
    expect(outer).toHaveLength(5);
    for (const c of corners) expect(outer.some((p) => Math.hypot(p.y - c.y, p.z - c.z) < 1e-9), `corner (${c.y}, ${c.z})`).toBe(true);
    // Analytic: twice the shoelace area of the half (0, 0), (560, 120), (700, 600), (0, 600): 2 x 336000 mm^2.
    expectClose(polygonArea(outer), 672000, 1e-6, 'area');
    expect(g.plane).toBe('measured');
    expectProperRegions(g.layers[0]!.regions, 'measured');
  });

  it('keeps an asymmetric frame as measured, and mirrors one side only when asked', () => {
    // Invented: the starboard chine was found 15 mm lower than the port one.
    const skew = corners.map((c) => (c.y === 560 ? { y: 560, z: 105 } : c));
    const offsets = { kind: 'offsets' as const, referenceZ: 0, points: skew.map((c) => ({ y: c.y, h: c.z, bevel: null })) };
    const asIs = built(frameOfPart(hull, measured({ measurement: offsets })));
    expect(asIs.layers[0]!.regions[0]!.outer.some((p) => p.y === 560 && p.z === 105)).toBe(true);
    expect(asIs.layers[0]!.regions[0]!.outer.some((p) => p.y === -560 && p.z === 120)).toBe(true);
    const mirrored = built(frameOfPart(hull, measured({ measurement: offsets, symmetry: 'mirror-port' })));
    const outer = mirrored.layers[0]!.regions[0]!.outer;
    for (const p of outer) expect(outer.some((q) => Math.hypot(q.y + p.y, q.z - p.z) < 1e-9), `mirror of (${p.y}, ${p.z})`).toBe(true);
    expect(outer.some((p) => p.y === 560 && p.z === 120)).toBe(true);
    const w = mirrored.warnings.find((x) => x.code === 'measured-asymmetry');
    expect(w?.message).toMatch(/differ by up to \d+\.\d mm; the port side is kept and mirrored/);
  });

  it('puts the other face where the bevel readings say: 18 tan(b) in for an under bevel', () => {
    // Readings every 20 mm along each run, all 10 deg under (a sliding bevel reading 80 deg). Away from the
    // corners each far-face point is 18 tan 10 = 3.17 mm inside the measured edge along its normal
    // (REFERENCES.md: wood removed across siding s at bevel b is s tan b).
    const pts = along(corners, 20).map((c) => ({ y: c.y, h: c.z, bevel: reading(10, 'under') }));
    const g = built(frameOfPart(hull, measured({ measurement: { kind: 'offsets', referenceZ: 0, points: pts } })));
    // Auto: the measured face is the larger (an under bevel), so it is marked; the far face is 18 mm away along x.
    expect(g.markedFace).toBe('forward');
    expect(g.layers[0]!.largerFace).toBe('near');
    const far = g.layers[0]!.otherFaceRegions[0]!.outer;
    // Analytic: the bottom run's line from (0, 0) to (560, 120): far points strictly inside it lie on the parallel line 3.17 mm in.
    const L = Math.hypot(560, 120);
    const dIn = (p: SectionPoint): number => (120 * p.y - 560 * p.z) / -L;
    const mid = far.filter((p) => p.y > 60 && p.y < 500);
    expect(mid.length).toBeGreaterThan(10);
    for (const p of mid) expectClose(dIn(p), 18 * Math.tan(degToRad(10)), 1e-9, `far face at (${p.y.toFixed(1)}, ${p.z.toFixed(1)})`);
    // The bevel marks carry the readings: 10 deg under, the sliding bevel at 80 deg.
    const marks = g.bevelMarks.filter((m) => !m.corner && m.y > 60 && m.y < 500);
    expect(marks.length).toBeGreaterThan(3);
    for (const m of marks) {
      expectClose(m.bevelDeg, 10, 1e-9, 'bevel');
      expect(m.kind).toBe('under');
      expectClose(m.slidingBevelDeg, 80, 1e-9, 'sliding bevel');
    }
  });

  it('marks the other face when it is the larger one (a standing bevel as measured), and bevels under from it', () => {
    const pts = along(corners, 20).map((c) => ({ y: c.y, h: c.z, bevel: reading(10, 'standing') }));
    const g = built(frameOfPart(hull, measured({ measurement: { kind: 'offsets', referenceZ: 0, points: pts } })));
    expect(g.markedFace).toBe('aft');
    // Analytic: the marked face is the far one, so the measured face is its other face and the frame runs from it
    // back to x = 2500 (the measured face's x).
    expect(g.otherFaceX).toBe(2500);
    for (const m of g.bevelMarks.filter((x) => !x.corner && x.y > 60 && x.y < 500)) expect(m.kind).toBe('under');
  });

  it('sets the fillet clearance in normal to the skin, mitred at the readings', () => {
    // Analytic: a square corner moved in by c along both sides lands c sqrt(2) along the bisector.
    const edge = [{ y: -100, z: 100, bevelRad: 0 }, { y: -100, z: 0, bevelRad: 0 }, { y: 100, z: 0, bevelRad: 0 }, { y: 100, z: 100, bevelRad: 0 }];
    const cleared = measuredEdgeCleared(edge, 2);
    expect(cleared.map((p) => [p.y, p.z].map((v) => Number(v.toFixed(9))))).toEqual([[-98, 100], [-98, 2], [98, 2], [98, 100]]);
  });

  it('notches a longitudinal placed by girth along the measured edge, square', () => {
    const lg = longitudinalOf({ id: 'h', name: 'Hog', kind: 'hog', placement: { by: 'girth', girthMm: 0 }, widthMm: 60, depthMm: 25, sides: 'centreline' });
    const offsets = { kind: 'offsets' as const, referenceZ: 0, points: corners.map((c) => ({ y: c.y, h: c.z, bevel: null })) };
    const g = built(frameOfPart(hull, measured({ measurement: offsets }), [lg]));
    expect(g.notches).toHaveLength(1);
    expect(g.notches[0]!.widthMm).toBe(60);
    // Analytic: the notch floor is 25 mm in from the keel point along the bisector of the V (straight up).
    const outer = g.layers[0]!.regions[0]!.outer;
    expect(outer.some((p) => Math.abs(p.z - 25) < 1e-3 && Math.abs(p.y - 30) < 1e-3)).toBe(true);
  });
});
