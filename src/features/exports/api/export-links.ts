import type { TiledPdfQuery } from '../../../../shared/api/exports';

/** Where the files are fetched from: plain links for the quick exports (the browser downloads them itself). */
const base = (hullId: number) => `/api/hulls/${hullId}/exports`;
const part = (hullId: number, partId: string) => `${base(hullId)}/parts/${encodeURIComponent(partId)}`;

export const rollPdfHref = (hullId: number, partId: string, layer: number, rollWidthMm: number) => `${part(hullId, partId)}/roll.pdf?layer=${layer}&rollWidthMm=${rollWidthMm}`;

/** A part's DXF: one layer, or without one every layer of the part side by side. */
export const partDxfHref = (hullId: number, partId: string, units: 'mm' | 'in', layer: number | null) => `${part(hullId, partId)}/template.dxf?units=${units}${layer ? `&layer=${layer}` : ''}`;

export const hullDxfHref = (hullId: number, units: 'mm' | 'in') => `${base(hullId)}/hull.dxf?units=${units}`;

/** The tiled PDF straight, for a link to copy (the screen itself downloads it through an export job, with progress). */
export function tiledPdfHref(hullId: number, partId: string, q: TiledPdfQuery): string {
  const params = new URLSearchParams(Object.entries(q).filter(([, v]) => v !== undefined).map(([k, v]) => [k, String(v)]));
  return `${part(hullId, partId)}/template.pdf?${params.toString()}`;
}
