import type { EdgePoint } from './edge';
import type { BuiltFace, PartFaces } from './frame-faces';
import type { BuiltHull } from './hull';
import { layerFaceDepths, thicknessDirectionOf } from './layers';
import type { ContactRun } from './marks';
import { type MeasuredPoint, measuredEdgeAtDepth, measuredFrameOutline } from './measured';
import type { NotchCut } from './notch';
import { NOTCH_OVERRUN_MM } from './notch';
import type { Longitudinal, MeasuredFrame, PartIssue } from './part-schema';
import { girthPoint } from './pieces';
import { polylineLength } from './polygon';
import type { SectionPoint } from './types';

/**
 * A frame measured by hand on a standing hull (measured.ts) as a part like any other. The readings are the
 * inside of the skin, so the fillet clearance is set in from them (normal to the skin: c / cos(bevel) in
 * the frame's plane, mitred at each reading). Each face is the edge at its depth from the measured face,
 * moved by depth x tan(bevel) from the readings (measured.ts); the bevel marks carry the readings' bevels.
 * Notches can only be placed by girth along the measured edge (there is no section to find a line or a
 * height on), and are cut square: a measured frame has no run along x to widen them by.
 */

/** Longest mitre (as a multiple of the clearance) at a sharp reading before it is cut back. */
export const MEASURED_MITRE_LIMIT = 4;

/** The measured edge set in by `clearanceMm` normal to the skin (the edge runs counter-clockwise, port end to starboard end). */
export function measuredEdgeCleared(edge: readonly MeasuredPoint[], clearanceMm: number): MeasuredPoint[] {
  if (!(clearanceMm > 0)) return edge.map((p) => ({ ...p }));
  const n = edge.length;
  const normal = (i: number): SectionPoint => {
    const a = edge[i]!;
    const b = edge[i + 1]!;
    const len = Math.hypot(b.y - a.y, b.z - a.z);
    return len === 0 ? { y: 0, z: 0 } : { y: (b.z - a.z) / len, z: -(b.y - a.y) / len };
  };
  return edge.map((p, i) => {
    const n0 = i > 0 ? normal(i - 1) : normal(0);
    const n1 = i < n - 1 ? normal(i) : normal(n - 2);
    const sy = n0.y + n1.y;
    const sz = n0.z + n1.z;
    const len = Math.hypot(sy, sz);
    if (len === 0) return { ...p };
    const b = { y: sy / len, z: sz / len };
    // Along the bisector the move is c / cos(half the turn) so both sides stand c off.
    const cosHalf = Math.max(b.y * n1.y + b.z * n1.z, 1 / MEASURED_MITRE_LIMIT);
    const d = (clearanceMm * Math.sqrt(1 + Math.tan(p.bevelRad ?? 0) ** 2)) / cosHalf;
    return { y: p.y - b.y * d, z: p.z - b.z * d, bevelRad: p.bevelRad };
  });
}

/** Index and fraction of the lowest crossing of the centreline along an open polyline, or null. */
function lowestCrossing(pts: readonly SectionPoint[]): { i: number; f: number; z: number } | null {
  let best: { i: number; f: number; z: number } | null = null;
  for (let i = 0; i + 1 < pts.length; i++) {
    const a = pts[i]!;
    const b = pts[i + 1]!;
    if ((a.y > 0 && b.y > 0) || (a.y < 0 && b.y < 0)) continue;
    const f = a.y === b.y ? 0 : a.y / (a.y - b.y);
    const z = a.z + f * (b.z - a.z);
    if (best === null || z < best.z) best = { i, f, z };
  }
  return best;
}

/** The marked face's edge as contact runs from the centreline outward, with rates that give the readings' bevels. */
function contactOf(face: SectionPoint[], bevels: (number | null)[], rateSign: number): ContactRun[] {
  const n = face.length;
  const normalAt = (i: number): SectionPoint => {
    const seg = (k: number): SectionPoint => {
      const a = face[k]!;
      const b = face[k + 1]!;
      const len = Math.hypot(b.y - a.y, b.z - a.z) || 1;
      return { y: (b.z - a.z) / len, z: -(b.y - a.y) / len };
    };
    const s0 = i > 0 ? seg(i - 1) : seg(0);
    const s1 = i < n - 1 ? seg(i) : seg(n - 2);
    const len = Math.hypot(s0.y + s1.y, s0.z + s1.z) || 1;
    return { y: (s0.y + s1.y) / len, z: (s0.z + s1.z) / len };
  };
  const pts: EdgePoint[] = face.map((p, i) => {
    const nn = normalAt(i);
    const rate = Math.tan(bevels[i] ?? 0) * rateSign;
    return { y: p.y, z: p.z, ny: nn.y, nz: nn.z, rate, bevel: Math.atan(Math.abs(rate)), girthMm: 0, setInMm: 0, edge: 'hull', corner: false };
  });
  const cross = lowestCrossing(face);
  const origin: EdgePoint = cross ? { ...pts[cross.i]!, y: 0, z: cross.z } : pts[0]!;
  // The crossing point belongs to both halves: each gets its own copy (girths are set per half).
  const originCopy = (): EdgePoint => ({ ...origin });
  if (cross) {
    const a = pts[cross.i]!;
    const b = pts[cross.i + 1]!;
    origin.rate = a.rate + cross.f * (b.rate - a.rate);
    origin.bevel = Math.atan(Math.abs(origin.rate));
  }
  const star = cross ? [originCopy(), ...pts.slice(cross.i + 1)] : pts;
  const port = cross ? [originCopy(), ...pts.slice(0, cross.i + 1).map((p) => ({ ...p })).reverse()] : [];
  const withGirth = (run: EdgePoint[]): EdgePoint[] => {
    let g = 0;
    return run.map((p, i) => {
      if (i > 0) g += Math.hypot(p.y - run[i - 1]!.y, p.z - run[i - 1]!.z);
      p.girthMm = g;
      return p;
    });
  };
  const out: ContactRun[] = [];
  if (star.length > 1) out.push({ points: withGirth(star), side: 'starboard' });
  if (port.length > 1) out.push({ points: withGirth(port), side: 'port' });
  return out;
}

/** Notches by girth along the measured edge (see the file's note); others are reported as not placed. */
function measuredNotches(part: MeasuredFrame, face: SectionPoint[], longitudinals: readonly Longitudinal[], warnings: PartIssue[]): NotchCut[] {
  const out: NotchCut[] = [];
  const ids = part.longitudinalIds ?? longitudinals.map((l) => l.id);
  for (const id of ids) {
    const lg = longitudinals.find((l) => l.id === id);
    if (!lg || (lg.fromX !== null && part.x < lg.fromX) || (lg.toX !== null && part.x > lg.toX)) continue;
    if (lg.placement.by !== 'girth' || lg.against !== 'skin') {
      warnings.push({ code: 'longitudinal-missed', message: `no notch for "${lg.name}" (${lg.id}): on a measured frame a longitudinal can only be placed by girth along the skin`, longitudinalId: lg.id, field: 'longitudinalIds', path: ['longitudinalIds'], value: lg.id });
      continue;
    }
    const g = lg.placement.girthMm;
    const sides: [number, NotchCut['side']][] = lg.sides === 'centreline' ? [[g, 'centreline']] : [[g, 'starboard'], [-g, 'port']];
    for (const [girth, side] of sides) {
      const at = girthPoint({ points: face, closed: false }, girth);
      if (!at) continue;
      const m = at.point;
      const inward = at.inward;
      const t = { y: inward.z, z: -inward.y };
      const depth = lg.depthMm - part.filletClearanceMm;
      if (depth <= 0) continue;
      const pt = (along: number, d: number): SectionPoint => ({ y: m.y + t.y * along + inward.y * d, z: m.z + t.z * along + inward.z * d });
      const w = lg.widthMm;
      const loop = [pt(-w / 2, -NOTCH_OVERRUN_MM - part.filletClearanceMm), pt(w / 2, -NOTCH_OVERRUN_MM - part.filletClearanceMm), pt(w / 2, depth), pt(-w / 2, depth)];
      out.push({ longitudinalId: lg.id, name: lg.name, side, against: 'skin', centre: pt(0, -part.filletClearanceMm), widthMm: w, depthMm: depth, floorMm: lg.depthMm, crossingAngleRad: 0, loop });
    }
  }
  return out;
}

/**
 * The faces of a hand-measured frame. The measured face is at the frame's x; the marked face is the one the
 * part states, or (auto) the larger of the two (measured.ts).
 * @throws GeometryInputError from measured.ts (too few points, a crossing outline, a side not measured).
 */
export function measuredFaces(hull: BuiltHull, part: MeasuredFrame, longitudinals: readonly Longitudinal[]): PartFaces {
  const out = measuredFrameOutline(part);
  const warnings: PartIssue[] = [];
  if (out.maxAsymmetryMm !== null && out.maxAsymmetryMm > 0) {
    warnings.push({ code: 'measured-asymmetry', message: `the two sides as measured differ by up to ${out.maxAsymmetryMm.toFixed(1)} mm; the ${part.symmetry === 'mirror-starboard' ? 'starboard' : 'port'} side is kept and mirrored`, field: 'symmetry', path: ['symmetry'], value: out.maxAsymmetryMm });
  }
  const edge = measuredEdgeCleared(out.edge, part.filletClearanceMm);
  const markedFace = out.markedFace;
  const fromMeasured = markedFace === part.measuredFace;
  const xDir = hull.lines.xDirection;
  const dir = thicknessDirectionOf(markedFace, xDir);
  const T = part.thicknessMm;
  const markedX = fromMeasured ? part.x : part.x - dir * T;
  const depths = layerFaceDepths(part.layers);
  const faceLoops = depths.map((d) => measuredEdgeAtDepth(edge, fromMeasured ? d : T - d));
  const notches = faceLoops.map((f) => measuredNotches(part, f, longitudinals, depths.length > 0 && f === faceLoops[0] ? warnings : []));
  const faces: BuiltFace[] = faceLoops.map((loop, i) => ({
    x: markedX + dir * depths[i]!,
    depthMm: depths[i]!,
    regions: [{ outer: loop, holes: [] }],
    girthEdges: [{ points: loop, closed: false }],
    hullEdge: loop,
    notches: notches[i]!,
    ring: null,
  }));
  // Seen from the marked face the far face stands out by T tan(b) when it is the measured face's far side, in otherwise.
  const contact = contactOf(faceLoops[0]!, edge.map((p) => p.bevelRad), (fromMeasured ? 1 : -1) * dir);
  return {
    plane: 'measured',
    markedFace,
    markedFaceFrom: part.markedFace === 'auto' ? 'auto' : 'stated',
    direction: dir,
    markedFaceX: markedX,
    otherFaceX: markedX + dir * T,
    faces,
    contact,
    frame: { markedFace, sidingMm: T, xDirection: xDir },
    jointLengthMm: polylineLength(faceLoops[0]!),
    templateZ: (h) => h,
    transom: null,
    warnings,
  };
}
