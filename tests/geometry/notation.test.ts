import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { lengthFormat, lengthParse, lengthPrecisionStepMm } from '../../shared/geometry/notation';
import { type Notation, notationSchema } from '../../shared/geometry/notation-schema';
import { expectClose } from './helpers';

const notation = (n: Partial<Notation> = {}): Notation => notationSchema.parse(n);
const FTIN = notation({ unit: 'ftin', sixteenthMarks: 'plus-sixteenth', precision: '1/16in' });
const INCH = notation({ unit: 'in', precision: '1/16in' });
const MM = notation({ unit: 'mm', precision: '0.5mm' });

/** The millimetres text reads as, failing the test (with the parser's message) if it does not read. */
function read(text: string, n: Notation): number {
  const r = lengthParse(text, n);
  if (r === null) throw new Error(`"${text}" read as an empty cell`);
  if (!r.ok) throw new Error(r.message);
  return r.mm;
}

/** The message text is rejected with, failing the test if it reads. */
function rejection(text: string, n: Notation): string {
  const r = lengthParse(text, n);
  if (r === null || r.ok) throw new Error(`"${text}" was accepted as ${r === null ? 'an empty cell' : r.mm}`);
  return r.message;
}

const INCH_MM = 25.4;
const SIXTEENTH = INCH_MM / 16;
const THIRTY_SECOND = INCH_MM / 32;

describe('lengthParse: feet-inches-eighths', () => {
  it('reads the worked conversions', () => {
    // common practice in published tables of offsets; arithmetic derived: 1 ft 3 4/8 in = 15.5 in
    expectClose(read('1-3-4', FTIN), 393.7, 1e-9);
    // common practice in published tables of offsets; arithmetic derived: 3/16 in
    expectClose(read('0-0-1+', FTIN), 4.7625, 1e-9);
    // common practice in published tables of offsets; arithmetic derived: 41.3125 in
    expectClose(read('3-5-2+', FTIN), 1049.3375, 1e-9);
    // common practice in published tables of offsets; arithmetic derived: 3 ft 5 2/8 in = 41.25 in
    expectClose(read('3-5-2', FTIN), 1047.75, 1e-9);
  });

  it('reads every mark with plus-sixteenth', () => {
    // common practice in published tables of offsets; arithmetic derived: 3-5-2 is 41.25 in
    const base = 41.25 * INCH_MM;
    expectClose(read('3-5-2+', FTIN) - base, SIXTEENTH, 1e-9);
    expectClose(read('3-5-2+-', FTIN) - base, THIRTY_SECOND, 1e-9);
    expectClose(read('3-5-2++', FTIN) - base, 3 * THIRTY_SECOND, 1e-9);
    expectClose(read('3-5-2-', FTIN) - base, -SIXTEENTH, 1e-9);
  });

  it('reads only + with plus-only', () => {
    const n = notation({ unit: 'ftin', sixteenthMarks: 'plus-only' });
    // common practice in published tables of offsets; arithmetic derived
    expectClose(read('3-5-2+', n), 1049.3375, 1e-9);
    for (const text of ['3-5-2++', '3-5-2+-', '3-5-2-']) {
      expect(rejection(text, n)).toContain('this hull reads only + (1/16 in) after the eighths');
    }
  });

  it('reads no marks with none', () => {
    const n = notation({ unit: 'ftin', sixteenthMarks: 'none' });
    // common practice in published tables of offsets; arithmetic derived
    expectClose(read('1-3-4', n), 393.7, 1e-9);
    for (const text of ['3-5-2+', '3-5-2-', '3-5-2++']) {
      expect(rejection(text, n)).toContain('this hull reads no marks after the eighths');
    }
  });

  it('rejects an unknown mark with plus-sixteenth, naming the marks it does read', () => {
    const m = rejection('3-5-2+++', FTIN);
    expect(m).toContain('"+++" is not a mark this hull reads');
    expect(m).toContain('+- (1/32)');
    expect(rejection('3-5-2-+', FTIN)).toContain('"-+" is not a mark');
  });

  it('rejects eighths and inches out of range with what was expected', () => {
    // The message the offsets table shows, word for word (the issue's own example).
    expect(rejection('1-3-9', FTIN)).toBe('"1-3-9": eighths must be 0 to 7 (expected feet-inches-eighths like 3-5-2)');
    expect(rejection('1-12-0', FTIN)).toBe('"1-12-0": inches must be 0 to 11 (expected feet-inches-eighths like 3-5-2)');
    expect(rejection('1-3-2.5', FTIN)).toContain('eighths must be a whole number 0 to 7 (a sixteenth is written as a mark after them)');
    expect(rejection('1-3-', FTIN)).toContain('the eighths are missing');
    expect(rejection('1-3', FTIN)).toContain('feet-inches-eighths needs three numbers');
  });

  it('takes a leading minus, trims whitespace and reads typographic dashes', () => {
    // common practice in published tables of offsets; arithmetic derived
    expectClose(read('-1-3-4', FTIN), -393.7, 1e-9);
    expectClose(read('  1-3-4 \t', FTIN), 393.7, 1e-9);
    expectClose(read('\u22121-3-4', FTIN), -393.7, 1e-9);
  });

  it('is read in an inch hull too, but not in a metric hull', () => {
    // common practice in published tables of offsets; arithmetic derived
    expectClose(read('3-5-2+', INCH), 1049.3375, 1e-9);
    expect(rejection('3-5-2', MM)).toBe(
      '"3-5-2": feet-inches-eighths are read only when the hull is set to imperial units (expected millimetres like 1049.5)',
    );
  });
});

describe('lengthParse: inches', () => {
  it('reads decimal inches with or without a mark', () => {
    // common practice in published tables of offsets; arithmetic derived: 41.3125 in = 1049.3375 mm
    for (const text of ['41.3125', '41.3125"', '41.3125 in', '41.3125in']) expectClose(read(text, INCH), 1049.3375, 1e-9);
    // Source: International Yard and Pound Agreement (1959); NIST SP 811
    expect(read('1', INCH)).toBe(25.4);
    // Source: International Yard and Pound Agreement (1959); NIST SP 811
    expect(read('1"', MM)).toBe(25.4);
  });

  it('reads fractional inches', () => {
    // derived: 41 5/16 in = 41.3125 in = 1049.3375 mm
    for (const text of ['41 5/16', '41 5/16"', '41-5/16', '41 5/16 in', '41  5/16\u201d']) {
      expectClose(read(text, INCH), 1049.3375, 1e-9);
    }
    // derived: 5/16 in = 7.9375 mm
    expectClose(read('5/16', INCH), 7.9375, 1e-12);
    expectClose(read('-5/16"', MM), -7.9375, 1e-12);
  });

  it('reads feet and inches', () => {
    // derived: 3 ft 5 5/16 in = 41.3125 in = 1049.3375 mm
    for (const text of [`3' 5 5/16"`, `3'5 5/16"`, `3'-5 5/16"`, '3 ft 5 5/16 in', `3\u2032 5 5/16\u2033`, `3' 5.3125"`]) {
      expectClose(read(text, FTIN), 1049.3375, 1e-9);
    }
    // Source: International Yard and Pound Agreement (1959); NIST SP 811
    expectClose(read(`1'`, MM), 304.8, 1e-12);
    expect(rejection(`3' 13"`, FTIN)).toContain('inches after feet must be less than 12');
    expect(rejection(`3' abc`, FTIN)).toContain('the inches after the feet could not be read');
  });

  it('rejects bad fractions, saying why', () => {
    expect(rejection('41 5/0', INCH)).toContain('the fraction has a denominator of 0');
    expect(rejection('41 17/16', INCH)).toBe(
      '"41 17/16": after a whole number the fraction must be less than 1 (expected inches like 41 5/16 or 41.3125)',
    );
    expect(rejection('5/16', MM)).toContain('a fraction is read as inches: add " or in');
  });
});

describe('lengthParse: millimetres', () => {
  it('reads millimetres with a decimal point', () => {
    // analytic: the text is the number
    expect(read('1049.5', MM)).toBe(1049.5);
    expect(read('-12.25', MM)).toBe(-12.25);
    expect(read('.5', MM)).toBe(0.5);
    expect(read('1049.5 mm', MM)).toBe(1049.5);
    expect(read('1049.5mm', FTIN)).toBe(1049.5);
  });

  it('reads a decimal comma only when set, and refuses the other separator', () => {
    const comma = notation({ unit: 'mm', decimalComma: true });
    // analytic: the text is the number
    expect(read('1049,5', comma)).toBe(1049.5);
    expect(read('41,3125"', comma)).toBeCloseTo(1049.3375, 9);
    expect(rejection('1049.5', comma)).toBe(
      '"1049.5": this hull writes decimals with a comma, and a point could be a thousands mark (expected millimetres like 1049,5)',
    );
    expect(rejection('1,049', MM)).toContain('this hull writes decimals with a point');
  });

  it('gives null for an empty cell, distinct from an error', () => {
    expect(lengthParse('', MM)).toBeNull();
    expect(lengthParse('   \t ', FTIN)).toBeNull();
    expect(lengthParse('\u00a0', INCH)).toBeNull();
  });

  it('never reads -0 and refuses lone or doubled signs', () => {
    expect(Object.is(read('-0', MM), 0)).toBe(true);
    expect(rejection('-', MM)).toContain('a single minus sign must be followed by a length');
    expect(rejection('--5', MM)).toContain('a single minus sign');
  });

  it('rejects text that is not a length, saying what the hull expects', () => {
    expect(rejection('abc', MM)).toBe('"abc": this is not a length (expected millimetres like 1049.5)');
    expect(rejection('12 34', INCH)).toBe('"12 34": this is not a length (expected inches like 41 5/16 or 41.3125)');
    expect(rejection('five', FTIN)).toBe(
      '"five": this is not a length (expected feet-inches-eighths like 3-5-2, or inches like 41 5/16 or 41.3125)',
    );
    expect(rejection('3-5-2 ft', FTIN)).toBe('"3-5-2 ft": eighths must be a whole number 0 to 7 (expected feet-inches-eighths like 3-5-2)');
    expect(rejection('1e5', MM)).toContain('this is not a length');
    expect(rejection('9'.repeat(400), MM)).toContain('the number is too large');
  });

  it('never gives NaN or an infinite length for any text', () => {
    const anyNotation = fc.record({
      unit: fc.constantFrom('mm', 'in', 'ftin'),
      decimalComma: fc.boolean(),
      sixteenthMarks: fc.constantFrom('plus-sixteenth', 'plus-only', 'none'),
      precision: fc.constantFrom('1mm', '0.5mm', '0.1mm', '1/16in', '1/32in'),
    }) as fc.Arbitrary<Notation>;
    // Text built from the characters lengths are written with, so that many samples come close to valid.
    const lengthish = fc.string({ unit: fc.constantFrom(...'0123456789-+/.,\'" mfti'.split('')), maxLength: 14 });
    fc.assert(
      fc.property(fc.oneof(lengthish, fc.string()), anyNotation, (text, n) => {
        const r = lengthParse(text, n);
        if (r === null) expect(text.trim()).toBe('');
        else if (r.ok) expect(Number.isFinite(r.mm)).toBe(true);
        else expect(r.message.startsWith('"') && r.message.includes('(expected ')).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });
});

describe('lengthFormat', () => {
  it('writes feet-inches-eighths with the + mark', () => {
    // common practice in published tables of offsets; arithmetic derived
    expect(lengthFormat(1049.3375, FTIN)).toBe('3-5-2+');
    expect(lengthFormat(393.7, FTIN)).toBe('1-3-4');
    expect(lengthFormat(4.7625, FTIN)).toBe('0-0-1+');
    expect(lengthFormat(-393.7, FTIN)).toBe('-1-3-4');
    expect(lengthFormat(0, FTIN)).toBe('0-0-0');
  });

  it('writes 32nds as +- and ++ only at 1/32 in with plus-sixteenth', () => {
    const fine = notation({ unit: 'ftin', sixteenthMarks: 'plus-sixteenth', precision: '1/32in' });
    // common practice in published tables of offsets; arithmetic derived: 3-5-2 is 41.25 in
    const base = 41.25 * INCH_MM;
    expect(lengthFormat(base + THIRTY_SECOND, fine)).toBe('3-5-2+-');
    expect(lengthFormat(base + 2 * THIRTY_SECOND, fine)).toBe('3-5-2+');
    expect(lengthFormat(base + 3 * THIRTY_SECOND, fine)).toBe('3-5-2++');
    expect(lengthFormat(base + 4 * THIRTY_SECOND, fine)).toBe('3-5-3');
    // plus-only cannot write a 32nd: 1/32 rounds to the nearest 1/16 (here 2/32 -> +)
    const plusOnly = notation({ unit: 'ftin', sixteenthMarks: 'plus-only', precision: '1/32in' });
    expect(lengthFormat(base + 3 * THIRTY_SECOND - 0.1, plusOnly)).toBe('3-5-2+');
    expect(lengthFormat(base + 2 * THIRTY_SECOND, plusOnly)).toBe('3-5-2+');
    // none writes whole eighths
    const none = notation({ unit: 'ftin', sixteenthMarks: 'none', precision: '1/16in' });
    expect(lengthFormat(base + SIXTEENTH - 0.1, none)).toBe('3-5-2');
    expect(lengthFormat(base + SIXTEENTH + 0.1, none)).toBe('3-5-3');
  });

  it('writes fractional inches in lowest terms', () => {
    // derived: 1049.3375 mm = 41 5/16 in
    expect(lengthFormat(1049.3375, INCH)).toBe('41 5/16');
    expect(lengthFormat(1049.3375, INCH, { unitMark: true })).toBe('41 5/16"');
    // derived: 8 sixteenths = 1/2 in; 7.9375 mm = 5/16 in
    expect(lengthFormat(12.7, INCH)).toBe('1/2');
    expect(lengthFormat(-7.9375, INCH)).toBe('-5/16');
    // Source: International Yard and Pound Agreement (1959); NIST SP 811
    expect(lengthFormat(25.4, INCH)).toBe('1');
    const fine = notation({ unit: 'in', precision: '1/32in' });
    // derived: 41 11/32 in = 1050.13125 mm
    expect(lengthFormat(1050.13125, fine)).toBe('41 11/32');
  });

  it('writes millimetres to 1, 0.5 and 0.1 mm, with a decimal comma when set', () => {
    // analytic: rounding to the step
    expect(lengthFormat(1049.3375, notation({ unit: 'mm', precision: '1mm' }))).toBe('1049');
    expect(lengthFormat(1049.3375, notation({ unit: 'mm', precision: '0.5mm' }))).toBe('1049.5');
    expect(lengthFormat(1049.2, notation({ unit: 'mm', precision: '0.5mm' }))).toBe('1049');
    expect(lengthFormat(1049.3375, notation({ unit: 'mm', precision: '0.1mm' }))).toBe('1049.3');
    expect(lengthFormat(1049, notation({ unit: 'mm', precision: '0.1mm' }))).toBe('1049.0');
    expect(lengthFormat(1049.3375, notation({ unit: 'mm', precision: '0.1mm', decimalComma: true }))).toBe('1049,3');
    expect(lengthFormat(-0.04, notation({ unit: 'mm', precision: '0.1mm' }))).toBe('0.0');
    expect(lengthFormat(1049.5, MM, { unitMark: true })).toBe('1049.5 mm');
  });

  it('takes a precision of the other system as the nearest step not coarser', () => {
    // analytic: 1/16 in = 1.5875 mm -> 1 mm; 1/32 in = 0.79375 mm -> 0.5 mm; any mm step -> 1/32 in
    expect(lengthPrecisionStepMm(notation({ unit: 'mm', precision: '1/16in' }))).toBe(1);
    expect(lengthPrecisionStepMm(notation({ unit: 'mm', precision: '1/32in' }))).toBe(0.5);
    expect(lengthPrecisionStepMm(notation({ unit: 'in', precision: '1mm' }))).toBe(THIRTY_SECOND);
    expect(lengthFormat(1050.13125, notation({ unit: 'in', precision: '0.5mm' }))).toBe('41 11/32');
  });

  it('refuses a length that is not finite (a bug upstream, never printed as NaN)', () => {
    expect(() => lengthFormat(Number.NaN, MM)).toThrow(/finite/);
    expect(() => lengthFormat(Infinity, FTIN)).toThrow(/finite/);
  });
});

describe('lengthFormat then lengthParse', () => {
  const anyNotation = fc.record({
    unit: fc.constantFrom('mm', 'in', 'ftin'),
    decimalComma: fc.boolean(),
    sixteenthMarks: fc.constantFrom('plus-sixteenth', 'plus-only', 'none'),
    precision: fc.constantFrom('1mm', '0.5mm', '0.1mm', '1/16in', '1/32in'),
  }) as fc.Arbitrary<Notation>;
  const length = fc.double({ min: -100_000, max: 100_000, noNaN: true });

  it('round-trips to within half the precision step in every unit and precision', () => {
    // analytic: rounding to the nearest step moves a value by at most half a step
    fc.assert(
      fc.property(length, anyNotation, fc.boolean(), (x, n, unitMark) => {
        const text = lengthFormat(x, n, { unitMark });
        const step = lengthPrecisionStepMm(n);
        expectClose(read(text, n), x, step / 2 + 1e-9, `${x} -> "${text}"`);
      }),
      { numRuns: 3000 },
    );
  });

  it('is stable: formatting what was read gives the same text', () => {
    // analytic: a value on the grid rounds to itself
    fc.assert(
      fc.property(length, anyNotation, (x, n) => {
        const text = lengthFormat(x, n);
        expect(lengthFormat(read(text, n), n)).toBe(text);
      }),
      { numRuns: 2000 },
    );
  });

  it('covers every precision step exactly on the grid', () => {
    // analytic: k steps formatted and read back are k steps, for every unit and precision
    for (const n of [
      notation({ unit: 'mm', precision: '1mm' }),
      notation({ unit: 'mm', precision: '0.5mm', decimalComma: true }),
      notation({ unit: 'mm', precision: '0.1mm' }),
      notation({ unit: 'in', precision: '1/16in' }),
      notation({ unit: 'in', precision: '1/32in' }),
      notation({ unit: 'ftin', precision: '1/32in', sixteenthMarks: 'plus-sixteenth' }),
      notation({ unit: 'ftin', precision: '1/16in', sixteenthMarks: 'plus-only' }),
      notation({ unit: 'ftin', precision: '1/16in', sixteenthMarks: 'none' }),
    ]) {
      const step = lengthPrecisionStepMm(n);
      for (let k = -40; k <= 400; k++) expectClose(read(lengthFormat(k * step, n), n), k * step, 1e-9);
    }
  });
});
