import { describe, expect, it } from 'vitest';
import { mouldSetInMm, ringSpecOf, sectionChineGirth, stationFaceAt } from '../../shared/geometry/face';
import type { StationPart } from '../../shared/geometry/face';
import { hullBuild } from '../../shared/geometry/hull';
import { loopMirrored } from '../../shared/geometry/outline';
import { CLIPPER_SCALE, polygonArea, polygonPerimeter, shapeBoolean } from '../../shared/geometry/polygon';
import { sectionAt } from '../../shared/geometry/section';
import { GeometryInputError } from '../../shared/geometry/types';
import { chineHull, evenStations, range, roundHull } from './analytic-hulls';
import { longitudinalOf, partOf } from './frame-fixtures';
import { expectClose } from './helpers';

const DEG = Math.PI / 180;
const ctx = { chineGirthMm: null, inboardYMm: null, extraSetInMm: 0, chordToleranceMm: 0.05 };
const station = (p: ReturnType<typeof partOf>): StationPart => p as StationPart;

describe('stationFaceAt: floors and partial bulkheads', () => {
  const R = 1000;
  const zc = 1100;
  const hull = hullBuild(roundHull({ xs: evenStations(0, 6000, 10), radius: () => R, centreZ: zc, sheerAngle: 110 * DEG, waterlineZs: range(200, 1400, 100), buttockYs: range(100, 900, 100), skinMm: 9 }));
  const floorInput = { id: 'f', name: 'Floor 4', kind: 'floor' as const, stationId: 'st4', topZ: 400, thicknessMm: 12, layers: [{ thicknessMm: 12 }] };
  const floor = station(partOf(floorInput));

  it('is the outline cut level at its top: the same region clipper-lib gives', () => {
    const face = stationFaceAt(hull, floor, 2400, ctx);
    // Source: clipper-lib 6.4.2 (npm), intersection of the whole outline with the half-plane below 400 mm.
    const full = loopMirrored(face.half);
    const theirs = shapeBoolean('intersection', [{ outer: full, holes: [] }], [{ outer: [{ y: -2000, z: 0 }, { y: 2000, z: 0 }, { y: 2000, z: 400 }, { y: -2000, z: 400 }], holes: [] }]);
    expect(face.regions).toHaveLength(1);
    // Clipper rounds every vertex to its 1 micrometre grid: half a unit along the perimeter.
    expectClose(polygonArea(face.regions[0]!.outer), polygonArea(theirs[0]!.outer), (polygonPerimeter(full) * 0.5) / CLIPPER_SCALE, 'area');
    // Analytic: a circular segment of radius r = R - 11 below the chord 400 - (zc - r) above its bottom.
    const r = R - 11;
    const h = 400 - (zc - r);
    const segment = r * r * Math.acos((r - h) / r) - (r - h) * Math.sqrt(2 * r * h - h * h);
    expectClose(polygonArea(face.regions[0]!.outer), segment, 2 * Math.PI * r * 0.05 * 0.5, 'segment area');
    // The edge against the skin stops at the top: its last point is on the level of the top.
    const last = face.contact[0]![face.contact[0]!.length - 1]!;
    expectClose(last.z, 400, 1e-9, 'contact ends at the top');
  });

  it('refuses a top at or below the bottom of the frame', () => {
    const low = station(partOf({ ...floorInput, topZ: 50 }));
    expect(() => stationFaceAt(hull, low, 2400, ctx)).toThrowError(GeometryInputError);
    try {
      stationFaceAt(hull, low, 2400, ctx);
    } catch (e) {
      expect((e as GeometryInputError).issues[0]).toMatchObject({ code: 'top-below-keel', field: 'topZ', value: 50 });
    }
  });

  it('refuses an x the hull does not reach', () => {
    expect(() => stationFaceAt(hull, floor, 7000, ctx)).toThrowError(/the hull does not reach x = 7000\.0 mm/);
  });
});

describe('ring widths and mould set-in', () => {
  const hull = hullBuild(chineHull({ xs: evenStations(0, 3000, 6), chineY: () => 600, flare: 0.2, sheerZ: 500, waterlineZs: [100, 300], bottomMm: 12, sideMm: 9 }));

  it('takes the bottom width to the lowest chine (its moulded girth), or a stated height', () => {
    // Analytic: the chine is 600 mm along the flat bottom from the keel.
    expect(sectionChineGirth(hull, sectionAt(hull, 1500)!)).toBe(600);
    const ring = partOf({ id: 'r', name: 'R', kind: 'ring-frame', stationId: 'st3', thicknessMm: 18, layers: [{ thicknessMm: 18 }], ringWidth: { bottomMm: 80, sidesMm: 60, underDeckMm: 70 } });
    if (ring.kind !== 'ring-frame') throw new Error('fixture');
    expect(ringSpecOf(ring, 600)).toEqual({ bottomMm: 80, sidesMm: 60, underDeckMm: 70, bottom: { by: 'girth', girthMm: 600 }, cornerRadiusMm: 25, top: 'deck' });
    expect(ringSpecOf({ ...ring, bottomToZ: 150 }, 600).bottom).toEqual({ by: 'height', z: 150 });
    expect(ringSpecOf({ ...ring, ringWidth: { bottomMm: 80, sidesMm: 60, underDeckMm: null } }, null)).toMatchObject({ underDeckMm: 60, bottom: { by: 'normal' } });
  });

  it('sets a mould in by the deepest longitudinal it carries there', () => {
    const a = longitudinalOf({ id: 'a', name: 'A', kind: 'ribband', placement: { by: 'girth', girthMm: 100 }, widthMm: 40, depthMm: 19 });
    const b = longitudinalOf({ id: 'b', name: 'B', kind: 'ribband', placement: { by: 'girth', girthMm: 300 }, widthMm: 40, depthMm: 25, fromX: 2000 });
    const mould = station(partOf({ id: 'm', name: 'M', kind: 'mould', stationId: 'st3', thicknessMm: 18, layers: [{ thicknessMm: 18 }], carriesIds: ['a', 'b'] }));
    expect(mouldSetInMm(mould, [a, b], 1500)).toBe(19);
    expect(mouldSetInMm(mould, [a, b], 2500)).toBe(25);
  });
});
