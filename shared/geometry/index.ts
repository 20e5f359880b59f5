/**
 * shared/geometry: the hull's lines, sections, deductions, bevels and fairness, and the parts cut from
 * them, as plain data and free functions, the same in the editor and on the server. Millimetres and
 * radians throughout.
 */
export * from './types';
export * from './units';
export * from './notation-schema';
export * from './notation';
export * from './camber-schema';
export * from './camber';
export * from './hull-schema';
export * from './plan-schema';
export * from './plan';
export * from './plan-compare';
export * from './offsets';
export * from './spline';
export * from './curve';
export * from './vector';
export * from './polyline';
export * from './lines';
export * from './nodes';
export * from './hull';
export * from './section';
export * from './edge';
export * from './deduction';
export * from './deck';
export * from './bevel';
export * from './fairness';
export * from './fairing';
export * from './part-schema';
export * from './polygon';
export * from './pieces';
export * from './measured';
export * from './nesting';
export * from './estimate';
