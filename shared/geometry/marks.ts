import { lastOf } from './arrays';
import { type FrameSiding, bevelMarkOf, bevelSummaryOf } from './bevel';
import type { EdgePoint } from './edge';
import type { CheckDimension, PartBevelMark, PartCut, PartLevelLine, PartRegion, PartSide, PartTemplateMarks } from './frame-types';
import { edgePointLerp, negated } from './outline';
import { type Bounds, polygonBounds } from './polygon';
import type { SectionPoint } from './types';

/**
 * What is drawn on a part's template besides its outline: bevel marks along the edges against the skin and
 * deck, the reference lines (centreline, level line, design waterline, set-up line), labels and the grain
 * arrow, and one long check dimension for the taped-up paper.
 */

/** An edge against the skin or the deck in template coordinates, from the centreline outward (girth increasing). */
export interface ContactRun {
  points: EdgePoint[];
  side: PartSide;
}

/** How far (mm) the centreline is drawn past the part, above and below. */
export const CENTRELINE_OVERRUN_MM = 50;
/** Level lines are put at a multiple of this (mm) when the part has none of its own. */
export const LEVEL_LINE_STEP_MM = 10;

/**
 * Bevel marks along the contact runs: at every multiple of `everyMm` of girth from the centreline, both
 * sides of each corner, and each run's far end; none inside `cutters` (notches and limbers take that edge
 * away). Girth is signed by side (port negative); a tilt past `sawTiltLimitRad` is flagged.
 */
export function bevelMarksAlong(runs: readonly ContactRun[], frame: FrameSiding, everyMm: number, sawTiltLimitRad: number, cutters: readonly SectionPoint[][] = []): PartBevelMark[] {
  const out: PartBevelMark[] = [];
  const step = everyMm > 0 ? everyMm : 50;
  const boxes = cutters.map((c) => polygonBounds(c)!);
  const emit = (p: EdgePoint, side: PartSide): void => {
    for (let k = 0; k < cutters.length; k++) {
      const b = boxes[k]!;
      if (p.y < b.minY || p.y > b.maxY || p.z < b.minZ || p.z > b.maxZ) continue;
      if (insideLoop(cutters[k]!, p)) return;
    }
    const m = bevelMarkOf(p, frame);
    const last = lastOf(out);
    const g = side === 'port' ? negated(m.girthMm) : m.girthMm;
    if (last && last.side === side && last.edge === m.edge && Math.abs(last.girthMm - g) < 1e-9 && last.bevel === m.bevel) return;
    // Field by field (an overriding spread is V8's slow path); + 0 turns a -0 (a normal straight up on the
    // centreline) into 0, which plain JSON cannot tell apart.
    out.push({
      y: m.y + 0,
      z: m.z,
      ny: m.ny + 0,
      nz: m.nz + 0,
      girthMm: g + 0,
      edge: m.edge,
      corner: m.corner,
      bevel: m.bevel,
      bevelDeg: m.bevelDeg,
      kind: m.kind,
      slidingBevelDeg: m.slidingBevelDeg,
      markedFace: m.markedFace,
      largerFace: m.largerFace,
      faceDown: m.faceDown,
      removedMm: m.removedMm,
      tableTilt: m.tableTilt,
      side,
      overLimit: m.bevel > sawTiltLimitRad,
    });
  };
  for (const run of runs) {
    const pts = run.points;
    if (pts.length === 0) continue;
    let next = Math.ceil(pts[0]!.girthMm / step - 1e-9) * step;
    for (let i = 0; i < pts.length; i++) {
      const p = pts[i]!;
      const q = pts[i + 1];
      if (i === 0 || (p.corner && p.edge !== 'closure')) emit(p, run.side);
      if (!q) break;
      const g0 = p.girthMm;
      const g1 = q.girthMm;
      while (next <= g1 + 1e-9 && g1 > g0) {
        if (next >= g0 - 1e-9) emit(edgePointLerp(p, q, Math.min(1, Math.max(0, (next - g0) / (g1 - g0)))), run.side);
        next += step;
      }
    }
    emit(pts[pts.length - 1]!, run.side);
  }
  return out;
}

/** Even-odd test: p strictly inside the loop (on the boundary counts either way; marks there are dropped or kept alike). */
function insideLoop(loop: readonly SectionPoint[], p: SectionPoint): boolean {
  let inside = false;
  for (let i = 0, j = loop.length - 1; i < loop.length; j = i++) {
    const a = loop[i]!;
    const b = loop[j]!;
    if (a.z > p.z !== b.z > p.z && p.y < ((b.y - a.y) * (p.z - a.z)) / (b.z - a.z) + a.y) inside = !inside;
  }
  return inside;
}

/** The summary of the marks (bevel.ts), with how many pass the saw's limit. */
export function bevelMarksSummary(marks: readonly PartBevelMark[], sawTiltLimitRad: number): ReturnType<typeof bevelSummaryOf> & { overLimit: number; sawTiltLimitRad: number } {
  const s = bevelSummaryOf(marks);
  let overLimit = 0;
  for (const m of marks) if (m.overLimit) overLimit++;
  // Field by field: a spread of the summary took as long as counting the marks.
  return { under: s.under, standing: s.standing, square: s.square, mixed: s.mixed, maxBevelDeg: s.maxBevelDeg, overLimit, sawTiltLimitRad };
}

/** Where the level line at template height z crosses the part's outer loops: leftmost and rightmost y, or null. */
function crossingsAt(regions: readonly PartRegion[], z: number): { min: number; max: number } | null {
  let min = Infinity;
  let max = -Infinity;
  for (const r of regions) {
    const loop = r.outer;
    for (let i = 0; i < loop.length; i++) {
      const a = loop[i]!;
      const b = loop[(i + 1) % loop.length]!;
      if ((a.z - z) * (b.z - z) > 0) continue;
      const ys = a.z === b.z ? [a.y, b.y] : [a.y + ((z - a.z) / (b.z - a.z)) * (b.y - a.y)];
      for (const y of ys) [min, max] = [Math.min(min, y), Math.max(max, y)];
    }
  }
  return min <= max ? { min, max } : null;
}

/** A level line at hull height `heightMm`, drawn at template height `templateZ` across the part. */
export function levelLineOf(regions: readonly PartRegion[], bounds: Bounds, heightMm: number, templateZ: number): PartLevelLine {
  const c = crossingsAt(regions, templateZ);
  const from = { y: c ? c.min : bounds.minY, z: templateZ };
  const to = { y: c ? c.max : bounds.maxY, z: templateZ };
  return { heightMm, templateZ, from, to, crossesPart: c !== null };
}

/**
 * The widest level line across the part: at the height of its starboard-most point, from where that line
 * leaves the outline on the port side to where it leaves it on the starboard side. Null for no outline.
 */
export function checkDimensionOf(regions: readonly PartRegion[]): CheckDimension | null {
  let best: SectionPoint | null = null;
  for (const r of regions) for (const p of r.outer) if (best === null || p.y > best.y) best = p;
  if (best === null) return null;
  const c = crossingsAt(regions, best.z);
  if (!c || c.max - c.min <= 0) return null;
  return { from: { y: c.min, z: best.z }, to: { y: c.max, z: best.z }, lengthMm: c.max - c.min };
}

/** What the template marks need besides the regions. */
export interface MarksInput {
  regions: readonly PartRegion[];
  bounds: Bounds;
  /** Template height of a hull height (identity except on a transom). */
  templateZ: (heightMm: number) => number;
  levelLineZ: number | null;
  designWaterlineZ: number | null;
  setUpLineZ: number | null;
  grain: 'y' | 'z' | null;
  stationName: string | null;
  partName: string;
  markedFace: 'forward' | 'aft';
  notchCentres: SectionPoint[];
  limberCentres: SectionPoint[];
}

/**
 * The template's reference marks. The level line is the part's own; without one, the design waterline
 * where it crosses the part; else the part's mid-height, rounded down to `LEVEL_LINE_STEP_MM` (our choice:
 * any level line serves for setting up, as long as its height is written on it).
 */
export function templateMarksOf(m: MarksInput): PartTemplateMarks {
  const { bounds: b } = m;
  const centreline: PartCut = { from: { y: 0, z: b.minZ - CENTRELINE_OVERRUN_MM }, to: { y: 0, z: b.maxZ + CENTRELINE_OVERRUN_MM } };
  const line = (h: number): PartLevelLine => levelLineOf(m.regions, b, h, m.templateZ(h));
  const dwl = m.designWaterlineZ === null ? null : line(m.designWaterlineZ);
  let levelHeight = m.levelLineZ;
  if (levelHeight === null && dwl !== null && dwl.crossesPart) levelHeight = m.designWaterlineZ;
  if (levelHeight === null) {
    // Back from the template's mid-height to a hull height (the template map is linear).
    const t0 = m.templateZ(0);
    const scale = m.templateZ(1) - t0 || 1;
    const mid = ((b.minZ + b.maxZ) / 2 - t0) / scale;
    levelHeight = Math.floor(mid / LEVEL_LINE_STEP_MM) * LEVEL_LINE_STEP_MM;
  }
  const cy = (b.minY + b.maxY) / 2;
  const cz = (b.minZ + b.maxZ) / 2;
  const arrow = Math.min(300, 0.25 * (m.grain === 'z' ? b.maxZ - b.minZ : b.maxY - b.minY));
  const grain = m.grain === null ? null : m.grain === 'y' ? { direction: 'y' as const, from: { y: cy - arrow / 2, z: cz }, to: { y: cy + arrow / 2, z: cz } } : { direction: 'z' as const, from: { y: cy, z: cz - arrow / 2 }, to: { y: cy, z: cz + arrow / 2 } };
  return {
    centreline,
    levelLine: line(levelHeight),
    designWaterline: dwl,
    setUpLine: m.setUpLineZ === null ? null : line(m.setUpLineZ),
    stationName: m.stationName,
    faceLabel: [m.partName, m.stationName, `${m.markedFace} face`].filter((s) => s !== null).join(', '),
    markedFace: m.markedFace,
    grain,
    notchCentres: m.notchCentres,
    limberCentres: m.limberCentres,
  };
}
