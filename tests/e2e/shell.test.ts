import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLabWithMembers } from '../support/accounts';
import type { TestUser } from '../support/accounts';
import { launchBrowser, screenshotDir } from '../support/browser';
import { startLiveServer } from '../support/live-server';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let page: Page;
let viewer: TestUser;
const requestedHosts = new Set<string>();
const consoleProblems: string[] = [];

beforeAll(async () => {
  server = await startLiveServer();
  viewer = (await createLabWithMembers(server.sequelize, { roles: ['viewer'] })).users.viewer;
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  page.on('request', (request) => requestedHosts.add(new URL(request.url()).host));
  // Helmet's content security policy must let the built app run: any refusal shows up here.
  page.on('console', (message) => {
    if (/Content Security Policy|Refused to/i.test(message.text())) consoleProblems.push(message.text());
  });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('the app shell in Chromium', () => {
  it('when the overview opens after sign-in, then the navigation and the lab news render, without server internals for a viewer', async () => {
    await page.goto(server.baseUrl);
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill(viewer.email);
    await page.getByLabel('Password').fill(viewer.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Overview', level: 1 }).waitFor();
    await expect(page.getByRole('heading', { name: 'Overview', level: 1 }).isVisible()).resolves.toBe(true);
    await page.getByRole('heading', { name: 'Recent activity' }).waitFor();
    // Server facts are for the lab's admins (under "About this workspace"); a viewer starts no study.
    expect(await page.getByText('About this workspace').count()).toBe(0);
    expect(await page.getByRole('link', { name: 'New study' }).count()).toBe(0);
    const navigation = page.getByRole('navigation', { name: 'Main' });
    // A viewer sees only the screens open to viewers: no lab settings, which are for admins. With
    // mail caught (no SMTP_URL) everyone reads the messages addressed to them, and only those.
    expect(await navigation.getByRole('link').allTextContents()).toEqual([
      'Overview',
      'Studies',
      'Library',
      'Members',
      'Compare',
      'Who quenches?',
      'Temperature',
      'Planner',
      'Account',
      'Caught mail',
    ]);
    const font = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
    expect(font).toContain('Lato');
    fs.mkdirSync(screenshotDir, { recursive: true });
    await page.screenshot({ path: path.join(screenshotDir, 'overview.png'), fullPage: true });
  });

  it('when an unknown address is opened, then the not-found screen offers the way back', async () => {
    await page.goto(`${server.baseUrl}/no/such/screen`);
    await page.getByRole('heading', { name: 'Nothing here' }).waitFor();
    await page.getByRole('link', { name: 'Back to the overview' }).click();
    await page.getByRole('heading', { name: 'Overview', level: 1 }).waitFor();
    await page.screenshot({ path: path.join(screenshotDir, 'not-found-back.png') });
  });

  it('when the pages load, then nothing was requested from outside this machine', () => {
    expect([...requestedHosts].every((host) => host.startsWith('127.0.0.1:'))).toBe(true);
  });

  it('when the pages ran, then the content security policy refused nothing', () => {
    expect(consoleProblems).toEqual([]);
  });
});
