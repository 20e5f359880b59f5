/**
 * GET /api/hulls/:hullId/parts: every part of the latest revision, computed on the server from the stored
 * plan with shared/geometry. A part that cannot be computed says why (`issues`), the others still come.
 */
export interface PartResultSummary {
  partId: string;
  name: string;
  kind: string;
  stationName: string | null;
  /** False when the part could not be computed; `issues` says why, field by field. */
  ok: boolean;
  issues: { code: string; message: string; field?: string }[];
  /** Things to look at before cutting (a tilt past the saw's limit, a notch near an edge...). */
  warnings: { code: string; message: string }[];
  layers: { index: number; thicknessMm: number; areaMm2: number; perimeterMm: number; pieces: number }[];
  massKg: number | null;
  /** Smallest and largest saw tilt along the edge, degrees from square; null without bevel marks. */
  bevelRangeDeg: [number, number] | null;
}

export interface PartsResponse {
  revisionId: number | null;
  results: PartResultSummary[];
}
