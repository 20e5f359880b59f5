/**
 * Reading back what the PDF writers made, with outside tools: pdfjs-dist (pages, sizes, text) and
 * poppler's pdftoppm (the page rendered to an image, measured in pixels).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs';

/**
 * Installs poppler-utils when pdftoppm is missing (Debian's package; the tests run as root). On a new
 * machine the package lists may be missing, so `apt-get update` is run once when the first try fails.
 */
export function ensurePdftoppm(): void {
  if (spawnSync('which', ['pdftoppm']).status === 0) return;
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const install = () => spawnSync('apt-get', ['install', '-y', '-qq', 'poppler-utils'], { stdio: 'ignore', env }).status === 0;
  if (install()) return;
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'ignore', env });
  if (!install()) throw new Error('pdftoppm is missing and poppler-utils could not be installed');
}

/** A page read back by pdfjs: its size (pt, from page.view) and its text items. */
export interface PdfPageRead {
  widthPt: number;
  heightPt: number;
  texts: { str: string; heightPt: number }[];
}

/** Every page of the PDF, read with pdfjs-dist. */
export async function pdfRead(buf: Buffer): Promise<PdfPageRead[]> {
  const doc = await pdfjs.getDocument({ data: new Uint8Array(buf), useSystemFonts: false, isEvalSupported: false, verbosity: 0 }).promise;
  const pages: PdfPageRead[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const page = await doc.getPage(i);
    const [x0, y0, x1, y1] = page.view as number[];
    const content = await page.getTextContent();
    const texts = content.items.filter((it): it is { str: string; transform: number[]; height: number } & typeof it => 'str' in it).map((it) => ({ str: it.str, heightPt: Math.hypot(it.transform[2]!, it.transform[3]!) }));
    pages.push({ widthPt: x1! - x0!, heightPt: y1! - y0!, texts });
  }
  await doc.destroy();
  return pages;
}

/** A text item read back by pdfjs with its font: the font's name in the file and whether the file carries the font itself. */
export interface PdfTextFont {
  str: string;
  fontName: string;
  embedded: boolean;
}

/** Every text item of every page with its font, as pdfjs-dist loads it to draw the page. */
export async function pdfTextFonts(buf: Buffer): Promise<PdfTextFont[]> {
  const doc = await pdfjs.getDocument({ data: new Uint8Array(buf), useSystemFonts: false, isEvalSupported: false, verbosity: 0, fontExtraProperties: true }).promise;
  const out: PdfTextFont[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const page = await doc.getPage(i);
    const content = await page.getTextContent();
    // The fonts are loaded into the page's objects as it is drawn.
    await page.getOperatorList();
    for (const it of content.items) {
      if (!('str' in it)) continue;
      const font = page.commonObjs.get(it.fontName) as { name?: string; missingFile?: boolean };
      out.push({ str: it.str, fontName: font.name ?? '', embedded: font.missingFile === false });
    }
  }
  await doc.destroy();
  return out;
}

/** The Info dictionary's Title and Subject as pdfjs-dist reads them. */
export async function pdfInfo(buf: Buffer): Promise<{ title: string; subject: string }> {
  const doc = await pdfjs.getDocument({ data: new Uint8Array(buf), useSystemFonts: false, isEvalSupported: false, verbosity: 0 }).promise;
  const info = (await doc.getMetadata()).info as { Title?: string; Subject?: string };
  await doc.destroy();
  return { title: info.Title ?? '', subject: info.Subject ?? '' };
}

/** An RGB image as rendered. */
export interface Rgb {
  width: number;
  height: number;
  data: Buffer;
}

/** Parses a binary PPM (P6, maxval 255). */
export function ppmRead(buf: Buffer): Rgb {
  let pos = 0;
  const token = (): string => {
    while (/\s/.test(String.fromCharCode(buf[pos]!))) pos++;
    if (buf[pos] === 0x23) {
      while (buf[pos] !== 0x0a) pos++;
      return token();
    }
    let s = '';
    while (!/\s/.test(String.fromCharCode(buf[pos]!))) s += String.fromCharCode(buf[pos++]!);
    return s;
  };
  if (token() !== 'P6') throw new Error('not a P6 PPM');
  const width = Number(token());
  const height = Number(token());
  if (Number(token()) !== 255) throw new Error('PPM maxval is not 255');
  pos++;
  return { width, height, data: buf.subarray(pos, pos + width * height * 3) };
}

/**
 * Renders pages of a PDF with poppler's pdftoppm at `dpi`, without anti-aliasing (so colours stay pure),
 * optionally cropped to a box in pixels. Returns one image per page, in page order.
 */
export function pdfRender(buf: Buffer, dpi: number, opts: { first?: number; last?: number; crop?: { x: number; y: number; w: number; h: number } } = {}): Rgb[] {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'loftbench-render-'));
  try {
    const file = path.join(dir, 'in.pdf');
    writeFileSync(file, buf);
    const args = ['-r', String(dpi), '-aa', 'no', '-aaVector', 'no'];
    if (opts.first) args.push('-f', String(opts.first));
    if (opts.last) args.push('-l', String(opts.last));
    if (opts.crop) args.push('-x', String(opts.crop.x), '-y', String(opts.crop.y), '-W', String(opts.crop.w), '-H', String(opts.crop.h));
    execFileSync('pdftoppm', [...args, file, path.join(dir, 'p')]);
    return readdirSync(dir)
      .filter((f) => f.endsWith('.ppm'))
      .sort()
      .map((f) => ppmRead(readFileSync(path.join(dir, f))));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Bounding box (px) of the pixels for which `match(r, g, b)` holds, or null. */
export function pixelBox(img: Rgb, match: (r: number, g: number, b: number) => boolean): { x0: number; y0: number; x1: number; y1: number } | null {
  let x0 = Infinity;
  let y0 = Infinity;
  let x1 = -Infinity;
  let y1 = -Infinity;
  const d = img.data;
  for (let y = 0; y < img.height; y++) {
    for (let x = 0; x < img.width; x++) {
      const i = (y * img.width + x) * 3;
      if (match(d[i]!, d[i + 1]!, d[i + 2]!)) {
        if (x < x0) x0 = x;
        if (x > x1) x1 = x;
        if (y < y0) y0 = y;
        if (y > y1) y1 = y;
      }
    }
  }
  return Number.isFinite(x0) ? { x0, y0, x1, y1 } : null;
}

/** The check squares' colours as rendered (pdf-sheet-marks: #1f5fbf blue, #1e8c3c green), with slack. */
export const isSquareBlue = (r: number, g: number, b: number): boolean => Math.abs(r - 0x1f) < 24 && Math.abs(g - 0x5f) < 24 && Math.abs(b - 0xbf) < 24;
export const isSquareGreen = (r: number, g: number, b: number): boolean => Math.abs(r - 0x1e) < 24 && Math.abs(g - 0x8c) < 24 && Math.abs(b - 0x3c) < 24;
/** Black ink (the drawing). */
export const isBlack = (r: number, g: number, b: number): boolean => r < 80 && g < 80 && b < 80;

/** Count of matching pixels in each column (x) over rows y0..y1, or in each row over columns. */
export function profile(img: Rgb, axis: 'columns' | 'rows', match: (r: number, g: number, b: number) => boolean): Int32Array {
  const out = new Int32Array(axis === 'columns' ? img.width : img.height);
  for (let y = 0; y < img.height; y++) {
    for (let x = 0; x < img.width; x++) {
      const i = (y * img.width + x) * 3;
      if (match(img.data[i]!, img.data[i + 1]!, img.data[i + 2]!)) out[axis === 'columns' ? x : y]!++;
    }
  }
  return out;
}

/** Centre (px, sub-pixel) of the strongest run of the profile within [from, to]: a line's middle. */
export function peakCentre(p: Int32Array, from: number, to: number, minCount: number): number | null {
  let best = -1;
  let bestAt = -1;
  for (let i = Math.max(0, from); i <= Math.min(p.length - 1, to); i++) if (p[i]! > best) {
    best = p[i]!;
    bestAt = i;
  }
  if (best < minCount) return null;
  // The run of columns round the peak that carry at least half of it: the line's width.
  let a = bestAt;
  let b = bestAt;
  while (a > 0 && p[a - 1]! >= best / 2) a--;
  while (b < p.length - 1 && p[b + 1]! >= best / 2) b++;
  let sum = 0;
  let w = 0;
  for (let i = a; i <= b; i++) {
    sum += i * p[i]!;
    w += p[i]!;
  }
  return sum / w;
}
