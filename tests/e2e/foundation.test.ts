import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts, demoHull } from '../../server/seed/demo-accounts';
import { signInThroughForm, startRig, type BrowserRig } from './support';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startRig();
});
afterAll(() => rig?.close());

const builder = demoAccounts[0];
const helper = demoAccounts[1];

describe('foundation in the browser', () => {
  it('a demo builder signs in, creates a hull, adds a crew member and sees them listed', async () => {
    const { page, context, consoleErrors } = await rig.newPage();
    await signInThroughForm(page, builder.email, builder.password);
    await page.getByText(demoHull.name).first().waitFor();
    await rig.screenshot(page, 'foundation-01-hulls');

    const name = `Test dory ${Date.now()}`;
    await page.getByRole('link', { name: 'New hull' }).first().click();
    await page.getByLabel('Hull name').fill(name);
    await page.getByLabel('Units').selectOption('ftin');
    await page.getByRole('button', { name: 'Create hull' }).click();
    await page.getByRole('heading', { name }).waitFor();
    await rig.screenshot(page, 'foundation-02-new-hull');

    await page.getByLabel("Crew member's e-mail").fill(helper.email);
    await page.getByLabel('Role', { exact: true }).selectOption('helper');
    await page.getByRole('button', { name: 'Add to crew' }).click();
    const crewTable = page.getByRole('table');
    await crewTable.getByRole('rowheader', { name: helper.displayName }).waitFor();
    // The owner sees each member's role as a select: its value is the role the server stored.
    expect(await page.getByLabel(`Role for ${helper.displayName}`).inputValue()).toBe('helper');
    const rows = await crewTable.getByRole('row').allInnerTexts();
    expect(rows.some((r) => r.includes(helper.email))).toBe(true);
    expect(rows.some((r) => r.includes(builder.displayName))).toBe(true);
    await rig.screenshot(page, 'foundation-03-crew');

    // The same page on a tablet in the workshop.
    await page.setViewportSize({ width: 820, height: 1180 });
    await rig.screenshot(page, 'foundation-04-crew-tablet');

    expect(consoleErrors).toEqual([]);
    await context.close();
  });

  it('the helper sees the new hull read-only, and a stranger is sent to sign in', async () => {
    const { page, context, consoleErrors } = await rig.newPage({ width: 820, height: 1180 });
    await signInThroughForm(page, helper.email, helper.password);
    await page.getByText(demoHull.name).first().click();
    await page.getByRole('heading', { name: 'Crew' }).waitFor();
    expect(await page.getByRole('button', { name: 'Add to crew' }).count()).toBe(0);
    await rig.screenshot(page, 'foundation-05-helper-tablet');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto('/hulls');
    await page.waitForURL(/\/sign-in/);
    expect(consoleErrors.filter((e) => !/401/.test(e))).toEqual([]);
    await context.close();
  });
});
