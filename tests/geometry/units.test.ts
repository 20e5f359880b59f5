import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  INCHES_PER_FOOT,
  MM_PER_FOOT,
  MM_PER_INCH,
  feetToMm,
  inchesToMm,
  mmToFeet,
  mmToInches,
} from '../../shared/geometry/units';
import { expectClose } from './helpers';

describe('constants', () => {
  it('defines the inch and the foot exactly', () => {
    // Source: International Yard and Pound Agreement (1959); NIST SP 811
    expect(MM_PER_INCH).toBe(25.4);
    // Source: International Yard and Pound Agreement (1959); NIST SP 811
    expect(INCHES_PER_FOOT).toBe(12);
    // derived: 12 x 25.4 = 304.8 exactly; the constant is the nearest double, not 25.4 * 12 in float64
    expect(MM_PER_FOOT).toBe(304.8);
  });
});

describe('inchesToMm', () => {
  it('converts 1 in to 25.4 mm', () => {
    // Source: International Yard and Pound Agreement (1959); NIST SP 811
    expect(inchesToMm(1)).toBe(25.4);
  });

  it('converts 41.3125 in (3-5-2+) to 1049.3375 mm', () => {
    // common practice in published tables of offsets; arithmetic derived
    expectClose(inchesToMm(41.3125), 1049.3375, 1e-9);
  });

  it('converts 15.5 in (1-3-4) to 393.7 mm', () => {
    // common practice in published tables of offsets; arithmetic derived
    expectClose(inchesToMm(15.5), 393.7, 1e-9);
  });
});

describe('feetToMm', () => {
  it('converts 1 ft to 304.8 mm and 4 x 8 ft to 1219.2 x 2438.4 mm', () => {
    // Source: International Yard and Pound Agreement (1959); NIST SP 811
    expect(feetToMm(1)).toBe(304.8);
    // common practice (suppliers' lists): a 4 x 8 ft sheet is 1219.2 x 2438.4 mm
    expectClose(feetToMm(4), 1219.2, 1e-9);
    expectClose(feetToMm(8), 2438.4, 1e-9);
  });
});

describe('mmToInches and mmToFeet', () => {
  it('are the inverses of inchesToMm and feetToMm', () => {
    // analytic: x -> 25.4x -> x, to float64 rounding
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (x) => {
        expectClose(mmToInches(inchesToMm(x)), x, 1e-12 * Math.max(1, Math.abs(x)));
        expectClose(mmToFeet(feetToMm(x)), x, 1e-12 * Math.max(1, Math.abs(x)));
      }),
    );
  });

  it('gives 12 in to the foot', () => {
    // Source: International Yard and Pound Agreement (1959); NIST SP 811
    expectClose(mmToInches(feetToMm(1)), 12, 1e-12);
    expectClose(mmToFeet(inchesToMm(12)), 1, 1e-12);
  });
});
