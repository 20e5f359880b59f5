/** The address of the latest revision's table of offsets as CSV, in millimetres, inches or feet-inches-eighths (a plain download link). */
export function exportOffsetsCsvHref(hullId: number, unit: 'mm' | 'in' | 'ftin'): string {
  return `/api/hulls/${hullId}/plan/export/offsets.csv?unit=${unit}`;
}
