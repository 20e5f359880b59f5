/**
 * Array helpers the geometry's hot loops share.
 */

/**
 * The last item of `items`, or undefined when it is empty. Not `items[items.length - 1]` on an empty array:
 * that reads index -1, which V8 looks up as a named property, and it then treats the load as megamorphic for
 * every later call (measured as a few per cent of a frame where outlines are built point by point).
 */
export function lastOf<T>(items: readonly T[]): T | undefined {
  return items.length > 0 ? items[items.length - 1] : undefined;
}
