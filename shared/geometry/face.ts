import { beamOutline } from './beam';
import { deductionOf } from './deduction';
import type { EdgePoint } from './edge';
import type { BuiltHull } from './hull';
import { edgeRunsBelow, hullEdgeOpen, loopMirrored, outlineContactRuns, outlineEdgeLength } from './outline';
import type { Longitudinal, Part } from './part-schema';
import type { GirthEdge } from './pieces';
import { type Shape, polygonIsSimple, polylineLength, shapeBoolean } from './polygon';
import { type RingBottomRule, type RingSpec, ringRegion } from './ring';
import { type Section, sectionAt } from './section';
import { GeometryInputError, type SectionPoint } from './types';

/**
 * One face of a part cut in a station plane (x = const): the deducted outline at that x shaped by the part's
 * kind (ring, bulkhead, floor, beam, mould) before notches and holes are cut, with what the later stages
 * need: the edges against the skin and deck (for bevel marks and fillets), the outer edge limbers are
 * placed along, and the edge joints are measured along.
 */

/** The parts cut in a station plane. */
export type StationPart = Exclude<Part, { kind: 'transom' } | { kind: 'measured-frame' }>;


/** A face before cutting (see the file's note). Station faces are symmetric: contact runs are starboard only. */
export interface StationFace {
  x: number;
  section: Section;
  /** The deducted half outline (deduction.ts). */
  half: EdgePoint[];
  regions: Shape[];
  /** Per region, the edge its joints are measured along. */
  girthEdges: GirthEdge[];
  /** The outer edge against the skin from port to starboard (limbers are placed along it). */
  hullEdge: SectionPoint[];
  /** Starboard edges against the skin and deck, each from the centreline outward (girths increasing). */
  contact: EdgePoint[][];
  /** Which sides the contact edges are on: both (the port side is their mirror), or one. */
  contactSides: 'both' | 'starboard' | 'port';
  /** Length (mm) of edge bonded to the skin and deck, both sides. */
  jointLengthMm: number;
  /** Ring widths, for a ring frame (notch and limber depths are checked against them). */
  ring: RingSpec | null;
}

/** What shaping a face needs besides the part: the lowest chine's girth, the half beam's inboard end. */
export interface FaceContext {
  chineGirthMm: number | null;
  inboardYMm: number | null;
  /** Extra set-in (mm) normal to the skin: the depth of the longitudinals a mould carries. */
  extraSetInMm: number;
  chordToleranceMm: number;
}

const fail = (code: string, field: string, value: unknown, message: string): never => {
  throw new GeometryInputError([{ code, message, field, value }]);
};

/** Moulded girth (mm) of the lowest chine in a section (a node on a line of role chine), or null. */
export function sectionChineGirth(hull: BuiltHull, section: Section): number | null {
  const chines = new Set(hull.fitted.filter((f) => f.role === 'chine').map((f) => f.id));
  let best: { z: number; i: number } | null = null;
  section.nodes.forEach((n, i) => {
    if (n.lineIds.some((id) => chines.has(id)) && (best === null || n.z < best.z)) best = { z: n.z, i };
  });
  if (best === null) return null;
  const i = (best as { i: number }).i;
  for (const v of section.vertices) if (v.t === 0 && section.segments[v.segment]!.fromNode === i) return v.girthMm;
  return i === section.nodes.length - 1 ? section.girthMm : null;
}

/** The ring's widths and where its bottom width ends (stated height, the lowest chine, else where the bottom turns). */
export function ringSpecOf(part: Extract<Part, { kind: 'ring-frame' }>, chineGirthMm: number | null): RingSpec {
  const bottom: RingBottomRule = part.bottomToZ !== null ? { by: 'height', z: part.bottomToZ } : chineGirthMm !== null ? { by: 'girth', girthMm: chineGirthMm } : { by: 'normal' };
  const w = part.ringWidth;
  return { bottomMm: w.bottomMm, sidesMm: w.sidesMm, underDeckMm: w.underDeckMm ?? w.sidesMm, bottom, cornerRadiusMm: part.innerCornerRadiusMm, top: part.top };
}

/** The loop clipped to the half-plane z <= topZ (Sutherland-Hodgman: one pass over the edges). */
function loopBelow(loop: readonly SectionPoint[], topZ: number): SectionPoint[] {
  const out: SectionPoint[] = [];
  for (let i = 0; i < loop.length; i++) {
    const a = loop[i]!;
    const b = loop[(i + 1) % loop.length]!;
    const ina = a.z <= topZ;
    const inb = b.z <= topZ;
    if (ina) out.push(a);
    if (ina !== inb) out.push({ y: a.y + ((topZ - a.z) / (b.z - a.z)) * (b.y - a.y), z: topZ });
  }
  return out;
}

/**
 * The face of a station part at x (mm): `hull` is the hull to cut (for a mould, its copy without a deck);
 * `known` the section at x when the caller has it already.
 * @throws GeometryInputError where the hull does not reach x, or the kind cannot be cut there (a ring too
 *   wide, a floor's top below the keel, a beam that misses the side).
 */
export function stationFaceAt(hull: BuiltHull, part: StationPart, x: number, ctx: FaceContext, known: Section | null = null): StationFace {
  const section = known ?? sectionAt(hull, x, { chordToleranceMm: ctx.chordToleranceMm });
  if (!section) return fail('hull-does-not-reach', 'stationId', x, `the hull does not reach x = ${x.toFixed(1)} mm (its lines run from ${hull.xMin} to ${hull.xMax} mm)`);
  const ded = deductionOf(hull, section!, { filletClearanceMm: part.filletClearanceMm + ctx.extraSetInMm });
  const half = ded.outline;
  const runs = outlineContactRuns(half);
  const hullEdge = hullEdgeOpen(half);
  const openEdge: GirthEdge = { points: hullEdge, closed: false };
  // Built as one literal: spreading a base and overriding its keys takes V8's slow path (outline.ts), and
  // this runs on every face.
  type Own = Pick<StationFace, 'regions' | 'girthEdges' | 'contact' | 'jointLengthMm'> & Partial<Pick<StationFace, 'hullEdge' | 'ring' | 'contactSides'>>;
  const faceOf = (f: Own): StationFace => ({
    x,
    section: section!,
    half,
    hullEdge: f.hullEdge ?? hullEdge,
    ring: f.ring ?? null,
    contactSides: f.contactSides ?? 'both',
    regions: f.regions,
    girthEdges: f.girthEdges,
    contact: f.contact,
    jointLengthMm: f.jointLengthMm,
  });
  const bothSides = (k: number): number => 2 * k;
  switch (part.kind) {
    case 'bulkhead':
    case 'mould': {
      const outer = loopMirrored(half);
      const joint = part.kind === 'mould' ? 0 : bothSides(outlineEdgeLength(half, ['hull', 'deck']));
      return faceOf({ regions: [{ outer, holes: [] }], girthEdges: [openEdge], contact: contactOf([runs.hull, runs.deck]), jointLengthMm: joint });
    }
    case 'ring-frame': {
      const spec = ringSpecOf(part, ctx.chineGirthMm);
      const region = ringRegion(half, spec, ctx.chordToleranceMm);
      const girthEdge: GirthEdge = spec.top === 'deck' ? { points: region.outer, closed: true } : openEdge;
      const kinds: ('hull' | 'deck')[] = spec.top === 'deck' ? ['hull', 'deck'] : ['hull'];
      return faceOf({ ring: spec, regions: [region], girthEdges: [girthEdge], contact: contactOf(spec.top === 'deck' ? [runs.hull, runs.deck] : [runs.hull]), jointLengthMm: bothSides(outlineEdgeLength(half, kinds)) });
    }
    case 'floor':
    case 'partial-bulkhead': {
      const full = loopMirrored(half);
      let zMin = Infinity;
      for (const p of full) zMin = Math.min(zMin, p.z);
      if (!(part.topZ > zMin)) fail('top-below-keel', 'topZ', part.topZ, `the top at ${part.topZ} mm is not above the bottom of the frame (${zMin.toFixed(1)} mm)`);
      let loop = loopBelow(full, part.topZ);
      let regions: Shape[] = [{ outer: loop, holes: [] }];
      if (!polygonIsSimple(loop)) {
        regions = shapeBoolean('intersection', [{ outer: full, holes: [] }], [{ outer: [{ y: -1e6, z: zMin - 10 }, { y: 1e6, z: zMin - 10 }, { y: 1e6, z: part.topZ }, { y: -1e6, z: part.topZ }], holes: [] }]);
        loop = regions[0]?.outer ?? loop;
      }
      const hullBelow = edgeRunsBelow(runs.hull, (p) => p.z, part.topZ);
      const deckBelow = edgeRunsBelow(runs.deck, (p) => p.z, part.topZ);
      const contact = contactOf([...hullBelow, ...deckBelow]);
      const joint = bothSides([...hullBelow, ...deckBelow].reduce((s, r) => s + polylineLength(r), 0));
      const edge = edgeRunsBelow(half.filter((p) => p.edge === 'hull'), (p) => p.z, part.topZ)[0] ?? runs.hull;
      const edgePts = edge.map((p) => ({ y: p.y, z: p.z }));
      const open = [...edgePts.filter((p) => p.y > 1e-9).map((p) => ({ y: -p.y, z: p.z })).reverse(), ...edgePts];
      return faceOf({ regions, girthEdges: regions.map(() => ({ points: open, closed: false })), contact, jointLengthMm: joint });
    }
    case 'deck-beam':
    case 'half-beam': {
      const beam = beamOutline(half, {
        mouldedDepthMm: part.mouldedDepthMm,
        taper: part.taper,
        inboardYMm: part.kind === 'half-beam' ? ctx.inboardYMm : null,
        sides: part.kind === 'half-beam' ? part.sides : 'both',
      });
      const joint = (beam.regions.length === 1 && part.kind === 'half-beam' ? 1 : 2) * (polylineLength(beam.deckEdge) + polylineLength(beam.endEdge));
      const sides = part.kind === 'half-beam' ? (part.sides === 'both' ? ['starboard', 'port'] : [part.sides]) : ['starboard'];
      const girthEdges: GirthEdge[] = sides.map((s) => ({ points: s === 'port' ? beam.topEdge.map((p) => ({ y: -p.y, z: p.z })).reverse() : beam.topEdge, closed: false }));
      const contactSides = part.kind === 'half-beam' ? part.sides : 'both';
      return faceOf({ regions: beam.regions, girthEdges, hullEdge: beam.topEdge, contact: contactOf([beam.deckEdge, beam.endEdge]), contactSides, jointLengthMm: joint });
    }
  }
}

const contactOf = (runs: EdgePoint[][]): EdgePoint[][] => runs.filter((r) => r.length > 1);

/** The longitudinals a mould carries, in its x: the deepest one's depth (mm) is set in on top of the skin. */
export function mouldSetInMm(part: StationPart, longitudinals: readonly Longitudinal[], x: number): number {
  if (part.kind !== 'mould') return 0;
  let d = 0;
  for (const id of part.carriesIds) {
    const lg = longitudinals.find((l) => l.id === id);
    if (lg && (lg.fromX === null || x >= lg.fromX) && (lg.toX === null || x <= lg.toX)) d = Math.max(d, lg.depthMm);
  }
  return d;
}
