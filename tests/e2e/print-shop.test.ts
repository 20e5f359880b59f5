import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { demoAccounts, demoHull } from '../../server/seed/demo-accounts';
import { sheetViewScale } from '../../src/features/exports/components/sheet-view-scale';
import { outputDir, signInThroughForm, startRig, type BrowserRig } from './support';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startRig();
});
afterAll(() => rig?.close());

const builder = demoAccounts[0];

async function openDemoHull(page: Page, tab: string) {
  await signInThroughForm(page, builder.email, builder.password);
  await page.getByRole('link', { name: demoHull.name }).first().click();
  await page.getByRole('heading', { name: demoHull.name, level: 1 }).waitFor();
  await page.getByRole('navigation', { name: 'Parts of this hull' }).getByRole('link', { name: tab }).click();
}

/** The selected piece's place as the sheet view says it: sheet, mm across, mm along. */
async function placeOf(page: Page): Promise<string> {
  return page.getByText(/: sheet \d+, box corner at/).innerText();
}

describe('Print shop in the browser', () => {
  it('a builder chooses A4 landscape, sees the grid and the page count, downloads a PDF with that many pages, and moves a piece on a sheet', async () => {
    const { page, consoleErrors } = await rig.newPage({ width: 1400, height: 1000 });
    await openDemoHull(page, 'Print shop');
    await page.getByRole('heading', { name: 'Print shop', level: 2 }).waitFor();
    await page.getByText('Check the calibration square before cutting').waitFor();

    await page.getByRole('radio', { name: /^Bulkhead 5/ }).check();
    await page.getByLabel('Paper', { exact: true }).selectOption('a4');
    await page.getByRole('radio', { name: 'Landscape' }).check();
    const count = page.getByRole('status', { name: 'Pages in the PDF' }).or(page.locator('output[aria-label="Pages in the PDF"]'));
    await count.first().waitFor();
    const shown = Number(await count.first().innerText());
    expect(shown).toBeGreaterThan(1);
    const grid = page.getByRole('img', { name: /^Tile grid over Bulkhead 5/ });
    await grid.locator('canvas').first().waitFor();
    await rig.screenshot(page, 'print-shop-01-a4-landscape');
    await grid.screenshot({ path: path.join(outputDir, 'print-shop-01b-grid-close.png') });

    const downloading = page.waitForEvent('download', { timeout: 60000 });
    await page.getByRole('button', { name: `Tiled PDF, ${shown} pages` }).click();
    const download = await downloading;
    expect(download.suggestedFilename()).toMatch(/bulkhead-5-layer-1-a4-landscape-tiles-r\d+\.pdf$/);
    const file = await download.path();
    // Read back with pdfjs-dist: the file has exactly the pages the screen said.
    const pdf = await getDocument({ data: new Uint8Array(await readFile(file)), verbosity: 0 }).promise;
    expect(pdf.numPages).toBe(shown);
    await page.getByText(/^Made .*a4-landscape-tiles-r\d+\.pdf/).waitFor();

    // The sheet view: pick a piece, try moves until one keeps the rules; one past the sheet's edge is refused.
    const sheets = page.getByRole('region', { name: 'Cut list: pieces on plywood sheets' }).or(page.locator('section[aria-labelledby="cut-list-heading"]'));
    await sheets.first().scrollIntoViewIfNeeded();
    await page.getByLabel('Piece', { exact: true }).selectOption('Transom / layer 1 / piece 1');
    const before = await placeOf(page);
    await page.getByLabel('Step', { exact: true }).selectOption('10');
    let moved = false;
    for (const name of ['Move up the sheet 10 mm', 'Move right 10 mm', 'Move down the sheet 10 mm', 'Move left 10 mm']) {
      await page.getByRole('button', { name }).click();
      if (await page.getByText('Moved, not saved yet').isVisible()) {
        moved = true;
        break;
      }
    }
    expect(moved).toBe(true);
    const after = await placeOf(page);
    expect(after).not.toBe(before);
    // Drag it with the mouse, a piece's height up its sheet: found on the canvas by the view's own scale.
    const stage = page.getByRole('img', { name: /^Plywood sheets/ }).locator('canvas').first();
    await stage.scrollIntoViewIfNeeded();
    const box = (await stage.boundingBox())!;
    const hullPath = new URL(page.url()).pathname.replace(/\/print-shop$/, '');
    const now = await page.evaluate(async (p) => (await fetch(`/api${p}/cut-list/arrangement`)).json(), hullPath);
    const transom = now.pieces.find((p: { id: string }) => p.id === 'Transom / layer 1 / piece 1');
    const [, acrossText, alongText] = /at (-?\d+) mm across, (-?\d+) mm along/.exec(after)!;
    const v = sheetViewScale(now.layout, box.width);
    const sheetIndex = now.layout.sheets.findIndex((s: { plyThicknessMm: number }) => s.plyThicknessMm === transom.plyThicknessMm);
    // Turned: across it is the drawing's height, along it the width (sheetPieceSize).
    const centre = v.at(sheetIndex, Number(acrossText) + transom.heightMm / 2, Number(alongText) + transom.widthMm / 2);
    await page.mouse.move(box.x + centre.px, box.y + centre.py);
    await page.mouse.down();
    for (let i = 1; i <= 10; i += 1) await page.mouse.move(box.x + centre.px, box.y + centre.py - 6 * i);
    await page.mouse.up();
    const dragged = await placeOf(page);
    const draggedAlong = Number(/(-?\d+) mm along/.exec(dragged)![1]);
    // 60 px up the screen is 60 / k mm along the sheet (to the whole millimetre the view rounds to).
    expect(Math.abs(draggedAlong - (Number(alongText) + 60 / v.k))).toBeLessThanOrEqual(1);
    await page.getByLabel('Step', { exact: true }).selectOption('100');
    for (let i = 0; i < 30 && !(await page.getByText('That move is refused').isVisible()); i += 1) await page.getByRole('button', { name: 'Move right 100 mm' }).click();
    await page.getByText('That move is refused').waitFor();
    await rig.screenshot(page, 'print-shop-02-sheet-refused');
    await page.getByRole('img', { name: /^Plywood sheets/ }).screenshot({ path: path.join(outputDir, 'print-shop-02b-sheets-close.png') });

    // Start a new sheet for it: one more sheet, the piece in its corner inside the edge margin.
    const sheetsLabel = async () => (await page.getByRole('img', { name: /^Plywood sheets/ }).getAttribute('aria-label'))!;
    const sheetCount = async () => Number(/(\d+) sheets/.exec(await sheetsLabel())![1]);
    const countBefore = await sheetCount();
    await page.getByLabel('Sheet', { exact: true }).selectOption('new');
    expect(await sheetCount()).toBe(countBefore + 1);
    const margin = now.layout.edgeMarginMm;
    expect(await placeOf(page)).toContain(`sheet ${countBefore + 1}, box corner at ${margin} mm across, ${margin} mm along`);
    const kept = (await placeOf(page)).replace(/sheet \d+, /, '');

    await page.getByRole('button', { name: 'Save the arrangement' }).click();
    await page.getByText('Arrangement saved: the cut list PDF and CSV use it.').waitFor();
    await page.reload();
    await page.getByText(/Arranged by hand, saved/).waitFor();
    await page.getByLabel('Piece', { exact: true }).selectOption('Transom / layer 1 / piece 1');
    // Saved sheets are renumbered (thinnest ply first), so the place is compared without its sheet number;
    // the piece is alone on its sheet.
    expect((await placeOf(page)).replace(/sheet \d+, /, '')).toBe(kept);
    const saved = await page.evaluate(async (p) => (await fetch(`/api${p}/cut-list/arrangement`)).json(), hullPath);
    const own = saved.layout.placements.find((pl: { pieceId: string }) => pl.pieceId === 'Transom / layer 1 / piece 1');
    expect(saved.layout.placements.filter((pl: { sheetNo: number }) => pl.sheetNo === own.sheetNo)).toHaveLength(1);
    await page.getByRole('button', { name: 'Go back to the automatic arrangement' }).scrollIntoViewIfNeeded();
    await rig.screenshot(page, 'print-shop-03-saved');
    // Leave the demo hull as it was for the other browser tests.
    await page.getByRole('button', { name: 'Go back to the automatic arrangement' }).click();
    await page.getByText('Arranged automatically by the packer.', { exact: false }).waitFor();
    expect(consoleErrors).toEqual([]);
  });

  it('lists the downloads with their sizes and revision', async () => {
    const { page } = await rig.newPage({ width: 1400, height: 1000 });
    await openDemoHull(page, 'Downloads');
    const table = page.getByRole('table', { name: 'Exports of this hull' });
    await table.waitFor({ timeout: 60000 });
    expect(await table.getByRole('row').count()).toBeGreaterThan(10);
    await rig.screenshot(page, 'downloads-01');
  });

  it('fits a workshop tablet', async () => {
    const { page, consoleErrors } = await rig.newPage({ width: 820, height: 1180 });
    await openDemoHull(page, 'Print shop');
    await page.locator('output[aria-label="Pages in the PDF"]').waitFor();
    await page.getByRole('img', { name: /^Plywood sheets/ }).locator('canvas').first().waitFor();
    // Nothing wider than the screen but the sheet view, which scrolls inside its own box.
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await rig.screenshot(page, 'print-shop-04-tablet');
    expect(consoleErrors).toEqual([]);
  });
});
