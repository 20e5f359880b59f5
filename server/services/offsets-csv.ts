import Papa from 'papaparse';
import type { Notation } from '../../shared/geometry/notation-schema';
import type { HullLines } from '../../shared/geometry/hull-schema';
import { offsetsTableRead, offsetsTableRows, type OffsetsTableIssue } from '../../shared/geometry/offsets';
import { AppError } from '../errors';

/**
 * CSV text ↔ table of offsets. UTF-8 with or without a byte-order mark; comma, semicolon or tab separated
 * (papaparse guesses among those three only). The notation is the person's choice, never guessed.
 */
export function offsetsFromCsv(bytes: Buffer, notation: Notation, previous: Pick<HullLines, 'stations' | 'lines'>) {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new AppError(400, 'not_utf8', 'The file is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8" and try again.', 'file');
  }
  text = text.replace(/^\uFEFF/, '');
  const parsed = Papa.parse<string[]>(text, { delimitersToGuess: [',', ';', '\t'], skipEmptyLines: 'greedy' });
  const fatal = parsed.errors.find((e) => e.type === 'Quotes');
  if (fatal) throw new AppError(400, 'bad_csv', `Row ${(fatal.row ?? 0) + 1}: ${fatal.message}`, 'file');
  const read = offsetsTableRead(parsed.data, notation, previous);
  if (!read.ok) throw csvIssuesError(read.issues);
  return read;
}

export function csvIssuesError(issues: OffsetsTableIssue[]): AppError {
  const first = issues[0];
  const more = issues.length > 1 ? ` (and ${issues.length - 1} more)` : '';
  return new AppError(
    400,
    'bad_offsets',
    `Nothing was imported: row ${first.row}, column ${first.column} (${first.columnName}), "${first.value}": ${first.message}${more}`,
    'file',
    true,
    { cells: issues },
  );
}

/** The table of offsets as CSV text (comma-separated, UTF-8 with a byte-order mark so spreadsheets read it as UTF-8). */
export function offsetsToCsv(lines: HullLines, notation: Notation): string {
  return `\uFEFF${Papa.unparse(offsetsTableRows(lines, notation), { newline: '\r\n' })}\r\n`;
}
