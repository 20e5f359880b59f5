import { z } from 'zod';

/**
 * How a hull's lengths are typed and shown. Tables of offsets differ in how they write sixteenths after
 * feet-inches-eighths (`3-5-2+`), so the reading of those marks is a per-hull setting, never guessed.
 */
export const lengthUnitSchema = z.enum(['mm', 'in', 'ftin']);
export type LengthUnit = z.infer<typeof lengthUnitSchema>;

/**
 * Reading of the marks after the eighths in feet-inches-eighths:
 * - `plus-sixteenth`: `+` adds 1/16 in; `+-` adds 1/32 in; `++` adds 3/32 in; a trailing `-` subtracts 1/16 in.
 * - `plus-only`: only a single `+` (1/16 in) is accepted; any other mark is an error.
 * - `none`: no marks accepted.
 */
export const sixteenthMarksSchema = z.enum(['plus-sixteenth', 'plus-only', 'none']);
export type SixteenthMarks = z.infer<typeof sixteenthMarksSchema>;

/** Precision lengths are shown to. */
export const displayPrecisionSchema = z.enum(['1mm', '0.5mm', '0.1mm', '1/16in', '1/32in']);
export type DisplayPrecision = z.infer<typeof displayPrecisionSchema>;

/** A hull's notation settings. */
export const notationSchema = z.object({
  unit: lengthUnitSchema.default('mm'),
  decimalComma: z.boolean().default(false),
  sixteenthMarks: sixteenthMarksSchema.default('plus-sixteenth'),
  precision: displayPrecisionSchema.default('0.5mm'),
});
export type Notation = z.infer<typeof notationSchema>;
