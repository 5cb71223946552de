import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Lab } from '../../server/models';
import { demoLabs, demoPassword, demoPeople, seedDemoData } from '../../server/seed/demo';
import { demoExciplexFileName } from '../../server/seed/demo-exciplex';
import { launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { startLiveServer } from '../support/live-server';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let page: Page;
let labId = '';

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

describe('the demo exciplex, in Chromium', () => {
  it('when the iridium/amine dilution study is opened, then the spectra panel and the mechanism panel both say a new emission grows with [Q]', async () => {
    await page.goto(`${server.baseUrl}/labs/${labId}/studies`);
    await page
      .getByRole('link', { name: 'Demo: HL-Ir-7 (iridium) with the amine Q-amine-3, stock without emitter' })
      .click();
    // The spectra panel: the kept demo matrix carries the flag (the engine's words, analyse-spectrum-matrix.ts).
    const kept = page.getByRole('article', { name: `Spectra ${demoExciplexFileName}` });
    await kept.waitFor();
    await expect
      .poll(() => kept.textContent())
      .toContain('A new emission grows with the quencher (exciplex or product)');
    // The mechanism panel reads the same matrix: its wavelength piece names the exciplex, and so does the verdict.
    const panel = page.getByRole('region', { name: 'Mechanism' });
    const piece = panel.getByRole('article', { name: 'Same K_SV at every wavelength' });
    await piece.waitFor();
    expect(await piece.textContent()).toMatch(
      /A new emission grows with the quencher .*an exciplex or an emitting product/,
    );
    expect(await panel.getByRole('group', { name: 'Combined verdict' }).textContent()).toMatch(
      /Two emitters or an exciplex/,
    );
    await panel.scrollIntoViewIfNeeded();
    await panel.screenshot({ path: path.join(screenshotDir, 'mechanism-panel-exciplex.png') });
  });
});
