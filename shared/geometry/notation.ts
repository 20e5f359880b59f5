import type { DisplayPrecision, Notation } from './notation-schema';
import { type Mm, invariant, mm } from './types';
import { MM_PER_INCH } from './units';

/**
 * Reading and writing lengths the way people type them into a table of offsets and read them off a
 * template: millimetres, decimal or fractional inches, and feet-inches-eighths with sixteenth marks.
 *
 * What is accepted (after trimming; see `lengthParse` for the full list):
 * - a number with an explicit unit (`1049.5 mm`, `41.3125"`, `41 5/16 in`, `3' 5 5/16"`) is read in that
 *   unit whatever the hull's unit, because the mark says what was meant;
 * - a bare number is read in the hull's unit: millimetres for `mm`, inches for `in` and `ftin`;
 * - feet-inches-eighths (`3-5-2+`) and bare fractions (`5/16`) only in an imperial hull, since in a metric
 *   hull they are more likely a slip than a length and a length is never guessed.
 */

/** A length read from text: millimetres, or a message for the cell saying what was wrong and what was expected. */
export type LengthParse = { ok: true; mm: Mm } | { ok: false; message: string };

/** Options for `lengthFormat`. */
export interface LengthFormatOptions {
  /**
   * Append the unit (` mm` or `"`) so the text stands alone, as on a template label; table cells leave it
   * off because the column says the unit. Feet-inches-eighths carry their unit in the dashes and take no
   * mark. Default false.
   */
  unitMark?: boolean;
}

const THIRTY_SECONDS_PER_INCH = 32;
const THIRTY_SECONDS_PER_FOOT = 12 * THIRTY_SECONDS_PER_INCH;

// Length of 32nds of an inch in mm, applied as count * 25.4 / 32 so that a count of 32nds (an exact
// integer) is turned into mm with a single rounding.
const thirtySecondsToMm = (count: number): number => (count * MM_PER_INCH) / THIRTY_SECONDS_PER_INCH;

/**
 * The precision actually used for a notation. A precision of the other system than the unit (the schema
 * allows the pair) is taken as the nearest step that is not coarser, or the finest there is:
 * in `mm`, 1/16 in -> 1 mm and 1/32 in -> 0.5 mm; in `in` / `ftin`, any mm precision -> 1/32 in.
 */
function precisionFor(notation: Notation): DisplayPrecision {
  const p = notation.precision;
  if (notation.unit === 'mm') {
    if (p === '1/16in') return '1mm';
    if (p === '1/32in') return '0.5mm';
    return p;
  }
  return p === '1/16in' ? '1/16in' : '1/32in';
}

/**
 * Step of feet-inches-eighths output in 32nds of an inch. The marks limit what can be written: with
 * `plus-only` there is no 1/32 mark, with `none` not even a sixteenth, so the step coarsens to match.
 */
function ftinStepThirtySeconds(notation: Notation): number {
  if (notation.sixteenthMarks === 'none') return 4;
  if (notation.sixteenthMarks === 'plus-only') return 2;
  return precisionFor(notation) === '1/32in' ? 1 : 2;
}

/**
 * The step (mm) that `lengthFormat` rounds to for this notation: 1, 0.5 or 0.1 mm; 1/16 or 1/32 in;
 * for feet-inches-eighths also limited by the sixteenth marks (1/8 in with `none`, 1/16 in with
 * `plus-only`). Formatting then parsing returns the length to within half this step.
 */
export function lengthPrecisionStepMm(notation: Notation): number {
  const p = precisionFor(notation);
  if (notation.unit === 'mm') return p === '1mm' ? 1 : p === '0.5mm' ? 0.5 : 0.1;
  if (notation.unit === 'in') return thirtySecondsToMm(p === '1/16in' ? 2 : 1);
  return thirtySecondsToMm(ftinStepThirtySeconds(notation));
}

const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));

/**
 * Write a length (mm, finite) as text in the notation's unit and precision, rounded to the nearest step
 * (`lengthPrecisionStepMm`):
 * - `mm`: `1049` (1 mm), `1049.5` / `1049` (0.5 mm: a half only when there is one), `1049.3` (0.1 mm,
 *   always one decimal); a decimal comma when `decimalComma` is set;
 * - `in`: fractional inches reduced to lowest terms, `41 5/16`, `5/16`, `41`;
 * - `ftin`: feet-inches-eighths `3-5-2`, with `+` for a sixteenth and, at 1/32 in with `plus-sixteenth`,
 *   `+-` (1/32) and `++` (3/32). A trailing `-` is never written: it is read but the `+` form is clearer.
 * Negative lengths take a leading minus; a length that rounds to zero is written without one.
 * `lengthParse` reads every output back to within half a step.
 * @throws Error (invariant) when the length is not finite: that is a bug upstream, not bad input.
 */
export function lengthFormat(lengthMm: number, notation: Notation, options: LengthFormatOptions = {}): string {
  invariant(Number.isFinite(lengthMm), `lengthFormat needs a finite length, got ${lengthMm}`);
  const precision = precisionFor(notation);

  if (notation.unit === 'mm') {
    // Work in whole tenths of a millimetre so that no float is ever printed directly.
    const stepTenths = precision === '1mm' ? 10 : precision === '0.5mm' ? 5 : 1;
    const tenths = Math.round((lengthMm * 10) / stepTenths) * stepTenths;
    const sign = tenths < 0 ? '-' : '';
    const whole = Math.floor(Math.abs(tenths) / 10);
    const digit = Math.abs(tenths) % 10;
    const sep = notation.decimalComma ? ',' : '.';
    const showDecimal = precision === '0.1mm' || digit !== 0;
    return `${sign}${whole}${showDecimal ? sep + digit : ''}${options.unitMark ? ' mm' : ''}`;
  }

  if (notation.unit === 'in') {
    const denom = precision === '1/16in' ? 16 : 32;
    const n = Math.round((lengthMm / MM_PER_INCH) * denom);
    const sign = n < 0 ? '-' : '';
    const whole = Math.floor(Math.abs(n) / denom);
    const rest = Math.abs(n) % denom;
    const g = gcd(rest, denom);
    const fraction = rest === 0 ? '' : `${rest / g}/${denom / g}`;
    const body = whole === 0 && fraction !== '' ? fraction : fraction === '' ? `${whole}` : `${whole} ${fraction}`;
    return `${sign}${body}${options.unitMark ? '"' : ''}`;
  }

  const step = ftinStepThirtySeconds(notation);
  const count = Math.round((lengthMm / MM_PER_INCH) * (THIRTY_SECONDS_PER_INCH / step)) * step;
  const sign = count < 0 ? '-' : '';
  const abs = Math.abs(count);
  const feet = Math.floor(abs / THIRTY_SECONDS_PER_FOOT);
  const inches = Math.floor((abs % THIRTY_SECONDS_PER_FOOT) / THIRTY_SECONDS_PER_INCH);
  const eighths = Math.floor((abs % THIRTY_SECONDS_PER_INCH) / 4);
  const mark = ['', '+-', '+', '++'][abs % 4];
  return `${sign}${feet}-${inches}-${eighths}${mark}`;
}

// ---------------------------------------------------------------------------------------------------
// Parsing

type Unsigned = { ok: true; mm: number } | { ok: false; message: string };

const FIE_EXAMPLE = 'feet-inches-eighths like 3-5-2';
const FEET_EXAMPLE = `feet and inches like 3' 5 5/16"`;
const INCH_EXAMPLE = 'inches like 41 5/16 or 41.3125';

function mmExample(notation: Notation): string {
  return `millimetres like ${notation.decimalComma ? '1049,5' : '1049.5'}`;
}

function inchExample(notation: Notation): string {
  return notation.decimalComma ? 'inches like 41 5/16 or 41,3125' : INCH_EXAMPLE;
}

function unitExample(notation: Notation): string {
  if (notation.unit === 'mm') return mmExample(notation);
  if (notation.unit === 'in') return inchExample(notation);
  return `${FIE_EXAMPLE}, or ${inchExample(notation)}`;
}

/**
 * Pasted text brings typographic marks: the minus sign, primes and curly quotes, non-breaking spaces.
 * They mean the same as the keyboard characters, so they are read as such.
 */
function normalise(text: string): string {
  return text
    .replace(/[\u2212\u2012\u2013]/g, '-')
    .replace(/[\u2032\u2019\u00b4]/g, "'")
    .replace(/[\u2033\u201d\u201c]/g, '"')
    .replace(/''/g, '"')
    .replace(/\s+/g, ' ')
    .trim();
}

/**
 * Read a length typed by a person. Surrounding whitespace is ignored; empty (or all-whitespace) text is
 * an empty cell and gives `null`, distinct from an error. Never gives NaN or an infinite length.
 *
 * Forms, each optionally after a leading minus (`-`):
 * - millimetres: `1049.5` (in a metric hull), `1049.5 mm` (anywhere); a decimal comma instead when
 *   `decimalComma` is set, and then a decimal point is an error (it could be a thousands mark) and vice versa;
 * - decimal inches: `41.3125`, `41.3125"`, `41.3125 in` (bare only in an imperial hull);
 * - fractional inches: `41 5/16`, `41-5/16`, `5/16`, each optionally with `"` or `in` (bare only in an
 *   imperial hull); after a whole number the fraction must be less than one;
 * - feet and inches: `3'`, `3' 5"`, `3' 5 5/16"`, `3'-5.25"`, `3 ft 5 in` (inches less than 12);
 * - feet-inches-eighths (imperial hull only): `3-5-2` = 3 ft 5 2/8 in, inches 0 to 11, eighths 0 to 7,
 *   then the marks the notation's `sixteenthMarks` reads: `plus-sixteenth` reads `+` (+1/16 in),
 *   `+-` (+1/32), `++` (+3/32) and `-` (-1/16); `plus-only` reads only `+`; `none` reads no mark.
 * @returns millimetres, or a message of the form `"<text>": <what is wrong> (expected <example>)`.
 */
export function lengthParse(text: string, notation: Notation): LengthParse | null {
  const shown = normalise(text);
  if (shown === '') return null;

  let body = shown;
  let sign = 1;
  if (body.startsWith('-')) {
    sign = -1;
    body = body.slice(1).trimStart();
    if (body === '' || /^[-+]/.test(body)) {
      return fail(shown, 'a single minus sign must be followed by a length', unitExample(notation));
    }
  }

  const r = parseUnsigned(body, shown, notation);
  if (!r.ok) return r;
  if (!Number.isFinite(r.mm)) return fail(shown, 'the number is too large', unitExample(notation));
  // `0 * -1` is -0; a cell that reads "-0" is still zero.
  return { ok: true, mm: mm(r.mm === 0 ? 0 : sign * r.mm) };
}

function fail(shown: string, what: string, expected: string): { ok: false; message: string } {
  return { ok: false, message: `"${shown}": ${what} (expected ${expected})` };
}

function parseUnsigned(body: string, shown: string, notation: Notation): Unsigned {
  const sep = notation.decimalComma ? ',' : '.';
  const other = notation.decimalComma ? '.' : ',';
  if (body.includes(other)) {
    const what = notation.decimalComma
      ? 'this hull writes decimals with a comma, and a point could be a thousands mark'
      : 'this hull writes decimals with a point, and a comma could be a thousands mark';
    return fail(shown, what, unitExample(notation));
  }
  const num = sep === ',' ? String.raw`\d+(?:,\d*)?|,\d+` : String.raw`\d+(?:\.\d*)?|\.\d+`;
  const decimal = (s: string): number => Number(s.replace(',', '.'));
  const imperial = notation.unit !== 'mm';

  // Explicit millimetres.
  const mmMatch = new RegExp(`^(${num}) ?mm$`).exec(body);
  if (mmMatch) return { ok: true, mm: decimal(mmMatch[1]!) };

  // Feet, then optionally inches: 3' 5 5/16", 3'-5", 3 ft 5 in.
  const feetMatch = new RegExp(`^(${num}) ?(?:'|ft)(?: ?- ?| )?(.*)$`).exec(body);
  if (feetMatch) {
    const feet = decimal(feetMatch[1]!);
    const rest = feetMatch[2]!;
    if (rest === '') return { ok: true, mm: feet * 12 * MM_PER_INCH };
    const inches = parseInchText(rest, num, decimal);
    if (inches === null) return fail(shown, 'the inches after the feet could not be read', FEET_EXAMPLE);
    if (typeof inches === 'string') return fail(shown, inches, FEET_EXAMPLE);
    if (inches.value >= 12) return fail(shown, 'inches after feet must be less than 12', FEET_EXAMPLE);
    return { ok: true, mm: (feet * 12 + inches.value) * MM_PER_INCH };
  }

  // Feet-inches-eighths: three dash-separated groups, marks after the eighths.
  const fie = /^(\d+)-(\d+)-([^+-]*)([+-]*)$/.exec(body);
  if (fie) {
    if (!imperial) {
      return fail(shown, 'feet-inches-eighths are read only when the hull is set to imperial units', mmExample(notation));
    }
    return parseFeetInchesEighths(fie, shown, notation);
  }
  if (/^\d+-\d+$/.test(body)) {
    return fail(shown, 'feet-inches-eighths needs three numbers', FIE_EXAMPLE);
  }

  // Inches, decimal or fractional, with or without a mark.
  const inches = parseInchText(body, num, decimal);
  if (typeof inches === 'string') return fail(shown, inches, inchExample(notation));
  if (inches !== null) {
    if (inches.marked || imperial) return { ok: true, mm: inches.value * MM_PER_INCH };
    if (inches.fraction) return fail(shown, 'a fraction is read as inches: add " or in', mmExample(notation));
    return { ok: true, mm: inches.value };
  }

  return fail(shown, 'this is not a length', unitExample(notation));
}

/**
 * Inch text: `41.3125`, `41 5/16`, `41-5/16`, `5/16`, each optionally followed by `"` or `in`.
 * @returns the inches and how they were written, a reason string when the form is right but a number is
 *   not, or null when the text is not inches at all.
 */
function parseInchText(
  text: string,
  num: string,
  decimal: (s: string) => number,
): { value: number; marked: boolean; fraction: boolean } | string | null {
  const markMatch = /^(.*?) ?(?:"|in)$/.exec(text);
  const marked = markMatch !== null;
  const core = markMatch ? markMatch[1]! : text;

  if (new RegExp(`^(?:${num})$`).test(core)) return { value: decimal(core), marked, fraction: false };

  const frac = /^(?:(\d+)(?: |-| - ))?(\d+)\/(\d+)$/.exec(core);
  if (!frac) return null;
  const whole = frac[1] === undefined ? 0 : Number(frac[1]);
  const numerator = Number(frac[2]);
  const denominator = Number(frac[3]);
  if (denominator === 0) return 'the fraction has a denominator of 0';
  if (frac[1] !== undefined && numerator >= denominator) return 'after a whole number the fraction must be less than 1';
  return { value: whole + numerator / denominator, marked, fraction: true };
}

/** Sixteenth marks in 32nds of an inch, as `plus-sixteenth` reads them. */
const MARKS_32: Record<string, number> = { '': 0, '+': 2, '+-': 1, '++': 3, '-': -2 };

function parseFeetInchesEighths(m: RegExpExecArray, shown: string, notation: Notation): Unsigned {
  const feet = Number(m[1]);
  const inches = Number(m[2]);
  const eighthsText = m[3]!;
  const marks = m[4]!;
  const example = notation.sixteenthMarks === 'none' ? FIE_EXAMPLE : `${FIE_EXAMPLE}+`;

  if (inches > 11) return fail(shown, 'inches must be 0 to 11', FIE_EXAMPLE);
  if (!/^\d+$/.test(eighthsText)) {
    // A decimal in the eighths is usually a sixteenth written the metric way: say how the hull writes it.
    const decimalEighths = /^\d*[.,]\d+$/.test(eighthsText) && notation.sixteenthMarks !== 'none';
    const what =
      eighthsText === ''
        ? 'the eighths are missing'
        : decimalEighths
          ? 'eighths must be a whole number 0 to 7 (a sixteenth is written as a mark after them)'
          : 'eighths must be a whole number 0 to 7';
    return fail(shown, what, FIE_EXAMPLE);
  }
  const eighths = Number(eighthsText);
  if (eighths > 7) return fail(shown, 'eighths must be 0 to 7', FIE_EXAMPLE);

  let extra32 = 0;
  if (marks !== '') {
    if (notation.sixteenthMarks === 'none') {
      return fail(shown, `this hull reads no marks after the eighths, found "${marks}"`, FIE_EXAMPLE);
    }
    if (notation.sixteenthMarks === 'plus-only' && marks !== '+') {
      return fail(shown, `this hull reads only + (1/16 in) after the eighths, found "${marks}"`, example);
    }
    const v = MARKS_32[marks];
    if (v === undefined) {
      return fail(
        shown,
        `"${marks}" is not a mark this hull reads after the eighths: + (1/16 in), +- (1/32), ++ (3/32), - (less 1/16)`,
        example,
      );
    }
    extra32 = v;
  }
  const count = ((feet * 12 + inches) * 8 + eighths) * 4 + extra32;
  return { ok: true, mm: thirtySecondsToMm(count) };
}
