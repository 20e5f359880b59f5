import { lastOf } from './arrays';
import { vectorLength } from './vector';
import { type Shape, polygonBounds, polygonSignedArea, shapeBoolean } from './polygon';
import type { SectionPoint } from './types';

/**
 * Cutters (notch rectangles, limber circles, openings) taken out of a part's regions. Almost every cut is a
 * bite out of the outer edge (the cutter crosses it twice and touches nothing else) or a hole wholly inside
 * the material: those are spliced here exactly, in time linear in the loop. Anything else (cutters that
 * overlap, a cutter reaching a hole, an edge crossed more than twice) goes to clipper-lib's difference.
 *
 * A bite: walking the outer loop (counter-clockwise, material on the left), where it enters the cutter the
 * walk turns onto the cutter's edge and follows it backward (clockwise) to where the loop leaves it, so the
 * material stays on the left and the bitten part is left out.
 */

interface Crossing {
  /** Edge of the loop (from point i to i + 1) and the fraction along it. */
  i: number;
  s: number;
  /** Edge of the cutter and the fraction along it. */
  k: number;
  u: number;
  point: SectionPoint;
}

/**
 * A loop's edges in runs of `LOOP_BLOCK` with the box of each run, so that a cutter, a few millimetres
 * across, skips the runs of a 400-point loop it cannot reach instead of testing every edge (a frame's nine
 * cutters tested every edge of every face twice over: the largest part of cutting). Block b holds edges
 * b * LOOP_BLOCK up to the next block, edge i running from point i to i + 1 (the last one back to point 0).
 */
interface IndexedLoop {
  loop: readonly SectionPoint[];
  /** minY, maxY, minZ, maxZ of each block. */
  boxes: number[];
}

/** Edges per block of an `IndexedLoop`. */
const LOOP_BLOCK = 16;

function indexedLoop(loop: readonly SectionPoint[]): IndexedLoop {
  const n = loop.length;
  const blocks = Math.ceil(n / LOOP_BLOCK);
  // A plain array, not a typed one: V8 takes a couple of microseconds over each typed array past 64 bytes.
  const boxes: number[] = [];
  for (let b = 0; b < blocks; b++) {
    let minY = Infinity;
    let maxY = -Infinity;
    let minZ = Infinity;
    let maxZ = -Infinity;
    // The block's edges end at the first point of the next block (or back at point 0).
    for (let i = b * LOOP_BLOCK, end = Math.min(n, (b + 1) * LOOP_BLOCK); i <= end; i++) {
      const p = loop[i < n ? i : 0]!;
      if (p.y < minY) minY = p.y;
      if (p.y > maxY) maxY = p.y;
      if (p.z < minZ) minZ = p.z;
      if (p.z > maxZ) maxZ = p.z;
    }
    boxes.push(minY, maxY, minZ, maxZ);
  }
  return { loop, boxes };
}

/**
 * The box of an indexed loop from its blocks' boxes, or null when it has no points: the same figures as
 * `polygonBounds` of the loop (every point is in a block), without walking its points again.
 */
function indexedBounds(il: IndexedLoop): Box | null {
  const bb = il.boxes;
  if (bb.length === 0) return null;
  let minY = Infinity;
  let maxY = -Infinity;
  let minZ = Infinity;
  let maxZ = -Infinity;
  for (let b = 0; b < bb.length; b += 4) {
    if (bb[b]! < minY) minY = bb[b]!;
    if (bb[b + 1]! > maxY) maxY = bb[b + 1]!;
    if (bb[b + 2]! < minZ) minZ = bb[b + 2]!;
    if (bb[b + 3]! > maxZ) maxZ = bb[b + 3]!;
  }
  return { minY, maxY, minZ, maxZ };
}

/** Even-odd test of p against the loop (a ray toward +y). */
const inside = (loop: readonly SectionPoint[], p: SectionPoint): boolean => {
  let c = false;
  for (let i = 0, j = loop.length - 1; i < loop.length; j = i++) {
    const a = loop[i]!;
    const b = loop[j]!;
    if (a.z > p.z !== b.z > p.z && p.y < ((b.y - a.y) * (p.z - a.z)) / (b.z - a.z) + a.y) c = !c;
  }
  return c;
};

/**
 * `inside` on an indexed loop, the same answer: an edge counts only when p.z lies between its ends' heights
 * (one above p.z, one not), which no edge of a block wholly above p.z, or wholly at or below it, does.
 */
function insideIndexed(il: IndexedLoop, p: SectionPoint): boolean {
  const loop = il.loop;
  const n = loop.length;
  let c = false;
  for (let blk = 0; 4 * blk < il.boxes.length; blk++) {
    if (il.boxes[4 * blk + 2]! > p.z || il.boxes[4 * blk + 3]! <= p.z) continue;
    for (let e = blk * LOOP_BLOCK, end = Math.min(n, (blk + 1) * LOOP_BLOCK); e < end; e++) {
      // Edge e joins point e and e + 1: the same pair as `inside` takes (i, j = i - 1) for i = e + 1.
      const a = loop[(e + 1) % n]!;
      const b = loop[e]!;
      if (a.z > p.z !== b.z > p.z && p.y < ((b.y - a.y) * (p.z - a.z)) / (b.z - a.z) + a.y) c = !c;
    }
  }
  return c;
}

type Box = { minY: number; maxY: number; minZ: number; maxZ: number };
const boxesMeet = (a: Box, b: Box): boolean => a.minY <= b.maxY && b.minY <= a.maxY && a.minZ <= b.maxZ && b.minZ <= a.maxZ;

/** Where the loop's edges cross the cutter's (each crossing counted once: fractions in [0, 1) on both). */
function crossings(il: IndexedLoop, cutter: readonly SectionPoint[], box: Box): Crossing[] | null {
  const out: Crossing[] = [];
  const loop = il.loop;
  const n = loop.length;
  const m = cutter.length;
  for (let blk = 0; 4 * blk < il.boxes.length; blk++) {
    const bb = il.boxes;
    if (bb[4 * blk + 1]! < box.minY || bb[4 * blk]! > box.maxY || bb[4 * blk + 3]! < box.minZ || bb[4 * blk + 2]! > box.maxZ) continue;
    for (let i = blk * LOOP_BLOCK, end = Math.min(n, (blk + 1) * LOOP_BLOCK); i < end; i++) {
      const a = loop[i]!;
      const b = loop[(i + 1) % n]!;
      if (Math.max(a.y, b.y) < box.minY || Math.min(a.y, b.y) > box.maxY || Math.max(a.z, b.z) < box.minZ || Math.min(a.z, b.z) > box.maxZ) continue;
      const ry = b.y - a.y;
      const rz = b.z - a.z;
      for (let k = 0; k < m; k++) {
        const c = cutter[k]!;
        const d = cutter[(k + 1) % m]!;
        const qy = d.y - c.y;
        const qz = d.z - c.z;
        const den = ry * qz - rz * qy;
        if (Math.abs(den) < 1e-15) {
          // Parallel: only a problem when they overlap (a cutter edge lying on the loop's edge): not a simple bite.
          const cross = (c.y - a.y) * rz - (c.z - a.z) * ry;
          if (Math.abs(cross) < 1e-12 * Math.max(1, vectorLength(ry, rz))) return null;
          continue;
        }
        const wy = c.y - a.y;
        const wz = c.z - a.z;
        const s = (wy * qz - wz * qy) / den;
        const u = (wy * rz - wz * ry) / den;
        if (s >= 0 && s < 1 && u >= 0 && u < 1) out.push({ i, s, k, u, point: { y: a.y + s * ry, z: a.z + s * rz } });
      }
    }
  }
  return out;
}

/** A bite: where the loop goes into the cutter and where it comes out. */
interface Bite {
  cutter: readonly SectionPoint[];
  enter: Crossing;
  leave: Crossing;
}

/** The bite a cutter takes from the loop, or null when it is not a simple one (not two crossings, in then out). */
function biteOf(loop: readonly SectionPoint[], cutter: readonly SectionPoint[], x: Crossing[]): Bite | null {
  if (x.length !== 2) return null;
  const n = loop.length;
  // Which of the two is where the loop goes in: just after it the loop lies inside the cutter.
  const after = (c: Crossing): SectionPoint => {
    const a = loop[c.i]!;
    const b = loop[(c.i + 1) % n]!;
    const f = Math.min(1, c.s + 1e-6);
    return { y: a.y + f * (b.y - a.y), z: a.z + f * (b.z - a.z) };
  };
  const in0 = inside(cutter, after(x[0]!));
  if (in0 === inside(cutter, after(x[1]!))) return null;
  return in0 ? { cutter, enter: x[0]!, leave: x[1]! } : { cutter, enter: x[1]!, leave: x[0]! };
}

const along = (c: Crossing): number => c.i + c.s;

/**
 * The loop with its bites taken out, in one walk: from each bite's way out along the loop to the next bite's
 * way in, then back along that cutter (clockwise) to its way out. The bites do not overlap (their cutters do
 * not meet). Null when they do not follow one another round the loop as simple bites do.
 */
function bitten(loop: readonly SectionPoint[], bites: readonly Bite[]): SectionPoint[] | null {
  const n = loop.length;
  const order = [...bites].sort((a, b) => along(a.leave) - along(b.leave));
  const out: SectionPoint[] = [];
  const push = (p: SectionPoint): void => {
    // A bite entered or left exactly at a vertex gives that point twice: once is enough.
    const q = lastOf(out);
    if (!q || q.y !== p.y || q.z !== p.z) out.push(p);
  };
  for (let b = 0; b < order.length; b++) {
    const from = order[b]!;
    const to = order[(b + 1) % order.length]!;
    // Going round from this bite's way out, the next bite's way in must come before its way out.
    let gap = along(to.enter) - along(from.leave);
    if (gap < 0 || (gap === 0 && order.length === 1)) gap += n;
    let next = along(to.leave) - along(from.leave);
    if (next <= 0) next += n;
    if (!(gap < next)) return null;
    push(from.leave.point);
    // The loop's points strictly after the way out, up to and with the start of the edge the next bite enters on.
    let span = to.enter.i - from.leave.i;
    if (span < 0 || (span === 0 && gap > 1)) span += n;
    for (let k = 1; k <= span; k++) push(loop[(from.leave.i + k) % n]!);
    push(to.enter.point);
    // Back along the cutter from the edge it is entered on to the edge it is left by; both on one edge, either
    // straight along it (left before entered, going backward) or all the way round.
    const m = to.cutter.length;
    let k = to.enter.k;
    if (!(k === to.leave.k && to.leave.u < to.enter.u)) {
      for (let guard = 0; guard <= m; guard++) {
        push(to.cutter[k]!);
        k = (k - 1 + m) % m;
        if (k === to.leave.k) break;
      }
    }
  }
  const first = out[0]!;
  const last = out[out.length - 1]!;
  if (out.length > 1 && first.y === last.y && first.z === last.z) out.pop();
  return polygonSignedArea(out) > 0 ? out : null;
}

/** The shapes with every cutter (counter-clockwise loops) taken out: spliced when simple, else by clipper-lib. */
export function cutShapes(regions: readonly Shape[], cutters: readonly SectionPoint[][]): Shape[] {
  if (cutters.length === 0) return [...regions];
  const boxes = cutters.map((c) => polygonBounds(c)!);
  // Cutters that overlap each other need a real boolean.
  for (let a = 0; a < boxes.length; a++) {
    for (let b = a + 1; b < boxes.length; b++) if (boxesMeet(boxes[a]!, boxes[b]!) && loopsMeet(cutters[a]!, cutters[b]!, boxes[b]!)) return clipped(regions, cutters);
  }
  const out: Shape[] = regions.map((r) => ({ outer: r.outer, holes: [...r.holes] }));
  // Indexed once for all the cutters (holes as given: a cutter that reaches one goes to clipper).
  const outers = regions.map((r) => indexedLoop(r.outer));
  const outerBoxes = outers.map((il) => indexedBounds(il)!);
  const holes = regions.map((r) => r.holes.map(indexedLoop));
  const bites: Bite[][] = out.map(() => []);
  for (let c = 0; c < cutters.length; c++) {
    const cutter = cutters[c]!;
    const box = boxes[c]!;
    for (let ri = 0; ri < out.length; ri++) {
      const r = out[ri]!;
      if (!boxesMeet(outerBoxes[ri]!, box)) continue;
      // A cutter that reaches a hole (crosses it, or lies in it) needs a real boolean.
      for (const h of holes[ri]!) {
        const xh = crossings(h, cutter, box);
        if (xh === null || xh.length > 0 || insideIndexed(h, cutter[0]!)) return clipped(regions, cutters);
      }
      const x = crossings(outers[ri]!, cutter, box);
      if (x === null) return clipped(regions, cutters);
      if (x.length === 0) {
        if (insideIndexed(outers[ri]!, cutter[0]!)) {
          // Wholly inside the material: a hole (clockwise).
          r.holes.push([...cutter].reverse());
          break;
        }
        if (inside(cutter, r.outer[0]!)) return clipped(regions, cutters);
        continue;
      }
      const b = biteOf(r.outer, cutter, x);
      if (b === null) return clipped(regions, cutters);
      bites[ri]!.push(b);
      break;
    }
  }
  for (let ri = 0; ri < out.length; ri++) {
    if (bites[ri]!.length === 0) continue;
    const cut = bitten(out[ri]!.outer, bites[ri]!);
    if (cut === null) return clipped(regions, cutters);
    out[ri]!.outer = cut;
  }
  return out;
}

/** Whether two loops overlap: their edges cross, or one lies inside the other. */
function loopsMeet(a: readonly SectionPoint[], b: readonly SectionPoint[], bBox: Box): boolean {
  const x = crossings(indexedLoop(a), b, bBox);
  return x === null || x.length > 0 || inside(a, b[0]!) || inside(b, a[0]!);
}

function clipped(regions: readonly Shape[], cutters: readonly SectionPoint[][]): Shape[] {
  return shapeBoolean('difference', regions, cutters.map((outer) => ({ outer, holes: [] })));
}
