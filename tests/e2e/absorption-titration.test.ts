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

/*
 * An invented UV-vis titration: emitter band at 450 nm ([E]0 = 20 µM, ε 14 000 M^-1 cm^-1), a
 * 1:1 complex with K_a = 150 M^-1 absorbing to the red, 1 nm grid, σ = 0.001 from a fixed seed.
 */
const concentrationsMm = [0, 2, 4, 6, 8, 12, 16, 20];
function titrationFile(): string {
  const normal = seededNormal(23);
  const gauss = (nm: number, centre: number, width: number) => Math.exp(-(((nm - centre) / width) ** 2) / 2);
  const e0 = 2e-5;
  const lines = [['wavelength (nm)', ...concentrationsMm.map((mM) => `${mM} mM`)].join(',')];
  for (let nm = 350; nm <= 550; nm++)
    lines.push(
      [
        nm,
        ...concentrationsMm.map((mM) => {
          const q = mM / 1000;
          const s = e0 + q + 1 / 150;
          const complex = (2 * e0 * q) / (s + Math.sqrt(s * s - 4 * e0 * q));
          const epsilon = 14000 * gauss(nm, 450, 25);
          const value = epsilon * e0 + (9000 * gauss(nm, 480, 30) - 0.6 * epsilon) * complex;
          return (value + 0.001 * normal()).toFixed(5);
        }),
      ].join(','),
    );
  const file = path.join(screenshotDir, 'e2e-absorption-titration.csv');
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

const seriousFindings = async (page: Page, selector: string) =>
  (
    await new AxeBuilder({ page })
      .include(selector)
      .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'])
      .analyze()
  ).violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => v.id);

describe('absorption evidence in Chromium', () => {
  it('when a titration is previewed and kept, then the flag, K_a both ways and the plots are on screen, also at 390 px', async () => {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    await signInThroughPage(page, server.baseUrl, people.researcher);
    await createStudyThroughPage(page, {
      emitter: 'E2E-acridinium-uv',
      quencher: 'E2E-anisole-uv',
      title: 'E2E absorption: acridinium/anisole',
    });

    await page.getByLabel('UV-vis spectra file').setInputFiles(titrationFile());
    await page.getByLabel('Emitter concentration (µM)').fill('20');
    await page.getByRole('button', { name: 'Preview the absorption' }).click();
    const preview = page.getByRole('region', { name: 'Preview' });
    await expect.poll(() => preview.textContent()).toContain('a ground-state complex may form');
    await page.getByRole('button', { name: 'Keep with the study' }).click();
    const kept = page.getByRole('article', { name: 'Absorption e2e-absorption-titration.csv' });
    await kept.waitFor();
    const text = (await kept.textContent()) ?? '';
    expect(text).toContain('K_a, 1:1 isotherm');
    expect(text).toContain('K_a, Benesi–Hildebrand');
    expect(text).toContain('No K_S: fit the study with the combined static and dynamic model to compare.');
    await kept.getByRole('figure', { name: 'Difference spectra' }).waitFor();
    await kept.getByRole('figure', { name: 'Benesi–Hildebrand plot' }).waitFor();
    expect(await seriousFindings(page, 'article[aria-label^="Absorption "]')).toEqual([]);
    await kept.scrollIntoViewIfNeeded();
    await kept.screenshot({ path: path.join(screenshotDir, 'absorption-panel.png') });

    // At a phone's width nothing of the panel is wider than the screen.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.reload();
    await kept.waitFor();
    await kept.getByRole('figure', { name: 'Benesi–Hildebrand plot' }).waitFor();
    await kept.scrollIntoViewIfNeeded();
    const wide = await page.evaluate(() =>
      [...document.querySelectorAll('#absorption *')]
        .filter((element) => element.getBoundingClientRect().right > window.innerWidth + 1)
        .map((element) => `${element.tagName}.${element.className}`.slice(0, 80))
        .slice(0, 5),
    );
    expect(wide).toEqual([]);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await kept.screenshot({ path: path.join(screenshotDir, 'absorption-panel-phone.png') });
    await context.close();
  });
});
