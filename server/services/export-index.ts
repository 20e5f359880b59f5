import type { ExportIndexEntry, ExportIndexResponse } from '../../shared/api/exports';
import { rollPdfQuerySchema, tiledPdfQuerySchema } from '../../shared/api/exports';
import { arrangementStamp, cutListNestingFor } from './cut-list-arrangement';
import { bevelsCsvFile, bevelsPdfFile, cutListCsvFile, cutListPdfFile, type ExportFile, hullDxfFile, partDxfFile, rollPdfFile, tiledPdfFile, zipFileOf } from './export-files';
import { AppError } from '../errors';
import type { ExportSource } from './exports';

/**
 * The Downloads index: every export of the latest revision with its size in bytes. The sizes are those of
 * the files themselves, made once here and kept: a revision never changes, so its files only change with
 * the hand arrangement of its cut list or the date in the title blocks, which are in the cache key. One
 * index request rather than a HEAD per file, because a HEAD makes the whole file just as a GET does, and
 * the screen would ask for a dozen of them on every visit with nothing kept between.
 */

const MAX_ENTRIES = 32;
const cache = new Map<string, ExportIndexResponse>();

type Planned = { kind: ExportIndexEntry['kind']; label: string; href: string; make: () => ExportFile | Promise<ExportFile>; partId?: string; layer?: number };

/** The entry of one file: its name and size, or, when it cannot be made (a part too big for the sheet), why, in the person's words. */
async function entryOf(p: Planned, revisionId: number): Promise<ExportIndexEntry> {
  const { make, ...rest } = p;
  try {
    const file = await make();
    return { ...rest, revisionId, name: file.name, bytes: file.data.length, problem: null };
  } catch (e) {
    if (e instanceof AppError && e.expected) return { ...rest, revisionId, name: null, bytes: null, problem: e.message };
    throw e;
  }
}

export async function exportIndexOf(hullId: number, source: ExportSource): Promise<ExportIndexResponse> {
  const key = `${source.revisionId}:${await arrangementStamp(hullId, source.revisionId)}:${source.date}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const base = `/api/hulls/${hullId}/exports`;
  // Awaited only by the files that need it, so that a cut list that cannot be nested marks only those.
  const nesting = cutListNestingFor(hullId, source);
  nesting.catch(() => {});
  const planned: Planned[] = [];
  for (const part of source.built) {
    for (let i = 0; i < part.layers.length; i += 1) {
      const layer = i + 1;
      const of = `${part.name}, layer ${layer} of ${part.layers.length}`;
      planned.push({ kind: 'tiled-pdf', partId: part.partId, layer, label: `${of}: tiled PDF, A4 portrait`, href: `${base}/parts/${part.partId}/template.pdf?layer=${layer}`, make: () => tiledPdfFile(source, part, tiledPdfQuerySchema.parse({ layer })) });
      planned.push({ kind: 'roll-pdf', label: `${of}: one-sheet PDF, 914 mm roll`, href: `${base}/parts/${part.partId}/roll.pdf?layer=${layer}`, make: () => rollPdfFile(source, part, rollPdfQuerySchema.parse({ layer })) });
      planned.push({ kind: 'dxf', label: `${of}: DXF in millimetres`, href: `${base}/parts/${part.partId}/template.dxf?layer=${layer}&units=mm`, make: () => partDxfFile(source, part, { units: 'mm', layer }) });
    }
  }
  planned.push({ kind: 'dxf', label: 'Every part: DXF in millimetres', href: `${base}/hull.dxf?units=mm`, make: () => hullDxfFile(source, { units: 'mm' }) });
  planned.push({ kind: 'dxf', label: 'Every part: DXF in inches', href: `${base}/hull.dxf?units=in`, make: () => hullDxfFile(source, { units: 'in' }) });
  planned.push({ kind: 'bevels-csv', label: 'Bevel table, CSV', href: `${base}/bevels.csv`, make: () => bevelsCsvFile(source) });
  planned.push({ kind: 'bevels-pdf', label: 'Bevel table, PDF', href: `${base}/bevels.pdf`, make: () => bevelsPdfFile(source) });
  planned.push({ kind: 'cut-list-csv', label: 'Cut list and material, CSV', href: `${base}/cut-list.csv`, make: async () => cutListCsvFile(source, await nesting) });
  planned.push({ kind: 'cut-list-pdf', label: 'Cut list and material, PDF', href: `${base}/cut-list.pdf`, make: async () => cutListPdfFile(source, await nesting) });
  planned.push({ kind: 'zip', label: 'Everything, one zip', href: `${base}/all.zip`, make: async () => zipFileOf(source, await nesting) });
  const exports: ExportIndexEntry[] = [];
  // One after another: each file is a burst of work, and other requests get their turn between them.
  for (const p of planned) exports.push(await entryOf(p, source.revisionId));
  const how = await nesting.then((n) => (n.byHand ? 'arranged by hand' : 'arranged automatically')).catch(() => null);
  for (const e of exports) if (how && (e.kind === 'cut-list-csv' || e.kind === 'cut-list-pdf')) e.label += ` (${how})`;
  const index: ExportIndexResponse = { revisionId: source.revisionId, exports };
  cache.set(key, index);
  if (cache.size > MAX_ENTRIES) cache.delete(cache.keys().next().value!);
  return index;
}
