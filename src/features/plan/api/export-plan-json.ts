/** The address of the latest revision's whole plan as JSON (a plain download link). */
export function exportPlanJsonHref(hullId: number): string {
  return `/api/hulls/${hullId}/plan/export/plan.json`;
}
