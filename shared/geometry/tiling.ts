import { type DrawingPath, type DrawingPathRole, type TemplateDrawing, drawingAsSeen, drawingBounds, drawingIssues, drawingPathBounds, drawingPathPoints } from './drawing';
import type { Bounds } from './polygon';
import { GeometryInputError, type GeometryIssue, type SectionPoint } from './types';

/**
 * The grid of printed sheets that shows a drawing at full size: each sheet prints what falls in its
 * window, neighbouring windows share an `overlapMm` band so that the sheets can be laid over each other
 * and taped. Shared by the tiled PDF writer and the Print shop preview, so both show the same grid.
 *
 * Coordinates are those of the drawing as printed (`drawingAsSeen`): y to the right, z up, mm. Columns
 * are lettered from the left (A, B, ..., Z, AA, ...), rows numbered from the top (1, 2, ...): "B3" is
 * the second column, third row, as on a street map or a spreadsheet.
 */

/** A paper size, portrait (width across, height up the sheet), mm. */
export interface PaperSize {
  id: string;
  name: string;
  widthMm: number;
  heightMm: number;
}

/** ISO 216 A4, 210 x 297 mm. */
export const PAPER_A4: PaperSize = { id: 'a4', name: 'A4', widthMm: 210, heightMm: 297 };
/** ISO 216 A3, 297 x 420 mm. */
export const PAPER_A3: PaperSize = { id: 'a3', name: 'A3', widthMm: 297, heightMm: 420 };
/** US Letter, 8.5 x 11 in (ANSI/ASME Y14.1), in mm at 25.4 mm/in. */
export const PAPER_LETTER: PaperSize = { id: 'letter', name: 'US Letter', widthMm: 8.5 * 25.4, heightMm: 11 * 25.4 };
/** Tabloid, 11 x 17 in (ANSI/ASME Y14.1 size B), in mm. */
export const PAPER_TABLOID: PaperSize = { id: 'tabloid', name: 'Tabloid', widthMm: 11 * 25.4, heightMm: 17 * 25.4 };
/** The paper sizes offered by name. */
export const PAPER_SIZES: readonly PaperSize[] = [PAPER_A4, PAPER_LETTER, PAPER_A3, PAPER_TABLOID];

/** A custom paper size (mm), stored portrait whichever way round it was given. */
export function paperCustom(widthMm: number, heightMm: number): PaperSize {
  const w = Math.min(widthMm, heightMm);
  const h = Math.max(widthMm, heightMm);
  return { id: 'custom', name: `${fmt(w)} x ${fmt(h)} mm`, widthMm: w, heightMm: h };
}

export type Orientation = 'portrait' | 'landscape';

/** Default printer margin (mm): most office printers cannot print within about 5 mm of the edge (common practice). */
export const DEFAULT_PRINTER_MARGIN_MM = 6.35;
/** Default overlap (mm) between neighbouring sheets: room for registration marks and tape (our choice). */
export const DEFAULT_TILE_OVERLAP_MM = 15;
/** Default clear space (mm) kept round the drawing's extents, so no line falls on a sheet's edge (our choice). */
export const DEFAULT_TILE_PADDING_MM = 5;

/**
 * Which sheets are left out of the print: `empty` those no line crosses or lies in (the default);
 * `reference-only` also those crossed only by straight reference lines (centreline, level line,
 * waterline, set-up line), which a straightedge carries across between the sheets either side, as
 * over the open middle of a ring frame.
 */
export type TileLeaveOut = 'empty' | 'reference-only';

/** The straight reference lines that `reference-only` does not count. */
export const REFERENCE_ROLES: readonly DrawingPathRole[] = ['centreline', 'level-line', 'waterline', 'set-up-line'];

/** How to tile: paper, which way up, the margin the printer cannot print in, the overlap, the padding, which sheets to leave out. */
export interface TilingOptions {
  paper: PaperSize;
  orientation: Orientation;
  marginMm?: number;
  overlapMm?: number;
  paddingMm?: number;
  leaveOut?: TileLeaveOut;
}

/** One sheet of the grid. `window` is the part of the drawing (mm) its printable area shows at full size. */
export interface Tile {
  row: number;
  col: number;
  name: string;
  window: Bounds;
  /** The names of the neighbouring tiles (null at the grid's edge). */
  neighbours: { left: string | null; right: string | null; above: string | null; below: string | null };
}

/** The grid: sizes of the sheet as printed (mm), its printable area, the step between windows, the tiles row by row from the top left. */
export interface TileGrid {
  rows: number;
  cols: number;
  pageWidthMm: number;
  pageHeightMm: number;
  marginMm: number;
  overlapMm: number;
  printableWidthMm: number;
  printableHeightMm: number;
  /** Distance between the left edges (across) and the top edges (up) of neighbouring windows. */
  stepYMm: number;
  stepZMm: number;
  /** The drawing extents the grid was laid over, grown by the padding. */
  extents: Bounds;
  /** The union of the windows: covers `extents`, centred on it. */
  covered: Bounds;
  tiles: Tile[];
}

const fmt = (v: number): string => String(Number(v.toFixed(2)));

/** A column's letters: 0 -> A, 25 -> Z, 26 -> AA. */
export function tileColumnLetters(col: number): string {
  let s = '';
  let n = col + 1;
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

/** A tile's name: column letters then row number from 1 ("B3" = column 1, row 2, both from 0). */
export function tileName(row: number, col: number): string {
  return `${tileColumnLetters(col)}${row + 1}`;
}

/** Sheet size as printed (mm), for the orientation. */
export function pageSizeMm(paper: PaperSize, orientation: Orientation): { widthMm: number; heightMm: number } {
  return orientation === 'portrait' ? { widthMm: paper.widthMm, heightMm: paper.heightMm } : { widthMm: paper.heightMm, heightMm: paper.widthMm };
}

/**
 * The tile grid over `extents` (mm, as printed) grown by the padding: as few columns and rows as cover it,
 * each window the sheet's printable area (the sheet less `marginMm` all round), neighbours `overlapMm`
 * apart, the grid centred on the extents so that the spare paper is shared between its edges.
 * Columns = max(1, ceil((W - o) / (p - o))) for extents W wide, printable width p, overlap o; rows alike.
 * @throws GeometryInputError when the margins leave no printable area, or the overlap is not less than it.
 */
export function tileGrid(extents: Bounds, options: TilingOptions): TileGrid {
  const margin = options.marginMm ?? DEFAULT_PRINTER_MARGIN_MM;
  const overlap = options.overlapMm ?? DEFAULT_TILE_OVERLAP_MM;
  const pad = options.paddingMm ?? DEFAULT_TILE_PADDING_MM;
  const page = pageSizeMm(options.paper, options.orientation);
  const pw = page.widthMm - 2 * margin;
  const ph = page.heightMm - 2 * margin;
  const issues: GeometryIssue[] = [];
  if (![margin, overlap, pad].every((v) => Number.isFinite(v) && v >= 0)) issues.push({ code: 'tiling-input', message: `margin, overlap and padding must be finite lengths of 0 mm or more, found ${margin}, ${overlap} and ${pad} mm`, field: 'marginMm' });
  if (!(page.widthMm > 0 && page.heightMm > 0)) issues.push({ code: 'tiling-paper', message: `the paper must have a size, found ${fmt(page.widthMm)} x ${fmt(page.heightMm)} mm`, field: 'paper' });
  else if (!(pw > 0 && ph > 0)) issues.push({ code: 'tiling-margin', message: `a margin of ${fmt(margin)} mm leaves nothing printable on ${fmt(page.widthMm)} x ${fmt(page.heightMm)} mm paper`, field: 'marginMm', value: margin });
  else if (!(overlap < Math.min(pw, ph) / 2)) issues.push({ code: 'tiling-overlap', message: `an overlap of ${fmt(overlap)} mm must be less than half the printable area (${fmt(Math.min(pw, ph))} mm)`, field: 'overlapMm', value: overlap });
  if (![extents.minY, extents.minZ, extents.maxY, extents.maxZ].every(Number.isFinite) || extents.maxY < extents.minY || extents.maxZ < extents.minZ) issues.push({ code: 'tiling-extents', message: 'the drawing has no extents to tile', field: 'extents' });
  if (issues.length) throw new GeometryInputError(issues);

  const grown: Bounds = { minY: extents.minY - pad, minZ: extents.minZ - pad, maxY: extents.maxY + pad, maxZ: extents.maxZ + pad };
  const w = grown.maxY - grown.minY;
  const h = grown.maxZ - grown.minZ;
  const stepY = pw - overlap;
  const stepZ = ph - overlap;
  // A small allowance keeps a drawing that exactly fills n windows from being given an n + 1th for a rounding error.
  const cols = Math.max(1, Math.ceil((w - overlap) / stepY - 1e-9));
  const rows = Math.max(1, Math.ceil((h - overlap) / stepZ - 1e-9));
  const gridW = cols * stepY + overlap;
  const gridH = rows * stepZ + overlap;
  const left = (grown.minY + grown.maxY) / 2 - gridW / 2;
  const top = (grown.minZ + grown.maxZ) / 2 + gridH / 2;
  const tiles: Tile[] = [];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      const minY = left + c * stepY;
      const maxZ = top - r * stepZ;
      tiles.push({
        row: r,
        col: c,
        name: tileName(r, c),
        window: { minY, maxY: minY + pw, maxZ, minZ: maxZ - ph },
        neighbours: {
          left: c > 0 ? tileName(r, c - 1) : null,
          right: c < cols - 1 ? tileName(r, c + 1) : null,
          above: r > 0 ? tileName(r - 1, c) : null,
          below: r < rows - 1 ? tileName(r + 1, c) : null,
        },
      });
    }
  }
  return {
    rows,
    cols,
    pageWidthMm: page.widthMm,
    pageHeightMm: page.heightMm,
    marginMm: margin,
    overlapMm: overlap,
    printableWidthMm: pw,
    printableHeightMm: ph,
    stepYMm: stepY,
    stepZMm: stepZ,
    extents: grown,
    covered: { minY: left, maxY: left + gridW, maxZ: top, minZ: top - gridH },
    tiles,
  };
}

/** True when segment ab meets the box (inside it or crossing its edge): Liang-Barsky clipping. */
export function segmentMeetsBox(a: SectionPoint, b: SectionPoint, box: Bounds): boolean {
  let t0 = 0;
  let t1 = 1;
  const dy = b.y - a.y;
  const dz = b.z - a.z;
  const edges: [number, number][] = [
    [-dy, a.y - box.minY],
    [dy, box.maxY - a.y],
    [-dz, a.z - box.minZ],
    [dz, box.maxZ - a.z],
  ];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q < 0) return false;
    } else {
      const t = q / p;
      if (p < 0) {
        if (t > t1) return false;
        if (t > t0) t0 = t;
      } else {
        if (t < t0) return false;
        if (t < t1) t1 = t;
      }
    }
  }
  return t0 <= t1;
}

const boxesMeet = (a: Bounds, b: Bounds): boolean => a.minY <= b.maxY && b.minY <= a.maxY && a.minZ <= b.maxZ && b.minZ <= a.maxZ;

/** True when any part of the path's line lies in the box (a loop round the box with no line in it does not). */
export function pathMeetsBox(path: DrawingPath, box: Bounds): boolean {
  return flatMeetsBox(flatOf(path), box);
}

/** A path as straight pieces with its box, worked out once for every tile it is tested against. */
interface FlatPath {
  role: DrawingPathRole;
  points: SectionPoint[];
  closed: boolean;
  bounds: Bounds;
}

const flatOf = (path: DrawingPath): FlatPath => ({ role: path.role, ...drawingPathPoints(path), bounds: drawingPathBounds(path) });

function flatMeetsBox(f: FlatPath, box: Bounds): boolean {
  if (!boxesMeet(f.bounds, box)) return false;
  const { points, closed } = f;
  const n = points.length;
  if (n === 1) return segmentMeetsBox(points[0]!, points[0]!, box);
  const segments = closed ? n : n - 1;
  for (let i = 0; i < segments; i++) if (segmentMeetsBox(points[i]!, points[(i + 1) % n]!, box)) return true;
  return false;
}

type Content = Pick<TemplateDrawing, 'paths' | 'checkDimension' | 'centres'>;

function hasContent(window: Bounds, flat: readonly FlatPath[], drawing: Content, leaveOut: TileLeaveOut): boolean {
  const counts = (p: FlatPath): boolean => leaveOut === 'empty' || !REFERENCE_ROLES.includes(p.role);
  if (flat.some((p) => counts(p) && flatMeetsBox(p, window))) return true;
  const cd = drawing.checkDimension;
  if (cd && segmentMeetsBox(cd.from, cd.to, window)) return true;
  return drawing.centres.some((c) => segmentMeetsBox(c.at, c.at, window));
}

/**
 * True when the window shows something to cut or mark by: a line of any path (but for `reference-only`,
 * not counting the reference lines), the check dimension or a notch or limber centre. Labels alone do not
 * make a tile worth a sheet: nothing is cut by them.
 */
export function tileHasContent(window: Bounds, drawing: Content, leaveOut: TileLeaveOut = 'empty'): boolean {
  return hasContent(window, drawing.paths.map(flatOf), drawing, leaveOut);
}

/** The tiles of the grid that show something (`tileHasContent`), in grid order; the others are left out of the print. */
export function tilesWithContent(grid: TileGrid, drawing: Content, leaveOut: TileLeaveOut = 'empty'): Tile[] {
  const flat = drawing.paths.map(flatOf);
  return grid.tiles.filter((t) => hasContent(t.window, flat, drawing, leaveOut));
}

/** Pages of a tiled print before its first sheet: the assembly map with the instructions. */
export const TILED_INTRO_PAGES = 1;

/** Smallest printable area (mm) each way that still holds the 100 mm check square with room round it. */
export const TILED_MIN_PRINTABLE_MM = 112;

/** What a tiled print holds: the drawing as printed, the grid over it, the sheets printed, the pages before them. */
export interface TiledPrintPlan {
  seen: TemplateDrawing;
  grid: TileGrid;
  printed: Tile[];
  introPages: number;
}

/**
 * The plan of a tiled print of one drawing: the drawing as seen from its marked face, the tile grid over
 * its extents and the sheets that show something. The tiled PDF writer and the Print shop preview both
 * call this, so the grid on the screen and the pages in the file cannot differ.
 * @throws GeometryInputError when the drawing has issues (`drawingIssues`), has no lines, or the printable
 *   area cannot hold the check square (field `paper`), and as `tileGrid`.
 */
export function tiledPrintPlan(drawing: TemplateDrawing, options: TilingOptions): TiledPrintPlan {
  const issues = drawingIssues(drawing);
  if (issues.length) throw new GeometryInputError(issues);
  const seen = drawingAsSeen(drawing);
  const extents = drawingBounds(seen);
  if (!extents) throw new GeometryInputError([{ code: 'drawing-empty', message: `${drawing.title.partName}: the drawing has no lines to print`, field: 'paths' }]);
  const grid = tileGrid(extents, options);
  if (Math.min(grid.printableWidthMm, grid.printableHeightMm) < TILED_MIN_PRINTABLE_MM) {
    throw new GeometryInputError([{ code: 'tiling-paper-small', message: `the printable area (${grid.printableWidthMm.toFixed(1)} x ${grid.printableHeightMm.toFixed(1)} mm) must be at least ${TILED_MIN_PRINTABLE_MM} mm each way to hold the 100 mm check square`, field: 'paper' }]);
  }
  return { seen, grid, printed: tilesWithContent(grid, seen, options.leaveOut), introPages: TILED_INTRO_PAGES };
}

/** Pages in the tiled PDF of a plan: the assembly map and every printed sheet. */
export const tiledPrintPageCount = (plan: Pick<TiledPrintPlan, 'introPages' | 'printed'>): number => plan.introPages + plan.printed.length;
