import { describe, expect, it } from 'vitest';
import type { EdgePoint } from '../../shared/geometry/edge';
import { outlineRuns } from '../../shared/geometry/outline';
import { RING_WIDTH_TAPER, type RingSpec, ringRunWidths, ringWidthAt } from '../../shared/geometry/ring-width';
import { expectClose } from './helpers';

const spec = (over: Partial<RingSpec> = {}): RingSpec => ({ bottomMm: 90, sidesMm: 60, underDeckMm: 40, bottom: { by: 'height', z: 100 }, cornerRadiusMm: 0, top: 'deck', ...over });
// Invented: a straight side from (500, 0) up to (500, 400), one run of two points, normal outward (+y).
const side: EdgePoint[] = [0, 400].map((z, i) => ({ y: 500, z, ny: 1, nz: 0, rate: 0, bevel: 0, girthMm: 500 + z, setInMm: 0, edge: 'hull' as const, corner: i > 0 }));

describe('ringRunWidths', () => {
  it('changes width at the stated height, tapering on the narrower side', () => {
    const run = outlineRuns(side)[0]!;
    const r = ringRunWidths(run, false, spec());
    // Analytic: 90 up to z = 100, then down to 60 over RING_WIDTH_TAPER x 30 = 120 mm, then 60.
    expect(r.pts.map((p) => p.z)).toEqual([0, 100, 100 + RING_WIDTH_TAPER * 30, 400]);
    expect(r.widths).toEqual([90, 90, 60, 60]);
    // A taper from the narrower to the wider comes before the change: 60 below, 80 above z = 100, the taper
    // 4 x 20 = 80 mm long from z = 20.
    const up = ringRunWidths(run, false, spec({ bottomMm: 60, sidesMm: 80 }));
    expect(up.pts.map((p) => p.z)).toEqual([0, 100 - RING_WIDTH_TAPER * 20, 100, 400]);
    expect(up.widths).toEqual([60, 60, 80, 80]);
  });

  it('keeps one width where none changes, the normals the run gave', () => {
    const r = ringRunWidths(outlineRuns(side)[0]!, false, spec({ bottom: { by: 'height', z: -10 } }));
    expect(r.widths).toEqual([60, 60]);
    expectClose(r.normals[0]!.y, 1, 1e-12, 'normal');
  });
});

describe('ringWidthAt', () => {
  it('reads the width of the stretch a notch or limber is in', () => {
    const s = spec({ bottom: { by: 'girth', girthMm: 600 } });
    expect(ringWidthAt(s, 'skin', { girthMm: 300, z: 0, ny: 0, nz: -1 })).toBe(90);
    expect(ringWidthAt(s, 'skin', { girthMm: 700, z: 100, ny: 1, nz: 0 })).toBe(60);
    expect(ringWidthAt(s, 'deck', { girthMm: 100, z: 500, ny: 0, nz: 1 })).toBe(40);
    // Round bilge: bottom where the normal is within 45 degrees of straight down.
    const round = spec({ bottom: { by: 'normal' } });
    expect(ringWidthAt(round, 'skin', { girthMm: 0, z: 0, ny: 0.6, nz: -0.8 })).toBe(90);
    expect(ringWidthAt(round, 'skin', { girthMm: 0, z: 0, ny: 0.8, nz: -0.6 })).toBe(60);
  });
});
