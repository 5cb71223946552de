import fs from 'node:fs';
import path from 'node:path';
import { generateSync } from 'otplib';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLabWithMembers } from '../support/accounts';
import { launchBrowser, screenshotDir } from '../support/browser';
import { startLiveServer } from '../support/live-server';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(screenshotDir, name), fullPage: true });
// The code an authenticator app shows `stepsAhead` 30-second steps from now (RFC 6238).
const codeFor = (secret: string, stepsAhead = 0) =>
  generateSync({ secret, epoch: Math.floor(Date.now() / 1000) + stepsAhead * 30 });

async function signIn(page: Page, email: string, password: string) {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

beforeAll(async () => {
  server = await startLiveServer();
  browser = await launchBrowser();
  fs.mkdirSync(screenshotDir, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('two-step sign-in in Chromium', () => {
  it('when an admin turns it on and requires it for the lab, then sign-in asks for the code and the lab rule shows', async () => {
    const { lab, users } = await createLabWithMembers(server.sequelize, { roles: ['admin'] });
    const admin = users.admin;
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await page.goto(`${server.baseUrl}/sign-in`);
    await signIn(page, admin.email, admin.password);
    await page.getByRole('heading', { name: 'Overview', level: 1 }).waitFor();

    await page.goto(`${server.baseUrl}/account`);
    await page.getByRole('button', { name: 'Turn on two-step sign-in' }).click();
    await page.getByRole('img', { name: 'QR code holding your new sign-in key' }).waitFor();
    const keyText = await page.getByText(/^Key:/).textContent();
    const secret = keyText!.replace('Key:', '').trim();
    await shot(page, 'two-factor-setup.png');
    await page.getByLabel('Code from your app').fill(codeFor(secret));
    await page.getByRole('button', { name: 'Confirm and turn on' }).click();
    const codes = page.getByRole('list', { name: 'Recovery codes' });
    await codes.waitFor();
    expect(await codes.getByRole('listitem').count()).toBe(10);
    await shot(page, 'two-factor-recovery-codes.png');
    await page.getByRole('button', { name: 'I have kept them' }).click();
    await page.getByText(/Signing in asks for a code from your phone/).waitFor();

    await page.goto(`${server.baseUrl}/labs/${lab.id}/settings`);
    await page.getByLabel(/Admins and reviewers must use two-step sign-in/).click();
    await expect
      .poll(async () => page.getByLabel(/Admins and reviewers must use two-step sign-in/).isChecked())
      .toBe(true);
    await shot(page, 'lab-sign-in-rules.png');

    await page.goto(`${server.baseUrl}/account/sessions`);
    await page.getByRole('list', { name: 'Signed-in browsers' }).getByText('This browser').waitFor();
    await shot(page, 'account-sessions.png');

    await page.getByRole('button', { name: 'Sign out' }).last().click();
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await signIn(page, admin.email, admin.password);
    await page.getByRole('heading', { name: 'One more step' }).waitFor();
    await page.getByLabel('Code from your app').fill(codeFor(secret, 1));
    await shot(page, 'two-factor-sign-in.png');
    await page.getByRole('button', { name: 'Continue' }).click();
    await page.getByRole('heading', { name: 'Overview', level: 1 }).waitFor();
    await page.close();
  });
});
