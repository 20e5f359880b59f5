import Papa from 'papaparse';
import { type BevelRow, type DrawingUnits, TILT_DIRECTION_WORDS, degreesLabel, lengthLabel } from '../../shared/geometry/drawing';
import { CAUTION_SAWS } from './cautions';
import { csvBuffer } from './csv';
import { type Doc, paragraph, pdfBuffer, pdfDocument, textAt } from './pdf-common';
import { PdfTable, type TableColumn } from './pdf-table';

/**
 * The bevel table, to read at the saw: for each part and layer, every bevel mark's girth from the
 * centreline, side, saw tilt, sliding-bevel reading, under or standing, which way to tilt and the face
 * to put down. PDF in large type (A4 landscape, 4.2 mm capitals, about 17 pt) and CSV.
 */

/** What heads the table. */
export interface BevelTableOptions {
  hullName: string;
  revisionId: string;
  date: string;
  units: DrawingUnits;
}

const A4_LANDSCAPE = { widthMm: 297, heightMm: 210 };
const MARGIN_MM = 12;
/** Capital height (mm) of the rows: readable at arm's length at the saw (our choice). */
export const BEVEL_TABLE_CAP_MM = 4.2;

const COLUMNS: TableColumn[] = [
  { title: 'Mark', widthMm: 18, align: 'end' },
  { title: 'Girth from CL', widthMm: 40, align: 'end' },
  { title: 'Side', widthMm: 28 },
  { title: 'Saw tilt', widthMm: 26, align: 'end' },
  { title: 'Sliding bevel', widthMm: 32, align: 'end' },
  { title: 'Bevel', widthMm: 26 },
  { title: 'Tilt', widthMm: 56 },
  { title: 'Face down', widthMm: 25 },
  { title: 'Note', widthMm: 22 },
];

/** Rows grouped by part and layer, in the order given, marks in order within each group. */
function groups(rows: readonly BevelRow[]): { key: string; partName: string; stationName: string; layerIndex: number; rows: BevelRow[] }[] {
  const out = new Map<string, { key: string; partName: string; stationName: string; layerIndex: number; rows: BevelRow[] }>();
  for (const r of rows) {
    const key = `${r.partName}\u0000${r.layerIndex}`;
    if (!out.has(key)) out.set(key, { key, partName: r.partName, stationName: r.stationName, layerIndex: r.layerIndex, rows: [] });
    out.get(key)!.rows.push(r);
  }
  for (const g of out.values()) g.rows.sort((a, b) => a.markNo - b.markNo);
  return [...out.values()];
}

/** Words for the tilt direction in the table: shorter than on the pattern, the same sense. */
const TILT_SHORT: Record<BevelRow['tiltDirection'], string> = { 'toward-centreline': 'toward the centreline', 'away-from-centreline': 'away from the centreline', none: '-' };

/** The bevel table as a PDF Buffer. */
export async function bevelTablePdf(rows: readonly BevelRow[], options: BevelTableOptions): Promise<Buffer> {
  const doc = pdfDocument({ title: `${options.hullName}: bevel table`, subject: 'Bevels at every mark, for the saw', date: options.date });
  const head = (d: Doc, pageNo: number): number => {
    const m = MARGIN_MM;
    textAt(d, `Bevel table: ${options.hullName}`, m, m + 6, { capMm: 6, bold: true });
    textAt(d, `Revision ${options.revisionId}, ${options.date}. Page ${pageNo}.`, A4_LANDSCAPE.widthMm - m, m + 6, { capMm: 2.8, align: 'end' });
    paragraph(d, 'Saw tilt is from square. Put the face named down on the table (it is the larger face) and tilt as the Tilt column says. The sliding bevel reads from the marked face: 90 minus the tilt for an under bevel, 90 plus for a standing one.', m, m + 10, A4_LANDSCAPE.widthMm - 2 * m, { capMm: 2.4 });
    paragraph(d, CAUTION_SAWS, m, A4_LANDSCAPE.heightMm - m - 8, A4_LANDSCAPE.widthMm - 2 * m, { capMm: 2.2, bold: true });
    return m + 24;
  };
  const table = new PdfTable(doc, { pageWidthMm: A4_LANDSCAPE.widthMm, pageHeightMm: A4_LANDSCAPE.heightMm, marginMm: MARGIN_MM, capMm: BEVEL_TABLE_CAP_MM, rowMm: 8.5, onPage: head, bottomMm: A4_LANDSCAPE.heightMm - MARGIN_MM - 11 }, COLUMNS);
  const all = groups(rows);
  if (all.length === 0) {
    table.group('No bevel marks');
  }
  for (const g of all) {
    table.group(`${g.partName}, station ${g.stationName}, layer ${g.layerIndex}`);
    for (const r of g.rows) {
      table.row({
        cells: [
          String(r.markNo),
          lengthLabel(r.girthMm, options.units),
          r.side,
          r.kind === 'square' ? 'square' : degreesLabel(r.sawTiltDeg),
          degreesLabel(r.slidingBevelDeg),
          r.kind,
          TILT_SHORT[r.tiltDirection],
          r.faceDown ?? '-',
          r.overSawLimit ? 'PAST LIMIT' : '',
        ],
        warn: r.overSawLimit,
      });
    }
  }
  return pdfBuffer(doc);
}

/** CSV column names of the bevel table. */
export const BEVEL_CSV_FIELDS = ['part', 'station', 'layer', 'mark', 'girth', 'girth_units', 'side', 'saw_tilt_deg', 'sliding_bevel_deg', 'bevel', 'tilt_direction', 'face_down', 'past_saw_limit'] as const;

/**
 * The bevel table as CSV (papaparse), one row per mark, a header row first. Girth in the given units
 * (mm to 0.1, inches to 0.001), degrees to 0.1; the tilt direction in words. UTF-8 with a byte-order
 * mark, which spreadsheet programs need to read accents in part names.
 */
export function bevelTableCsv(rows: readonly BevelRow[], options: Pick<BevelTableOptions, 'units'>): Buffer {
  const data = groups(rows).flatMap((g) =>
    g.rows.map((r) => [
      r.partName,
      r.stationName,
      r.layerIndex,
      r.markNo,
      options.units === 'mm' ? r.girthMm.toFixed(1) : (r.girthMm / 25.4).toFixed(3),
      options.units,
      r.side,
      r.sawTiltDeg.toFixed(1),
      r.slidingBevelDeg.toFixed(1),
      r.kind,
      TILT_DIRECTION_WORDS[r.tiltDirection],
      r.faceDown ?? '',
      r.overSawLimit ? 'yes' : 'no',
    ]),
  );
  return csvBuffer(Papa.unparse({ fields: [...BEVEL_CSV_FIELDS], data }, { newline: '\r\n' }));
}
