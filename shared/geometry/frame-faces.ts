import type { FrameFace, FrameSiding } from './bevel';
import { estimatePart } from './estimate';
import type { LayerGeometry, LayerPiecesGeometry, NotchGeometry, LimberGeometry, PartGeometry, PartRegion, TransomInfo } from './frame-types';
import { cutShapes } from './cut';
import { limberPlaces, openingLoops } from './holes';
import { layerPiecesOf } from './layers';
import { type ContactRun, bevelMarksAlong, bevelMarksSummary, checkDimensionOf, templateMarksOf } from './marks';
import type { NotchCut } from './notch';
import type { Part, PartIssue } from './part-schema';
import type { GirthEdge } from './pieces';
import { type Bounds, type Shape, polygonArea, polygonBounds, polygonPointLocation, shapeBoolean } from './polygon';
import { polylineSegmentsCross } from './polyline';
import { type RingSpec, ringWidthAt } from './ring';
import { GeometryInputError, type SectionPoint } from './types';

/**
 * The stage every kind of part shares once its faces are known: limbers and openings placed, every face
 * cut (notches, limbers, openings: one clipper-lib difference per face), the layers paired from the faces,
 * each layer in pieces, bevel marks and template marks on the marked face, the check dimension and the
 * estimate.
 */

/** One face of a part before cutting, in template coordinates. */
export interface BuiltFace {
  /** x (mm) of the face (see `LayerGeometry.faceX`). */
  x: number;
  depthMm: number;
  regions: Shape[];
  girthEdges: GirthEdge[];
  /** The outer edge against the skin, port to starboard: limbers are placed along it. */
  hullEdge: SectionPoint[];
  notches: NotchCut[];
  ring: RingSpec | null;
}

/** A part's faces, with what its kind knows of the marked face (internal: holds a function). */
export interface PartFaces {
  plane: PartGeometry['plane'];
  markedFace: FrameFace;
  markedFaceFrom: 'stated' | 'auto';
  direction: 1 | -1;
  markedFaceX: number;
  otherFaceX: number;
  /** Index for index with the layer face depths: 0 the marked face, k + 1 the far face of layer k. */
  faces: BuiltFace[];
  /** The marked face's edges against the skin and deck, with their bevels (rates), in template coordinates. */
  contact: ContactRun[];
  frame: FrameSiding;
  /** Length (mm) of edge bonded to the skin and deck. */
  jointLengthMm: number;
  /** Template height of a height above the baseline. */
  templateZ: (heightMm: number) => number;
  transom: TransomInfo | null;
  warnings: PartIssue[];
}

/** A piece left by cutting smaller than this (mm^2) is a sliver between two cutters, not a part: it is dropped. */
export const SLIVER_AREA_MM2 = 1;

/** What the finishing stage needs of the hull. */
export interface PartContext {
  stationName: string | null;
  designWaterlineZ: number | null;
  /** The thinnest skin (mm) the part is bonded to: the recommended fillet radius follows the thinner of it and the layers. */
  skinThicknessMm: number | null;
  chordToleranceMm: number;
}

const fail = (code: string, field: string, value: unknown, message: string): never => {
  throw new GeometryInputError([{ code, message, field, value }]);
};

const holesCount = (shapes: readonly Shape[]): number => shapes.reduce((n, s) => n + s.holes.length, 0);

/** A face's cutters (notches, limbers, openings) and the limbers placed on it. */
function cuttersOf(part: Part, face: BuiltFace, tol: number): { loops: SectionPoint[][]; limbers: LimberGeometry[] } {
  const loops: SectionPoint[][] = face.notches.map((n) => n.loop);
  const limbers: LimberGeometry[] = [];
  part.limbers.forEach((limber, i) => {
    if (face.hullEdge.length < 2) return;
    const places = limberPlaces(limber, { points: face.hullEdge, closed: false }, tol);
    places.forEach((pl) => {
      if (pl === null) fail('limber-off-edge', `limbers.${i}.girthMm`, limber.girthMm, `limber ${i + 1} at girth ${limber.girthMm} mm is off the frame's edge`);
      if (face.ring) {
        const w = ringWidthAt(face.ring, 'skin', { girthMm: Math.abs(pl!.girthMm), z: pl!.centre.z, ny: 0, nz: -1 });
        if (limber.radiusMm >= w) fail('limber-wider-than-ring', `limbers.${i}.radiusMm`, limber.radiusMm, `limber ${i + 1} has radius ${limber.radiusMm} mm, as much as the ring there (${w} mm): it would cut the frame through`);
      }
      loops.push(pl!.loop);
      limbers.push({ side: pl!.side, centre: pl!.centre, radiusMm: pl!.radiusMm, girthMm: pl!.girthMm });
    });
  });
  for (const o of part.openings) loops.push(...openingLoops(o, tol));
  return { loops, limbers };
}

/** The face's regions with its cutters taken out; a cut that splits the part or breaks into a ring's opening is an error. */
function cutFace(face: BuiltFace, loops: SectionPoint[][]): Shape[] {
  if (loops.length === 0) return face.regions;
  // Where two cutters nearly touch, clipper can leave a sliver between them: not a part, dropped.
  const cut = cutShapes(face.regions, loops).filter((s) => polygonArea(s.outer) >= SLIVER_AREA_MM2);
  const before = face.regions.length;
  if (cut.length > before || (face.ring && holesCount(cut) < holesCount(face.regions))) {
    // Name the culprit: the first cutter that alone splits the part.
    const n = face.notches.find((c) => {
      const alone = shapeBoolean('difference', face.regions, [{ outer: c.loop, holes: [] }]).filter((s) => polygonArea(s.outer) >= SLIVER_AREA_MM2);
      return alone.length > before || (face.ring !== null && holesCount(alone) < holesCount(face.regions));
    });
    if (n) fail('notch-wider-than-part', 'longitudinalIds', n.longitudinalId, `the notch for "${n.name}" (${n.longitudinalId}), ${n.widthMm.toFixed(1)} mm wide and ${n.depthMm.toFixed(1)} mm deep, cuts the part through`);
    fail('hole-through-part', 'openings', null, 'the limbers and openings cut the part through (into its edge or its opening)');
  }
  if (cut.length === 0) fail('part-cut-away', 'openings', null, 'the notches, limbers and openings leave nothing of the part');
  return cut;
}

/** Whether segment ab crosses the loop's edge or lies inside it. */
function segmentMeetsLoop(a: SectionPoint, b: SectionPoint, loop: readonly SectionPoint[]): boolean {
  if (polygonPointLocation(loop, a, 0) !== 'outside' || polygonPointLocation(loop, b, 0) !== 'outside') return true;
  for (let i = 0; i < loop.length; i++) if (polylineSegmentsCross(a, b, loop[i]!, loop[(i + 1) % loop.length]!)) return true;
  return false;
}

const region = (s: Shape): PartRegion => ({ outer: s.outer, holes: s.holes });

/** The box of the regions' outer loops, or null when they have no points (one loop at a time: flatMap copies every point). */
function regionsBounds(regions: readonly PartRegion[]): Bounds | null {
  let out: Bounds | null = null;
  for (const r of regions) {
    const b = polygonBounds(r.outer);
    if (b) out = out ? { minY: Math.min(out.minY, b.minY), minZ: Math.min(out.minZ, b.minZ), maxY: Math.max(out.maxY, b.maxY), maxZ: Math.max(out.maxZ, b.maxZ) } : b;
  }
  return out;
}
const areaOf = (shapes: readonly Shape[]): number => shapes.reduce((a, s) => a + polygonArea(s.outer) - s.holes.reduce((h, l) => h + polygonArea(l), 0), 0);

/**
 * The part from its faces (see the file's note).
 * @throws GeometryInputError for a limber off the edge, a cut through the part, or a jointing that cannot be placed.
 */
export function partOfFaces(part: Part, pf: PartFaces, ctx: PartContext): PartGeometry {
  const { stationName, designWaterlineZ } = ctx;
  const tol = ctx.chordToleranceMm;
  const cut = pf.faces.map((f) => {
    const c = cuttersOf(part, f, tol);
    return { regions: cutFace(f, c.loops), cutters: c.loops, limbers: c.limbers };
  });
  const layersRaw = part.layers.map((layer, k) => ({ layer, near: pf.faces[k]!, far: pf.faces[k + 1]!, nearCut: cut[k]!, farCut: cut[k + 1]! }));
  // Joints are placed on the cut layer. Where one falls in a notch or limber (and so misses the material),
  // they are placed on the uncut layer instead, the cutters taken out of the pieces, and the joint warned of.
  const warnings = [...pf.warnings];
  const piecesOf = (uncut: boolean): { pieces: LayerPiecesGeometry[]; uncut: boolean } => {
    try {
      return { pieces: layerPiecesOf(layersRaw.map((l) => ({ regions: uncut ? l.near.regions : l.nearCut.regions, girthEdges: l.near.girthEdges, joints: l.layer.joints })), part.jointing), uncut };
    } catch (e) {
      if (!(e instanceof GeometryInputError)) throw e;
      if (!uncut && e.issues.some((i) => i.code === 'joint-misses-layer')) return piecesOf(true);
      throw new GeometryInputError(e.issues.map((i) => ({ ...i, field: i.field?.startsWith('layers') ? i.field : `jointing.${i.field ?? ''}`, message: `joints: ${i.message}` })));
    }
  };
  const { pieces, uncut } = piecesOf(false);
  if (uncut) {
    pieces.forEach((lp, k) => {
      const cutters = layersRaw[k]!.nearCut.cutters;
      if (cutters.length === 0) return;
      lp.pieces = shapeBoolean('difference', lp.pieces, cutters.map((outer) => ({ outer, holes: [] }))).map(region);
      for (const j of lp.joints) {
        if (cutters.some((c) => segmentMeetsLoop(j.from, j.to, c))) warnings.push({ code: 'joint-at-cut', message: `layer ${k + 1}: the joint at girth ${j.girthMm.toFixed(0)} mm runs through a notch or limber; state the joints (by girth) to move it`, field: `layers.${k}.joints`, path: ['layers', k, 'joints'], value: j.girthMm });
      }
    });
  }
  const layers: LayerGeometry[] = layersRaw.map((l, k) => ({
    index: k,
    thicknessMm: l.layer.thicknessMm,
    material: l.layer.material,
    nearDepthMm: l.near.depthMm,
    farDepthMm: l.far.depthMm,
    faceX: l.near.x,
    otherFaceX: l.far.x,
    regions: l.nearCut.regions.map(region),
    otherFaceRegions: l.farCut.regions.map(region),
    largerFace: areaOf(l.farCut.regions) > areaOf(l.nearCut.regions) ? 'far' : 'near',
    pieces: pieces[k]!,
  }));
  const marked = cut[0]!;
  const bm = part.bevelMarks;
  const bevelMarks = bevelMarksAlong(pf.contact, pf.frame, bm.everyMm, bm.sawTiltLimitRad, marked.cutters);
  const summary = bevelMarksSummary(bevelMarks, bm.sawTiltLimitRad);
  if (summary.overLimit > 0) {
    const worst = bevelMarks.reduce((a, m) => (m.bevel > a.bevel ? m : a));
    warnings.push({
      code: 'bevel-past-saw-limit',
      message: `${summary.overLimit} bevel mark${summary.overLimit > 1 ? 's' : ''} tilt past the saw's ${((bm.sawTiltLimitRad * 180) / Math.PI).toFixed(1)} degrees; the largest is ${worst.bevelDeg.toFixed(1)} degrees at girth ${worst.girthMm.toFixed(0)} mm (${worst.side}): cut those stretches by hand or plane them`,
      field: 'bevelMarks.sawTiltLimitRad',
      path: ['bevelMarks', 'sawTiltLimitRad'],
      value: worst.bevel,
    });
  }
  if (summary.mixed) {
    warnings.push({ code: 'bevels-mixed', message: `the edge has ${summary.under} under and ${summary.standing} standing bevel marks: the standing stretches cannot be cut from the marked face alone`, field: 'markedFace', path: ['markedFace'], value: pf.markedFace });
  }
  const markedRegions = marked.regions.map(region);
  const bounds: Bounds = regionsBounds(markedRegions) ?? { minY: 0, maxY: 0, minZ: 0, maxZ: 0 };
  const notches: NotchGeometry[] = pf.faces[0]!.notches.map((n) => ({ longitudinalId: n.longitudinalId, name: n.name, side: n.side, centre: n.centre, widthMm: n.widthMm, depthMm: n.depthMm, crossingAngleRad: n.crossingAngleRad, against: n.against }));
  const marks = templateMarksOf({
    regions: markedRegions,
    bounds,
    templateZ: pf.templateZ,
    levelLineZ: part.marks.levelLineZ,
    designWaterlineZ,
    setUpLineZ: part.marks.setUpLineZ,
    grain: part.marks.grain,
    stationName,
    partName: part.name,
    markedFace: pf.markedFace,
    notchCentres: notches.map((n) => n.centre),
    limberCentres: marked.limbers.map((l) => l.centre),
  });
  const fillet = part.kind === 'mould' ? { ...part.fillet, sides: 'none' as const } : part.fillet;
  const estimate = estimatePart({
    partId: part.id,
    thicknessMm: part.thicknessMm,
    layers: part.layers,
    layerShapes: layers.map((l) => l.regions),
    jointLengthMm: part.kind === 'mould' ? 0 : pf.jointLengthMm,
    filletClearanceMm: part.filletClearanceMm,
    fillet,
    skinThicknessMm: ctx.skinThicknessMm,
  });
  return {
    partId: part.id,
    name: part.name,
    kind: part.kind,
    stationId: 'stationId' in part ? part.stationId : null,
    stationName,
    markedFace: pf.markedFace,
    markedFaceFrom: pf.markedFaceFrom,
    markedFaceX: pf.markedFaceX,
    otherFaceX: pf.otherFaceX,
    thicknessDirection: pf.direction,
    thicknessMm: part.thicknessMm,
    plane: pf.plane,
    transom: pf.transom,
    chordToleranceMm: tol,
    bounds,
    layers,
    bevelMarks,
    bevelSummary: summary,
    notches,
    limbers: marked.limbers,
    marks,
    checkDimension: checkDimensionOf(markedRegions),
    estimate,
    warnings,
  };
}
