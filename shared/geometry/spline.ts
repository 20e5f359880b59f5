import { GeometryInputError, type GeometryIssue } from './types';

/**
 * Interpolating cubic splines in Hermite form: the knots, the values there and the first derivative
 * there. Plain data (arrays of numbers), so a fitted hull can be sent as JSON and evaluated anywhere.
 *
 * End conditions:
 * - `not-a-knot` (the default, and what the hull's lines use): the third derivative is continuous at the
 *   second and the last-but-one knot, so the end spans are the same cubic as their neighbours and no
 *   curvature is forced at the ends (with three points: the parabola through them; with two: the line).
 * - `natural`: zero second derivative at the end (a forced straightening; kept for agreement tests).
 * - `{ slope }`: a stated first derivative at the end (clamped).
 *
 * The derivatives come from the usual tridiagonal system in first derivatives; the not-a-knot rows are
 * the ones de Boor gives (A Practical Guide to Splines, ch. IV), eliminated so the system stays
 * tridiagonal and solvable without pivoting.
 */

/** An end condition of a spline. */
export type SplineEnd = 'not-a-knot' | 'natural' | { slope: number };

/** End conditions at the first and the last knot; both default to not-a-knot. */
export interface SplineEnds {
  start?: SplineEnd;
  end?: SplineEnd;
}

/** A cubic spline y(x): knots `xs` strictly increasing, values `ys`, first derivatives `ms` (dy/dx). */
export interface Spline {
  xs: number[];
  ys: number[];
  ms: number[];
}

/**
 * Fit the interpolating cubic spline through (xs[i], ys[i]).
 * Invariants: xs strictly increasing, xs.length === ys.length >= 2, all finite.
 * @throws GeometryInputError naming the offending field and index otherwise.
 */
export function splineFit(xs: readonly number[], ys: readonly number[], ends: SplineEnds = {}): Spline {
  const issues = splineInputIssues(xs, ys);
  if (issues.length > 0) throw new GeometryInputError(issues);
  const [ms] = splineSlopesSolve(xs, [ys], ends.start ?? 'not-a-knot', ends.end ?? 'not-a-knot', [ends.start], [ends.end]);
  return { xs: [...xs], ys: [...ys], ms: ms! };
}

/** Problems with spline input, as issues (empty when fit-able). */
export function splineInputIssues(xs: readonly number[], ys: readonly number[]): GeometryIssue[] {
  const issues: GeometryIssue[] = [];
  if (xs.length !== ys.length) {
    issues.push({ code: 'spline-length-mismatch', message: `a spline needs as many values as knots: ${xs.length} knots, ${ys.length} values`, field: 'ys', value: ys.length });
  }
  if (xs.length < 2) {
    issues.push({ code: 'spline-too-few', message: `a spline needs at least two points, found ${xs.length}`, field: 'xs', value: xs.length });
  }
  for (let i = 0; i < Math.min(xs.length, ys.length); i++) {
    if (!Number.isFinite(xs[i]) || !Number.isFinite(ys[i])) {
      issues.push({ code: 'spline-not-finite', message: `spline point ${i + 1} is not finite (x = ${xs[i]}, y = ${ys[i]})`, field: `xs[${i}]`, value: [xs[i], ys[i]] });
    } else if (i > 0 && !(xs[i]! > xs[i - 1]!)) {
      issues.push({ code: 'spline-knots-order', message: `spline knots must increase: x[${i}] = ${xs[i]} follows ${xs[i - 1]}`, field: `xs[${i}]`, value: xs[i] });
    }
  }
  return issues;
}

/**
 * First derivatives at the knots for several value sets sharing the knots `xs` and the end kinds (the
 * components of a parametric curve). `startEnds[d]` / `endEnds[d]` give each set's stated slope when its
 * end kind is a slope. Call only with valid knots (strictly increasing, at least two).
 */
export function splineSlopesSolve(
  xs: readonly number[],
  values: readonly (readonly number[])[],
  startKind: SplineEnd,
  endKind: SplineEnd,
  startEnds: readonly (SplineEnd | undefined)[],
  endEnds: readonly (SplineEnd | undefined)[],
): number[][] {
  const n = xs.length;
  const h = new Array<number>(n - 1);
  for (let i = 0; i < n - 1; i++) h[i] = xs[i + 1]! - xs[i]!;
  let sk = endKindOf(startKind);
  let ek = endKindOf(endKind);
  // Two points have no second knot for not-a-knot to act on: no curvature forced, so natural.
  if (n === 2) {
    if (sk === 'not-a-knot') sk = 'natural';
    if (ek === 'not-a-knot') ek = 'natural';
  }
  if (n === 3 && sk === 'not-a-knot' && ek === 'not-a-knot') {
    return values.map((ys) => parabolaSlopes(h, ys));
  }
  const a = new Array<number>(n).fill(0);
  const b = new Array<number>(n).fill(0);
  const c = new Array<number>(n).fill(0);
  for (let i = 1; i < n - 1; i++) {
    a[i] = h[i]!;
    b[i] = 2 * (h[i - 1]! + h[i]!);
    c[i] = h[i - 1]!;
  }
  if (sk === 'slope') b[0] = 1;
  else if (sk === 'natural') {
    b[0] = 2;
    c[0] = 1;
  } else {
    b[0] = h[1]!;
    c[0] = h[0]! + h[1]!;
  }
  if (ek === 'slope') b[n - 1] = 1;
  else if (ek === 'natural') {
    a[n - 1] = 1;
    b[n - 1] = 2;
  } else {
    a[n - 1] = h[n - 2]! + h[n - 3]!;
    b[n - 1] = h[n - 3]!;
  }

  // Forward elimination once; each value set then only needs its right-hand side swept.
  const cp = new Array<number>(n).fill(0);
  const bp = new Array<number>(n).fill(0);
  bp[0] = b[0]!;
  cp[0] = c[0]!;
  for (let i = 1; i < n; i++) {
    const w = a[i]! / bp[i - 1]!;
    bp[i] = b[i]! - w * cp[i - 1]!;
    cp[i] = c[i]!;
  }
  return values.map((ys, d) => {
    const del = new Array<number>(n - 1).fill(0);
    for (let i = 0; i < n - 1; i++) del[i] = (ys[i + 1]! - ys[i]!) / h[i]!;
    const r = new Array<number>(n).fill(0);
    for (let i = 1; i < n - 1; i++) r[i] = 3 * (h[i]! * del[i - 1]! + h[i - 1]! * del[i]!);
    const se = startEnds[d];
    const ee = endEnds[d];
    if (sk === 'slope') r[0] = typeof se === 'object' && se !== null ? se.slope : 0;
    else if (sk === 'natural') r[0] = 3 * del[0]!;
    else r[0] = ((h[0]! + 2 * (h[0]! + h[1]!)) * h[1]! * del[0]! + h[0]! * h[0]! * del[1]!) / (h[0]! + h[1]!);
    if (ek === 'slope') r[n - 1] = typeof ee === 'object' && ee !== null ? ee.slope : 0;
    else if (ek === 'natural') r[n - 1] = 3 * del[n - 2]!;
    else {
      const h1 = h[n - 2]!;
      const h0 = h[n - 3]!;
      r[n - 1] = (h1 * h1 * del[n - 3]! + (2 * (h0 + h1) + h1) * h0 * del[n - 2]!) / (h0 + h1);
    }
    for (let i = 1; i < n; i++) r[i] = r[i]! - (a[i]! / bp[i - 1]!) * r[i - 1]!;
    const m = new Array<number>(n);
    m[n - 1] = r[n - 1]! / bp[n - 1]!;
    for (let i = n - 2; i >= 0; i--) m[i] = (r[i]! - cp[i]! * m[i + 1]!) / bp[i]!;
    return m;
  });
}

function endKindOf(e: SplineEnd): 'not-a-knot' | 'natural' | 'slope' {
  return typeof e === 'object' ? 'slope' : e;
}

/** Derivatives of the parabola through three points (not-a-knot at both ends of three points). */
function parabolaSlopes(h: readonly number[], ys: readonly number[]): number[] {
  const d0 = (ys[1]! - ys[0]!) / h[0]!;
  const d1 = (ys[2]! - ys[1]!) / h[1]!;
  const c = (d1 - d0) / (h[0]! + h[1]!);
  return [d0 - c * h[0]!, d0 + c * h[0]!, d1 + c * h[1]!];
}

/**
 * Index k of the span [xs[k], xs[k+1]] holding x (clamped to the first or last span outside the knots).
 */
export function splineSpanOf(xs: readonly number[], x: number): number {
  let lo = 0;
  let hi = xs.length - 2;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (xs[mid]! <= x) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/**
 * Value, first and second derivative of the spline at x. Outside the knots the end span's cubic is
 * continued (callers decide whether a line reaches x; see `lineValueAt`).
 */
export function splineEvaluate(s: Spline, x: number): { value: number; slope: number; curvature: number } {
  const k = splineSpanOf(s.xs, x);
  const x0 = s.xs[k]!;
  const w = s.xs[k + 1]! - x0;
  const u = (x - x0) / w;
  const y0 = s.ys[k]!;
  const y1 = s.ys[k + 1]!;
  const m0 = s.ms[k]! * w;
  const m1 = s.ms[k + 1]! * w;
  const u2 = u * u;
  const u3 = u2 * u;
  const value = (2 * u3 - 3 * u2 + 1) * y0 + (u3 - 2 * u2 + u) * m0 + (-2 * u3 + 3 * u2) * y1 + (u3 - u2) * m1;
  const slope = ((6 * u2 - 6 * u) * y0 + (3 * u2 - 4 * u + 1) * m0 + (-6 * u2 + 6 * u) * y1 + (3 * u2 - 2 * u) * m1) / w;
  const curvature = ((12 * u - 6) * y0 + (6 * u - 4) * m0 + (-12 * u + 6) * y1 + (6 * u - 2) * m1) / (w * w);
  return { value, slope, curvature };
}

/** Value of the spline at x (mm when the spline is a line's offsets). */
export function splineValueAt(s: Spline, x: number): number {
  return splineEvaluate(s, x).value;
}

/** First derivative dy/dx of the spline at x. */
export function splineSlopeAt(s: Spline, x: number): number {
  return splineEvaluate(s, x).slope;
}

/** Second derivative d2y/dx2 of the spline at x (1/mm for a line of offsets in mm). */
export function splineCurvatureAt(s: Spline, x: number): number {
  return splineEvaluate(s, x).curvature;
}

/**
 * Where the spline's second derivative changes sign (its inflections), as x values in increasing order.
 * The second derivative is linear on each span, so each sign change is found exactly. Second derivatives
 * no larger than `minCurvature` (1/mm) count as straight: a change of sign must pass from below
 * -minCurvature to above +minCurvature (or back), so float noise on a straight run is not an inflection.
 */
export function splineInflections(s: Spline, minCurvature: number): number[] {
  // A C2 spline's second derivative is continuous and linear on each span: its knot values say it all.
  const n = s.xs.length;
  const c = new Array<number>(n);
  for (let k = 0; k < n; k++) c[k] = splineEvaluate(s, s.xs[k]!).curvature;
  const out: number[] = [];
  let lastSign = 0;
  let lastStrong = 0;
  for (let k = 0; k < n; k++) {
    if (Math.abs(c[k]!) <= minCurvature) continue;
    const sign = Math.sign(c[k]!);
    if (lastSign !== 0 && sign !== lastSign) {
      // The zero lies between knot lastStrong and knot k: on the span where the sign first changes.
      let j = lastStrong;
      while (j < k - 1 && Math.sign(c[j + 1]!) === lastSign) j++;
      const c0 = c[j]!;
      const c1 = c[j + 1]!;
      const f = c0 !== c1 ? c0 / (c0 - c1) : 0.5;
      out.push(s.xs[j]! + Math.min(1, Math.max(0, f)) * (s.xs[j + 1]! - s.xs[j]!));
    }
    lastSign = sign;
    lastStrong = k;
  }
  return out;
}

/**
 * First derivatives for a shape-preserving (monotone) piecewise cubic through (xs, ys): zero at a local
 * extreme, otherwise the weighted harmonic mean of the neighbouring chord slopes (Fritsch & Butland), and
 * the end chords' slopes at the ends unless a slope is stated. It never overshoots the data between
 * knots: used where values come with noise over uneven spacing (a section's rates), where an
 * interpolating cubic would ring. Call with valid knots (strictly increasing, at least two).
 */
export function splineMonotoneSlopes(xs: readonly number[], ys: readonly number[], startSlope: number | null = null, endSlope: number | null = null): number[] {
  const n = xs.length;
  const m = new Array<number>(n);
  const d = new Array<number>(n - 1);
  const h = new Array<number>(n - 1);
  for (let i = 0; i < n - 1; i++) {
    h[i] = xs[i + 1]! - xs[i]!;
    d[i] = (ys[i + 1]! - ys[i]!) / h[i]!;
  }
  for (let i = 1; i < n - 1; i++) {
    const a = d[i - 1]!;
    const b = d[i]!;
    if (a * b <= 0) m[i] = 0;
    else {
      const w1 = 2 * h[i]! + h[i - 1]!;
      const w2 = h[i]! + 2 * h[i - 1]!;
      m[i] = (w1 + w2) / (w1 / a + w2 / b);
    }
  }
  m[0] = startSlope ?? d[0]!;
  m[n - 1] = endSlope ?? d[n - 2]!;
  return m;
}

/**
 * Bending energy of the spline, the integral of its second derivative squared over the knots (1/mm for
 * a line of offsets in mm). The second derivative is linear on each span (c0 to c1 over width h), so
 * each span gives exactly h (c0^2 + c0 c1 + c1^2) / 3. A misread offset shows as a kink that costs energy.
 */
export function splineBendingEnergy(s: Spline): number {
  let e = 0;
  for (let k = 0; k < s.xs.length - 1; k++) {
    const h = s.xs[k + 1]! - s.xs[k]!;
    const c0 = splineEvaluate(s, s.xs[k]!).curvature;
    // The right end of span k, read on span k itself (the spline is C2 in any case).
    const m0 = s.ms[k]! * h;
    const m1 = s.ms[k + 1]! * h;
    const c1 = (6 * s.ys[k]! + 2 * m0 - 6 * s.ys[k + 1]! + 4 * m1) / (h * h);
    e += (h * (c0 * c0 + c0 * c1 + c1 * c1)) / 3;
  }
  return e;
}

/**
 * Where the spline turns from bending one way to the other, ignoring waves too small to matter: the
 * stretches between sign changes of the second derivative are kept only where the curve stands more than
 * `toleranceMm` off the chord across the stretch; smaller ones (rounding in the cells, a near-straight
 * run) merge into their neighbours. Returns the x of each turn between kept stretches of opposite bend
 * (where one stretch gives way to the other; the middle of any small stretches between them).
 */
export function splineTurns(s: Spline, toleranceMm: number): number[] {
  const raw = splineInflections(s, 0);
  const x0 = s.xs[0]!;
  const x1 = s.xs[s.xs.length - 1]!;
  const edges = [x0, ...raw, x1];
  const kept: { a: number; b: number; sign: number }[] = [];
  for (let i = 0; i < edges.length - 1; i++) {
    const a = edges[i]!;
    const b = edges[i + 1]!;
    if (!(b > a)) continue;
    const fa = splineValueAt(s, a);
    const fb = splineValueAt(s, b);
    let off = 0;
    const sign = Math.sign(splineCurvatureAt(s, (a + b) / 2));
    const n = 8 * Math.max(1, splineSpanOf(s.xs, b) - splineSpanOf(s.xs, a) + 1);
    for (let k = 1; k < n; k++) {
      const x = a + ((b - a) * k) / n;
      const d = splineValueAt(s, x) - (fa + ((fb - fa) * (x - a)) / (b - a));
      if (Math.abs(d) > Math.abs(off)) off = d;
    }
    if (Math.abs(off) > toleranceMm && sign !== 0) kept.push({ a, b, sign });
  }
  const turns: number[] = [];
  for (let i = 1; i < kept.length; i++) {
    const prev = kept[i - 1]!;
    const next = kept[i]!;
    if (prev.sign !== next.sign) turns.push((prev.b + next.a) / 2);
    else next.a = prev.a;
  }
  return turns;
}
