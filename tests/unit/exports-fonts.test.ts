import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { bevelTablePdf } from '../../server/exports/bevel-table';
import { cutListPdf } from '../../server/exports/cut-list';
import { CAP_HEIGHT, FONT, FONT_BOLD, FONT_FILES, pdfBuffer, pdfDocument, pdfPage, textAt } from '../../server/exports/pdf-common';
import { rollPdf } from '../../server/exports/roll-pdf';
import { tiledPdf } from '../../server/exports/tiled-pdf';
import { bevelRowsOf } from '../../shared/geometry/drawing';
import { PAPER_A4 } from '../../shared/geometry/tiling';
import { cutListPiecesFixture, ringFrameDrawing } from './exports-fixtures';
import { pdfInfo, pdfRead, pdfTextFonts } from './exports-render';

/**
 * The tables of a TrueType / OpenType file, read here apart from pdfkit and fontkit (OpenType
 * specification, "Font file": a 12-byte header, then a 16-byte record a table: tag, checksum, offset, length).
 */
function sfntTables(file: Buffer): Map<string, Buffer> {
  const tables = new Map<string, Buffer>();
  const count = file.readUInt16BE(4);
  for (let i = 0; i < count; i++) {
    const at = 12 + i * 16;
    const offset = file.readUInt32BE(at + 8);
    tables.set(file.toString('latin1', at, at + 4), file.subarray(offset, offset + file.readUInt32BE(at + 12)));
  }
  return tables;
}

/** The PostScript name: name ID 6 of the 'name' table, from its Windows record (platform 3, UTF-16BE). */
function postScriptName(file: Buffer): string {
  const name = sfntTables(file).get('name')!;
  const strings = name.readUInt16BE(4);
  for (let i = 0; i < name.readUInt16BE(2); i++) {
    const at = 6 + i * 12;
    if (name.readUInt16BE(at) !== 3 || name.readUInt16BE(at + 6) !== 6) continue;
    const bytes = Buffer.from(name.subarray(strings + name.readUInt16BE(at + 10), strings + name.readUInt16BE(at + 10) + name.readUInt16BE(at + 8)));
    return bytes.swap16().toString('utf16le');
  }
  throw new Error('no PostScript name');
}

/** sCapHeight of 'OS/2' (at byte 88, version 2 and later) over unitsPerEm of 'head' (at byte 18). */
function capHeightOfEm(file: Buffer): number {
  const t = sfntTables(file);
  return t.get('OS/2')!.readInt16BE(88) / t.get('head')!.readUInt16BE(18);
}

const REPO = path.resolve(import.meta.dirname, '..', '..');
const files = [FONT, FONT_BOLD].map((f) => readFileSync(FONT_FILES[f]!));
const psNames = files.map(postScriptName);

// Names a builder might type: Polish, Czech, Russian, and a sign outside WinAnsi.
const HULL = 'Žebro i Шпангоут ≥ 5,8 m';
const PART = 'Wręga 3';
const STATION = 'Шп 3';

/** A page's text, each run of white space as one space (paragraphs break where the font's widths say). */
const textOf = async (buf: Buffer): Promise<string> => (await pdfRead(buf)).flatMap((p) => p.texts.map((t) => t.str)).join(' ').replace(/\s+/g, ' ');

/** Every text item's font is one of the shipped files, embedded, named by its PostScript name after the subset tag. */
async function expectShippedFonts(buf: Buffer): Promise<void> {
  const items = (await pdfTextFonts(buf)).filter((t) => t.str.trim());
  expect(items.length).toBeGreaterThan(0);
  for (const t of items) {
    expect(t.embedded, t.str).toBe(true);
    // ISO 32000-1, 9.6.4: a subset font's name is six capitals, '+', then the font's PostScript name.
    expect(psNames).toContain(t.fontName.replace(/^[A-Z]{6}\+/, ''));
  }
}

describe('the fonts shipped in fonts/', () => {
  it('are the files of pdfjs-dist copied unchanged, with their licence', () => {
    for (const f of ['LiberationSans-Regular.ttf', 'LiberationSans-Bold.ttf']) {
      expect(readFileSync(path.join(REPO, 'fonts', f)).equals(readFileSync(path.join(REPO, 'node_modules/pdfjs-dist/standard_fonts', f)))).toBe(true);
    }
    expect(readFileSync(path.join(REPO, 'fonts/LICENSE-Liberation.txt'), 'utf8')).toContain('SIL OPEN FONT LICENSE Version 1.1');
    expect(psNames).toEqual(['LiberationSans', 'LiberationSans-Bold']);
  });

  it('have the capital height the text sizes are worked out from', () => {
    for (const f of files) expect(capHeightOfEm(f)).toBe(CAP_HEIGHT);
  });
});

describe('names outside WinAnsi read back with pdfjs-dist', { timeout: 120000 }, () => {
  const drawing = () => ringFrameDrawing({ halfBreadthMm: 300, depthMm: 250, title: { hullName: HULL, partName: PART, stationName: STATION } });

  it('prints them as typed on the tiled PDF, in the embedded font, and keeps them in the Title', async () => {
    const buf = await tiledPdf(drawing(), { paper: PAPER_A4, orientation: 'portrait' });
    const text = await textOf(buf);
    for (const s of [HULL, `${PART} (ring frame), station ${STATION}`]) expect(text).toContain(s);
    expect(text).not.toContain('?');
    await expectShippedFonts(buf);
    expect((await pdfInfo(buf)).title).toBe(`${HULL}: ${PART}, layer 1 of 2 (full size, tiled)`);
  });

  it('prints them on the roll PDF', async () => {
    const buf = await rollPdf(drawing(), { rollWidthMm: 914 });
    const text = await textOf(buf);
    for (const s of [HULL, `${PART} (ring frame), station ${STATION}`]) expect(text).toContain(s);
    await expectShippedFonts(buf);
  });

  it('prints them in the bevel table', async () => {
    const buf = await bevelTablePdf(bevelRowsOf(drawing()), { hullName: HULL, revisionId: 'r12', date: '2025-03-02', units: 'mm' });
    const text = await textOf(buf);
    for (const s of [HULL, `${PART}, station ${STATION}, layer 1`]) expect(text).toContain(s);
    await expectShippedFonts(buf);
    expect((await pdfInfo(buf)).title).toBe(`${HULL}: bevel table`);
  });

  it('prints them in the cut list', async () => {
    const pieces = cutListPiecesFixture().map((p, i) => (i === 0 ? { ...p, partName: 'Žebro 2 ≥ 45°' } : p));
    const buf = await cutListPdf(pieces, { hullName: HULL, revisionId: 'r12', date: '2025-03-02', units: 'mm', totals: { filletVolumeMl: 2350, glassTapeM: 41.5 } });
    const text = await textOf(buf);
    for (const s of [HULL, 'Žebro 2 ≥ 45°']) expect(text).toContain(s);
    await expectShippedFonts(buf);
  });
});

describe('text the font cannot show', { timeout: 120000 }, () => {
  async function oneLine(text: string): Promise<{ shown: string; title: string }> {
    const doc = pdfDocument({ title: text, subject: 'test', date: '2025-03-02' });
    pdfPage(doc, 400, 50);
    textAt(doc, text, 10, 20, { capMm: 3 });
    const buf = await pdfBuffer(doc);
    return { shown: (await pdfRead(buf))[0]!.texts.map((t) => t.str).join(''), title: (await pdfInfo(buf)).title };
  }

  it("still writes the PDF, with '?' for each character the font has no glyph for, and the Title as typed", async () => {
    // U+1F6A4 (speedboat) and U+8239 (Chinese 'boat') are not in Liberation Sans 1.07.
    const r = await oneLine('Frame 🚤 3 船');
    expect(r.shown).toBe('Frame ? 3 ?');
    expect(r.title).toBe('Frame 🚤 3 船');
  });

  it('composes a letter typed with a separate accent, drops invisible joiners, and sets line breaks as spaces', async () => {
    // Unicode Standard Annex 15: e + U+0328 (combining ogonek) composes to U+0119; U+200D is a zero-width joiner.
    const r = await oneLine('Wre\u0328ga\u200d 3\nport');
    expect(r.shown).toBe('Wręga 3 port');
    expect(r.title).toBe('Wręga\u200d 3 port');
  });

  it('shows every printable ASCII character as typed', async () => {
    const ascii = Array.from({ length: 0x7f - 0x21 }, (_, i) => String.fromCharCode(0x21 + i)).join('');
    expect((await oneLine(ascii)).shown).toBe(ascii);
  });

  it('reads back a letter as typed after another document drew it only inside an accented one', async () => {
    // Liberation Sans draws Ž as Z and a caron: the first file embeds Z for Ž's sake alone.
    expect((await oneLine('Ž')).shown).toBe('Ž');
    expect((await oneLine('Z Ž')).shown).toBe('Z Ž');
  });
});
