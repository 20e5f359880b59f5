import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
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
const designer = demoAccounts[2];
const stamp = Date.now().toString(36);
const curveName = `Skiff deck camber ${stamp}`;
const hullName = `Saltmarsh skiff, hull ${stamp}`;

/** The builder's own hull at the demo plan (deck camber: parabola, 60 mm over 1860 mm), the helper on its crew. */
async function builderHull(): Promise<number> {
  const owner = (await User.findOne({ where: { email: builder.email } }))!;
  const crewHelper = (await User.findOne({ where: { email: helper.email } }))!;
  const hull = await hullCreate(owner.id, { name: hullName, units: 'mm', notes: 'For the Library browser test.' });
  await HullMember.create({ hullId: hull.id, userId: crewHelper.id, role: 'helper' });
  await revisionSave({ hullId: hull.id, units: 'mm', authorId: owner.id, role: 'owner', baseRevisionId: null, plan: demoPlan() });
  return hull.id;
}

async function openHeaderLink(page: Page, name: string | RegExp) {
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name }).click();
}

describe('an invitation by e-mail, in the browser', () => {
  it('an owner invites a newcomer; the link from the local outbox makes their account and puts them on the crew, once', async () => {
    const hullId = await builderHull();
    const newcomer = `newcomer-${stamp}@example.test`;
    const o = await rig.newPage();
    await signInThroughForm(o.page, builder.email, builder.password);
    await o.page.goto(`/hulls/${hullId}`);
    await o.page.getByRole('navigation', { name: 'Working together on this hull' }).getByRole('link', { name: 'Invitations' }).click();
    await o.page.getByLabel('Their e-mail').fill(newcomer);
    await o.page.getByLabel('Role on this hull').selectOption('builder');
    await o.page.getByRole('button', { name: 'Send invitation' }).click();
    await o.page.getByText(`Invitation sent to ${newcomer}, as Builder.`).waitFor();
    await o.page.getByRole('region', { name: 'Waiting for an answer' }).getByText(newcomer).waitFor();
    await rig.screenshot(o.page, 'invite-01-sent');

    // Someone else, signed out, on the same machine: the local outbox, then the link in the mail.
    const n = await rig.newPage();
    await n.page.goto('/dev/mail');
    const mail = n.page.getByRole('listitem').filter({ hasText: `To ${newcomer}` });
    await mail.getByText(`${builder.displayName} invites you to the crew of ${hullName}`).waitFor();
    await rig.screenshot(n.page, 'invite-02-outbox');
    const link = await mail.getByRole('link').getAttribute('href');
    expect(link).toMatch(/\/invitation#[A-Za-z0-9_-]{43}$/);
    await mail.getByRole('link').click();
    await n.page.getByText(`invites ${newcomer} onto the crew of ${hullName}`).waitFor();
    // The token is kept out of the address bar once read.
    expect(new URL(n.page.url()).hash).toBe('');
    await n.page.getByLabel('Your name').fill('Noor Wend');
    await n.page.getByLabel('Choose a password').fill('a long enough password');
    await rig.screenshot(n.page, 'invite-03-accept');
    await n.page.getByRole('button', { name: 'Make my account and join the crew' }).click();
    await n.page.getByRole('heading', { name: hullName, level: 1 }).waitFor();
    expect(await n.page.getByText('Your role').locator('..').innerText()).toContain('Builder');
    await rig.screenshot(n.page, 'invite-04-on-the-crew');

    // The same link again, in a fresh browser: it has been used.
    const again = await rig.newPage();
    await again.page.goto(link!);
    await again.page.getByText('This invitation cannot be used.').waitFor();
    expect(await again.page.getByText('has been used already').count()).toBe(1);

    expect(o.consoleErrors).toEqual([]);
    expect(n.consoleErrors).toEqual([]);
    // The used link's preview answers 410, which the browser logs as a failed request.
    expect(again.consoleErrors.filter((e) => !/410/.test(e))).toEqual([]);
    await Promise.all([o.context.close(), n.context.close(), again.context.close()]);
  });
});

describe('the Library in the browser', () => {
  it('a designer publishes, a builder takes it, the designer publishes again, the builder sees the notice and the comparison and moves', async () => {
    const hullId = await builderHull();

    // The designer publishes a camber curve, shared with the builder.
    const d = await rig.newPage();
    await signInThroughForm(d.page, designer.email, designer.password);
    await openHeaderLink(d.page, 'Library');
    await d.page.getByRole('heading', { name: 'Library', level: 1 }).waitFor();
    await d.page.getByRole('link', { name: 'Publish' }).click();
    await d.page.getByLabel('Name').fill(curveName);
    await d.page.getByLabel('Rise (mm)').fill('60');
    await d.page.getByLabel('At a beam of (mm)').fill('1860');
    await d.page.getByLabel('Notes').fill('Parabolic deck camber for the 4.9 m skiff.');
    await d.page.getByLabel('Rules that go with it').fill('Rise measured at the widest beam, 1860 mm, top of deck.');
    await d.page.getByLabel('Visibility').selectOption('shared');
    await d.page.getByLabel('Share with').fill(builder.email);
    await d.page.getByRole('img', { name: 'The camber pattern as typed' }).waitFor();
    await rig.screenshot(d.page, 'library-01-publish-form');
    await d.page.getByRole('button', { name: 'Publish' }).click();
    await d.page.getByRole('heading', { name: curveName, level: 1 }).waitFor();
    const itemUrl = d.page.url();
    await rig.screenshot(d.page, 'library-02-published');

    // The builder finds it in the Library (shared with them) and takes it into the hull.
    const b = await rig.newPage();
    await signInThroughForm(b.page, builder.email, builder.password);
    await openHeaderLink(b.page, 'Library');
    const shared = b.page.getByRole('region', { name: 'Shared with you' });
    await shared.getByRole('link', { name: curveName }).click();
    await b.page.getByRole('heading', { name: 'Take into hull' }).waitFor();
    await b.page.getByLabel('Hull', { exact: true }).selectOption({ label: hullName });
    await b.page.getByRole('button', { name: 'Take into hull' }).click();
    await b.page.getByText(`Taken into ${hullName}.`).waitFor();
    await rig.screenshot(b.page, 'library-03-taken');
    await b.page.getByRole('link', { name: 'See what the hull took from the Library' }).click();
    await b.page.getByText('That is the newest revision.').waitFor();
    expect(await b.page.getByText('This hull follows revision 1').count()).toBe(1);

    // The designer publishes revision 2: more crown.
    await d.page.goto(itemUrl);
    await d.page.getByRole('link', { name: 'Publish a new revision' }).click();
    await d.page.getByRole('heading', { name: `Revision 2 of ${curveName}` }).waitFor();
    await d.page.getByLabel('Rise (mm)').fill('80');
    await d.page.getByLabel('Notes').fill('More crown: sheds water better off the side decks.');
    await d.page.getByRole('button', { name: 'Publish revision 2' }).click();
    await d.page.getByText('revision 2 of 2').waitFor();

    // The builder sees the notice, compares, and moves the hull.
    await b.page.goto('/hulls');
    const bell = b.page.getByRole('link', { name: 'Notices: 1 new' });
    await bell.waitFor();
    await rig.screenshot(b.page, 'library-04-notice-in-header');
    await bell.click();
    const notice = b.page.getByRole('listitem').filter({ hasText: hullName });
    await notice.getByText('Your hull').waitFor();
    await rig.screenshot(b.page, 'library-05-notices');
    await notice.getByRole('link', { name: 'Compare and decide' }).click();
    await b.page.getByRole('heading', { name: `${curveName}: revision 1 → revision 2` }).waitFor();
    await b.page.getByRole('img', { name: /drawn over each other/ }).waitFor();
    const frame3 = b.page.getByRole('table', { name: 'How far each part would move' }).getByRole('row', { name: /Frame 3/ });
    // The deck line at St 3 (half-beam 900 mm of a 930 mm pattern) rises 20 × (900/930)² = 18.7 mm on the centreline.
    expect(await frame3.innerText()).toContain('18.7 mm');
    await rig.screenshot(b.page, 'library-06-compare');
    await b.page.getByRole('button', { name: 'Move the hull to revision 2' }).click();
    await b.page.getByText('The hull now follows revision 2.').waitFor();
    await rig.screenshot(b.page, 'library-07-moved');

    const plan = await b.page.evaluate(async (id) => (await fetch(`/api/hulls/${id}/plan`)).json(), hullId);
    expect(plan.plan.lines.deck.camber.crown).toEqual({ kind: 'rise', riseMm: 80, referenceBeamMm: 1860 });
    expect(plan.revision.summary).toBe(`Moved to camber "${curveName}" (revision 2) from the Library`);

    // The same comparison page on a workshop tablet, as the helper sees it: no move, just the figures.
    const h = await rig.newPage({ width: 820, height: 1180 });
    await signInThroughForm(h.page, helper.email, helper.password);
    await h.page.goto(`/hulls/${hullId}/library`);
    await h.page.getByText('This hull follows').waitFor();
    await rig.screenshot(h.page, 'library-08-helper-tablet');

    expect(d.consoleErrors).toEqual([]);
    expect(b.consoleErrors).toEqual([]);
    expect(h.consoleErrors).toEqual([]);
    await Promise.all([d.context.close(), b.context.close(), h.context.close()]);
  });
});
