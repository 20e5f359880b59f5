import { useMutation } from '@tanstack/react-query';
import type { CsvCellIssue } from '../../../../shared/api/plan';
import type { LengthUnit, SixteenthMarks } from '../../../../shared/geometry/notation-schema';
import { api, ApiError } from '../../../lib/api-client';
import type { SavedRevision } from './save-revision';

export interface ImportOffsetsInput {
  file: File;
  baseRevisionId: number | null;
  unit: LengthUnit;
  decimalComma: boolean;
  sixteenthMarks: SixteenthMarks;
}

/** Upload a CSV table of offsets; the server reads it in the units chosen and saves it as a new revision. */
export function importOffsets(hullId: number, input: ImportOffsetsInput): Promise<SavedRevision> {
  const form = new FormData();
  form.append('baseRevisionId', input.baseRevisionId === null ? '' : String(input.baseRevisionId));
  form.append('unit', input.unit);
  form.append('decimalComma', String(input.decimalComma));
  form.append('sixteenthMarks', input.sixteenthMarks);
  form.append('file', input.file, input.file.name);
  return api.postForm<SavedRevision>(`/api/hulls/${hullId}/plan/import/offsets`, form);
}

/** The bad cells of a refused import (400 `bad_offsets`), as the server listed them. */
export function badCellsOf(error: unknown): CsvCellIssue[] {
  if (!(error instanceof ApiError) || error.code !== 'bad_offsets' || !Array.isArray(error.details.cells)) return [];
  return error.details.cells as CsvCellIssue[];
}

export function useImportOffsets(hullId: number) {
  return useMutation({ mutationFn: (input: ImportOffsetsInput) => importOffsets(hullId, input) });
}
