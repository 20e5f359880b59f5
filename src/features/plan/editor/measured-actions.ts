import type { Notation } from '../../../../shared/geometry/notation-schema';
import { lengthParse } from '../../../../shared/geometry/notation';
import { partSchema, type BevelReading, type MeasuredFrame, type Measurement } from '../../../../shared/geometry/part-schema';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { degToRad, radToDeg, type SectionPoint } from '../../../../shared/geometry/types';
import { idFor } from './ids';
import { partAdd, partUpdate } from './part-actions';

/**
 * The hand-measured frame's document actions: pure, plan in and plan out (the same plan when nothing
 * changed), and the reading of what a person types into its side table. Lengths are read with the table's
 * own `lengthParse` in the hull's notation, angles in degrees (stored in radians). A value that cannot be
 * read gives a message naming the point, the field and what was typed, and no plan.
 */

export type OffsetsReading = Extract<Measurement, { kind: 'offsets' }>['points'][number];
export type AngleReading = Extract<Measurement, { kind: 'angle-distance' }>['points'][number];
export type MeasuredReading = OffsetsReading | AngleReading;

/** A field of a reading as the side table has it. */
export type MeasuredField = 'y' | 'h' | 'side' | 'angle' | 'distance' | 'bevel' | 'sense';

/** What was typed (text) in each field of one reading; absent fields keep what the reading had. */
export type MeasuredTexts = Partial<Record<MeasuredField, string>>;

export type MeasuredEntry = { ok: true; plan: Plan } | { ok: false; errors: Partial<Record<MeasuredField, string>> };

const fieldWords: Record<MeasuredField, string> = {
  y: 'offset from the centreline',
  h: 'height above the reference line',
  side: 'side',
  angle: 'angle below the horizontal',
  distance: 'distance from the origin',
  bevel: 'bevel reading',
  sense: 'bevel sense',
};

function measuredOf(plan: Plan, partId: string): MeasuredFrame | null {
  const p = plan.parts.parts.find((q) => q.id === partId);
  return p?.kind === 'measured-frame' ? p : null;
}

/** The plan with the frame replaced, if it is still a part the schema accepts; else the plan as it was. */
function withFrame(plan: Plan, frame: MeasuredFrame): Plan {
  const parsed = partSchema.safeParse(frame);
  return parsed.success ? partUpdate(plan, { part: frame }) : plan;
}

/** A new hand-measured frame at `x` (mm), read by `kind`, with one 12 mm ply layer; its id new in the plan. */
export function measuredFrameNew(plan: Plan, args: { x: number; kind: Measurement['kind']; name?: string }): MeasuredFrame {
  const name = (args.name ?? `Measured frame ${plan.parts.parts.filter((p) => p.kind === 'measured-frame').length + 1}`).slice(0, 40);
  const referenceZ = plan.lines.designWaterlineZ ?? 0;
  const measurement: Measurement = args.kind === 'offsets' ? { kind: 'offsets', referenceZ, points: [] } : { kind: 'angle-distance', origin: { y: 0, z: referenceZ }, points: [] };
  return partSchema.parse({
    id: idFor('pt', name, plan.parts.parts.map((p) => p.id)),
    name,
    kind: 'measured-frame',
    x: args.x,
    measurement,
    measuredFace: 'aft',
    thicknessMm: 12,
    layers: [{ thicknessMm: 12 }],
  }) as MeasuredFrame;
}

/** Add a measured frame (see `measuredFrameNew`). */
export function measuredFrameAdd(plan: Plan, args: { frame: MeasuredFrame }): Plan {
  return partAdd(plan, { part: args.frame });
}

/** Insert a reading at `index` (default: the end). Its kind must be the frame's. */
export function measuredPointAdd(plan: Plan, args: { partId: string; reading: MeasuredReading; index?: number }): Plan {
  const frame = measuredOf(plan, args.partId);
  if (!frame || ('side' in args.reading) !== (frame.measurement.kind === 'angle-distance')) return plan;
  const points = [...frame.measurement.points] as MeasuredReading[];
  const at = Math.max(0, Math.min(args.index ?? points.length, points.length));
  points.splice(at, 0, args.reading);
  return withFrame(plan, { ...frame, measurement: { ...frame.measurement, points } as Measurement });
}

/** Replace the reading at `index`. */
export function measuredPointSet(plan: Plan, args: { partId: string; index: number; reading: MeasuredReading }): Plan {
  const frame = measuredOf(plan, args.partId);
  const old = frame?.measurement.points[args.index];
  if (!frame || !old || ('side' in old) !== ('side' in args.reading)) return plan;
  if (JSON.stringify(old) === JSON.stringify(args.reading)) return plan;
  const points = [...frame.measurement.points] as MeasuredReading[];
  points[args.index] = args.reading;
  return withFrame(plan, { ...frame, measurement: { ...frame.measurement, points } as Measurement });
}

export function measuredPointDelete(plan: Plan, args: { partId: string; index: number }): Plan {
  const frame = measuredOf(plan, args.partId);
  if (!frame || args.index < 0 || args.index >= frame.measurement.points.length) return plan;
  const points = (frame.measurement.points as MeasuredReading[]).filter((_, i) => i !== args.index);
  return withFrame(plan, { ...frame, measurement: { ...frame.measurement, points } as Measurement });
}

/** Change the frame's x, symmetry or measured face, the offsets' reference height or the origin (mm). */
export function measuredSettingsSet(
  plan: Plan,
  args: { partId: string; x?: number; symmetry?: MeasuredFrame['symmetry']; measuredFace?: MeasuredFrame['measuredFace']; referenceZ?: number; origin?: SectionPoint },
): Plan {
  const frame = measuredOf(plan, args.partId);
  if (!frame) return plan;
  let m = frame.measurement;
  if (args.referenceZ !== undefined && m.kind === 'offsets') m = { ...m, referenceZ: args.referenceZ };
  if (args.origin !== undefined && m.kind === 'angle-distance') m = { ...m, origin: { y: args.origin.y, z: args.origin.z } };
  const next: MeasuredFrame = { ...frame, x: args.x ?? frame.x, symmetry: args.symmetry ?? frame.symmetry, measuredFace: args.measuredFace ?? frame.measuredFace, measurement: m };
  return JSON.stringify(next) === JSON.stringify(frame) ? plan : withFrame(plan, next);
}

/** The section-plane point (mm) of one reading (measured.ts `measuredFramePoints`, one point). */
export function measuredReadingPoint(m: Measurement, reading: MeasuredReading): SectionPoint {
  if (m.kind === 'offsets') {
    const r = reading as OffsetsReading;
    return { y: r.y, z: m.referenceZ + r.h };
  }
  const r = reading as AngleReading;
  const across = r.distanceMm * Math.cos(r.angleRad);
  return { y: m.origin.y + (r.side === 'starboard' ? across : -across), z: m.origin.z - r.distanceMm * Math.sin(r.angleRad) };
}

/** The reading (in the frame's way of measuring) of a section-plane point: the inverse of `measuredReadingPoint`. */
export function measuredReadingOf(m: Measurement, p: SectionPoint, bevel: BevelReading | null = null): MeasuredReading {
  if (m.kind === 'offsets') return { y: p.y, h: p.z - m.referenceZ, bevel };
  const dy = p.y - m.origin.y;
  const dz = m.origin.z - p.z;
  return { side: dy >= 0 ? 'starboard' : 'port', angleRad: Math.atan2(dz, Math.abs(dy)), distanceMm: Math.hypot(dy, dz), bevel };
}

/**
 * Where a new point belongs in the run of readings: beside the pair of neighbours it lengthens the edge
 * least between (or before the first, after the last, whichever end is nearer when that is shorter).
 */
export function measuredInsertIndex(points: readonly SectionPoint[], p: SectionPoint): number {
  if (points.length === 0) return 0;
  const d = (a: SectionPoint, b: SectionPoint) => Math.hypot(a.y - b.y, a.z - b.z);
  let best = d(p, points[0]!);
  let index = 0;
  const after = d(p, points[points.length - 1]!);
  if (after < best) {
    best = after;
    index = points.length;
  }
  for (let i = 0; i + 1 < points.length; i++) {
    const detour = d(points[i]!, p) + d(p, points[i + 1]!) - d(points[i]!, points[i + 1]!);
    if (detour < best) {
      best = detour;
      index = i + 1;
    }
  }
  return index;
}

type Read = { ok: true; value: number } | { ok: false; message: string };

function lengthRead(text: string, notation: Notation): Read | null {
  const r = lengthParse(text, notation);
  if (r === null) return null;
  return r.ok ? { ok: true, value: r.mm } : { ok: false, message: r.message };
}

/** Degrees as typed ("78", "78.5", "78,5" in a decimal-comma hull), within [min, max] (exclusive when asked). */
function degreesRead(text: string, notation: Notation, min: number, max: number, exclusive: boolean): Read | null {
  const t = text.trim().replace(/°$/, '').trim();
  if (t === '') return null;
  const wrong = notation.decimalComma ? '.' : ',';
  if (t.includes(wrong)) return { ok: false, message: `"${text.trim()}": this hull writes decimals with a ${notation.decimalComma ? 'comma' : 'point'} (expected degrees, e.g. ${notation.decimalComma ? '78,5' : '78.5'})` };
  const v = Number(t.replace(',', '.'));
  if (!Number.isFinite(v) || !/^[-+]?(\d+([.,]\d*)?|[.,]\d+)$/.test(t)) return { ok: false, message: `"${text.trim()}" is not a number of degrees (expected e.g. 78.5)` };
  const out = exclusive ? v <= min || v >= max : v < min || v > max;
  if (out) return { ok: false, message: exclusive ? `${v}° must be more than ${min}° and less than ${max}°` : `${v}° must be from ${min}° to ${max}°` };
  return { ok: true, value: v };
}

/** The bevel sense a sliding bevel's reading (degrees) means: under below 90, standing above (common practice). */
export function bevelSenseOf(readingDeg: number): BevelReading['sense'] {
  return readingDeg > 90 ? 'standing' : 'under';
}

/**
 * A reading from the texts typed for it (`base`: the reading as it was, for the fields not typed; none for
 * a new point, which then needs every field of its kind). Every field is read; every one that cannot be is
 * named with its reason, and then there is no reading.
 */
export function measuredReadingRead(
  kind: Measurement['kind'],
  texts: MeasuredTexts,
  notation: Notation,
  base: MeasuredReading | null = null,
): { ok: true; reading: MeasuredReading } | { ok: false; errors: Partial<Record<MeasuredField, string>> } {
  const errors: Partial<Record<MeasuredField, string>> = {};
  const need = (field: MeasuredField, read: Read | null, old: number | undefined): number | undefined => {
    if (read === null) {
      if (texts[field] !== undefined || old === undefined) errors[field] = `Enter the ${fieldWords[field]}`;
      return old;
    }
    if (!read.ok) {
      errors[field] = `The ${fieldWords[field]}: ${read.message}`;
      return undefined;
    }
    return read.value;
  };
  const typed = (field: MeasuredField, read: (t: string) => Read | null): Read | null => (texts[field] === undefined ? null : read(texts[field]!));

  let bevel: BevelReading | null = base?.bevel ?? null;
  if (texts.bevel !== undefined) {
    const r = degreesRead(texts.bevel, notation, 0, 180, true);
    if (r === null) bevel = null;
    else if (!r.ok) errors.bevel = `The ${fieldWords.bevel}: ${r.message}`;
    else bevel = { readingRad: degToRad(r.value), sense: texts.sense === 'under' || texts.sense === 'standing' ? texts.sense : bevelSenseOf(r.value) };
  } else if (bevel && (texts.sense === 'under' || texts.sense === 'standing')) {
    bevel = { ...bevel, sense: texts.sense };
  }
  if (bevel && !errors.bevel) {
    const d = radToDeg(bevel.readingRad);
    if ((bevel.sense === 'under' && d > 90 + 1e-9) || (bevel.sense === 'standing' && d < 90 - 1e-9)) {
      errors.sense = `A sliding bevel reading ${Number(d.toFixed(2))}° is ${bevel.sense === 'under' ? 'more' : 'less'} than 90°: that is ${bevel.sense === 'under' ? 'a standing' : 'an under'} bevel, not ${bevel.sense === 'under' ? 'an under' : 'a standing'} one`;
    }
  }

  if (kind === 'offsets') {
    const b = base && 'h' in base ? base : null;
    const y = need('y', typed('y', (t) => lengthRead(t, notation)), b?.y);
    const h = need('h', typed('h', (t) => lengthRead(t, notation)), b?.h);
    if (Object.keys(errors).length > 0 || y === undefined || h === undefined) return { ok: false, errors };
    return { ok: true, reading: { y, h, bevel } };
  }
  const b = base && 'side' in base ? base : null;
  const sideText = texts.side?.trim().toLowerCase();
  let side = b?.side;
  if (sideText !== undefined) {
    if (sideText === 'port' || sideText === 'starboard') side = sideText;
    else errors.side = `The side: "${texts.side}" is neither port nor starboard`;
  } else if (!side) errors.side = 'Choose the side: port or starboard';
  const angle = need('angle', typed('angle', (t) => degreesRead(t, notation, -180, 180, false)), b ? radToDeg(b.angleRad) : undefined);
  const distance = need('distance', typed('distance', (t) => lengthRead(t, notation)), b?.distanceMm);
  if (distance !== undefined && distance < 0) errors.distance = `The ${fieldWords.distance} cannot be negative, found ${distance} mm`;
  if (Object.keys(errors).length > 0 || angle === undefined || distance === undefined || !side) return { ok: false, errors };
  // An angle not typed keeps its radians exactly rather than going through degrees and back.
  const angleRad = texts.angle === undefined && b ? b.angleRad : degToRad(angle);
  return { ok: true, reading: { side, angleRad, distanceMm: distance, bevel } };
}

/**
 * Text typed into the side table for reading `index` of the frame (index = the number of readings adds a
 * new one at the end): the new plan, or the fields that could not be read with their reasons (and no plan).
 */
export function measuredEntry(plan: Plan, args: { partId: string; index: number; texts: MeasuredTexts }, notation: Notation): MeasuredEntry {
  const frame = measuredOf(plan, args.partId);
  if (!frame) return { ok: false, errors: { y: `There is no measured frame "${args.partId}"` } };
  const points = frame.measurement.points as MeasuredReading[];
  const base = points[args.index] ?? null;
  const read = measuredReadingRead(frame.measurement.kind, args.texts, notation, base);
  if (!read.ok) {
    const row = `Point ${args.index + 1}`;
    return { ok: false, errors: Object.fromEntries(Object.entries(read.errors).map(([k, v]) => [k, `${row}: ${v}`])) };
  }
  const next = base ? measuredPointSet(plan, { partId: args.partId, index: args.index, reading: read.reading }) : measuredPointAdd(plan, { partId: args.partId, reading: read.reading });
  return { ok: true, plan: next };
}
