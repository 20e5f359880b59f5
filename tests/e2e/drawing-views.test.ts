import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { demoAccounts, demoHull } from '../../server/seed/demo-accounts';
import { signInThroughForm, startRig, type BrowserRig } from './support';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startRig();
});
afterAll(() => rig?.close());

const builder = demoAccounts[0];

/** Console errors, less the frames results route that answers 404 until a revision has results. */
function watchConsole(page: Page) {
  const errors: string[] = [];
  page.on('console', (msg) => {
    if (msg.type() !== 'error') return;
    if (/\/api\/hulls\/\d+\/parts/.test(msg.location().url) && /404/.test(msg.text())) return;
    errors.push(`${msg.text()} (${msg.location().url})`);
  });
  page.on('pageerror', (err) => errors.push(String(err)));
  return errors;
}

/** The stage's viewport once it has fitted the drawing (the stage writes it on its box). */
async function fittedViewport(page: Page, index = 0) {
  const stage = page.getByTestId('drawing-stage').nth(index);
  await stage.locator('canvas').first().waitFor();
  const raw = await stage.getAttribute('data-viewport');
  return JSON.parse(raw!) as { scale: number; offsetX: number; offsetY: number; yScale: number; width: number; height: number };
}

async function openDemoDrawing(page: Page, view: string) {
  await signInThroughForm(page, builder.email, builder.password);
  await page.getByText(demoHull.name).first().click();
  await page.waitForURL(/\/hulls\/\d+/);
  const hullPath = new URL(page.url()).pathname.match(/^\/hulls\/\d+/)![0];
  await page.goto(`${hullPath}/drawing?view=${view}`);
  return hullPath;
}

describe('Drawing views in the browser', () => {
  it('the Part view draws each part of the demo hull, with dimensions on demand', async () => {
    const { page, context } = await rig.newPage({ width: 1400, height: 1000 });
    const errors = watchConsole(page);
    await openDemoDrawing(page, 'part');
    const picker = page.getByLabel('Part', { exact: true });
    await picker.waitFor();
    expect(await picker.inputValue()).toBe('pt-frame-3');
    const v = await fittedViewport(page);
    expect(v.scale).toBeGreaterThan(0);
    await page.getByText(/\(marked face\)\. Seen from/).waitFor();
    await rig.screenshot(page, 'drawing-views-01-part-frame-3');

    await page.getByRole('button', { name: 'Dimensions' }).click();
    expect(await page.getByRole('button', { name: 'Dimensions' }).getAttribute('aria-pressed')).toBe('true');
    await rig.screenshot(page, 'drawing-views-02-part-frame-3-dimensions');

    await picker.selectOption('pt-transom');
    await page.getByText(/Transom.*\(marked face\)\. Seen from/).waitFor();
    await rig.screenshot(page, 'drawing-views-03-part-transom');
    await picker.selectOption('pt-bulkhead-5');
    await page.getByText(/Bulkhead 5.*\(marked face\)\. Seen from/).waitFor();
    await rig.screenshot(page, 'drawing-views-04-part-bulkhead');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('the Fairing view draws a line with its heights stretched', async () => {
    const { page, context } = await rig.newPage({ width: 1400, height: 1000 });
    const errors = watchConsole(page);
    await openDemoDrawing(page, 'fairing');
    const line = page.getByLabel('Line', { exact: true });
    await line.waitFor();
    await line.selectOption({ label: 'Chine in profile (heights)' });
    await page.getByRole('button', { name: 'Heights 20 times' }).click();
    // The stage takes the new scale on its next render: asked until it has it.
    await expect.poll(async () => (await fittedViewport(page)).yScale).toBe(20);
    await page.getByRole('status').filter({ hasText: /Chine/ }).first().waitFor();
    await rig.screenshot(page, 'drawing-views-05-fairing-chine-profile-x20');
    await line.selectOption({ label: 'Sheer in plan (half-breadths)' });
    await page.getByRole('button', { name: 'Heights 5 times' }).click();
    await expect.poll(async () => (await fittedViewport(page)).yScale).toBe(5);
    await rig.screenshot(page, 'drawing-views-06-fairing-sheer-plan-x5');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('a measured frame: typed points are drawn, mirrored with the asymmetry shown', async () => {
    const { page, context } = await rig.newPage({ width: 1400, height: 1100 });
    const errors = watchConsole(page);
    await openDemoDrawing(page, 'measured');
    await page.getByLabel('Frame x (mm)').fill('2300');
    await page.getByRole('button', { name: 'Add a measured frame' }).click();
    await page.getByLabel('Measured frame', { exact: true }).waitFor();
    const form = page.getByRole('form', { name: 'Add a point' });
    // Invented readings from a level line at the design waterline (280 mm), port sheer round to starboard sheer.
    const points: [string, string, string][] = [
      ['-890', '505', ''],
      ['-735', '-118', '80'],
      ['0', '-226', ''],
      ['728', '-122', '81'],
      ['884', '498', ''],
    ];
    for (const [y, h, bevel] of points) {
      await form.getByLabel('Offset from centreline (mm)').fill(y);
      await form.getByLabel('Height above reference (mm)').fill(h);
      await form.getByLabel('Bevel reading (°)').fill(bevel);
      await form.getByRole('button', { name: 'Add point' }).click();
    }
    await page.getByLabel('Point 5 offset from centreline (mm)').waitFor();
    // The drawing is fitted to the box it is in now, not to the size it had before the table filled up.
    const box = page.getByRole('application', { name: /Drawing of Measured frame 1/ });
    await expect.poll(async () => (await fittedViewport(page)).width).toBe(await box.evaluate((el) => Math.floor(el.clientWidth)));
    // Both sheer readings (y -890 and 884 mm) are in view, inside the fit's margin.
    const fitted = await fittedViewport(page);
    for (const y of [-890, 884]) {
      const x = fitted.offsetX + y * fitted.scale;
      expect(x, `reading at y ${y} mm is drawn at x ${x} px of ${fitted.width}`).toBeGreaterThan(0);
      expect(x, `reading at y ${y} mm is drawn at x ${x} px of ${fitted.width}`).toBeLessThan(fitted.width);
    }
    await rig.screenshot(page, 'drawing-views-07-measured-as-measured');

    await page.getByLabel('Sides').selectOption('mirror-starboard');
    await page.getByText(/The two sides differ by up to/).waitFor();
    await rig.screenshot(page, 'drawing-views-08-measured-mirrored');

    // A bad value is marked and nothing is written.
    await form.getByLabel('Offset from centreline (mm)').fill('12O');
    await form.getByLabel('Height above reference (mm)').fill('3');
    await form.getByRole('button', { name: 'Add point' }).click();
    await page.getByText(/Point 6: The offset from the centreline: "12O"/).waitFor();
    expect(await page.getByLabel('Point 6 offset from centreline (mm)').count()).toBe(0);

    // A point clicked onto the drawing goes into the table (and the plan) where it falls along the edge.
    await page.getByRole('button', { name: 'Add points by clicking' }).click();
    const drawing = page.getByRole('application', { name: /Drawing of Measured frame 1/ });
    const size = (await drawing.boundingBox())!;
    await drawing.click({ position: { x: size.width * 0.75, y: size.height * 0.85 } });
    await page.getByLabel('Point 6 offset from centreline (mm)').waitFor();
    await rig.screenshot(page, 'drawing-views-08b-measured-clicked-point');

    // The Part view draws the same frame.
    await page.getByRole('button', { name: 'Part', exact: true }).click();
    await page.getByLabel('Part', { exact: true }).selectOption({ label: 'Measured frame 1 (measured frame)' });
    await page.getByText(/Measured frame 1.*\(marked face\)\. Seen from/).waitFor();
    await rig.screenshot(page, 'drawing-views-09-part-measured');
    expect(errors).toEqual([]);
    await context.close();
  });
});
