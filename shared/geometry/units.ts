import { type Mm, mm } from './types';

/**
 * Exact length constants and conversions between millimetres (the unit of everything inside
 * shared/geometry) and the imperial units people read and type. Angles live in types.ts.
 */

/** Millimetres in one inch: exactly 25.4 by definition (International Yard and Pound Agreement, 1959). */
export const MM_PER_INCH = 25.4;

/** Inches in one foot: exactly 12. */
export const INCHES_PER_FOOT = 12;

/**
 * Millimetres in one foot: exactly 304.8. Written as a literal because 25.4 * 12 in float64 is
 * 304.79999999999995, one unit in the last place short of the nearest double to the exact value.
 */
export const MM_PER_FOOT = 304.8;

/** Inches (any real number) to millimetres. Exact up to the one float64 rounding of the product. */
export function inchesToMm(inches: number): Mm {
  return mm(inches * MM_PER_INCH);
}

/** Millimetres to inches (any real number). */
export function mmToInches(lengthMm: number): number {
  return lengthMm / MM_PER_INCH;
}

/** Feet (any real number) to millimetres. */
export function feetToMm(feet: number): Mm {
  return mm(feet * MM_PER_FOOT);
}

/** Millimetres to feet (any real number). */
export function mmToFeet(lengthMm: number): number {
  return lengthMm / MM_PER_FOOT;
}
