import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HullMember, User } from '../../server/models';
import { hullCreate } from '../../server/services/hulls';
import { revisionSave } from '../../server/services/plans';
import { demoAccounts } from '../../server/seed/demo-accounts';
import { demoPlan } from '../../server/seed/demo-plan';
import { signInThroughForm, startRig, type BrowserRig } from './support';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startRig();
});
afterAll(() => rig?.close());

const builder = demoAccounts[0];
const helper = demoAccounts[1];
const stamp = Date.now().toString(36);

/** A hull of the demo builder's at the demo plan, with the demo helper on its crew. */
async function crewHull(): Promise<number> {
  const owner = (await User.findOne({ where: { email: builder.email } }))!;
  const crewHelper = (await User.findOne({ where: { email: helper.email } }))!;
  const hull = await hullCreate(owner.id, { name: `Bench skiff ${stamp}`, units: 'mm', notes: 'For the build log browser test.' });
  await HullMember.create({ hullId: hull.id, userId: crewHelper.id, role: 'helper' });
  await revisionSave({ hullId: hull.id, units: 'mm', authorId: owner.id, role: 'owner', baseRevisionId: null, plan: demoPlan() });
  return hull.id;
}

describe('the build log on a tablet at the bench', () => {
  it('a helper marks each layer of a part patterned and cut, attaches a photo, sees it on the board, and deletes it', async () => {
    const hullId = await crewHull();
    const { page, consoleErrors } = await rig.newPage({ width: 820, height: 1180 });
    await signInThroughForm(page, helper.email, helper.password);
    await page.goto(`/hulls/${hullId}`);
    await page.getByRole('navigation', { name: 'Parts of this hull' }).getByRole('link', { name: 'Build log' }).click();
    await page.getByRole('heading', { name: 'Build log', level: 2 }).waitFor();
    await page.getByRole('list', { name: 'Parts by stage' }).getByRole('button', { name: /Frame 3/ }).click();
    await rig.screenshot(page, 'build-log-01-part');

    // Frame 3 is laminated from two layers: each is patterned and cut by itself, then the part is laminated.
    await page.getByRole('button', { name: 'Mark layer 1 patterned' }).click();
    await page.getByRole('button', { name: 'Mark layer 2 patterned' }).click();
    // The saw caution shows now that the layers are at the saw.
    await page.getByText(/guards on, push sticks/).waitFor();
    await page.getByLabel('Note (optional)').fill('Sheer 2 mm high at port; planed to the line');
    await page.getByLabel('Ply sheets').fill('1');
    await page.getByRole('button', { name: 'Mark layer 1 cut' }).click();
    await page.getByRole('button', { name: 'Reopen layer 1 cut' }).waitFor();
    const card = page.getByRole('list', { name: 'Parts by stage' }).getByRole('button', { name: /Frame 3/ });
    await card.getByText('Cut 1/2 layers').waitFor();
    await page.getByRole('button', { name: 'Mark layer 2 cut' }).click();
    await page.getByRole('button', { name: 'Mark laminated' }).waitFor();
    // The epoxy caution shows now that laminating is next.
    await page.getByText(/nitrile gloves and eye protection/).waitFor();

    const png = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#c8a27a' } }).png().toBuffer();
    await page.getByLabel('Add a photo').setInputFiles({ name: 'frame-3.png', mimeType: 'image/png', buffer: png });
    const thumb = page.getByRole('list', { name: 'Photos' }).getByRole('img');
    await thumb.waitFor();
    await expect.poll(() => thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(320);

    // Cut on the part's own row of stages and on each of its two layers' rows.
    await expect.poll(() => card.getByText('✓ Cut', { exact: true }).count()).toBe(3);
    await card.getByText('1 photo', { exact: false }).waitFor();
    await page.getByText(/by Sam Quillon/).first().waitFor();
    expect(await page.getByRole('cell', { name: '1', exact: true }).count()).toBeGreaterThan(0);
    await rig.screenshot(page, 'build-log-02-cut-with-photo');

    await page.getByRole('link', { name: 'Build sheet to print' }).click();
    await page.getByRole('heading', { name: 'Build sheet: Frame 3' }).waitFor();
    await page.getByText('Sheer 2 mm high at port; planed to the line', { exact: false }).waitFor();
    expect(await page.getByRole('table').getByRole('row').count()).toBeGreaterThan(2);
    await rig.screenshot(page, 'build-log-03-sheet');

    // Back on the board, the helper deletes the photo they added, after saying so once more.
    await page.goBack();
    await page.getByRole('button', { name: /^Delete photo/ }).click();
    await page.getByRole('button', { name: 'Delete photo', exact: true }).click();
    await page.getByRole('list', { name: 'Photos' }).waitFor({ state: 'detached' });
    await expect.poll(() => card.textContent()).not.toContain('photo');
    expect(consoleErrors).toEqual([]);
  });

  it('the builder who owns the hull sets the movement tolerance in millimetres, on a tablet', async () => {
    const hullId = await crewHull();
    const { page, consoleErrors } = await rig.newPage({ width: 820, height: 1180 });
    await signInThroughForm(page, builder.email, builder.password);
    await page.goto(`/hulls/${hullId}/build-log`);
    const field = page.getByLabel('Flag a cut part when a new revision moves it more than');
    expect(await field.inputValue()).toBe('1.0');
    await field.fill('0,5');
    await page.getByRole('button', { name: 'Save tolerance' }).click();
    // A metric hull writes a decimal point: the comma is refused where the field is, and nothing is saved.
    await page.getByText(/"0,5"/).waitFor();
    await field.fill('2.5');
    await page.getByRole('button', { name: 'Save tolerance' }).click();
    await page.getByText(/Saved/).waitFor();
    const stored = await page.evaluate(async (id) => (await (await fetch(`/api/hulls/${id}/build-log`)).json()).moveToleranceMm, hullId);
    expect(stored).toBe(2.5);
    await rig.screenshot(page, 'build-log-04-tolerance');
    expect(consoleErrors).toEqual([]);
  });
});
