import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import PDFDocument from 'pdfkit';

/**
 * What every PDF writer shares: millimetres to points, the document set-up, text on a baseline, and the
 * Buffer at the end. Millimetres everywhere else; points only here and in the PDF writers' last step.
 */

/** Points per millimetre: 1 pt = 1/72 in (ISO 32000-1, 8.3.2) and 1 in = 25.4 mm exactly (NIST SP 811). */
export const PT_PER_MM = 72 / 25.4;
/** Millimetres to points. */
export const pt = (lengthMm: number): number => lengthMm * PT_PER_MM;

/**
 * The fonts, embedded in every PDF (pdfkit writes only the glyphs a file uses): Liberation Sans, shipped in
 * the repository's fonts/ folder (see fonts/README.md), so names in Polish, Czech, Cyrillic and so on print
 * as typed. Its widths match Helvetica's, the standard font it replaces. The folder is found from this
 * file, as scripts/lib/setup.mjs finds the root, so it is the same from a clone, `npm start` and the tests
 * whatever the working directory.
 */
export const FONT = 'Liberation Sans';
export const FONT_BOLD = 'Liberation Sans Bold';
const FONTS_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..', 'fonts');
export const FONT_FILES: Readonly<Record<string, string>> = {
  [FONT]: path.join(FONTS_DIR, 'LiberationSans-Regular.ttf'),
  [FONT_BOLD]: path.join(FONTS_DIR, 'LiberationSans-Bold.ttf'),
};
// Read once, when the server starts (a missing file stops it there, not on a builder's export); each
// document is given the bytes, so no export reads the disk again.
const fontBytes = Object.entries(FONT_FILES).map(([name, file]) => [name, readFileSync(file)] as const);

/**
 * Liberation Sans's capital height as a fraction of its size: OS/2 sCapHeight 1409 over head unitsPerEm
 * 2048, the same in Regular and Bold (the files in fonts/; the outlines of H, E and I top out at 1409 too).
 * Helvetica's is 0.718, so a capital height in millimetres now asks for a size about 4 % larger.
 */
export const CAP_HEIGHT = 1409 / 2048;

export type Doc = PDFKit.PDFDocument;

/** A new document with no page yet, no margins, its information set, and a fixed creation date for repeatable files. */
export function pdfDocument(info: { title: string; subject: string; date: string }): Doc {
  const created = /^\d{4}-\d{2}-\d{2}/.test(info.date) ? new Date(`${info.date.slice(0, 10)}T00:00:00Z`) : new Date(0);
  const doc = new PDFDocument({
    autoFirstPage: false,
    margin: 0,
    compress: true,
    info: { Title: infoText(info.title), Subject: infoText(info.subject), Creator: 'Loftbench', Producer: 'Loftbench (pdfkit)', CreationDate: created, ModDate: created },
  });
  for (const [name, bytes] of fontBytes) useFont(doc, name, bytes);
  return doc;
}

/**
 * The Info dictionary's Title and Subject are PDF text strings, which pdfkit writes as UTF-16BE when they
 * are not ASCII: every character is kept (a reader shows them with its own fonts), on one line.
 */
function infoText(text: string): string {
  return text.normalize('NFC').replace(/[\p{Cc}\u2028\u2029]/gu, ' ');
}

/**
 * pdfkit's font in use (pdfkit 0.20 internals): its `encode`, its layout of one word (`layoutRun`, and
 * `layoutCached`, which keeps it), and for an embedded font the fontkit font parsed from the file.
 */
type FontkitFont = {
  layout?: unknown;
  hasGlyphForCodePoint?: (codePoint: number) => boolean;
  characterSet?: readonly number[];
  glyphForCodePoint?: (codePoint: number) => unknown;
};
type PdfkitFont = {
  encode?: (text: string, features?: unknown) => unknown;
  layoutRun?: (text: string) => unknown;
  layoutCached?: (text: string) => unknown;
  font?: FontkitFont;
};
type FontDoc = Doc & { _font?: PdfkitFont };

/**
 * Each font file parsed once for the whole server, not once per document: pdfkit 0.20 takes a parsed
 * fontkit font in `registerFont`, and the one it parsed for the first document is kept. With it, the
 * layout of each word (glyphs and kerning, the slow part of setting text in an embedded font), which
 * depends on the font alone: the cautions, check words and numbers are the same in every export. Started
 * afresh past WORD_LAYOUTS words, so that a server running for months does not grow without end.
 */
const parsedFonts = new Map<string, { font: FontkitFont; words: Map<string, unknown> }>();
const WORD_LAYOUTS = 20000;

function useFont(doc: Doc, name: string, bytes: Buffer): void {
  const known = parsedFonts.get(name);
  // @types/pdfkit lists paths and bytes only; pdfkit 0.20 also takes the parsed font (its changelog).
  doc.registerFont(name, (known?.font ?? bytes) as Buffer);
  doc.font(name);
  const f = (doc as FontDoc)._font;
  if (!f) return;
  const shared = known ?? (f.font && typeof f.font.layout === 'function' ? { font: f.font, words: new Map<string, unknown>() } : undefined);
  if (shared && !known) {
    parsedFonts.set(name, shared);
    // fontkit keeps each glyph with the characters it was first asked for, and pdfkit writes those as the
    // text a reader copies out. A glyph first met as part of another (Z inside Ž, when a file is embedded)
    // would keep none, in every later document: so every glyph is asked for by its character first.
    for (const codePoint of shared.font.characterSet ?? []) shared.font.glyphForCodePoint?.(codePoint);
  }
  if (shared && typeof f.layoutRun === 'function' && typeof f.layoutCached === 'function') {
    const layoutRun = f.layoutRun.bind(f);
    const words = shared.words;
    f.layoutCached = (text: string) => {
      let r = words.get(text);
      if (r === undefined) {
        if (words.size >= WORD_LAYOUTS) words.clear();
        words.set(text, (r = layoutRun(text)));
      }
      return r;
    };
  }
  memoiseEncoding(f);
}

/**
 * The same strings go on every sheet (title, check words, neighbours' names): pdfkit joins the words'
 * glyphs and marks them in the document's subset afresh for each, so each font's `encode` (pdfkit 0.20
 * internals) keeps what it has worked out, per document. Its result is only read by pdfkit, and its one
 * side effect, marking the glyphs for the subset, is done the first time. Left as it is when absent.
 */
function memoiseEncoding(f: PdfkitFont): void {
  if (typeof f.encode !== 'function') return;
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

// Printable ASCII, which Liberation Sans has in full: most strings on a sheet, passed through unchecked.
const PLAIN = /^[\x20-\x7e]*$/;
const LINE_BREAK = /[\t\n\v\f\r\u0085\u2028\u2029]/u;
const CONTROL = /\p{Cc}/u;
// Invisible by definition (joiners, variation selectors, soft hyphens...): nothing to draw.
const INVISIBLE = /\p{Default_Ignorable_Code_Point}/u;

/**
 * `text` as `fontName` can show it, on one line: composed (NFC, so a letter typed as a base and an accent
 * gets the font's accented glyph), line breaks and tabs as spaces, invisible characters dropped, and a
 * character the font has no glyph for (an emoji, Chinese) as '?', one per character: the builder sees that
 * something is missing there rather than an empty box or nothing, and the file's Title keeps the name as
 * typed. Makes `fontName` the document's current font when it has to look.
 */
function shown(doc: Doc, text: string, fontName: string): string {
  if (PLAIN.test(text)) return text;
  doc.font(fontName);
  const font = (doc as FontDoc)._font?.font;
  let out = '';
  for (const ch of text.normalize('NFC')) {
    if (LINE_BREAK.test(ch)) out += ' ';
    else if (CONTROL.test(ch)) out += '?';
    else if (INVISIBLE.test(ch)) continue;
    // Without pdfkit's fontkit font (other pdfkit internals) the text goes as typed.
    else if (!font?.hasGlyphForCodePoint || font.hasGlyphForCodePoint(ch.codePointAt(0)!)) out += ch;
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
  const font = bold ? FONT_BOLD : FONT;
  return widthPt(doc, shown(doc, text, font), font, fontSizeForCap(capMm)) / PT_PER_MM;
}

function setLine(doc: Doc, s: string, xPt: number, yPt: number): void {
  const d = doc as FragmentDoc;
  if (typeof d._fragment === 'function') d._fragment(s, xPt, yPt, { baseline: 'alphabetic' });
  else doc.text(s, xPt, yPt, { lineBreak: false, baseline: 'alphabetic' });
}

/** Sets `text` with its baseline through (xMm, yMm) on the page (mm from the top-left corner). */
export function textAt(doc: Doc, text: string, xMm: number, yMm: number, style: TextStyle): void {
  const font = style.bold ? FONT_BOLD : FONT;
  const s = shown(doc, text, font);
  if (!s) return;
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
  for (const word of shown(doc, text, font).split(/ +/).filter(Boolean)) {
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
