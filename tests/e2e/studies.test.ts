import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLabWithMembers } from '../support/accounts';
import { launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { pngFacts, saveFigure, svgFacts } from '../support/figures';
import { startLiveServer } from '../support/live-server';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let people: Awaited<ReturnType<typeof createLabWithMembers>>['users'];
let labId = '';
// Invented test data: I0/I = 1 + 500 [Q] (tests/fixtures/uploads/README.md), so K_SV reads 500 M^-1.
const fixture = path.join(import.meta.dirname, '../fixtures/uploads/series-comma-mM.csv');
const shot = (page: Page, name: string) => page.screenshot({ path: path.join(screenshotDir, name), fullPage: true });

/** At 1400 x 900 the study screen fits the window's width: no panel or grid column cut off on the right. */
async function expectFitsWindow(page: Page, name: string) {
  await page.setViewportSize({ width: 1400, height: 900 });
  await page.screenshot({ path: path.join(screenshotDir, name) });
  const overflow = await page.evaluate(() => ({
    page: document.documentElement.scrollWidth,
    window: window.innerWidth,
    past: [...document.querySelectorAll('main *')]
      .filter((element) => element.getBoundingClientRect().right > window.innerWidth + 1)
      .slice(0, 5)
      .map((element) => `${element.tagName.toLowerCase()}.${String(element.className)}`),
  }));
  expect(overflow.page, `wider than the window: ${overflow.past.join(' | ')}`).toBeLessThanOrEqual(overflow.window);
}

const signIn = (page: Page, person: { email: string; password: string }) =>
  signInThroughPage(page, server.baseUrl, person);

async function fillStudyForm(page: Page, title: string, tag: string) {
  await page.getByRole('link', { name: 'New study' }).click();
  await page.getByLabel('Emitter (required)').selectOption({ label: '+ a new compound…' });
  await page.getByLabel('New emitter name').fill(`E2E-Ir-${tag}`);
  await page.getByLabel('Quencher (required)').selectOption({ label: '+ a new compound…' });
  await page.getByLabel('New quencher name').fill(`E2E-amine-${tag}`);
  await page.getByLabel('Title').fill(title);
  // The rest sits folded under "Conditions".
  await page.getByText(/^Conditions:/).click();
  await page.getByLabel('τ0 (ns)').fill('1000');
}

beforeAll(async () => {
  server = await startLiveServer();
  browser = await launchBrowser();
  const created = await createLabWithMembers(server.sequelize, { roles: ['researcher', 'reviewer'] });
  people = created.users;
  labId = created.lab.id;
  fs.mkdirSync(screenshotDir, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('studies in Chromium', () => {
  it('when a researcher sets up a study, uploads a CSV and submits, then a reviewer approves it', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signIn(page, people.researcher);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Studies' }).click();
    await page.getByRole('heading', { name: 'Studies', level: 1 }).waitFor();
    await page.getByText('No studies match').waitFor();
    await fillStudyForm(page, 'E2E amine titration', '1');
    await shot(page, 'study-form.png');
    await page.getByRole('button', { name: 'Create study' }).click();
    await page.getByRole('heading', { name: 'E2E amine titration', level: 1 }).waitFor();

    await page.getByLabel(/Instrument file/).setInputFiles(fixture);
    await page.getByRole('table', { name: 'Parsed table' }).waitFor();
    await expect.poll(() => page.getByLabel('Points from the file').textContent()).toContain('6 points');
    await shot(page, 'study-upload-preview.png');
    await expectFitsWindow(page, 'study-upload-preview-1400x900.png');
    await page.getByRole('button', { name: 'Use these points' }).click();
    await expect
      .poll(async () => (await page.getByLabel('K_SV', { exact: true }).textContent()) ?? '')
      .toMatch(/^500 ± /);
    await expect
      .poll(async () => (await page.getByLabel('kq', { exact: true }).textContent()) ?? '')
      .toMatch(/^5\.00 × 10⁸ ± /);
    await page.getByRole('img', { name: /^Residuals of the fit/ }).waitFor(); // plots are drawn after the first paint
    await shot(page, 'study-fitted.png');
    await expectFitsWindow(page, 'study-fitted-1400x900.png');
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.getByText('Awaiting review').first().waitFor();
    await page.close();

    const reviewerPage = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signIn(reviewerPage, people.reviewer);
    await reviewerPage.goto(`${server.baseUrl}/labs/${labId}/studies?status=submitted`);
    await reviewerPage.getByRole('link', { name: 'E2E amine titration' }).click();
    await reviewerPage.getByLabel('Review comment').fill('Clean line, approved.');
    await reviewerPage.getByRole('button', { name: 'Approve…' }).click();
    await reviewerPage.getByRole('alertdialog', { name: 'Confirm approval' }).getByRole('button').first().click();
    await reviewerPage.getByText('Approved and locked.').waitFor();
    await shot(reviewerPage, 'study-approved.png');
    await reviewerPage.goto(`${server.baseUrl}/labs/${labId}/studies`);
    await reviewerPage.getByRole('link', { name: 'E2E amine titration' }).waitFor();
    await shot(reviewerPage, 'studies-list.png');
    await reviewerPage.close();
  });

  it('when the plots are saved as PNG and SVG, then each PNG is one or two columns wide at 300 or 600 dpi and each SVG is sized in cm and holds the points, named after the study', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signIn(page, people.researcher);
    await page.goto(`${server.baseUrl}/labs/${labId}/studies`);
    await fillStudyForm(page, 'E2E figures: Ir/amine', '2');
    await page.getByRole('button', { name: 'Create study' }).click();
    await page.getByRole('heading', { name: 'E2E figures: Ir/amine', level: 1 }).waitFor();
    // invented series with lifetimes: I0/I = tau0/tau = 1 + 1000 [Q] (tests/fixtures/uploads/README.md)
    await page
      .getByLabel(/Instrument file/)
      .setInputFiles(path.join(import.meta.dirname, '../fixtures/uploads/series-semicolon-decimal-comma-bom.csv'));
    await page.getByRole('button', { name: 'Use these points' }).click();
    await page.getByRole('figure', { name: 'Lifetime plot' }).waitFor();
    const figures: Array<[string, string]> = [
      ['Stern–Volmer plot', 'stern-volmer'],
      ['residual plot', 'residuals'],
      ['lifetime plot', 'lifetimes'],
    ];
    for (const [what, suffix] of figures) {
      for (const [widthCm, dpi, pixels] of [
        [8.5, 300, 1004],
        [17, 300, 2008],
        [8.5, 600, 2008],
      ] as const) {
        const { download, file } = await saveFigure(page, what, { kind: 'png', widthCm, dpi }, screenshotDir);
        const millimetres = Math.round(widthCm * 10);
        expect(download.suggestedFilename()).toBe(`e2e-figures-ir-amine-${suffix}-${millimetres}mm-${dpi}dpi.png`);
        const png = pngFacts(file);
        // PNG signature (PNG specification, ISO/IEC 15948, section 5.2): 89 50 4E 47 0D 0A 1A 0A
        expect(png.signature).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
        // IHDR width: the column width at the resolution, 8.5 cm / 2.54 × 300 = 1004 px (common practice: 1 in = 2.54 cm)
        expect(png.width).toBe(pixels);
        // pHYs right after IHDR: 300 dpi = 11 811 pixels per metre, 600 dpi = 23 622 (ISO/IEC 15948, 11.3.5.3)
        expect(png.pixelsPerMetre).toBe(dpi === 300 ? 11811 : 23622);
        expect(png.size).toBeGreaterThan(8000); // a drawn chart, not an empty canvas
      }
    }
    // The same figures as SVG: each file parses as XML, is 8.5 cm wide and holds the plotted points with their values.
    const parsed: Record<string, Awaited<ReturnType<typeof svgFacts>>> = {};
    for (const [what, suffix] of figures) {
      const { download, file } = await saveFigure(page, what, { kind: 'svg', widthCm: 8.5 }, screenshotDir);
      expect(download.suggestedFilename()).toBe(`e2e-figures-ir-amine-${suffix}-85mm.svg`);
      parsed[suffix] = await svgFacts(page, file);
      expect(parsed[suffix]!.width).toBe('8.5cm');
    }
    for (const [, suffix] of figures) {
      expect(parsed[suffix]!.error, suffix).toBeNull();
      expect(parsed[suffix]!.root).toBe('svg');
      expect(parsed[suffix]!.marks.length, suffix).toBeGreaterThanOrEqual(6);
    }
    expect(parsed['stern-volmer']!.title).toBe('Stern–Volmer plot');
    expect(parsed['stern-volmer']!.lines).toBeGreaterThanOrEqual(1); // the fitted line
    // The fixture's points (tests/fixtures/uploads/README.md): [Q] = 0 to 800 µM, I0/I = 1 + 1000 M⁻¹ [Q].
    const used = parsed['stern-volmer']!.marks.filter((mark) => mark.series === 'Points used');
    expect(used.map((mark) => mark.x)).toEqual([0, 0.1, 0.2, 0.4, 0.6, 0.8].map((mM) => expect.closeTo(mM, 6)));
    expect(used.map((mark) => mark.y)).toEqual(
      [0, 0.1, 0.2, 0.4, 0.6, 0.8].map((mM) => expect.closeTo(1 + 1000 * mM * 1e-3, 4)),
    );
    await shot(page, 'study-figures.png');
    await expectFitsWindow(page, 'study-figures-1400x900.png');
    await page.close();
  });
});
