import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { demoAccounts, demoHull } from '../../server/seed/demo-accounts';
import type { Plan } from '../../shared/geometry/plan-schema';
import type { PointLine } from '../../shared/geometry/hull-schema';
import { bodyPlanSides } from '../../src/features/plan/drawing/body-plan';
import { toHull, toScreen, type Viewport } from '../../src/features/plan/drawing/viewport';
import { signInThroughForm, startRig, type BrowserRig } from './support';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startRig();
});
afterAll(() => rig?.close());

const [builder, helper] = demoAccounts;

type StageView = Viewport & { width: number; height: number };

/** GET or POST through the page, so the session cookie and the page's own Origin go with it. */
async function apiCall<T>(page: Page, method: 'GET' | 'POST', path: string, body?: unknown): Promise<T> {
  return page.evaluate(
    async ({ method, path, body }) => {
      const res = await fetch(path, { method, headers: body ? { 'content-type': 'application/json' } : {}, body: body ? JSON.stringify(body) : undefined });
      if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
      return res.json();
    },
    { method, path, body },
  ) as Promise<T>;
}

async function demoHullId(page: Page): Promise<number> {
  const { hulls } = await apiCall<{ hulls: { id: number; name: string }[] }>(page, 'GET', '/api/hulls');
  return hulls.find((h) => h.name === demoHull.name)!.id;
}

/**
 * The demo plan with a waterline added at 500 mm: its half-breadths lie on the straight line from chine
 * to sheer at that height, so the sections stay fair (invented test data).
 */
function withWaterline(plan: Plan): Plan {
  const byId = (id: string) => plan.lines.lines.find((l) => l.id === id) as PointLine;
  const chine = byId('ln-chine');
  const sheer = byId('ln-sheer');
  const cells: Record<string, number> = {};
  for (const s of plan.lines.stations) {
    const c = chine.cells[s.id]!;
    const t = sheer.cells[s.id]!;
    cells[s.id] = Math.round((c.y + ((t.y - c.y) * (500 - c.z)) / (t.z - c.z)) * 2) / 2;
  }
  return { ...plan, lines: { ...plan.lines, lines: [...plan.lines.lines, { id: 'ln-wl-500', name: 'WL 500', kind: 'waterline', z: 500, knuckle: null, cells }] } };
}

/** A builder signed in, with a copy of the demo hull that has WL 500 added (`withWaterline`). */
async function builderWithWaterlineCopy(name: string) {
  const { page, consoleErrors } = await rig.newPage({ width: 1440, height: 1000 });
  await signInThroughForm(page, builder.email, builder.password);
  const demoId = await demoHullId(page);
  const { plan: demoPlan } = await apiCall<{ plan: Plan }>(page, 'GET', `/api/hulls/${demoId}/plan`);
  const plan = withWaterline(demoPlan);
  const { hull } = await apiCall<{ hull: { id: number } }>(page, 'POST', `/api/hulls/${demoId}/copy`, { name: `${name} ${Date.now()}`, plan });
  return { page, consoleErrors, plan, hull };
}

const viewportOf = async (page: Page, scope = page.getByTestId('body-plan')): Promise<StageView> =>
  JSON.parse((await scope.getByTestId('drawing-stage').getAttribute('data-viewport'))!) as StageView;

/** Page px of a drawing point (mm), from the stage's viewport and where its canvas sits. */
async function pagePoint(page: Page, p: { x: number; y: number }) {
  await page.getByTestId('body-plan').locator('.konvajs-content').scrollIntoViewIfNeeded();
  const box = (await page.getByTestId('body-plan').locator('.konvajs-content').boundingBox())!;
  const s = toScreen(await viewportOf(page), p);
  return { x: box.x + s.x, y: box.y + s.y };
}

const sideInput = (page: Page, label: string) => page.getByTestId('station-offsets').getByLabel(label, { exact: true });
const view = (page: Page, name: string) => page.getByRole('group', { name: 'Which drawing' }).getByRole('button', { name, exact: true });

/** Every cell, station and part of a plan, flattened to path → value, to compare two plans. */
function flatten(value: unknown, path = '', out = new Map<string, unknown>()): Map<string, unknown> {
  if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) flatten(v, path ? `${path}.${k}` : k, out);
  } else out.set(path, value);
  return out;
}
function differences(a: unknown, b: unknown): string[] {
  const fa = flatten(a);
  const fb = flatten(b);
  return [...new Set([...fa.keys(), ...fb.keys()])].filter((k) => fa.get(k) !== fb.get(k));
}

describe('Drawing in the browser', () => {
  it('a builder drags a waterline point: only its half-breadth changes, the table and the part follow, undo puts both back; zoom and fit keep the drawing in view', async () => {
    const { page, consoleErrors, plan, hull } = await builderWithWaterlineCopy('Drawing test');
    const { plan: start } = await apiCall<{ plan: Plan }>(page, 'GET', `/api/hulls/${hull.id}/plan`);

    await page.goto(`/hulls/${hull.id}`);
    await page.getByRole('navigation', { name: 'Parts of this hull' }).getByRole('link', { name: 'Drawing' }).click();
    await page.getByTestId('body-plan').locator('canvas').first().waitFor();
    await page.getByRole('heading', { name: 'Station St 4' }).waitFor();
    await rig.screenshot(page, 'drawing-01-body-plan');

    // Fit: every offset of the plan, on the side its station is drawn, lies inside the stage.
    const fitted = await viewportOf(page);
    const sides = bodyPlanSides(start.lines);
    for (const line of start.lines.lines) {
      for (const s of start.lines.stations) {
        const cell = (line.cells as Record<string, unknown>)[s.id];
        if (cell == null) continue;
        const at = line.kind === 'point' ? (cell as { y: number; z: number }) : line.kind === 'waterline' ? { y: cell as number, z: line.z } : null;
        if (!at) continue;
        const p = toScreen(fitted, { x: sides.get(s.id) === 'aft' ? -at.y : at.y, y: at.z });
        expect(p.x).toBeGreaterThan(0);
        expect(p.x).toBeLessThan(fitted.width);
        expect(p.y).toBeGreaterThan(0);
        expect(p.y).toBeLessThan(fitted.height);
      }
    }

    // The Frame 3 station, and the part drawn before the drag.
    await page.getByRole('button', { name: 'Previous station' }).click();
    await page.getByRole('heading', { name: 'Station St 3' }).waitFor();
    const before = Number(await sideInput(page, 'WL 500 at St 3').inputValue());
    expect(before).toBe(plan.lines.lines.at(-1)!.cells['st-3']);
    await view(page, 'Part').click();
    await page.getByLabel('Part', { exact: true }).selectOption('pt-frame-3');
    const partCanvas = page.locator('.konvajs-content').first();
    await partCanvas.waitFor();
    await page.waitForTimeout(300);
    const partBefore = await partCanvas.screenshot();
    await view(page, 'Body plan').click();
    await page.getByRole('heading', { name: 'Station St 3' }).waitFor();
    await page.getByRole('button', { name: 'Snap to points' }).click();
    expect(await page.getByRole('button', { name: 'Snap to points' }).getAttribute('aria-pressed')).toBe('false');

    // St 3 is forward of midships (350..4900 mm, x growing aft): drawn right of the centreline.
    expect(sides.get('st-3')).toBe('forward');
    const handle = await pagePoint(page, { x: before, y: 500 });
    // Frame 3 stands at St 3: its cut outline is laid over the body plan while the drag goes on.
    await page.getByText('Part at this station (follows the drag)').waitFor();
    const partWidth = async () => {
      const v = await page.getByTestId('body-plan').getAttribute('data-part-half-breadth');
      return v === null ? null : Number(v);
    };
    const widthBefore = (await partWidth())!;
    expect(widthBefore).toBeGreaterThan(0);
    await page.mouse.move(handle.x, handle.y);
    await page.mouse.down();
    // Across and also up: the waterline point may only move across.
    await page.mouse.move(handle.x + 16, handle.y - 25, { steps: 12 });
    // Still held down: the part is worked out again for the dragged value (once the pointer rests) and drawn.
    await expect.poll(partWidth, { timeout: 10_000 }).not.toBe(widthBefore);
    expect(await page.getByTestId('body-plan').getAttribute('data-dragging')).toBe('true');
    // Let any computation for an earlier position of the pointer give way to the one for where it stopped.
    await page.waitForTimeout(400);
    const widthMidDrag = (await partWidth())!;
    // WL 500 pushed outward fills the section out between chine and sheer, so the frame cut from it is wider.
    expect(widthMidDrag).toBeGreaterThan(widthBefore);
    await rig.screenshot(page, 'drawing-01b-part-follows-drag');
    // Nothing is saved while the drag goes on: the side table still holds the old half-breadth.
    expect(Number(await sideInput(page, 'WL 500 at St 3').inputValue())).toBe(before);
    await page.mouse.up();
    const v = await viewportOf(page);
    const box = (await page.getByTestId('body-plan').locator('.konvajs-content').boundingBox())!;
    const expected = toHull(v, { x: handle.x + 16 - box.x, y: 0 }).x;
    await expect.poll(async () => Number(await sideInput(page, 'WL 500 at St 3').inputValue())).not.toBe(before);
    const after = Number(await sideInput(page, 'WL 500 at St 3').inputValue());
    // Rounded to the hull's precision, 0.5 mm (demo notation).
    expect(Math.abs(after - expected)).toBeLessThanOrEqual(0.25 + 1e-9);
    expect(after - before).toBeCloseTo(16 / v.scale, -0.5);
    // Let go where the drag last drew: the part at the station is the one drawn mid-drag.
    await expect.poll(partWidth).toBeCloseTo(widthMidDrag, 3);

    // The autosaved draft differs from the revision in that one cell and nowhere else.
    await page.getByTestId('save-status').getByText('Draft saved').waitFor({ timeout: 15_000 });
    const { draft } = await apiCall<{ draft: { plan: Plan } | null }>(page, 'GET', `/api/hulls/${hull.id}/plan/draft`);
    const wlIndex = start.lines.lines.findIndex((l) => l.id === 'ln-wl-500');
    expect(differences(start, draft!.plan)).toEqual([`lines.lines.${wlIndex}.cells.st-3`]);
    expect((draft!.plan.lines.lines[wlIndex]!.cells as Record<string, number>)['st-3']).toBe(after);

    // The part outline follows.
    await view(page, 'Part').click();
    await partCanvas.waitFor();
    await page.waitForTimeout(300);
    const partAfter = await partCanvas.screenshot();
    expect(partAfter.equals(partBefore)).toBe(false);
    await rig.screenshot(page, 'drawing-02-part-after-drag');

    // The Lines table shows the new half-breadth: the same working copy.
    await page.getByRole('navigation', { name: 'Parts of this hull' }).getByRole('link', { name: 'Lines' }).click();
    const gridCell = page.getByRole('gridcell', { name: 'WL 500 at St 3', exact: true }).locator('[data-cell-value]');
    expect(Number(await gridCell.innerText())).toBe(after);
    await page.getByRole('navigation', { name: 'Parts of this hull' }).getByRole('link', { name: 'Drawing' }).click();
    await page.getByTestId('body-plan').locator('canvas').first().waitFor();

    // Undo with the keyboard: one step takes the whole drag back, table and part alike.
    await page.getByRole('heading', { name: 'Drawing', level: 2 }).click();
    await page.keyboard.press('Control+z');
    await page.getByRole('button', { name: 'Previous station' }).click();
    await page.getByRole('heading', { name: 'Station St 3' }).waitFor();
    expect(Number(await sideInput(page, 'WL 500 at St 3').inputValue())).toBe(before);
    await expect.poll(partWidth).toBe(widthBefore);
    await view(page, 'Part').click();
    await partCanvas.waitFor();
    await page.waitForTimeout(300);
    expect((await partCanvas.screenshot()).equals(partBefore)).toBe(true);

    // A click on a point chooses it without moving it; Delete takes it out, Ctrl+Z puts it back.
    await view(page, 'Body plan').click();
    await page.getByRole('heading', { name: 'Station St 3' }).waitFor();
    const again = await pagePoint(page, { x: before, y: 500 });
    await page.mouse.click(again.x, again.y);
    expect(Number(await sideInput(page, 'WL 500 at St 3').inputValue())).toBe(before);
    await page.getByRole('application').first().focus();
    await page.keyboard.press('Delete');
    await expect.poll(() => sideInput(page, 'WL 500 at St 3').inputValue()).toBe('');
    await page.getByRole('heading', { name: 'Drawing', level: 2 }).click();
    await page.keyboard.press('Control+z');
    await expect.poll(async () => Number(await sideInput(page, 'WL 500 at St 3').inputValue())).toBe(before);
    await view(page, 'Fairing').click();
    await page.locator('.konvajs-content').first().waitFor();
    // The waterline added for this test, in plan: a line with a shape to see.
    const lineChoice = page.getByLabel('Line', { exact: true });
    const choices = await lineChoice.locator('option').allInnerTexts();
    await lineChoice.selectOption({ index: choices.findIndex((c) => c.startsWith('WL 500')) });
    await page.waitForTimeout(300);
    await rig.screenshot(page, 'drawing-03-fairing');
    await view(page, 'Body plan').click();
    await page.getByTestId('body-plan').locator('canvas').first().waitFor();

    // Zoom in about the centre: the scale grows by the step and the middle of the stage stays put.
    const fit = await viewportOf(page);
    await page.getByRole('button', { name: 'Zoom in' }).click();
    const zoomed = await viewportOf(page);
    expect(zoomed.scale / fit.scale).toBeCloseTo(1.25, 9);
    const centre = { x: fit.width / 2, y: fit.height / 2 };
    expect(toHull(zoomed, centre).x).toBeCloseTo(toHull(fit, centre).x, 6);
    expect(toHull(zoomed, centre).y).toBeCloseTo(toHull(fit, centre).y, 6);
    // The wheel zooms about the pointer: the hull point under it stays under it.
    await page.getByTestId('body-plan').locator('.konvajs-content').scrollIntoViewIfNeeded();
    const stageBox = (await page.getByTestId('body-plan').locator('.konvajs-content').boundingBox())!;
    const at = { x: Math.round(stageBox.x + fit.width * 0.3), y: Math.round(stageBox.y + fit.height * 0.6) };
    await page.mouse.move(at.x, at.y);
    const underBefore = toHull(zoomed, { x: at.x - stageBox.x, y: at.y - stageBox.y });
    await page.mouse.wheel(0, -240);
    await expect.poll(async () => (await viewportOf(page)).scale).toBeGreaterThan(zoomed.scale);
    const wheeled = await viewportOf(page);
    // Within a pixel: the browser reports the pointer to whole pixels.
    const stillUnder = toScreen(wheeled, underBefore);
    expect(Math.abs(stillUnder.x - (at.x - stageBox.x))).toBeLessThan(1);
    expect(Math.abs(stillUnder.y - (at.y - stageBox.y))).toBeLessThan(1);
    // Fit brings back exactly the fitted view, and 0 does the same from the keyboard.
    await page.getByRole('button', { name: 'Fit the drawing to the view' }).click();
    expect(await viewportOf(page)).toEqual(fit);
    await page.getByRole('button', { name: 'Zoom out' }).click();
    await page.getByRole('application').first().focus();
    await page.keyboard.press('0');
    expect(await viewportOf(page)).toEqual(fit);

    // The measure tool: two clicks give a distance and an angle in the hull's units.
    await page.getByRole('button', { name: 'Measure', exact: true }).click();
    const a = await pagePoint(page, { x: 0, y: 500 });
    const b = await pagePoint(page, { x: 300, y: 900 });
    await page.mouse.click(a.x, a.y);
    await page.mouse.click(b.x, b.y);
    // analytic: a 300-400-500 triangle, atan2(400, 300) = 53.1°; 0.5 mm is what a pixel may add at this scale
    const words = await page.getByTestId('measure-readout').innerText();
    const measured = /Distance ([\d.]+) mm, angle from horizontal ([\d.]+)°/.exec(words)!;
    expect(Math.abs(Number(measured[1]) - 500)).toBeLessThan(2 / fit.scale);
    expect(Math.abs(Number(measured[2]) - 53.1)).toBeLessThan(0.5);
    await rig.screenshot(page, 'drawing-04-measure');
    expect(consoleErrors).toEqual([]);
  });

  it('a builder steps through a section\'s points by key and moves one with the arrows: one step the way its cell allows, one undo a key', async () => {
    const { page, consoleErrors, plan, hull } = await builderWithWaterlineCopy('Drawing keys test');
    await page.goto(`/hulls/${hull.id}/drawing`);
    await page.getByTestId('body-plan').locator('canvas').first().waitFor();
    await page.getByRole('heading', { name: 'Station St 4' }).waitFor();

    const drawing = page.getByRole('application').first();
    const said = page.getByTestId('body-plan-announcement');
    const value = async (label: string) => Number(await sideInput(page, label).inputValue());
    const wlBefore = plan.lines.lines.find((l) => l.id === 'ln-wl-500')!.cells['st-4'] as number;
    const sheerBefore = (plan.lines.lines.find((l) => l.id === 'ln-sheer') as PointLine).cells['st-4']!;
    expect(await value('WL 500 at St 4')).toBe(wlBefore);

    // With nothing chosen the arrows move the drawing.
    await drawing.focus();
    const start = await viewportOf(page);
    await page.keyboard.press('ArrowRight');
    await expect.poll(async () => (await viewportOf(page)).offsetX).not.toBe(start.offsetX);
    await page.keyboard.press('ArrowLeft');
    const still = await viewportOf(page);

    // N steps keel to sheer along the girth (the table lists WL 500 last, the section passes it before the sheer), and round again.
    const stepped: string[] = [];
    for (let i = 0; i < 5; i++) {
      await page.keyboard.press('n');
      stepped.push(await said.innerText());
    }
    expect(stepped.map((w) => w.split(' at ')[0])).toEqual(['Keel', 'Chine', 'WL 500', 'Sheer', 'Keel']);
    expect(stepped[2]).toBe(`WL 500 at St 4: half-breadth ${wlBefore} mm. Point 3 of 4.`);
    await page.keyboard.press('p');
    await page.keyboard.press('p');
    await expect.poll(() => said.innerText()).toMatch(/^WL 500 at St 4: /);
    await rig.screenshot(page, 'drawing-06-point-chosen-by-key');

    // St 4 is aft of midships, drawn left of the centreline: Left takes a point outboard there.
    expect(bodyPlanSides(plan.lines).get('st-4')).toBe('aft');
    await page.keyboard.press('ArrowLeft');
    await expect.poll(() => value('WL 500 at St 4')).toBe(wlBefore + 1);
    expect(await said.innerText()).toBe(`WL 500 at St 4: half-breadth ${wlBefore + 1} mm`);
    await page.keyboard.press('Shift+ArrowLeft');
    await expect.poll(() => value('WL 500 at St 4')).toBe(wlBefore + 11);
    // A waterline point moves across only: Up leaves it as it is and says so.
    await page.keyboard.press('ArrowUp');
    await expect.poll(() => said.innerText()).toMatch(/across only/);
    expect(await value('WL 500 at St 4')).toBe(wlBefore + 11);
    // The keys moved the point, not the drawing.
    expect(await viewportOf(page)).toEqual(still);

    // A sheer point moves either way: Up changes its height alone.
    await page.keyboard.press('n');
    await expect.poll(() => said.innerText()).toMatch(/^Sheer at St 4: /);
    await page.keyboard.press('ArrowUp');
    await expect.poll(() => value('Sheer height at St 4')).toBe(sheerBefore.z + 1);
    expect(await value('Sheer half-breadth at St 4')).toBe(sheerBefore.y);
    // With the grid on, a key moves a grid step (10 mm for a metric hull).
    await page.getByRole('button', { name: 'Snap to grid' }).click();
    await drawing.focus();
    await page.keyboard.press('ArrowDown');
    await expect.poll(() => value('Sheer height at St 4')).toBe(sheerBefore.z + 1 - 10);
    expect(await value('Sheer half-breadth at St 4')).toBe(sheerBefore.y);

    // Each key was one edit, autosaved like a drag.
    await page.getByTestId('save-status').getByText('Draft saved').waitFor({ timeout: 15_000 });
    const { draft } = await apiCall<{ draft: { plan: Plan } | null }>(page, 'GET', `/api/hulls/${hull.id}/plan/draft`);
    const drafted = draft!.plan.lines.lines;
    expect(drafted.find((l) => l.id === 'ln-wl-500')!.cells['st-4']).toBe(wlBefore + 11);
    expect((drafted.find((l) => l.id === 'ln-sheer') as PointLine).cells['st-4']).toEqual({ y: sheerBefore.y, z: sheerBefore.z - 9 });

    // Ctrl+Z takes the key moves back one at a time.
    await page.keyboard.press('Control+z');
    await expect.poll(() => value('Sheer height at St 4')).toBe(sheerBefore.z + 1);
    await page.keyboard.press('Control+z');
    await expect.poll(() => value('Sheer height at St 4')).toBe(sheerBefore.z);
    await page.keyboard.press('Control+z');
    await expect.poll(() => value('WL 500 at St 4')).toBe(wlBefore + 1);
    await page.keyboard.press('Control+z');
    await expect.poll(() => value('WL 500 at St 4')).toBe(wlBefore);

    // Escape lets go of the point: the arrows move the drawing again and the point stays.
    await page.keyboard.press('Escape');
    await expect.poll(() => said.innerText()).toMatch(/^No point chosen/);
    await page.keyboard.press('ArrowUp');
    await expect.poll(async () => (await viewportOf(page)).offsetY).not.toBe(still.offsetY);
    expect(await value('Sheer height at St 4')).toBe(sheerBefore.z);
    expect(await value('WL 500 at St 4')).toBe(wlBefore);
    expect(consoleErrors).toEqual([]);
  });

  it('a helper sees the body plan read-only: a drag on a point changes nothing and saves nothing', async () => {
    const { page, consoleErrors } = await rig.newPage({ width: 1440, height: 1000 });
    await signInThroughForm(page, helper.email, helper.password);
    const hullId = await demoHullId(page);
    const { plan } = await apiCall<{ plan: Plan }>(page, 'GET', `/api/hulls/${hullId}/plan`);
    const writes: string[] = [];
    page.on('request', (r) => {
      if (r.method() !== 'GET') writes.push(`${r.method()} ${r.url()}`);
    });
    await page.goto(`/hulls/${hullId}/drawing`);
    await page.getByTestId('body-plan').locator('canvas').first().waitFor();
    await page.getByText('Read only', { exact: true }).waitFor();
    expect(await page.getByRole('button', { name: 'Snap to grid' }).count()).toBe(0);
    await page.getByRole('heading', { name: 'Station St 4' }).waitFor();
    const sheer = plan.lines.lines.find((l) => l.id === 'ln-sheer') as PointLine;
    const point = sheer.cells['st-4']!;
    const input = sideInput(page, 'Sheer half-breadth at St 4');
    expect(await input.getAttribute('readonly')).not.toBeNull();
    const beforeValue = await input.inputValue();

    const sides = bodyPlanSides(plan.lines);
    const handle = await pagePoint(page, { x: sides.get('st-4') === 'aft' ? -point.y : point.y, y: point.z });
    await page.mouse.move(handle.x, handle.y);
    await page.mouse.down();
    await page.mouse.move(handle.x + 60, handle.y + 40, { steps: 10 });
    await page.mouse.up();
    await page.waitForTimeout(500);
    // What the helper dragged was the drawing (a pan), not the point.
    expect(await input.inputValue()).toBe(beforeValue);

    // By key the helper steps to the sheer point and hears it, but the arrows move the drawing, not the point.
    await page.getByRole('application').first().focus();
    for (let i = 0; i < 3; i++) await page.keyboard.press('n');
    const said = page.getByTestId('body-plan-announcement');
    expect(await said.innerText()).toBe(`Sheer at St 4: half-breadth ${point.y} mm, height ${point.z} mm. Point 3 of 3.`);
    const panned = await viewportOf(page);
    await page.keyboard.press('ArrowUp');
    await page.keyboard.press('Shift+ArrowLeft');
    await page.waitForTimeout(300);
    expect(await input.inputValue({ timeout: 5_000 })).toBe(beforeValue);
    expect(await sideInput(page, 'Sheer height at St 4').inputValue({ timeout: 5_000 })).toBe(String(point.z));
    expect((await viewportOf(page)).offsetY).not.toBe(panned.offsetY);
    expect(await page.getByRole('button', { name: /^Undo/ }).count()).toBe(0);
    expect(writes).toEqual([]);
    await rig.screenshot(page, 'drawing-05-helper-read-only');
    expect(consoleErrors).toEqual([]);
  });
});
