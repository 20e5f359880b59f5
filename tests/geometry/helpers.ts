import { expect } from 'vitest';

/**
 * Expect `actual` within `tol` of `expected` (|actual - expected| <= tol). NaN or Infinity never passes,
 * so a broken computation cannot slip through a loose tolerance. `label` says which check failed.
 */
export function expectClose(actual: number, expected: number, tol: number, label?: string): void {
  const what = label ? `${label}: ` : '';
  expect(Number.isFinite(actual), `${what}expected a finite number, got ${actual}`).toBe(true);
  expect(
    Math.abs(actual - expected),
    `${what}expected ${actual} to be within ${tol} of ${expected}`,
  ).toBeLessThanOrEqual(tol);
}

/** Expect every coordinate of a point (any object of numbers, e.g. { y, z }) within `tol` of the expected one. */
export function expectPointClose<P extends Record<string, number>>(actual: P, expected: P, tol: number, label?: string): void {
  for (const key of Object.keys(expected)) {
    expectClose(actual[key]!, expected[key]!, tol, `${label ? `${label} ` : ''}${key}`);
  }
}
