import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError, describeError, type FieldIssue } from './api-client';

/** Our own words for an error code a form expects, and the field to show them under (none: top of the form). */
export type ErrorWords<T extends FieldValues> = Partial<Record<string, { field?: Path<T>; message: string }>>;

/**
 * Puts a server error where the person will look for it: under the field it names (the server's 400 gives
 * the field path), else at the top of the form as `errors.root.server`.
 */
export function showServerError<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
  words: ErrorWords<T> = {},
): void {
  const known = error instanceof ApiError ? words[error.code] : undefined;
  if (known) {
    if (known.field) setError(known.field, { type: 'server', message: known.message }, { shouldFocus: true });
    else setError('root.server', { type: 'server', message: known.message });
    return;
  }

  if (error instanceof ApiError) {
    const issues: FieldIssue[] = [...error.issues];
    if (error.field && !issues.some((issue) => issue.field === error.field)) {
      issues.unshift({ field: error.field, message: error.message });
    }
    const isFormField = (field: string): field is Path<T> => (fields as readonly string[]).includes(field);
    const placed = issues.filter((issue) => isFormField(issue.field));
    placed.forEach((issue, index) => {
      setError(issue.field as Path<T>, { type: 'server', message: issue.message }, { shouldFocus: index === 0 });
    });
    if (placed.length > 0) return;
  }

  setError('root.server', { type: 'server', message: describeError(error) });
}
