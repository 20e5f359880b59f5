import type { Camber, Crown } from './camber-schema';
import { GeometryInputError, type GeometryIssue, POINT_TOLERANCE_MM } from './types';
import { INCHES_PER_FOOT, MM_PER_FOOT, MM_PER_INCH } from './units';

/**
 * Deck camber: the athwartships curve of the deck at a station, as a height (mm) above the straight line
 * joining the station's two beam ends, at half-breadth y (mm from the centreline, either side).
 *
 * Shapes: `parabola` h(1 - t^2); `arc`, the exact circle through the crown and both beam ends; `custom`,
 * a designer's normalised points (t from 0 at the centreline to 1 at the beam's edge, h a fraction of the
 * crown) joined by a monotone cubic (see `customCurve`).
 *
 * Conventions: `one-pattern` cuts one curve for the reference beam and every station takes its middle
 * part; `scaled` fits the curve to each station's beam with the crown the spec gives for that beam.
 */

/** Default tolerance on the normalised custom points (t and h are fractions): how far from (0, 1) and (1, 0) the end points may be. */
/**
 * How much wider (mm of half-beam) than a one-pattern camber's reference a station may be and still take
 * the pattern, clamped to its edge: splines through the table bulge a little between stations. Our choice.
 */
export const CAMBER_PATTERN_OVERHANG_MM = 0.5;

export const CAMBER_POINT_TOLERANCE = 1e-9;

// ---------------------------------------------------------------------------------------------------
// Crown and rise-per-foot conversions

/** Rise per foot of beam (inches per foot) to a percentage of beam: 1/4 in/ft = 0.25 / 12 = 2.083 %. */
export function camberPercentFromPerFoot(inchesPerFoot: number): number {
  return (inchesPerFoot / INCHES_PER_FOOT) * 100;
}

/** A percentage of beam to rise per foot of beam (inches per foot): 3.125 % = 3/8 in/ft. */
export function camberPerFootFromPercent(percent: number): number {
  return (percent / 100) * INCHES_PER_FOOT;
}

/**
 * Radius (mm) of the circle through the crown at the centreline and both beam ends: R = (b^2 + h^2) / (2h),
 * b the half-beam, h the crown (both mm, h >= 0, b >= 0). A flat deck (h = 0) is an arc of infinite
 * radius and gives Infinity. Throws GeometryInputError for a negative or non-finite input.
 */
export function camberArcRadiusMm(crownMm: number, halfBeamMm: number): number {
  const issues = [
    ...finiteNonNegative(crownMm, 'crownMm', 'the crown'),
    ...finiteNonNegative(halfBeamMm, 'halfBeamMm', 'the half-beam'),
  ];
  if (issues.length > 0) throw new GeometryInputError(issues);
  if (crownMm === 0) return Infinity;
  return (halfBeamMm * halfBeamMm + crownMm * crownMm) / (2 * crownMm);
}

/**
 * The crown (mm, rise at the centreline above the line joining the beam ends) that the crown spec gives
 * for a full beam `beamMm` (mm, >= 0):
 * - `rise`: the rise the reference curve (riseMm over referenceBeamMm, in the camber's shape) has over
 *   that beam: riseMm (b/B)^2 for a parabola, the sagitta of the same circle for an arc, riseMm (1 - f(b/B))
 *   for a custom curve (which cannot reach past its own beam, so b > B is an error there);
 * - `percent-of-beam`: percent / 100 x beam;
 * - `per-foot`: inchesPerFoot x 25.4 x beam / 304.8.
 * @throws GeometryInputError for an invalid camber (see `camberIssues`) or a negative or non-finite beam.
 */
export function camberCrownMm(camber: Camber, beamMm: number, toleranceMm: number = POINT_TOLERANCE_MM): number {
  throwIfAny([...camberIssues(camber), ...finiteNonNegative(beamMm, 'beamMm', 'the beam')]);
  const crown = camber.crown;
  if (crown.kind === 'percent-of-beam') return (crown.percent / 100) * beamMm;
  if (crown.kind === 'per-foot') return (crown.inchesPerFoot * MM_PER_INCH * beamMm) / MM_PER_FOOT;

  const B = crown.referenceBeamMm;
  if (crown.riseMm === 0) return 0;
  if (camber.shape === 'parabola') return crown.riseMm * (beamMm / B) ** 2;
  if (camber.shape === 'arc') {
    const R = camberArcRadiusMm(crown.riseMm, B / 2);
    const c = beamMm / 2;
    if (c >= R) {
      throw issue(
        'camber-arc-beyond-circle',
        `a beam of ${n(beamMm)} mm is too wide for the circular arc of ${n(crown.riseMm)} mm rise over ${n(B)} mm ` +
          `(radius ${n(R)} mm): the circle's half-width is only ${n(R)} mm`,
        'beamMm',
        beamMm,
      );
    }
    return sagitta(R, c);
  }
  if (beamMm > B + toleranceMm) {
    throw issue(
      'camber-custom-beyond-reference',
      `a beam of ${n(beamMm)} mm is wider than the ${n(B)} mm the custom camber's rise is given for; ` +
        `a designer's curve cannot be extended past its edge`,
      'beamMm',
      beamMm,
    );
  }
  return crown.riseMm * (1 - splineValue(customCurve(camber.points), Math.min(1, beamMm / B)));
}

/**
 * The half-beam (mm) of the camber pattern: for a `rise` crown half its referenceBeamMm, otherwise the
 * hull's widest half-beam `hullMaxHalfBeamMm` (mm, > 0). Pass the result as `referenceHalfBeamMm`.
 * @throws GeometryInputError for an invalid camber or a non-positive or non-finite half-beam when it is used.
 */
export function camberReferenceHalfBeamMm(camber: Camber, hullMaxHalfBeamMm: number): number {
  throwIfAny(camberIssues(camber));
  if (camber.crown.kind === 'rise') return camber.crown.referenceBeamMm / 2;
  throwIfAny(finitePositive(hullMaxHalfBeamMm, 'hullMaxHalfBeamMm', "the hull's widest half-beam"));
  return hullMaxHalfBeamMm;
}

// ---------------------------------------------------------------------------------------------------
// Height and slope at a station

/**
 * Height (mm) of the deck top above the straight line joining the station's two beam ends, at
 * half-breadth `y` (mm, either side, |y| <= stationHalfBeamMm). Zero at the beam ends; symmetric in y.
 * - `one-pattern`: the reference curve (crown for the beam 2 x referenceHalfBeamMm, that half-beam)
 *   moved down so its ends sit at the station's beam ends: H(y) - H(stationHalfBeamMm). The station must
 *   not be wider than the reference (within `toleranceMm`).
 * - `scaled`: the curve fitted to the station's half-beam with the crown `camberCrownMm` gives for that beam.
 * `referenceHalfBeamMm` is what `camberReferenceHalfBeamMm` returns; the scaled convention does not use it
 * but it is checked all the same so a bad value is found whichever convention is set.
 * Values within `toleranceMm` outside the beam are taken as at the beam end.
 * @throws GeometryInputError for an invalid camber, y outside the beam, a negative station half-beam or
 *   a station wider than a one-pattern reference.
 */
export function camberHeightAt(
  camber: Camber,
  y: number,
  stationHalfBeamMm: number,
  referenceHalfBeamMm: number,
  toleranceMm: number = POINT_TOLERANCE_MM,
): number {
  const deck = stationDeck(camber, y, stationHalfBeamMm, referenceHalfBeamMm, toleranceMm);
  return curveHeight(deck.curve, deck.y) - deck.base;
}

/**
 * Slope of the deck across the station, dz/dy at half-breadth `y`, as a ratio (mm of rise per mm of
 * half-breadth, not an angle: Math.atan of it is the angle from level in radians). Zero at the
 * centreline, negative for y > 0 where the deck falls toward the side, odd in y. Same conventions,
 * arguments and errors as `camberHeightAt`. For the deck-edge bevel this is the deck's slope where it
 * meets the side at y = +-stationHalfBeamMm.
 */
export function camberSlopeAt(
  camber: Camber,
  y: number,
  stationHalfBeamMm: number,
  referenceHalfBeamMm: number,
  toleranceMm: number = POINT_TOLERANCE_MM,
): number {
  const deck = stationDeck(camber, y, stationHalfBeamMm, referenceHalfBeamMm, toleranceMm);
  return curveSlope(deck.curve, deck.y);
}

/** The deck's height and slope across one station, worked out from a camber checked once (see `camberAtStation`). */
export interface StationCamber {
  /** As `camberHeightAt` at half-breadth `y` (mm). */
  heightAt: (y: number) => number;
  /** As `camberSlopeAt` at half-breadth `y` (mm). */
  slopeAt: (y: number) => number;
}

/**
 * `camberHeightAt` and `camberSlopeAt` for one station, with the camber and the beams checked and the
 * curve built once rather than on every call: the deck line of every part samples the camber at dozens
 * of half-breadths on each of three nearby stations. Same values, same errors (the station's when this
 * is called, a half-breadth's when it is used).
 */
export function camberAtStation(camber: Camber, stationHalfBeamMm: number, referenceHalfBeamMm: number, toleranceMm: number = POINT_TOLERANCE_MM): StationCamber {
  const station = stationCurve(camber, stationHalfBeamMm, referenceHalfBeamMm, toleranceMm);
  return {
    heightAt: (y) => curveHeight(station.curve, stationY(station, y)) - station.base,
    slopeAt: (y) => curveSlope(station.curve, stationY(station, y)),
  };
}

// ---------------------------------------------------------------------------------------------------
// Validation

/**
 * Everything wrong with a camber that does not depend on a station, as issues a person can fix
 * (empty when it is usable): a negative or non-finite crown or reference beam; an arc whose crown would be
 * half the beam or more (its ends would stand vertical); for a custom shape fewer than two points, points
 * out of order of t or with a repeated t, a first point other than (t = 0, h = 1) or a last other than
 * (t = 1, h = 0), within `pointTolerance` (a fraction).
 */
export function camberIssues(camber: Camber, pointTolerance: number = CAMBER_POINT_TOLERANCE): GeometryIssue[] {
  const issues = crownIssues(camber.crown);
  if (issues.length === 0 && camber.shape === 'arc') issues.push(...arcIssues(camber.crown));
  if (camber.shape === 'custom') issues.push(...customPointIssues(camber.points, pointTolerance));
  return issues;
}

function crownIssues(crown: Crown): GeometryIssue[] {
  switch (crown.kind) {
    case 'rise':
      return [
        ...finiteNonNegative(crown.riseMm, 'crown.riseMm', 'the crown (rise)'),
        ...finitePositive(crown.referenceBeamMm, 'crown.referenceBeamMm', 'the beam the rise is given at'),
      ];
    case 'percent-of-beam':
      return finiteNonNegative(crown.percent, 'crown.percent', 'the crown (percent of beam)');
    case 'per-foot':
      return finiteNonNegative(crown.inchesPerFoot, 'crown.inchesPerFoot', 'the crown (rise per foot of beam)');
  }
}

function arcIssues(crown: Crown): GeometryIssue[] {
  // Crown / half-beam for each spec; the arc needs it below 1 (a half circle has vertical ends).
  const ratio =
    crown.kind === 'rise'
      ? crown.riseMm / (crown.referenceBeamMm / 2)
      : crown.kind === 'percent-of-beam'
        ? (2 * crown.percent) / 100
        : (2 * crown.inchesPerFoot) / INCHES_PER_FOOT;
  if (ratio < 1) return [];
  return [
    {
      code: 'camber-arc-too-high',
      message:
        'a circular-arc camber needs a crown less than half the beam; at half the beam or more the arc is a ' +
        'half circle or more and its ends stand vertical',
      field: 'crown',
      value: crown,
    },
  ];
}

function customPointIssues(points: readonly { t: number; h: number }[], tol: number): GeometryIssue[] {
  const issues: GeometryIssue[] = [];
  points.forEach((p, i) => {
    if (!Number.isFinite(p.t) || !Number.isFinite(p.h)) {
      issues.push({
        code: 'camber-point-not-finite',
        message: `custom camber point ${i + 1} must have finite t and h, found t = ${p.t}, h = ${p.h}`,
        field: `points[${i}]`,
        value: p,
      });
    }
  });
  if (issues.length > 0) return issues;
  if (points.length < 2) {
    return [
      {
        code: 'camber-points-too-few',
        message: `a custom camber curve needs at least two points, (t = 0, h = 1) and (t = 1, h = 0); it has ${points.length}`,
        field: 'points',
        value: points.length,
      },
    ];
  }
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1]!;
    const b = points[i]!;
    if (b.t === a.t) {
      issues.push({
        code: 'camber-points-duplicate',
        message: `custom camber points ${i} and ${i + 1} have the same t = ${n(a.t)}; each t may appear only once`,
        field: `points[${i}].t`,
        value: b.t,
      });
    } else if (b.t < a.t) {
      issues.push({
        code: 'camber-points-unsorted',
        message:
          `custom camber points must run in order of t from the centreline (0) to the beam's edge (1): ` +
          `point ${i + 1} (t = ${n(b.t)}) comes after point ${i} (t = ${n(a.t)})`,
        field: `points[${i}].t`,
        value: b.t,
      });
    }
  }
  const first = points[0]!;
  const last = points[points.length - 1]!;
  if (Math.abs(first.t) > tol || Math.abs(first.h - 1) > tol) {
    issues.push({
      code: 'camber-points-start',
      message:
        `a custom camber curve starts at the centreline with the full crown, t = 0 and h = 1; ` +
        `its first point is t = ${n(first.t)}, h = ${n(first.h)}`,
      field: 'points[0]',
      value: first,
    });
  }
  if (Math.abs(last.t - 1) > tol || Math.abs(last.h) > tol) {
    issues.push({
      code: 'camber-points-end',
      message:
        `a custom camber curve ends at the beam's edge with no rise, t = 1 and h = 0; ` +
        `its last point is t = ${n(last.t)}, h = ${n(last.h)}`,
      field: `points[${points.length - 1}]`,
      value: last,
    });
  }
  return issues;
}

function finiteNonNegative(v: number, field: string, what: string): GeometryIssue[] {
  if (!Number.isFinite(v)) return [{ code: 'camber-not-finite', message: `${what} must be a finite number, found ${v}`, field, value: v }];
  if (v < 0) return [{ code: 'camber-negative', message: `${what} cannot be negative, found ${n(v)}`, field, value: v }];
  return [];
}

function finitePositive(v: number, field: string, what: string): GeometryIssue[] {
  const issues = finiteNonNegative(v, field, what);
  if (issues.length === 0 && v === 0) return [{ code: 'camber-zero', message: `${what} must be more than 0`, field, value: v }];
  return issues;
}

function throwIfAny(issues: GeometryIssue[]): void {
  if (issues.length > 0) throw new GeometryInputError(issues);
}

function issue(code: string, message: string, field: string, value: unknown): GeometryInputError {
  return new GeometryInputError([{ code, message, field, value }]);
}

/** A number for a message: at most 3 decimals, no float noise. */
const n = (v: number): string => String(Number(v.toFixed(3)));

// ---------------------------------------------------------------------------------------------------
// Curves

/** A camber curve over one beam: height above its end line at half-breadth y, |y| <= halfBeamMm. */
interface Curve {
  shape: Camber['shape'];
  crownMm: number;
  halfBeamMm: number;
  spline: Spline | null;
}

/** A piecewise cubic Hermite curve over t in [0, 1]: knots, values and first derivatives. */
interface Spline {
  t: number[];
  h: number[];
  d: number[];
}

function makeCurve(camber: Camber, crownMm: number, halfBeamMm: number): Curve {
  return { shape: camber.shape, crownMm, halfBeamMm, spline: camber.shape === 'custom' ? customCurve(camber.points) : null };
}

/**
 * The custom curve as a monotone piecewise cubic (Fritsch-Carlson / PCHIP derivatives), chosen over a
 * natural cubic because it never overshoots between the designer's points: the deck cannot rise above
 * the crown or dip below the beam line where the points do not, and it is local (moving one point moves
 * only its two neighbouring spans). The derivative at t = 0 is set to 0: that is exactly what PCHIP gives
 * for the curve mirrored about the centreline (the centre point is then a local extreme), so the two
 * halves of the deck meet without a ridge. At t = 1 the usual one-sided PCHIP end formula is used; the
 * deck edge is a corner anyway. The end points are snapped to (0, 1) and (1, 0), which validation has
 * checked are within tolerance. Call only with points that `camberIssues` passes.
 */
function customCurve(points: readonly { t: number; h: number }[]): Spline {
  const t = points.map((p) => p.t);
  const h = points.map((p) => p.h);
  const last = t.length - 1;
  t[0] = 0;
  h[0] = 1;
  t[last] = 1;
  h[last] = 0;
  const widths = t.slice(1).map((v, i) => v - t[i]!);
  const slopes = widths.map((w, i) => (h[i + 1]! - h[i]!) / w);
  const d = new Array<number>(t.length).fill(0);
  for (let k = 1; k < last; k++) {
    const s0 = slopes[k - 1]!;
    const s1 = slopes[k]!;
    if (s0 === 0 || s1 === 0 || Math.sign(s0) !== Math.sign(s1)) continue;
    // Weighted harmonic mean (Fritsch & Butland), which keeps each span monotone.
    const w0 = 2 * widths[k]! + widths[k - 1]!;
    const w1 = widths[k]! + 2 * widths[k - 1]!;
    d[k] = (w0 + w1) / (w0 / s0 + w1 / s1);
  }
  if (last === 1) {
    d[last] = slopes[0]!;
  } else {
    const w0 = widths[last - 1]!;
    const w1 = widths[last - 2]!;
    const s0 = slopes[last - 1]!;
    const s1 = slopes[last - 2]!;
    let end = ((2 * w0 + w1) * s0 - w0 * s1) / (w0 + w1);
    if (Math.sign(end) !== Math.sign(s0)) end = 0;
    else if (Math.sign(s0) !== Math.sign(s1) && Math.abs(end) > Math.abs(3 * s0)) end = 3 * s0;
    d[last] = end;
  }
  return { t, h, d };
}

function spanOf(s: Spline, t: number): number {
  let lo = 0;
  let hi = s.t.length - 2;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (s.t[mid]! <= t) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Value of the spline at t in [0, 1]. */
function splineValue(s: Spline, t: number): number {
  const k = spanOf(s, t);
  const w = s.t[k + 1]! - s.t[k]!;
  const u = (t - s.t[k]!) / w;
  const u2 = u * u;
  const u3 = u2 * u;
  return (
    (2 * u3 - 3 * u2 + 1) * s.h[k]! +
    (u3 - 2 * u2 + u) * w * s.d[k]! +
    (-2 * u3 + 3 * u2) * s.h[k + 1]! +
    (u3 - u2) * w * s.d[k + 1]!
  );
}

/** Derivative dh/dt of the spline at t in [0, 1]. */
function splineSlope(s: Spline, t: number): number {
  const k = spanOf(s, t);
  const w = s.t[k + 1]! - s.t[k]!;
  const u = (t - s.t[k]!) / w;
  const u2 = u * u;
  return (
    ((6 * u2 - 6 * u) * s.h[k]! + (-6 * u2 + 6 * u) * s.h[k + 1]!) / w +
    (3 * u2 - 4 * u + 1) * s.d[k]! +
    (3 * u2 - 2 * u) * s.d[k + 1]!
  );
}

/** R - sqrt(R^2 - c^2) written as c^2 / (R + sqrt(R^2 - c^2)), which keeps its digits when R >> c (a flat deck). */
function sagitta(R: number, c: number): number {
  return (c * c) / (R + Math.sqrt(Math.max(0, R * R - c * c)));
}

// The arc is worked in units of the half-beam (u = y / b, k = h / b, r = R / b) so that squares of very
// small or very large lengths cannot underflow or overflow into 0 / 0.
const arcRadiusRatio = (k: number): number => (1 + k * k) / (2 * k);

function curveHeight(curve: Curve, y: number): number {
  const { crownMm: h, halfBeamMm: b } = curve;
  if (h === 0 || b === 0) return 0;
  const u = y / b;
  if (curve.shape === 'parabola') return h * (1 - u * u);
  if (curve.shape === 'arc') return b * (h / b - sagitta(arcRadiusRatio(h / b), u));
  return h * splineValue(curve.spline!, Math.abs(u));
}

function curveSlope(curve: Curve, y: number): number {
  const { crownMm: h, halfBeamMm: b } = curve;
  if (h === 0 || b === 0 || y === 0) return 0;
  const u = y / b;
  if (curve.shape === 'parabola') return -2 * (h / b) * u;
  if (curve.shape === 'arc') {
    const r = arcRadiusRatio(h / b);
    return -u / Math.sqrt(r * r - u * u);
  }
  return Math.sign(y) * (h / b) * splineSlope(curve.spline!, Math.abs(u));
}

/**
 * The curve a station's deck follows, the y to read it at (clamped into the beam within tolerance) and
 * the base to subtract so that the station's beam ends are at height 0.
 */
/** The deck curve of one station, checked once: the pattern curve, where the station's beam ends on it, and the height there. */
interface StationCurve {
  curve: Curve;
  /** Half-beam (mm) of the station, clamped to the pattern for one-pattern. */
  halfBeamMm: number;
  /** Height of the curve at the station's beam ends (0 for scaled), subtracted so the ends sit at 0. */
  base: number;
  /** The station's half-beam as given, for the outside-the-beam check. */
  givenHalfBeamMm: number;
  tol: number;
}

/**
 * The station's curve, everything checked. With `y` (a single height or slope asked for) the half-breadth
 * is checked with the rest and before the pattern's width, in the order the errors have always come.
 */
function stationCurve(camber: Camber, stationHalfBeamMm: number, referenceHalfBeamMm: number, tol: number, y?: number): StationCurve {
  throwIfAny([
    ...camberIssues(camber),
    ...finiteNonNegative(stationHalfBeamMm, 'stationHalfBeamMm', "the station's half-beam"),
    ...finitePositive(referenceHalfBeamMm, 'referenceHalfBeamMm', "the camber pattern's half-beam"),
    ...(y === undefined || Number.isFinite(y) ? [] : [yNotFinite(y)]),
  ]);
  if (y !== undefined) outsideBeamCheck(y, stationHalfBeamMm, tol);
  const bs = stationHalfBeamMm;
  if (camber.convention === 'scaled') {
    return { curve: makeCurve(camber, camberCrownMm(camber, 2 * bs, tol), bs), halfBeamMm: bs, base: 0, givenHalfBeamMm: bs, tol };
  }

  // A fair sheer bulges a few hundredths of a millimetre past its widest station between stations; a
  // pattern cut for the table's widest beam still serves there (the difference is nothing at the saw), so
  // only a station wider by more than CAMBER_PATTERN_OVERHANG_MM is refused, and one within it is clamped.
  if (bs > referenceHalfBeamMm + Math.max(tol, CAMBER_PATTERN_OVERHANG_MM)) {
    throw issue(
      'camber-station-wider-than-pattern',
      `the station's half-beam of ${n(bs)} mm is wider than the camber pattern's half-beam of ` +
        `${n(referenceHalfBeamMm)} mm: one pattern serves only beams up to the one it is cut for ` +
        `(give the rise at the widest beam, or scale the curve to each beam)`,
      'stationHalfBeamMm',
      bs,
    );
  }
  const clamped = Math.min(bs, referenceHalfBeamMm);
  const reference = makeCurve(camber, camberCrownMm(camber, 2 * referenceHalfBeamMm, tol), referenceHalfBeamMm);
  return { curve: reference, halfBeamMm: clamped, base: curveHeight(reference, clamped), givenHalfBeamMm: bs, tol };
}

const yNotFinite = (y: number): GeometryIssue => ({ code: 'camber-not-finite', message: `the half-breadth must be a finite number, found ${y}`, field: 'y', value: y });

function outsideBeamCheck(y: number, stationHalfBeamMm: number, tol: number): void {
  if (Math.abs(y) > stationHalfBeamMm + tol) {
    throw issue('camber-outside-beam', `half-breadth ${n(y)} mm is outside the deck at this station, whose half-beam is ${n(stationHalfBeamMm)} mm`, 'y', y);
  }
}

/** Where half-breadth `y` (mm) falls on the station's curve: checked against the beam, then clamped to it. */
function stationY(station: StationCurve, y: number): number {
  if (!Number.isFinite(y)) throwIfAny([yNotFinite(y)]);
  outsideBeamCheck(y, station.givenHalfBeamMm, station.tol);
  const bs = station.halfBeamMm;
  return Math.max(-bs, Math.min(bs, y));
}

function stationDeck(
  camber: Camber,
  y: number,
  stationHalfBeamMm: number,
  referenceHalfBeamMm: number,
  tol: number,
): { curve: Curve; y: number; base: number } {
  const station = stationCurve(camber, stationHalfBeamMm, referenceHalfBeamMm, tol, y);
  const bs = station.halfBeamMm;
  return { curve: station.curve, y: Math.max(-bs, Math.min(bs, y)), base: station.base };
}
