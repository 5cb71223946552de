import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Membership } from '../../server/models';
import { createLabWithMembers } from '../support/accounts';
import { launchBrowser, screenshotDir } from '../support/browser';
import { startLiveServer } from '../support/live-server';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let admin: { email: string; password: string };
let users: Awaited<ReturnType<typeof createLabWithMembers>>['users'];
let labName: string;
let labId: string;
const newcomer = {
  email: `newcomer-${Date.now()}@halflight.test`,
  name: 'Noor Okafor',
  password: 'amber dusk lantern 42',
};

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(screenshotDir, name), fullPage: true });

async function signIn(page: Page, email: string, password: string) {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

beforeAll(async () => {
  server = await startLiveServer();
  browser = await launchBrowser();
  const created = await createLabWithMembers(server.sequelize, { roles: ['admin'] });
  const { lab } = created;
  users = created.users;
  admin = users.admin;
  labName = lab.name;
  labId = lab.id;
  fs.mkdirSync(screenshotDir, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('accounts in Chromium', () => {
  it('when an admin invites a reviewer by e-mail, then the newcomer joins through the caught link', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 860 } });
    await page.goto(`${server.baseUrl}/`);
    await page.waitForURL(/\/sign-in\?next=%2F$/);
    await shot(page, 'sign-in.png');
    await signIn(page, admin.email, admin.password);
    await page.getByRole('heading', { name: 'Overview', level: 1 }).waitFor();
    await page.getByRole('region', { name: 'Your labs' }).getByText(labName).waitFor();
    await shot(page, 'overview-signed-in.png');

    const navigation = page.getByRole('navigation', { name: 'Main' });
    await navigation.getByRole('link', { name: 'Members' }).click();
    await page.getByRole('heading', { name: 'Members', level: 1 }).waitFor();
    await page.getByLabel('E-mail of the person to invite').fill(newcomer.email);
    await page.getByRole('radio', { name: /^Reviewer/ }).check();
    await page.getByRole('button', { name: 'Send invitation' }).click();
    const waiting = page.getByRole('region', { name: 'Invitations waiting for an answer' });
    await waiting.getByText(newcomer.email).waitFor();
    await shot(page, 'members-admin.png');

    await navigation.getByRole('link', { name: 'Caught mail' }).click();
    await page.getByRole('heading', { name: 'Caught mail', level: 1 }).waitFor();
    const message = page.getByRole('button', { name: new RegExp(newcomer.email.replace(/[.+]/g, '\\$&')) });
    // The catcher stores a message once SMTP delivery finishes, which may trail the API's answer.
    for (let attempt = 0; attempt < 10 && !(await message.isVisible()); attempt += 1) {
      await page.waitForTimeout(500);
      await page.reload();
      await page.getByRole('heading', { name: 'Caught mail', level: 1 }).waitFor();
    }
    await message.click();
    const reading = page.getByRole('article');
    await reading.getByRole('heading', { name: `Join ${labName} on Halflight` }).waitFor();
    const link = reading.getByRole('link', { name: /\/invitations\// });
    const href = await link.getAttribute('href');
    expect(href).toMatch(/\/invitations\/[A-Za-z0-9_-]{20,}$/);
    expect(await page.locator('article iframe, article [srcdoc]').count()).toBe(0);
    await shot(page, 'caught-mail.png');

    // The newcomer opens the link in their own browser, not in the admin's session.
    const context = await browser.newContext({ viewport: { width: 1280, height: 860 } });
    const guest = await context.newPage();
    await guest.goto(`${server.baseUrl}${new URL(href!).pathname}`);
    await guest.getByRole('heading', { name: `Join ${labName}` }).waitFor();
    await shot(guest, 'accept-invitation.png');
    await guest.getByLabel('Your name').fill(newcomer.name);
    await guest.getByLabel('Password', { exact: true }).fill(newcomer.password);
    await guest.getByLabel('Password, once more').fill(newcomer.password);
    await guest.getByRole('button', { name: 'Create my account and join' }).click();

    await guest.getByRole('heading', { name: 'Members', level: 1 }).waitFor();
    const rail = guest.getByRole('complementary');
    await expect(rail.getByText(labName).isVisible()).resolves.toBe(true);
    await expect(rail.getByText('Reviewer', { exact: true }).isVisible()).resolves.toBe(true);
    await expect(guest.getByText(`Signed in as ${newcomer.name}`).isVisible()).resolves.toBe(true);
    // A reviewer reads the member list but gets no controls; their caught mail holds nothing of the admin's.
    await expect(guest.getByRole('button', { name: /^Remove/ }).count()).resolves.toBe(0);
    await shot(guest, 'members-reviewer.png');

    await guest.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Overview' }).click();
    const labs = guest.getByRole('region', { name: 'Your labs' });
    await labs.getByText(labName).waitFor();
    await expect(labs.getByText('Reviewer', { exact: true }).isVisible()).resolves.toBe(true);
    await guest.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Account' }).click();
    await guest.getByRole('heading', { name: 'Account', level: 1 }).waitFor();
    await shot(guest, 'account.png');
    await guest.getByRole('button', { name: 'Sign out' }).click();
    await guest.getByRole('heading', { name: 'Sign in' }).waitFor();
    await context.close();
    await page.close();
  });

  it('when the password screens and a spent invitation open, then each explains itself', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await page.goto(`${server.baseUrl}/sign-in`);
    await signIn(page, admin.email, 'not the password at all');
    await page.getByRole('alert').waitFor();
    await shot(page, 'sign-in-refused.png');
    await page.getByRole('link', { name: 'Get a link to choose a new password' }).click();
    // The sign-in screen has an E-mail field too: wait for the new screen (its code loads on demand) before typing.
    await page.getByRole('heading', { name: 'Choose a new password' }).waitFor();
    await page.getByLabel('E-mail').fill(newcomer.email);
    await page.getByRole('button', { name: 'Send me a link' }).click();
    await page.getByText('If that address belongs to a Halflight account').waitFor();
    await shot(page, 'forgot-password.png');
    await page.goto(`${server.baseUrl}/reset-password?token=${'x'.repeat(32)}`);
    await page.getByLabel('New password', { exact: true }).fill('a fresh passphrase 7');
    await page.getByLabel('New password, once more').fill('a different one 8');
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await page.getByText('The two entries differ.').waitFor();
    await shot(page, 'reset-password.png');
    await page.goto(`${server.baseUrl}/invitations/${'y'.repeat(32)}`);
    await page.getByRole('heading', { name: 'This invitation no longer works' }).waitFor();
    await shot(page, 'invitation-spent.png');
    await page.close();
  });

  it('when an admin of two labs works the rail and the member table, then roles follow the lab and the last admin stays', async () => {
    const { lab: demoLab } = await createLabWithMembers(server.sequelize, {
      roles: ['viewer'],
      labName: 'Demo — Lantern Bay Group',
    });
    await demoLab.update({ isDemo: true });
    await Membership.create({ labId: demoLab.id, userId: users.admin.id, role: 'researcher' });
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await page.goto(`${server.baseUrl}/labs/${labId}/members`);
    await signIn(page, admin.email, admin.password);
    await page.getByRole('heading', { name: 'Members', level: 1 }).waitFor();

    await page.getByLabel(`Role of ${users.admin.name}`).selectOption('viewer');
    await page.getByText('A lab always needs at least one admin.').waitFor();
    await page.getByRole('button', { name: `Remove ${users.admin.name}` }).click();
    await page.getByRole('button', { name: 'Yes, remove' }).click();
    await page.getByText('A lab always needs at least one admin.').waitFor();
    await expect(page.getByLabel(`Role of ${users.admin.name}`).inputValue()).resolves.toBe('admin');
    await shot(page, 'members-last-admin.png');

    await page
      .getByRole('complementary')
      .getByRole('button', { name: /Demo — Lantern Bay Group/ })
      .click();
    await page.waitForURL(`${server.baseUrl}/labs/${demoLab.id}/members`);
    const rail = page.getByRole('complementary');
    await rail.getByText('Researcher', { exact: true }).waitFor();
    await expect(rail.getByText('Demo', { exact: true }).isVisible()).resolves.toBe(true);
    await expect(page.getByRole('button', { name: 'Send invitation' }).count()).resolves.toBe(0);
    await shot(page, 'lab-switched.png');
    // The choice is remembered: the overview opens on the lab picked last.
    await page.goto(`${server.baseUrl}/`);
    await page.getByRole('complementary').getByText('Researcher', { exact: true }).waitFor();
    await page.close();
  });
});
