import { type Doc, pdfPage, pt, textAt, textWidthMm } from './pdf-common';

/**
 * A plain table set on PDF pages, paged as it goes: a header row repeated on every page, rows of text
 * in fixed columns, a heading between groups of rows. Millimetres throughout.
 */

export interface TableColumn {
  title: string;
  widthMm: number;
  align?: 'start' | 'end';
}

/** A row: its cells, and whether it is to be shown as a warning. */
export interface TableRow {
  cells: string[];
  warn?: boolean;
}

/** Page set-up of a table and the sizes of its type. */
export interface TableLayout {
  pageWidthMm: number;
  pageHeightMm: number;
  marginMm: number;
  /** Capital height (mm) of the cells. */
  capMm: number;
  rowMm: number;
  /** Called on every new page to draw its head and foot; returns where the table may start (mm from the top). */
  onPage: (doc: Doc, pageNo: number) => number;
  /** Lowest point (mm from the top) a row may reach. */
  bottomMm: number;
}

/** Sets tables on pages; `group` starts a heading, `rows` adds rows below it. */
export class PdfTable {
  private y = 0;
  private page = 0;
  private heading: string | null = null;

  constructor(
    private readonly doc: Doc,
    private readonly layout: TableLayout,
    private readonly columns: TableColumn[],
  ) {}

  private newPage(withHeader: boolean): void {
    const l = this.layout;
    pdfPage(this.doc, l.pageWidthMm, l.pageHeightMm);
    this.page++;
    this.y = l.onPage(this.doc, this.page);
    if (!withHeader) return;
    if (this.heading !== null) this.headingRow(`${this.heading} (continued)`);
    this.headerRow();
  }

  private headingRow(text: string): void {
    textAt(this.doc, text, this.layout.marginMm, this.y + this.layout.capMm * 1.3, { capMm: this.layout.capMm * 1.25, bold: true });
    this.y += this.layout.rowMm * 1.35;
  }

  private headerRow(): void {
    const l = this.layout;
    let x = l.marginMm;
    const cap = l.capMm * 0.72;
    for (const c of this.columns) {
      const right = c.align === 'end';
      textAt(this.doc, c.title, right ? x + c.widthMm - 2 : x + 1, this.y + cap * 1.6, { capMm: cap, bold: true, align: right ? 'end' : 'start' });
      x += c.widthMm;
    }
    this.y += cap * 2.4;
    this.doc.lineWidth(pt(0.4)).strokeColor('black').undash().moveTo(pt(l.marginMm), pt(this.y)).lineTo(pt(x), pt(this.y)).stroke();
    this.y += 1;
  }

  /** Starts a group under a heading (on a new page when the heading and two rows would not fit). */
  group(heading: string): void {
    const l = this.layout;
    if (this.page === 0 || this.y + l.rowMm * 4 > l.bottomMm) {
      this.newPage(false);
    } else this.y += l.rowMm * 0.4;
    this.heading = heading;
    this.headingRow(heading);
    this.headerRow();
  }

  /** Adds one row, on a new page when it would not fit. */
  row(r: TableRow): void {
    const l = this.layout;
    if (this.page === 0 || this.y + l.rowMm > l.bottomMm) this.newPage(true);
    let x = l.marginMm;
    const base = this.y + (l.rowMm + l.capMm) / 2;
    r.cells.forEach((cell, i) => {
      const c = this.columns[i]!;
      const right = c.align === 'end';
      // A cell too long for its column is set smaller rather than run into the next.
      let cap = l.capMm;
      const room = c.widthMm - 3;
      const wide = textWidthMm(this.doc, cell, cap, r.warn);
      if (wide > room) cap = Math.max(l.capMm * 0.5, (cap * room) / wide);
      textAt(this.doc, cell, right ? x + c.widthMm - 2 : x + 1, base - (l.capMm - cap) / 2, { capMm: cap, bold: r.warn, align: right ? 'end' : 'start', color: r.warn ? '#b00000' : 'black' });
      x += c.widthMm;
    });
    this.y += l.rowMm;
    this.doc.lineWidth(pt(0.15)).strokeColor('#999999').undash().moveTo(pt(l.marginMm), pt(this.y)).lineTo(pt(x), pt(this.y)).stroke();
  }

  /** Where the next row would go (mm from the top of the current page). */
  get cursorMm(): number {
    return this.y;
  }

  /** Pages used so far. */
  get pages(): number {
    return this.page;
  }
}
