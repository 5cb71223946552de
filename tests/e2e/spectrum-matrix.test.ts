import fs from 'node:fs';
import path from 'node:path';
import { AxeBuilder } from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLabWithMembers } from '../support/accounts';
import { createStudyThroughPage, launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { startLiveServer } from '../support/live-server';
import { seededNormal } from '../unit/engine/support/seeded-random';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let people: Awaited<ReturnType<typeof createLabWithMembers>>['users'];
const shot = (page: Page, name: string) => page.screenshot({ path: path.join(screenshotDir, name), fullPage: true });

/*
 * Invented emission spectra: a monomer band at 430 nm quenched with K_SV = 200 M^-1 and an
 * exciplex band at 530 nm that grows as the quenched fraction 200[Q]/(1 + 200[Q]) (Lakowicz,
 * 3rd ed., ch. 8), 1 nm grid, 5 counts of noise from a fixed seed.
 */
const concentrationsMm = [0, 0, 2, 4, 6, 8, 10];
function exciplexFile(): string {
  const normal = seededNormal(7);
  const band = (nm: number, centre: number, width: number, height: number) =>
    height * Math.exp(-(((nm - centre) / width) ** 2) / 2);
  const lines = [['wavelength (nm)', ...concentrationsMm.map((mM, i) => `[Q] ${mM} mM rep ${i + 1}`)].join(',')];
  for (let nm = 400; nm <= 600; nm++)
    lines.push(
      [
        nm,
        ...concentrationsMm.map((mM) => {
          const q = mM / 1000;
          const value = band(nm, 430, 15, 1000) / (1 + 200 * q) + (band(nm, 530, 25, 600) * 200 * q) / (1 + 200 * q);
          return (value + 5 * normal()).toFixed(2);
        }),
      ].join(','),
    );
  const file = path.join(screenshotDir, 'e2e-exciplex-spectra.csv');
  fs.writeFileSync(file, `${lines.join('\n')}\n`);
  return file;
}

beforeAll(async () => {
  server = await startLiveServer();
  browser = await launchBrowser();
  people = (await createLabWithMembers(server.sequelize, { roles: ['researcher'] })).users;
  fs.mkdirSync(screenshotDir, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('emission by wavelength in Chromium', () => {
  it('when spectra with an exciplex band are kept on a study, then both flags and the K_SV(λ) plot are on screen', async () => {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    await signInThroughPage(page, server.baseUrl, people.researcher);
    await createStudyThroughPage(page, {
      emitter: 'E2E-pyrene-spectra',
      quencher: 'E2E-aniline-spectra',
      title: 'E2E spectra: pyrene/aniline',
    });

    await page.getByLabel('Spectra file', { exact: true }).setInputFiles(exciplexFile());
    await page.getByRole('button', { name: 'Keep and analyse the spectra' }).click();
    const kept = page.getByRole('article', { name: 'Spectra e2e-exciplex-spectra.csv' });
    await kept.waitFor();
    await expect.poll(() => kept.textContent()).toContain('Two emitting species or an exciplex may be present');
    expect(await kept.textContent()).toContain('A new emission grows with the quencher (exciplex or product)');
    await kept.getByRole('figure', { name: 'K_SV against wavelength' }).waitFor();
    await kept.getByRole('figure', { name: 'Emission spectra at each quencher concentration' }).waitFor();
    // The panel as every screen is held to: axe finds nothing serious or critical in it.
    const audit = await new AxeBuilder({ page })
      .include('article[aria-label^="Spectra "]')
      .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'])
      .analyze();
    expect(audit.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => v.id)).toEqual(
      [],
    );
    await kept.scrollIntoViewIfNeeded();
    await kept.screenshot({ path: path.join(screenshotDir, 'spectrum-matrix-panel.png') });
    await shot(page, 'spectrum-matrix-study.png');
    await context.close();
  });
});
