import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { demoAccounts } from '../../server/seed/demo-accounts';
import { signInThroughForm, startRig, type BrowserRig } from './support';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startRig();
});
afterAll(() => rig?.close());

const builder = demoAccounts[0];

const cell = (page: Page, name: string) => page.getByRole('gridcell', { name, exact: true });
const cellValue = (page: Page, name: string) => cell(page, name).locator('[data-cell-value]').innerText();
const status = (page: Page) => page.getByTestId('save-status');

/** Paste tab-separated text into the focused cell, as a spreadsheet's Ctrl+V delivers it. */
async function pasteBlock(page: Page, text: string) {
  await page.evaluate((block) => {
    const data = new DataTransfer();
    data.setData('text/plain', block);
    document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }));
  }, text);
}

/** Console errors with where they came from; the frames screen's results route is not built yet and answers 404. */
function watchConsole(page: Page) {
  const errors: string[] = [];
  page.on('console', (msg) => {
    if (msg.type() !== 'error') return;
    const url = msg.location().url;
    if (/\/api\/hulls\/\d+\/parts$/.test(url) && /404/.test(msg.text())) return;
    errors.push(`${msg.text()} (${url})`);
  });
  page.on('pageerror', (err) => errors.push(String(err)));
  return errors;
}

describe('Lines in the browser', () => {
  it('a builder types and pastes offsets, sees a bad cell marked, closes the tab, finds the draft, saves a revision, and it is all there after a reload', async () => {
    const first = await rig.newPage();
    const errors = watchConsole(first.page);
    const page = first.page;
    await signInThroughForm(page, builder.email, builder.password);

    const name = `Lines test skiff ${Date.now()}`;
    await page.getByRole('link', { name: 'New hull' }).first().click();
    await page.getByLabel('Hull name').fill(name);
    await page.getByRole('button', { name: 'Create hull' }).click();
    await page.getByRole('heading', { name, level: 1 }).waitFor();
    const hullUrl = new URL(page.url()).pathname;
    await page.getByRole('navigation', { name: 'Parts of this hull' }).getByRole('link', { name: 'Lines' }).click();
    await page.getByText('The table is empty.').waitFor();
    await rig.screenshot(page, 'lines-01-empty');

    // Four stations 600 mm apart: the form offers the next name and position each time.
    for (let i = 0; i < 4; i += 1) {
      await page.getByRole('button', { name: 'Add station' }).click();
      await page.getByText(`St ${i}`, { exact: true }).first().waitFor();
    }
    const addLine = async (kind: string, fixed: string) => {
      const form = page.getByRole('heading', { name: 'Add a line' }).locator('..');
      await form.getByLabel('Kind of line').selectOption(kind);
      if (fixed) await form.getByLabel(/^Height of the waterline/).fill(fixed);
      await form.getByRole('button', { name: 'Add line' }).click();
    };
    await addLine('waterline', '300');
    await addLine('waterline', '150');
    await addLine('chine', '');
    await page.getByRole('grid', { name: 'Table of offsets' }).waitFor();

    // Typed, the way a person works down a table: Tab across, Enter down.
    await cell(page, 'WL 300 at St 0').click();
    await page.keyboard.type('210');
    await page.keyboard.press('Tab');
    await page.keyboard.type('455');
    await page.keyboard.press('Tab');
    await page.keyboard.type('512');
    await page.keyboard.press('Tab');
    await page.keyboard.type('530');
    await page.keyboard.press('Enter');
    expect(await cellValue(page, 'WL 300 at St 3')).toBe('530');

    // A block from a spreadsheet: the chine's heights and half-breadths, two rows by four stations.
    await cell(page, 'Chine height at St 0').click();
    await pasteBlock(page, '250\t200\t180\t176\r\n300\t520\t600\t640\r\n');
    expect(await cellValue(page, 'Chine height at St 2')).toBe('180');
    expect(await cellValue(page, 'Chine half-breadth at St 3')).toBe('640');
    await cell(page, 'WL 150 at St 0').click();
    await pasteBlock(page, '120\t330\t400\t415');
    expect(await cellValue(page, 'WL 150 at St 3')).toBe('415');

    // A misread figure stays as typed, marked, and out of the plan.
    await cell(page, 'WL 150 at St 2').click();
    await page.keyboard.type('4O0');
    await page.keyboard.press('Enter');
    const bad = cell(page, 'WL 150 at St 2');
    expect(await bad.getAttribute('aria-invalid')).toBe('true');
    await page.getByRole('heading', { name: 'One cell is not in the plan yet' }).waitFor();
    expect(await page.getByText('WL 150 at St 2: "4O0": this is not a length').innerText()).toContain('expected millimetres');
    await rig.screenshot(page, 'lines-02-typed-pasted-bad-cell');

    await status(page).getByText('Draft saved').waitFor({ timeout: 15_000 });
    await first.context.close();
    expect(errors).toEqual([]);

    // A new tab, later: the draft comes back.
    const second = await rig.newPage();
    const errors2 = watchConsole(second.page);
    const again = second.page;
    await signInThroughForm(again, builder.email, builder.password);
    await again.goto(`${hullUrl}/lines`);
    await again.getByText(/^Restored your unsaved changes from /).waitFor();
    expect(await cellValue(again, 'WL 300 at St 1')).toBe('455');
    expect(await cellValue(again, 'Chine half-breadth at St 3')).toBe('640');
    expect(await cellValue(again, 'WL 150 at St 3')).toBe('415');
    // The misread text lived only in the closed tab; the plan never held it.
    expect(await cellValue(again, 'WL 150 at St 2')).toBe('400');
    await rig.screenshot(again, 'lines-03-draft-restored');

    await again.getByRole('button', { name: 'Save revision' }).click();
    await again.getByLabel('What changed (optional)').fill('Offsets typed in from the table');
    await again.getByRole('button', { name: 'Save revision' }).click();
    await status(again).getByText(/^Revision \d+ saved$/).waitFor();
    const saved = await status(again).innerText();

    await again.reload();
    await again.getByRole('grid', { name: 'Table of offsets' }).waitFor();
    expect(await status(again).innerText()).toBe(saved);
    expect(await again.getByText(/^Restored your unsaved changes/).count()).toBe(0);
    expect(await cellValue(again, 'WL 300 at St 2')).toBe('512');
    expect(await cellValue(again, 'Chine height at St 3')).toBe('176');
    expect(await cellValue(again, 'WL 150 at St 0')).toBe('120');
    await rig.screenshot(again, 'lines-04-saved-reloaded');

    // The same table on a tablet, and in feet-inches-eighths.
    await again.setViewportSize({ width: 820, height: 1180 });
    await again.getByRole('radio', { name: 'Feet-inches-eighths', exact: true }).check();
    expect(await cellValue(again, 'WL 300 at St 2')).toBe('1-8-1+');
    await rig.screenshot(again, 'lines-05-tablet-ftin');
    await again.setViewportSize({ width: 1280, height: 860 });

    // Frames and revisions, to see them drawn.
    await again.getByRole('navigation', { name: 'Parts of this hull' }).getByRole('link', { name: 'Frames' }).click();
    await again.getByRole('button', { name: 'Add part' }).click();
    await again.getByLabel('Ring width at the bottom (mm)').fill('80');
    await again.getByRole('button', { name: 'Apply changes' }).click();
    await again.getByText('Applied. Undo takes it back.').waitFor();
    await rig.screenshot(again, 'lines-06-frames');
    await again.getByRole('navigation', { name: 'Parts of this hull' }).getByRole('link', { name: 'Revisions' }).click();
    await again.getByRole('heading', { name: 'Revisions', level: 2 }).waitFor();
    await rig.screenshot(again, 'lines-07-revisions');

    expect(errors2).toEqual([]);
    await second.context.close();
  });

  it('two tabs save from the same revision: the second is told, reapplies its change on the latest, and saves both', async () => {
    const a = await rig.newPage();
    const b = await rig.newPage();
    const errorsA = watchConsole(a.page);
    const errorsB = watchConsole(b.page);
    await signInThroughForm(a.page, builder.email, builder.password);
    await signInThroughForm(b.page, builder.email, builder.password);

    // A hull with a saved table, made through the API as the app would.
    const hullId = await a.page.evaluate(async () => {
      const { csrfToken } = await (await fetch('/api/session')).json();
      const headers = { 'Content-Type': 'application/json', 'X-CSRF-Token': csrfToken };
      const made = await (await fetch('/api/hulls', { method: 'POST', headers, body: JSON.stringify({ name: `Conflict dory ${Date.now()}`, units: 'mm' }) })).json();
      const stations = [0, 600, 1200, 1800].map((x, i) => ({ id: `st-${i}`, name: `St ${i}`, x }));
      const plan = {
        schemaVersion: 1,
        lines: {
          notation: { unit: 'mm', decimalComma: false, sixteenthMarks: 'plus-sixteenth', precision: '0.5mm' },
          stations,
          lines: [{ id: 'ln-wl', name: 'WL 200', kind: 'waterline', z: 200, knuckle: null, cells: { 'st-0': 200, 'st-1': 350, 'st-2': 400, 'st-3': 350 } }],
          skin: { offsetsTo: 'outside', defaultThicknessMm: 6, panels: [], sheathingMm: 0 },
          deck: null,
          xDirection: 'aft',
          designWaterlineZ: null,
        },
        parts: { longitudinals: [], parts: [] },
      };
      const saved = await fetch(`/api/hulls/${made.hull.id}/plan/revisions`, { method: 'POST', headers, body: JSON.stringify({ baseRevisionId: null, plan, summary: 'Starting table' }) });
      if (saved.status !== 201) throw new Error(`first revision: ${saved.status} ${await saved.text()}`);
      return made.hull.id as number;
    });

    await a.page.goto(`/hulls/${hullId}/lines`);
    await b.page.goto(`/hulls/${hullId}/lines`);
    await cell(a.page, 'WL 200 at St 1').click();
    await a.page.keyboard.type('360');
    await a.page.keyboard.press('Enter');
    await status(a.page).getByText('Draft saved').waitFor({ timeout: 15_000 });

    await cell(b.page, 'WL 200 at St 2').click();
    await b.page.keyboard.type('410');
    await b.page.keyboard.press('Enter');
    await b.page.getByRole('button', { name: 'Save revision' }).click();
    await b.page.getByRole('button', { name: 'Save revision' }).click();
    await status(b.page).getByText(/^Revision \d+ saved$/).waitFor();

    await a.page.getByRole('button', { name: 'Save revision' }).click();
    await a.page.getByRole('button', { name: 'Save revision' }).click();
    const dialog = a.page.getByRole('dialog', { name: 'Someone saved a newer revision' });
    await dialog.waitFor();
    await rig.screenshot(a.page, 'lines-08-conflict');
    await dialog.getByRole('button', { name: 'Reload the latest and reapply my change' }).click();
    await a.page.getByText(/1 change of yours reapplied on top of revision \d+/).waitFor();
    expect(await cellValue(a.page, 'WL 200 at St 1')).toBe('360');
    expect(await cellValue(a.page, 'WL 200 at St 2')).toBe('410');
    await rig.screenshot(a.page, 'lines-09-reapplied');

    await a.page.getByRole('button', { name: 'Save revision' }).click();
    await a.page.getByRole('button', { name: 'Save revision' }).click();
    await status(a.page).getByText(/^Revision \d+ saved$/).waitFor();
    await b.page.reload();
    await b.page.getByRole('grid', { name: 'Table of offsets' }).waitFor();
    expect(await cellValue(b.page, 'WL 200 at St 1')).toBe('360');
    expect(await cellValue(b.page, 'WL 200 at St 2')).toBe('410');

    // The history shows the three revisions and what the last one changed.
    await b.page.getByRole('navigation', { name: 'Parts of this hull' }).getByRole('link', { name: 'Revisions' }).click();
    await b.page.getByRole('heading', { name: /^From revision \d+ to revision \d+: 1 change$/ }).waitFor();
    expect(await b.page.getByRole('region', { name: 'Revision list' }).getByRole('row').count()).toBe(4);
    expect(await b.page.getByRole('rowheader', { name: 'WL 200 at St 1' }).count()).toBe(1);
    await rig.screenshot(b.page, 'lines-10-revisions-compare');

    // The browser logs the one refused save this test provokes; that 409 and nothing else.
    const conflict = /status of 409 \(Conflict\) \(.*\/plan\/revisions\)$/;
    expect(errorsA.filter((e) => conflict.test(e))).toHaveLength(1);
    expect(errorsA.filter((e) => !conflict.test(e))).toEqual([]);
    expect(errorsB).toEqual([]);
    await a.context.close();
    await b.context.close();
  });
});
