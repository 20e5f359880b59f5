import { bench, describe } from 'vitest';
import { frameOfPart } from '../../shared/geometry/frame';
import { hullBuild } from '../../shared/geometry/hull';
import { type Part, longitudinalSchema, partSchema } from '../../shared/geometry/part-schema';
import { inventedHull } from './invented-hull';

/**
 * How long the parts take on a large hull (reports, never gates): the invented 7.2 m hull of 60 stations and
 * about 40 offsets a station (tests/bench/invented-hull.ts), one frame at every station: ring frames of two
 * 9 mm layers where the hull is wide enough, bulkheads of two layers at the fine ends; bevel marks every
 * 25 mm of girth; notches for two bottom stringers, a sheer clamp (by the sheer line) and a hog on the
 * centreline; a pair of limbers. Targets on the project machine: one frame at most 2 ms (median), the whole
 * hull at most 120 ms.
 * Run: npx vitest bench --run --project unit tests/bench/parts.bench.ts
 */

const hull = hullBuild(inventedHull(60));
const longitudinals = [
  { id: 'st-a', name: 'Stringer A', kind: 'stringer', placement: { by: 'girth', girthMm: 300 }, widthMm: 25, depthMm: 20 },
  { id: 'st-b', name: 'Stringer B', kind: 'stringer', placement: { by: 'girth', girthMm: 650 }, widthMm: 25, depthMm: 20 },
  { id: 'clamp', name: 'Clamp', kind: 'clamp', placement: { by: 'line', lineId: 'sheer', girthOffsetMm: -40 }, widthMm: 40, depthMm: 22 },
  { id: 'hog', name: 'Hog', kind: 'hog', placement: { by: 'girth', girthMm: 0 }, widthMm: 80, depthMm: 25, sides: 'centreline' },
].map((l) => longitudinalSchema.parse(l));

function frameAt(i: number, pieces: number): Part {
  const st = hull.stations[i]!;
  const wide = i >= 6 && i <= 56;
  const common = {
    id: `f${i}`,
    name: `Frame ${i}`,
    stationId: st.id,
    thicknessMm: 18,
    layers: [{ thicknessMm: 9, joints: { by: 'count', pieces } }, { thicknessMm: 9, joints: { by: 'count', pieces } }],
    bevelMarks: { everyMm: 25 },
    limbers: [{ girthMm: 60, radiusMm: 12 }],
  };
  return partSchema.parse(wide ? { ...common, kind: 'ring-frame', ringWidth: { bottomMm: 80, sidesMm: 55, underDeckMm: 60 }, innerCornerRadiusMm: 20 } : { ...common, kind: 'bulkhead' });
}

const parts = hull.stations.map((_, i) => frameAt(i, 1));
const jointed = hull.stations.map((_, i) => frameAt(i, 3));
const failed = parts.map((p) => frameOfPart(hull, p, longitudinals)).filter((r) => !r.ok);
if (failed.length > 0) throw new Error(`bench parts that do not build: ${failed.map((r) => (r.ok ? '' : r.issues[0]!.message)).join('; ')}`);

// vitest's table gives the mean and upper percentiles; the targets are medians, so a timing pass prints them,
// beside a fixed reference (one shoelace area of a 306-point loop) that says how fast the machine is running.
// The reference is its own copy of the shoelace as polygon.ts had it when the targets were set: polygonSignedArea
// itself has been made faster since, and a reference that speeds up with the code measures nothing.
function shoelaceReference(loop: readonly { y: number; z: number }[]): number {
  let twice = 0;
  for (let i = 0, n = loop.length; i < n; i++) {
    const a = loop[i]!;
    const b = loop[(i + 1) % n]!;
    twice += a.y * b.z - b.y * a.z;
  }
  return loop.length < 3 ? 0 : twice / 2;
}
{
  const median = (v: number[]): number => [...v].sort((x, y) => x - y)[v.length >> 1]!;
  for (let w = 0; w < 2; w++) for (const p of parts) frameOfPart(hull, p, longitudinals);
  const frames: number[] = [];
  const hulls: number[] = [];
  for (let r = 0; r < 5; r++) {
    const h0 = performance.now();
    for (const p of parts) {
      const t0 = performance.now();
      frameOfPart(hull, p, longitudinals);
      frames.push(performance.now() - t0);
    }
    hulls.push(performance.now() - h0);
  }
  const loop = hull.stations.flatMap((_, i) => Array.from({ length: 6 }, (__, k) => ({ y: Math.cos(i + k), z: Math.sin(i * k) }))).slice(0, 306);
  const r0 = performance.now();
  let sink = 0;
  for (let k = 0; k < 20000; k++) sink += shoelaceReference(loop);
  const refUs = ((performance.now() - r0) / 20000) * 1000;
  console.log(`parts bench: one frame median ${median(frames).toFixed(2)} ms, whole hull median ${median(hulls).toFixed(1)} ms; reference 306-point area ${refUs.toFixed(2)} us${sink === 0 ? '' : ''}`);
}

describe('every part of a large hull (60 frames, 2 layers, bevels every 25 mm, notches)', () => {
  bench('the whole hull: 60 frames', () => {
    for (const p of parts) frameOfPart(hull, p, longitudinals);
  });

  let k = 0;
  bench('one frame (what the editor recomputes on a drag; station cycling along the hull)', () => {
    frameOfPart(hull, parts[k++ % parts.length]!, longitudinals);
  });

  let j = 0;
  bench('one frame with each layer in 3 pieces (joints staggered, pieces cut)', () => {
    frameOfPart(hull, jointed[j++ % jointed.length]!, longitudinals);
  });
});
