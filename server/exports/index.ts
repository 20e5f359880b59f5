/**
 * server/exports: the writers of what leaves Loftbench (tiled and roll PDF, DXF, bevel table, cut list,
 * zip). Plain functions returning Buffers (or a stream for the tiled PDF); no Express here.
 */
export { tiledPdf, tiledPdfPlan, tiledPdfStream, registrationMarks, type PdfProgress, type TiledPdfPlan } from './tiled-pdf';
export { rollPdf, rollPdfPlan, PDF_MAX_PAGE_MM, ROLL_WIDTHS_MM, type RollPdfOptions, type RollPdfPlan } from './roll-pdf';
export { dxfOfDrawings, dxfWrite, DXF_LAYERS, type DxfOptions, type DxfUnits } from './dxf';
export { bevelTableCsv, bevelTablePdf, type BevelTableOptions } from './bevel-table';
export { cutListCsv, cutListNesting, cutListPdf, type CutListOptions, type CutListTotals } from './cut-list';
export { zipOf, type ZipFile } from './zip';
