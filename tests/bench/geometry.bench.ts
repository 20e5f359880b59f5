import { bench, describe } from 'vitest';
import { bevelAlong } from '../../shared/geometry/bevel';
import { deductionOf } from '../../shared/geometry/deduction';
import { fairnessCheck } from '../../shared/geometry/fairness';
import { hullBuild } from '../../shared/geometry/hull';
import { sectionAt } from '../../shared/geometry/section';
import { inventedHull } from './invented-hull';

/**
 * How long the geometry takes on a large hull: the invented 7.2 m hull of 60 stations and about 40 offsets
 * a station (tests/bench/invented-hull.ts). Targets on the project machine: building the hull at most 60 ms;
 * one section with its deduction and bevels (every 25 mm of girth) at most 1 ms (median).
 * Run: npx vitest bench --run --project unit tests/bench/geometry.bench.ts
 */

const lines = inventedHull(60);
const hull = hullBuild(lines);
const xs = Array.from({ length: 60 }, (_, i) => hull.xMin + 1 + ((hull.xMax - hull.xMin - 2) * i) / 59);
const frame = { markedFace: 'aft' as const, sidingMm: 18, xDirection: 'aft' as const };

function sectionWithBevels(x: number): number {
  const s = sectionAt(hull, x)!;
  const d = deductionOf(hull, s);
  return bevelAlong(d.hull, frame, 25).length + (d.deck ? bevelAlong(d.deck, frame, 25).length : 0);
}

describe('large hull (60 stations, ~40 offsets a station)', () => {
  bench('hullBuild: check and fit the whole table', () => {
    hullBuild(lines);
  });

  bench('60 sections with deduction, deck and bevels every 25 mm of girth', () => {
    for (const x of xs) sectionWithBevels(x);
  });

  let k = 0;
  bench('one section with deduction, deck and bevels (x cycling along the hull)', () => {
    sectionWithBevels(xs[k++ % xs.length]!);
  });

  let j = 0;
  bench('one section alone (what the editor draws on a pointer move)', () => {
    sectionAt(hull, xs[j++ % xs.length]!);
  });

  bench('fairness check of the whole table (on demand, not per pointer move)', () => {
    fairnessCheck(hull);
  });
});
