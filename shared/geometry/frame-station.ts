import type { FrameFace, FrameSiding } from './bevel';
import { type DeckLine, deckLineAt } from './deck';
import { type FaceContext, type StationFace, type StationPart, mouldSetInMm, sectionChineGirth, stationFaceAt } from './face';
import type { BuiltHull } from './hull';
import { faceToward, layerFaceDepths, markedFaceAuto, thicknessDirectionOf, type ThicknessDirection } from './layers';
import type { ContactRun } from './marks';
import { type LongitudinalPlace, type NotchCut, longitudinalCovers, longitudinalPlaceAt, notchCrossingAngle, notchesOfPlace } from './notch';
import type { Longitudinal, PartIssue } from './part-schema';
import { edgePointMirrored } from './outline';
import { polygonBounds } from './polygon';
import { polylineSegmentsCross } from './polyline';
import { ringWidthAt } from './ring';
import { sectionAt } from './section';
import { GeometryInputError, type SectionPoint } from './types';
import type { PartFaces } from './frame-faces';
import type { Station } from './hull-schema';
import type { EdgePoint } from './edge';

/**
 * A part cut in a station plane, up to its faces: the marked face (stated, or toward the larger section),
 * every face's outline at its own x (x plus or minus its depth), and the notches each longitudinal cuts
 * in each face, widened by the angle it crosses at (measured between the part's two outer faces).
 */

const fail = (code: string, field: string, value: unknown, message: string): never => {
  throw new GeometryInputError([{ code, message, field, value }]);
};

/** The half-breadth (mm) of a half beam's inboard end: stated, or the outboard face of its carlin. */
function inboardYOf(part: StationPart, longitudinals: readonly Longitudinal[]): number | null {
  if (part.kind !== 'half-beam') return null;
  const end = part.inboardEnd;
  if (end.by === 'half-breadth') return end.yMm;
  const c = longitudinals.find((l) => l.id === end.carlinId);
  if (!c || c.kind !== 'carlin') return fail('half-beam-carlin', 'inboardEnd.carlinId', end.carlinId, `carlin "${end.carlinId}" does not exist`);
  if (c!.placement.by !== 'half-breadth') return fail('half-beam-carlin', 'inboardEnd.carlinId', end.carlinId, `carlin "${c!.name}" must be placed by half-breadth for a half beam to end at it`);
  return (c!.placement as { y: number }).y + c!.widthMm / 2;
}

/** The expansion of starboard contact edges into real sides. */
function contactRuns(face: StationFace): ContactRun[] {
  const mirror = (pts: EdgePoint[]): EdgePoint[] => pts.map(edgePointMirrored);
  const out: ContactRun[] = [];
  for (const pts of face.contact) {
    if (face.contactSides !== 'port') out.push({ points: pts, side: 'starboard' });
    if (face.contactSides !== 'starboard') out.push({ points: mirror(pts), side: 'port' });
  }
  return out;
}

/**
 * The faces of a station part, its marked face and its notches.
 * @throws GeometryInputError where the hull does not reach a face, a layer passes the next station, or the
 *   kind cannot be cut (see face.ts).
 */
export function stationFaces(hull: BuiltHull, part: StationPart, station: Station, longitudinals: readonly Longitudinal[], chordToleranceMm: number): PartFaces {
  const x = station.x;
  const warnings: PartIssue[] = [];
  const faceHull: BuiltHull = part.kind === 'mould' ? { ...hull, lines: { ...hull.lines, deck: null } } : hull;
  const ctx: FaceContext = { chineGirthMm: null, inboardYMm: inboardYOf(part, longitudinals), extraSetInMm: mouldSetInMm(part, longitudinals, x), chordToleranceMm };
  const section0 = sectionAt(faceHull, x, { chordToleranceMm });
  if (!section0) fail('hull-does-not-reach', 'stationId', x, `the hull does not reach station ${station.name} at x = ${x} mm (its lines run from ${hull.xMin} to ${hull.xMax} mm)`);
  // The ring's bottom width runs to the lowest chine of the marked face's section, the same on every face.
  if (part.kind === 'ring-frame' && part.bottomToZ === null) ctx.chineGirthMm = sectionChineGirth(hull, section0!);
  const face0 = stationFaceAt(faceHull, part, x, ctx, section0);
  const T = part.thicknessMm;
  const xDir = hull.lines.xDirection;
  if ((part.kind === 'deck-beam' || part.kind === 'half-beam') && !hull.lines.deck) {
    warnings.push({ code: 'beam-no-deck', message: 'the hull has no deck: the beam is cut level at the sheer, with no camber', field: 'stationId', path: ['stationId'], value: part.stationId });
  }
  let markedFace: FrameFace = part.markedFace === 'auto' ? markedFaceAuto(hull, x, face0.half) : part.markedFace;
  let dir: ThicknessDirection = thicknessDirectionOf(markedFace, xDir);
  const inHull = (xx: number): boolean => xx >= hull.xMin - 1e-6 && xx <= hull.xMax + 1e-6;
  if (!inHull(x + dir * T)) {
    if (part.markedFace === 'auto' && inHull(x - dir * T)) {
      const wanted = markedFace;
      dir = -dir as ThicknessDirection;
      markedFace = faceToward(-dir as ThicknessDirection, xDir);
      warnings.push({ code: 'marked-face-flipped', message: `the ${wanted} face (toward the larger section) would put the frame past the end of the hull; the ${markedFace} face is marked instead, so its bevels are standing`, field: 'markedFace', path: ['markedFace'], value: markedFace });
    } else {
      fail('hull-does-not-reach', 'thicknessMm', T, `the ${markedFace} face is on station ${station.name}; the other face, ${T} mm ${dir > 0 ? 'toward larger x' : 'toward smaller x'} at x = ${(x + dir * T).toFixed(1)} mm, is past the end of the hull (x ${hull.xMin} to ${hull.xMax} mm)`);
    }
  }
  const depths = layerFaceDepths(part.layers);
  const neighbour = hull.stations.filter((s) => (s.x - x) * dir > 1e-9).sort((a, b) => (a.x - b.x) * dir)[0];
  if (neighbour) {
    const spacing = Math.abs(neighbour.x - x);
    const k = depths.findIndex((d) => d > spacing + 1e-9);
    if (k > 0) {
      fail('thicker-than-station-spacing', `layers.${k - 1}.thicknessMm`, part.layers[k - 1]!.thicknessMm, `layer ${k} reaches ${depths[k]} mm from the marked face on station ${station.name}, past the next station ${neighbour.name} ${spacing.toFixed(1)} mm away`);
    }
  }
  const faces = depths.map((d, i) => (i === 0 ? face0 : stationFaceAt(faceHull, part, x + dir * d, ctx)));

  // Notches: each longitudinal found in every face; its crossing angle from the two outer faces.
  const carried = new Set(part.kind === 'mould' ? part.carriesIds : []);
  const wanted = (part.longitudinalIds ?? longitudinals.map((l) => l.id)).filter((id) => !carried.has(id));
  const notchesPerFace: NotchCut[][] = faces.map(() => []);
  const decks: (DeckLine | null | undefined)[] = faces.map(() => undefined);
  const deckOf = (i: number): DeckLine | null => (decks[i] === undefined ? (decks[i] = deckLineAt(faceHull, faces[i]!.section, 0, chordToleranceMm)) : decks[i]!);
  for (const id of wanted) {
    const lg = longitudinals.find((l) => l.id === id);
    if (!lg || !longitudinalCovers(lg, x)) continue;
    const places = faces.map((f, i) => longitudinalPlaceAt(faceHull, f.section, lg.against === 'deck' ? deckOf(i) : null, lg));
    const p0 = places[0]!;
    if ('missed' in p0) {
      warnings.push({ code: 'longitudinal-missed', message: `no notch: ${p0.missed}`, longitudinalId: lg.id, field: 'longitudinalIds', path: ['longitudinalIds'], value: lg.id });
      continue;
    }
    const pl = places[places.length - 1]!;
    const angle = 'missed' in pl ? 0 : notchCrossingAngle(p0, pl as LongitudinalPlace);
    places.forEach((p, i) => {
      if ('missed' in p) return;
      // The part is cut to the whole outline the notch is placed on: it reaches it. Only a part cut to a piece
      // of the outline (a floor, a beam, an open ring's arms under a deck) may be clear of a notch.
      const whole = part.kind === 'bulkhead' || part.kind === 'mould' || (part.kind === 'ring-frame' && (part.top === 'deck' || lg.against === 'skin'));
      const cuts = notchesOfPlace(lg, p, angle, part.filletClearanceMm + ctx.extraSetInMm).filter((c) => whole || touches(c.loop, faces[i]!));
      if (faces[i]!.ring) {
        for (const c of cuts) {
          const w = ringWidthAt(faces[i]!.ring!, lg.against, { girthMm: p.girthMm, z: p.point.z, ny: p.normal.y, nz: p.normal.z });
          if (c.depthMm >= w) fail('notch-wider-than-part', 'ringWidth', w, `the notch for ${lg.kind} "${lg.name}" (${lg.id}) is ${c.depthMm.toFixed(1)} mm deep, as much as the ring there (${w} mm): it would cut the frame through`);
        }
      }
      notchesPerFace[i]!.push(...cuts);
    });
  }
  const contact = contactRuns(faces[0]!);
  const frame: FrameSiding = { markedFace, sidingMm: T, xDirection: xDir };
  return {
    plane: 'station',
    markedFace,
    markedFaceFrom: part.markedFace === 'auto' ? 'auto' : 'stated',
    direction: dir,
    markedFaceX: x,
    otherFaceX: x + dir * T,
    faces: faces.map((f, i) => ({ x: f.x, depthMm: depths[i]!, regions: f.regions, girthEdges: f.girthEdges, hullEdge: f.hullEdge, notches: notchesPerFace[i]!, ring: f.ring })),
    contact,
    frame,
    jointLengthMm: faces[0]!.jointLengthMm,
    templateZ: (h) => h,
    transom: null,
    warnings,
  };
}

/** Whether a cutter reaches the face's material: a corner inside it, a vertex of the face inside the cutter, or edges crossing. */
function touches(loop: readonly SectionPoint[], face: StationFace): boolean {
  const b = polygonBounds(loop)!;
  const fb = polygonBounds(face.regions.flatMap((r) => r.outer));
  if (!fb || b.maxY < fb.minY || b.minY > fb.maxY || b.maxZ < fb.minZ || b.minZ > fb.maxZ) return false;
  const inside = (l: readonly SectionPoint[], p: SectionPoint): boolean => {
    let c = false;
    for (let i = 0, j = l.length - 1; i < l.length; j = i++) {
      const a = l[i]!;
      const b = l[j]!;
      if (a.z > p.z !== b.z > p.z && p.y < ((b.y - a.y) * (p.z - a.z)) / (b.z - a.z) + a.y) c = !c;
    }
    return c;
  };
  for (const r of face.regions) {
    if (loop.some((p) => inside(r.outer, p) && !r.holes.some((h) => inside(h, p)))) return true;
    if (r.outer.some((p) => inside(loop, p))) return true;
    for (const l of [r.outer, ...r.holes]) {
      for (let i = 0; i < l.length; i++) {
        const a = l[i]!;
        const b = l[(i + 1) % l.length]!;
        for (let k = 0; k < loop.length; k++) if (polylineSegmentsCross(a, b, loop[k]!, loop[(k + 1) % loop.length]!)) return true;
      }
    }
  }
  return false;
}
