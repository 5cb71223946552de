import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword, demoPeople, seedDemoData } from '../../server/seed/demo';
import { launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { startLiveServer } from '../support/live-server';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
const person = (key: string) => ({ email: demoPeople.find((p) => p.key === key)!.email, password: demoPassword });
const shot = (page: Page, name: string) => page.screenshot({ path: path.join(screenshotDir, name), fullPage: true });
// tests/fixtures/uploads/README.md: spectra (lambda - 400) / (1 + 500 [Q]) on 450-550 nm.
const spectra = path.join(import.meta.dirname, '../fixtures/uploads/spectrum-matrix.csv');
// Invented series without a unit in its header: I = 1000 / (1 + 0.25 [Q]), [Q] = 0, 2, 4, 6, 8.
const unitless = path.join(screenshotDir, 'unitless-series.csv');

beforeAll(async () => {
  server = await startLiveServer();
  await seedDemoData(server.sequelize);
  browser = await launchBrowser();
  fs.mkdirSync(screenshotDir, { recursive: true });
  fs.writeFileSync(
    unitless,
    `[Q],intensity\n${[0, 2, 4, 6, 8].map((q) => `${q},${1000 / (1 + 0.25 * q)}`).join('\n')}\n`,
  );
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function newStudyPage() {
  const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
  await signInThroughPage(page, server.baseUrl, person('priya'));
  await page.getByRole('link', { name: 'New study' }).click();
  await page.getByLabel('Emitter (required)').selectOption({ label: 'HL-Ir-7' });
  await page.getByLabel('Quencher (required)').selectOption({ label: 'Q-thiol-8' });
  return page;
}

describe('the upload preview in Chromium', () => {
  it('when the study window is typed after the spectra are dropped, then the proposal follows it', async () => {
    const page = await newStudyPage();
    await page.getByLabel('Instrument export').setInputFiles(spectra);
    await page.getByLabel('Points from the file').waitFor();
    await page.getByText(/^Conditions:/).click();
    await page.getByLabel('Window from (nm)').fill('460');
    await page.getByLabel('Window to (nm)').fill('540');
    await page.getByText('Columns and units').click();
    await expect.poll(() => page.getByLabel('From (nm)', { exact: true }).inputValue()).toBe('460');
    expect(await page.getByLabel('To (nm)', { exact: true }).inputValue()).toBe('540');
    // Blank over 460-540 nm: the trapezoid integral of (lambda - 400) is (60 + 140) / 2 x 80 = 8000 (hand-computed).
    expect(await page.getByLabel('Points from the file').textContent()).toContain('0 → 8000');
    await shot(page, 'upload-preview-window.png');
    await page.close();
  });

  it('when a file names no concentration unit, then the unit is asked, doubtful values need ticks, and only then is the study fitted', async () => {
    const page = await newStudyPage();
    await page.getByLabel('Instrument export').setInputFiles(unitless);
    const unit = page.getByLabel('Concentration unit');
    await unit.waitFor();
    expect(await unit.inputValue()).toBe('');
    expect(await page.getByText(/"\[Q\]" names no unit: choose M, mM, µM or nM/).count()).toBe(1);
    await shot(page, 'upload-preview-unit-open.png');
    await unit.selectOption('M');
    const checks = page.getByRole('group', { name: 'Check before using these points' });
    await checks.waitFor();
    expect(await checks.getByRole('checkbox').count()).toBe(2);
    expect(await page.getByRole('button', { name: /^Create and fit/ }).count()).toBe(0);
    expect(await page.getByText('The file’s points wait for each check above to be ticked.').count()).toBe(1);
    await shot(page, 'upload-preview-questions.png');
    await checks.getByRole('checkbox', { name: /reads as 8 M/ }).check();
    await checks.getByRole('checkbox', { name: /K_SV of about 0\.25/ }).check();
    await page.getByRole('button', { name: /^Create and fit 5 points/ }).click();
    // I0/I - 1 = 0.25 [Q] exactly with [Q] in M (by construction), so K_SV = 0.25 M^-1.
    const result = page.getByRole('region', { name: 'Result' });
    await expect.poll(async () => (await result.getByLabel('K_SV result').textContent()) ?? '').toMatch(/^0\.25/);
    await page.close();
  });
});
