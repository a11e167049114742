// Accounts in the browser: each side sees its own navigation and its organization in the
// top bar; only owners see Members; a 401 sends the user to sign-in and back; an invitee
// joins from the e-mailed link.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { QueryTypes } from 'sequelize';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot } from '../support/browser.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';

const navLabels = (page: Page) => page.getByRole('navigation', { name: 'Main' }).getByRole('link').allInnerTexts();

describe('accounts in the browser', () => {
  let t: TestApp;
  let browser: Browser;
  beforeAll(async () => {
    t = await startTestApp();
    const farm = await buildOrganization({ kind: 'farm', name: 'Thistledown Orchard' });
    await buildUser({ organization: farm, role: 'owner', email: 'grower-e2e@example.test', name: 'Hazel Brackett' });
    await buildUser({ organization: farm, role: 'applicator', email: 'applicator-e2e@example.test', name: 'Moss Arlen' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Copperwing Apiaries' });
    await buildUser({ organization: apiary, role: 'owner', email: 'keeper-e2e@example.test', name: 'Tansy Hollis' });
    await buildUser({ organization: apiary, role: 'crew', email: 'crew-e2e@example.test', name: 'Reed Calloway' });
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await t?.stop();
  });

  it('shows the grower their farm in the top bar and a Members entry; the applicator none', async () => {
    const { page, context, externalRequests } = await openWatchedPage(browser);
    await signInThroughPage(page, t.baseUrl, 'grower-e2e@example.test');
    await expect.poll(() => page.locator('.pp-topbar-org').innerText()).toBe('Thistledown Orchard · Owner');
    await expect.poll(() => navLabels(page)).toContain('Members');
    await saveScreenshot(page, 'auth-grower-nav');
    await context.close();

    const applicator = await openWatchedPage(browser);
    await signInThroughPage(applicator.page, t.baseUrl, 'applicator-e2e@example.test');
    await expect.poll(() => applicator.page.locator('.pp-topbar-org').innerText()).toBe('Thistledown Orchard · Applicator');
    expect(await navLabels(applicator.page)).not.toContain('Members');
    await applicator.context.close();
    expect([...externalRequests, ...applicator.externalRequests]).toEqual([]);
  });

  it('shows the beekeeper their apiary business; the field crew has no Members entry and is sent home from it', async () => {
    const keeper = await openWatchedPage(browser);
    await signInThroughPage(keeper.page, t.baseUrl, 'keeper-e2e@example.test');
    await expect.poll(() => keeper.page.locator('.pp-topbar-org').innerText()).toBe('Copperwing Apiaries · Owner');
    await expect.poll(() => navLabels(keeper.page)).toContain('Members');
    await saveScreenshot(keeper.page, 'auth-beekeeper-nav');
    await keeper.context.close();

    const crew = await openWatchedPage(browser, { width: 360, height: 740 });
    await signInThroughPage(crew.page, t.baseUrl, 'crew-e2e@example.test');
    await crew.page.getByRole('button', { name: 'Open navigation' }).click();
    await expect.poll(() => crew.page.getByRole('navigation', { name: 'Main' }).getByRole('link').count()).toBeGreaterThan(0);
    expect(await navLabels(crew.page)).not.toContain('Members');
    await crew.page.goto(`${t.baseUrl}/organization/members`);
    await crew.page.waitForURL(`${t.baseUrl}/`);
    await crew.context.close();
  });

  it('sends a signed-out visitor, and a user whose session ended, to sign-in and back afterwards', async () => {
    const { page, context, consoleErrors } = await openWatchedPage(browser);
    await page.goto(`${t.baseUrl}/organization/members`);
    await page.waitForURL((url) => url.pathname === '/sign-in' && url.searchParams.get('redirect') === '/organization/members');
    await page.getByLabel('E-mail').fill('grower-e2e@example.test');
    await page.getByLabel('Password').fill('pollen-demo-2026');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${t.baseUrl}/organization/members`);
    await expect.poll(() => page.getByRole('list', { name: 'Members' }).innerText()).toContain('Moss Arlen');

    // The session ends on the server (as when an owner removes a member): the next call answers 401.
    await t.context.sequelize.query('DELETE FROM user_sessions', { type: QueryTypes.DELETE });
    // Sending an invitation is the next call, unless a call the page was still making gets
    // its 401 first: either way the page goes to sign-in.
    const invite = page.getByRole('form', { name: 'Invite a member' });
    const sendInvitation = (async () => {
      await invite.getByLabel('E-mail', { exact: true }).fill('someone@example.test', { timeout: 10_000 });
      await invite.getByRole('button', { name: 'Send invitation' }).click({ timeout: 10_000 });
    })().catch(() => undefined);
    await page.waitForURL((url) => url.pathname === '/sign-in' && url.searchParams.get('redirect') === '/organization/members');
    await sendInvitation;
    await page.getByLabel('E-mail').fill('grower-e2e@example.test');
    await page.getByLabel('Password').fill('pollen-demo-2026');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${t.baseUrl}/organization/members`);
    await context.close();
    // The only console errors are the browser's notes of the refused requests (the stale CSRF token, then the 401).
    expect(consoleErrors.filter((e) => !/^Failed to load resource: .* (401|403)/.test(e))).toEqual([]);
  });

  it('lets an owner invite someone who joins from the e-mailed link', async () => {
    const owner = await openWatchedPage(browser);
    await signInThroughPage(owner.page, t.baseUrl, 'keeper-e2e@example.test');
    await owner.page.goto(`${t.baseUrl}/organization/members`);
    await owner.page.getByLabel('E-mail', { exact: true }).fill('new-crew-e2e@example.test');
    await owner.page.getByRole('combobox', { name: 'Role', exact: true }).click();
    await owner.page.getByRole('option', { name: 'Field crew' }).click();
    await owner.page.getByRole('button', { name: 'Send invitation' }).click();
    await expect.poll(() => owner.page.getByRole('list', { name: 'Open invitations' }).innerText()).toContain('new-crew-e2e@example.test');
    await saveScreenshot(owner.page, 'auth-members-page');
    await owner.context.close();

    const message = await eventually(() => t.sink.messages.find((m) => m.to.includes('new-crew-e2e@example.test')));
    const link = new URL(/https?:\/\/\S+invitation#token=[A-Za-z0-9_-]+/.exec(message.text)![0]);
    const invitee = await openWatchedPage(browser, { width: 360, height: 740 });
    await invitee.page.goto(`${t.baseUrl}${link.pathname}${link.hash}`);
    await expect.poll(() => invitee.page.locator('.pp-invitation-for').innerText()).toContain('Copperwing Apiaries');
    await saveScreenshot(invitee.page, 'auth-invitation-page');
    await invitee.page.getByLabel('Your name').fill('Fern Okafor');
    await invitee.page.getByLabel('Choose a password').fill('smoke-and-frames-2026');
    await invitee.page.getByRole('button', { name: 'Join and sign in' }).click();
    await invitee.page.waitForURL(`${t.baseUrl}/`);
    await saveScreenshot(invitee.page, 'auth-invitation-joined');
    const me = await invitee.page.evaluate(async () => (await (await fetch('/api/auth/me')).json()) as { user: { role: string; organization: { name: string } } });
    expect(me.user).toMatchObject({ role: 'crew', organization: { name: 'Copperwing Apiaries' } });
    expect(invitee.externalRequests).toEqual([]);
    await invitee.context.close();
  });
});
