/**
 * Small vector helpers for the hot paths. `Math.hypot` guards against overflow and is about twenty
 * times slower in V8; lengths in a hull (mm) are nowhere near overflow.
 */

/** Length of the vector (a, b). */
export function vectorLength(a: number, b: number): number {
  return Math.sqrt(a * a + b * b);
}
