import { expect } from 'vitest';
import type { PartGeometry, PartRegion, PartResult } from '../../shared/geometry/frame-types';
import { z } from 'zod';
import { type Longitudinal, type Part, type PartInput, longitudinalSchema, partSchema } from '../../shared/geometry/part-schema';
import { polygonInsidePolygon, polygonIsSimple, polygonSignedArea } from '../../shared/geometry/polygon';

/**
 * Helpers for the frame tests: parts and longitudinals parsed by the schema (so defaults are filled in as in
 * a stored plan), and checks that every loop a part returns is a proper loop.
 */

/** A part from plain input, parsed by the schema. */
export function partOf(input: PartInput): Part {
  return partSchema.parse(input);
}

/** A longitudinal from plain input, parsed by the schema. */
export function longitudinalOf(input: z.input<typeof longitudinalSchema>): Longitudinal {
  return longitudinalSchema.parse(input);
}

/** The geometry of a result that must have built (the issues shown when it did not). */
export function built(r: PartResult): PartGeometry {
  if (!r.ok) expect.fail(`part ${r.partId} did not build: ${r.issues.map((i) => i.message).join('; ')}`);
  return (r as Extract<PartResult, { ok: true }>).part;
}

/** Every region: outer loop simple and counter-clockwise, holes simple, clockwise and inside it, no point repeated at the end. */
export function expectProperRegions(regions: readonly PartRegion[], label: string): void {
  for (const r of regions) {
    const loops = [r.outer, ...r.holes];
    for (const l of loops) {
      expect(l.length, `${label}: a loop has points`).toBeGreaterThanOrEqual(3);
      const a = l[0]!;
      const b = l[l.length - 1]!;
      expect(Math.hypot(a.y - b.y, a.z - b.z), `${label}: first point not repeated`).toBeGreaterThan(1e-9);
      expect(polygonIsSimple(l), `${label}: loop is simple`).toBe(true);
    }
    expect(polygonSignedArea(r.outer), `${label}: outer counter-clockwise`).toBeGreaterThan(0);
    for (const h of r.holes) {
      expect(polygonSignedArea(h), `${label}: hole clockwise`).toBeLessThan(0);
      expect(polygonInsidePolygon(h, r.outer), `${label}: hole inside the outer loop`).toBe(true);
    }
  }
}

/** Every number anywhere in a value (plain JSON) is finite. */
export function expectAllFinite(value: unknown, path = 'part'): void {
  if (typeof value === 'number') {
    expect(Number.isFinite(value), `${path} is ${value}`).toBe(true);
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => expectAllFinite(v, `${path}[${i}]`));
  } else if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) expectAllFinite(v, `${path}.${k}`);
  }
}
