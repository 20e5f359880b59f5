import PDFDocument from 'pdfkit';

/**
 * What every PDF writer shares: millimetres to points, the document set-up, text on a baseline, and the
 * Buffer at the end. Millimetres everywhere else; points only here and in the PDF writers' last step.
 */

/** Points per millimetre: 1 pt = 1/72 in (ISO 32000-1, 8.3.2) and 1 in = 25.4 mm exactly (NIST SP 811). */
export const PT_PER_MM = 72 / 25.4;
/** Millimetres to points. */
export const pt = (lengthMm: number): number => lengthMm * PT_PER_MM;

/** The standard PDF fonts used (no font is embedded: every reader has them). */
export const FONT = 'Helvetica';
export const FONT_BOLD = 'Helvetica-Bold';
/** Helvetica's capital height as a fraction of its size (Adobe's Helvetica AFM: CapHeight 718). */
export const CAP_HEIGHT = 0.718;

export type Doc = PDFKit.PDFDocument;

/** A new document with no page yet, no margins, its information set, and a fixed creation date for repeatable files. */
export function pdfDocument(info: { title: string; subject: string; date: string }): Doc {
  const created = /^\d{4}-\d{2}-\d{2}/.test(info.date) ? new Date(`${info.date.slice(0, 10)}T00:00:00Z`) : new Date(0);
  const doc = new PDFDocument({
    autoFirstPage: false,
    margin: 0,
    compress: true,
    info: { Title: winAnsi(info.title), Subject: winAnsi(info.subject), Creator: 'Loftbench', Producer: 'Loftbench (pdfkit)', CreationDate: created, ModDate: created },
  });
  for (const f of [FONT, FONT_BOLD]) memoiseEncoding(doc, f);
  return doc;
}

type EncodingFont = { encode?: (text: string, features?: unknown) => unknown };

/**
 * The same strings go on every sheet (title, check words, neighbours' names): pdfkit's standard fonts
 * work out glyphs and kerning afresh for each, so each font's `encode` (pdfkit 0.20 internals) keeps what
 * it has worked out, per document. Its result is only read by pdfkit. Left as it is when absent.
 */
function memoiseEncoding(doc: Doc, font: string): void {
  doc.font(font);
  const f = (doc as Doc & { _font?: EncodingFont })._font;
  if (!f || typeof f.encode !== 'function') return;
  const encode = f.encode.bind(f);
  const memo = new Map<string, unknown>();
  f.encode = (text: string, features?: unknown) => {
    if (features !== undefined) return encode(text, features);
    let r = memo.get(text);
    if (r === undefined) memo.set(text, (r = encode(text)));
    return r;
  };
}

/** Adds a page of `widthMm` x `heightMm` (the MediaBox in points, exact to 1e-6 pt as pdfkit writes numbers). */
export function pdfPage(doc: Doc, widthMm: number, heightMm: number): void {
  doc.addPage({ size: [pt(widthMm), pt(heightMm)], margin: 0 });
}

/**
 * Sets a dash pattern (mm on paper: dash, gap, dash, gap...), or solid when empty. pdfkit takes an array
 * (it writes the PDF dash array as given) though its published types say one number.
 */
export function dashMm(doc: Doc, pattern: readonly number[]): void {
  if (pattern.length === 0) doc.undash();
  else doc.dash(pattern.map(pt) as unknown as number, {});
}

/** Everything the document writes from now on, as one Buffer once it ends (the caller ends it). */
export function pdfCollect(doc: Doc): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
}

/** Ends a document already written and returns it as one Buffer. */
export function pdfBuffer(doc: Doc): Promise<Buffer> {
  const done = pdfCollect(doc);
  doc.end();
  return done;
}

// Characters the standard fonts' WinAnsi encoding has beyond Latin-1 (ISO 32000-1, Annex D.2).
const WIN_ANSI_EXTRA = new Set('€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ');

/** Text the standard fonts can show: any character outside WinAnsi becomes '?', line breaks become spaces. */
export function winAnsi(text: string): string {
  let out = '';
  for (const ch of text) {
    const c = ch.codePointAt(0)!;
    if (c === 10 || c === 13 || c === 9) out += ' ';
    else if ((c >= 0x20 && c <= 0x7e) || (c >= 0xa0 && c <= 0xff) || WIN_ANSI_EXTRA.has(ch)) out += ch;
    else out += '?';
  }
  return out;
}

/** How text is set by `textAt`. Sizes are the capital height in millimetres, as on a drawing. */
export interface TextStyle {
  capMm: number;
  bold?: boolean;
  align?: 'start' | 'centre' | 'end';
  /** Counter-clockwise, degrees, as seen on the page. */
  rotationDeg?: number;
  color?: string;
}

/** Font size (pt) whose capitals are `capMm` high. */
export const fontSizeForCap = (capMm: number): number => pt(capMm) / CAP_HEIGHT;

/**
 * pdfkit's one-line text set without its line wrapper: `text()` with `lineBreak: false` still measures
 * the string again after setting it, and the tiled PDF sets tens of thousands of short strings. The
 * internal `_fragment` (pdfkit 0.20) sets a line at (x, y) as given; `text()` is the fallback.
 */
type FragmentDoc = Doc & { _fragment?: (text: string, x: number, y: number, options: object) => void };

// Widths of strings already measured, per document, font and size: the same words go on every sheet.
const widths = new WeakMap<Doc, Map<string, number>>();

function widthPt(doc: Doc, s: string, font: string, size: number): number {
  let m = widths.get(doc);
  if (!m) widths.set(doc, (m = new Map()));
  const key = `${font}|${size}|${s}`;
  let w = m.get(key);
  if (w === undefined) {
    doc.font(font).fontSize(size);
    w = doc.widthOfString(s);
    m.set(key, w);
  }
  return w;
}

/** Width (mm) of `text` set at a capital height of `capMm`. */
export function textWidthMm(doc: Doc, text: string, capMm: number, bold = false): number {
  return widthPt(doc, winAnsi(text), bold ? FONT_BOLD : FONT, fontSizeForCap(capMm)) / PT_PER_MM;
}

function setLine(doc: Doc, s: string, xPt: number, yPt: number): void {
  const d = doc as FragmentDoc;
  if (typeof d._fragment === 'function') d._fragment(s, xPt, yPt, { baseline: 'alphabetic' });
  else doc.text(s, xPt, yPt, { lineBreak: false, baseline: 'alphabetic' });
}

/** Sets `text` with its baseline through (xMm, yMm) on the page (mm from the top-left corner). */
export function textAt(doc: Doc, text: string, xMm: number, yMm: number, style: TextStyle): void {
  const s = winAnsi(text);
  if (!s) return;
  const font = style.bold ? FONT_BOLD : FONT;
  const size = fontSizeForCap(style.capMm);
  const dx = style.align === 'centre' ? -widthPt(doc, s, font, size) / 2 : style.align === 'end' ? -widthPt(doc, s, font, size) : 0;
  doc.font(font).fontSize(size).fillColor(style.color ?? 'black');
  const rot = style.rotationDeg ?? 0;
  if (rot === 0) {
    setLine(doc, s, pt(xMm) + dx, pt(yMm));
    return;
  }
  doc.save();
  doc.translate(pt(xMm), pt(yMm));
  // pdfkit turns clockwise on the page (its y runs down): a counter-clockwise label turns by minus its angle.
  doc.rotate(-rot);
  setLine(doc, s, dx, 0);
  doc.restore();
}

/** Lines of `text` broken between words to fit `widthMm` (greedy, as a person would set it). */
export function wrapLines(doc: Doc, text: string, widthMm: number, capMm: number, bold = false): string[] {
  const font = bold ? FONT_BOLD : FONT;
  const size = fontSizeForCap(capMm);
  const room = pt(widthMm);
  const space = widthPt(doc, ' ', font, size);
  const lines: string[] = [];
  let line = '';
  let w = 0;
  for (const word of winAnsi(text).split(/ +/).filter(Boolean)) {
    const ww = widthPt(doc, word, font, size);
    if (line && w + space + ww > room) {
      lines.push(line);
      line = word;
      w = ww;
    } else {
      line = line ? `${line} ${word}` : word;
      w = line === word ? ww : w + space + ww;
    }
  }
  if (line) lines.push(line);
  return lines;
}

/** Line pitch (mm) of paragraphs: 1.45 times the capital height over the cap-to-size ratio (about 1.04 em). */
export const paragraphPitchMm = (capMm: number): number => (capMm / CAP_HEIGHT) * 1.04;

/** Height (mm) `paragraph` would take. */
export function paragraphHeightMm(doc: Doc, text: string, widthMm: number, style: { capMm: number; bold?: boolean }): number {
  return wrapLines(doc, text, widthMm, style.capMm, style.bold).length * paragraphPitchMm(style.capMm);
}

/** Paragraph text in a box (mm), its first line's top at yMm; returns the height (mm) it took. */
export function paragraph(doc: Doc, text: string, xMm: number, yMm: number, widthMm: number, style: { capMm: number; bold?: boolean; color?: string }): number {
  const lines = wrapLines(doc, text, widthMm, style.capMm, style.bold);
  const pitch = paragraphPitchMm(style.capMm);
  lines.forEach((line, i) => textAt(doc, line, xMm, yMm + style.capMm * 1.15 + i * pitch, { capMm: style.capMm, bold: style.bold, color: style.color }));
  return lines.length * pitch;
}
