import { z } from 'zod';
import type { Notation } from '../../../shared/geometry/notation-schema';
import { lengthParse } from '../../../shared/geometry/notation';

/**
 * A form field holding a length typed in the hull's notation ("1049.5", "3-5-2+"), read with the same
 * `lengthParse` as the table, so the message says what was typed and what was expected.
 */
export function lengthText(notation: Notation, what: string) {
  return z.string().transform((text, ctx) => {
    const read = lengthParse(text, notation);
    if (read === null) {
      ctx.addIssue({ code: 'custom', message: `Enter ${what}` });
      return z.NEVER;
    }
    if (!read.ok) {
      ctx.addIssue({ code: 'custom', message: read.message });
      return z.NEVER;
    }
    return read.mm as number;
  });
}

/** A number typed as text (degrees, counts): blank is "enter it", anything else must be a finite number in range. */
export function numberText(what: string, range: { min?: number; max?: number; integer?: boolean } = {}) {
  return z.string().transform((text, ctx) => {
    const trimmed = text.trim().replace(',', '.');
    if (trimmed === '') {
      ctx.addIssue({ code: 'custom', message: `Enter ${what}` });
      return z.NEVER;
    }
    const value = Number(trimmed);
    if (!Number.isFinite(value)) {
      ctx.addIssue({ code: 'custom', message: `${what} must be a number, found "${text.trim()}"` });
      return z.NEVER;
    }
    if (range.integer && !Number.isInteger(value)) {
      ctx.addIssue({ code: 'custom', message: `${what} must be a whole number, found ${value}` });
      return z.NEVER;
    }
    if ((range.min !== undefined && value < range.min) || (range.max !== undefined && value > range.max)) {
      const span = range.min !== undefined && range.max !== undefined ? `between ${range.min} and ${range.max}` : range.min !== undefined ? `at least ${range.min}` : `at most ${range.max}`;
      ctx.addIssue({ code: 'custom', message: `${what} must be ${span}, found ${value}` });
      return z.NEVER;
    }
    return value;
  });
}

/** The input mode that brings up the right keyboard on a tablet: digits for millimetres, full for feet-inches-eighths. */
export function lengthInputMode(notation: Notation): 'decimal' | 'text' {
  return notation.unit === 'mm' ? 'decimal' : 'text';
}
