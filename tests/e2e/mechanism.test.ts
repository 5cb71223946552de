import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Lab } from '../../server/models';
import { demoLabs, demoPassword, demoPeople, seedDemoData } from '../../server/seed/demo';
import { launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { startLiveServer } from '../support/live-server';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let page: Page;
let labId = '';
const shot = (name: string) => page.screenshot({ path: path.join(screenshotDir, name), fullPage: true });

beforeAll(async () => {
  server = await startLiveServer();
  await seedDemoData(server.sequelize);
  labId = (await Lab.findOne({ where: { slug: demoLabs[0].slug } }))!.id;
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1360, height: 900 } });
  fs.mkdirSync(screenshotDir, { recursive: true });
  await signInThroughPage(page, server.baseUrl, { email: demoPeople[0]!.email, password: demoPassword });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('mechanism evidence, in Chromium', () => {
  it('when the demo temperature series are opened, then one reads dynamic with its Ea and the other static', async () => {
    await page.goto(`${server.baseUrl}/labs/${labId}/studies`);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Temperature' }).click();
    const list = page.getByRole('region', { name: 'Pairs measured at several temperatures' });
    await list.getByRole('link').first().waitFor();
    const links = await list.getByRole('link').all();
    expect(links).toHaveLength(2);
    const verdicts: string[] = [];
    for (const [index, name] of (await Promise.all(links.map((link) => link.textContent()))).entries()) {
      await list.getByRole('link', { name: name! }).click();
      const verdict = page.getByRole('status', { name: 'Temperature verdict' });
      await verdict.waitFor();
      verdicts.push((await verdict.textContent()) ?? '');
      const ea = (await page.getByLabel('Activation energy').textContent()) ?? '';
      expect(ea).toMatch(/kJ mol⁻¹/);
      await page.getByRole('figure', { name: 'Arrhenius plot' }).waitFor();
      await shot(`temperature-series-${index + 1}.png`);
    }
    expect(verdicts.some((text) => text.startsWith('Dynamic'))).toBe(true);
    expect(verdicts.some((text) => text.startsWith('Static'))).toBe(true);
  });
});
