/**
 * Units carried in the types. Every length inside shared/geometry is millimetres (float64), every angle
 * radians unless the type says Degrees. Brands cost nothing at run time; they stop a value in inches or
 * pixels from being passed where millimetres are expected.
 */
declare const brand: unique symbol;
type Brand<T, B extends string> = T & { readonly [brand]: B };

/** A length in millimetres. */
export type Mm = Brand<number, 'mm'>;
/** An angle in radians. */
export type Radians = Brand<number, 'rad'>;
/** An angle in degrees (only at the edges: what people read and type). */
export type Degrees = Brand<number, 'deg'>;

/** Brand a number as millimetres. */
export const mm = (n: number): Mm => n as Mm;
/** Brand a number as radians. */
export const rad = (n: number): Radians => n as Radians;
/** Brand a number as degrees. */
export const deg = (n: number): Degrees => n as Degrees;
/** Degrees to radians. */
export const degToRad = (d: number): Radians => ((d * Math.PI) / 180) as Radians;
/** Radians to degrees. */
export const radToDeg = (r: number): Degrees => ((r * 180) / Math.PI) as Degrees;

/**
 * A point in a station's section plane (hull space): y across from the centreline (positive to
 * starboard), z up from the baseline, both millimetres. Screen space is a different type on purpose.
 */
export interface SectionPoint {
  y: number;
  z: number;
}

/** A point in hull space: x along the hull from the datum, y across, z up; millimetres. */
export interface HullPoint {
  x: number;
  y: number;
  z: number;
}

/** Default chord tolerance (mm) when a curve is flattened to a polyline. */
export const CHORD_TOLERANCE_MM = 0.05;
/** Default tolerance (mm) for "the same point" comparisons in geometry. */
export const POINT_TOLERANCE_MM = 1e-6;

/**
 * A geometry input problem a person can fix: says where (line, station, field) and what was found.
 * Returned as data (never thrown across the API) so the editor can mark the cell.
 */
export interface GeometryIssue {
  code: string;
  message: string;
  lineId?: string;
  stationId?: string;
  field?: string;
  value?: unknown;
}

/** Thrown by geometry functions when input cannot produce a result; carries the issues found. */
export class GeometryInputError extends Error {
  constructor(public readonly issues: GeometryIssue[]) {
    super(issues.map((i) => i.message).join('; '));
    this.name = 'GeometryInputError';
  }
}

/** Assert a programmer error (never bad user input: that is a GeometryInputError). */
export function invariant(condition: unknown, message: string): asserts condition {
  if (!condition) throw new Error(`Invariant failed: ${message}`);
}
