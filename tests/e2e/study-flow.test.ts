import fs from 'node:fs';
import path from 'node:path';
import { PDFParse } from 'pdf-parse';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Lab } from '../../server/models';
import { demoLabs, demoPassword, demoPeople, seedDemoData } from '../../server/seed/demo';
import { launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { startLiveServer } from '../support/live-server';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let labId = '';
// Invented test data: I0/I = 1 + 500 [Q] with [Q] in mM (tests/fixtures/uploads/README.md).
const fixture = path.join(import.meta.dirname, '../fixtures/uploads/series-comma-mM.csv');
const person = (key: string) => ({ email: demoPeople.find((p) => p.key === key)!.email, password: demoPassword });
const shot = (page: Page, name: string) => page.screenshot({ path: path.join(screenshotDir, name) });

/** Counts what a person does: clicks, fields typed or chosen, files picked. */
function counter() {
  let actions = 0;
  const act = async <T>(step: Promise<T>) => {
    actions += 1;
    return step;
  };
  return { act, count: () => actions };
}

/** True when the element lies wholly inside the window (the person sees it without scrolling). */
const inView = (page: Page, selector: string) =>
  page.evaluate((css) => {
    const box = document.querySelector(css)!.getBoundingClientRect();
    return box.top >= 0 && box.top < window.innerHeight && box.bottom > 0;
  }, selector);

beforeAll(async () => {
  server = await startLiveServer();
  await seedDemoData(server.sequelize);
  labId = (await Lab.findOne({ where: { slug: demoLabs[0].slug } }))!.id;
  browser = await launchBrowser();
  fs.mkdirSync(screenshotDir, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('the main job in Chromium', () => {
  it('when a researcher goes from the Overview to a fitted kq with an export in hand, then it takes at most 6 actions and the result is in view', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInThroughPage(page, server.baseUrl, person('priya'));
    await page.getByRole('heading', { name: 'Overview', level: 1 }).waitFor();
    await page.getByRole('heading', { name: 'Your drafts' }).waitFor();
    await shot(page, 'flow-overview.png');
    const { act, count } = counter();
    const started = performance.now();

    await act(page.getByRole('link', { name: 'New study' }).click());
    await act(page.getByLabel('Emitter (required)').selectOption({ label: 'HL-Ir-7' }));
    await act(page.getByLabel('Quencher (required)').selectOption({ label: 'Q-thiol-8' }));
    await act(page.getByLabel('Instrument export').setInputFiles(fixture));
    await page.getByLabel('Points from the file').waitFor();
    // The preview speaks the file's unit (mM), τ0 came from the one lifetime record, the title from the pair.
    expect(await page.getByLabel('Points from the file').textContent()).toContain('[Q] in mM');
    expect(await page.getByLabel('Title').inputValue()).toBe('HL-Ir-7 with Q-thiol-8 in acetonitrile');
    expect(await page.getByText('Chosen: series-comma-mM.csv').count()).toBe(1);
    await shot(page, 'flow-new-study-preview.png');
    await act(page.getByRole('button', { name: /^Create and fit 6 points/ }).click());

    const result = page.getByRole('region', { name: 'Result' });
    await expect.poll(async () => (await result.getByLabel('K_SV result').textContent()) ?? '').toMatch(/^500 ± /);
    const seconds = (performance.now() - started) / 1000;
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toBe('Result');
    expect(await inView(page, 'section[aria-label="Result"]')).toBe(true);
    await page.getByText(/^Fitted: K_SV = 500 ± /).waitFor();
    await shot(page, 'flow-result-in-view.png');
    process.stdout.write(`main job: ${count()} actions, ${seconds.toFixed(1)} s\n`);
    expect(count()).toBeLessThanOrEqual(6);
    await page.close();
  });

  it('when a reviewer approves a flagged study from the Overview, then the confirmation restates the flag', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInThroughPage(page, server.baseUrl, person('tomasz'));
    const waiting = page.getByRole('region', { name: 'Waiting for your review' });
    await waiting.waitFor();
    const { act, count } = counter();
    await act(waiting.getByRole('link', { name: /bipyridinium salt Q-viol-5/ }).click());
    await act(page.getByRole('button', { name: 'Approve…' }).click());
    const confirm = page.getByRole('alertdialog', { name: 'Confirm approval' });
    await confirm.getByText('Rate constant faster than diffusion').waitFor();
    await shot(page, 'flow-review-confirmation.png');
    await act(confirm.getByRole('button', { name: 'Approve with these flags' }).click());
    await page.getByText('Approved: the study is locked').waitFor();
    process.stdout.write(`review: ${count()} actions\n`);
    expect(count()).toBeLessThanOrEqual(3);
    await page.close();
  });

  it('when the owner opens a returned study, then the reviewer’s reason is above the fold', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInThroughPage(page, server.baseUrl, person('priya'));
    await page
      .getByRole('region', { name: 'Returned to you' })
      .getByRole('link', { name: /aryl bromide/ })
      .click();
    await page.getByText(/^Returned by Tomasz Wren:/).waitFor();
    expect(await inView(page, 'section[aria-label="Result"] [role="note"]')).toBe(true);
    await shot(page, 'flow-returned-reason.png');
    await page.close();
  });

  it('when an approved study is opened, then it reads as a record: no enabled input and no upload prompt', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInThroughPage(page, server.baseUrl, person('priya'));
    await page.goto(`${server.baseUrl}/labs/${labId}/studies`);
    await page.getByRole('link', { name: 'Demo: HL-Ir-7 (iridium) with the amine Q-amine-3 in MeCN' }).click();
    await page.getByText('Approved and locked.').waitFor();
    await page.getByRole('table', { name: 'Points' }).waitFor();
    // Saving a figure changes nothing, so its size and resolution choices stay open on a record;
    // every other input, select and text area is disabled.
    const enabled = await page
      .locator('main')
      .locator('input:enabled, select:enabled, textarea:enabled')
      .evaluateAll(
        (fields) => fields.filter((field) => !field.closest('[role="group"][aria-label^="Save the"]')).length,
      );
    expect(enabled).toBe(0);
    expect(await page.getByText(/Upload an instrument/).count()).toBe(0);
    await page.screenshot({ path: path.join(screenshotDir, 'flow-locked-study.png'), fullPage: true });
    await page.close();
  });

  it('when a file would replace points typed by hand, then it asks first, and the typed points come back with one click', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInThroughPage(page, server.baseUrl, person('priya'));
    await page
      .getByRole('region', { name: 'Your drafts' })
      .getByRole('link', { name: /thiol Q-thiol-8, no blank yet/ })
      .click();
    await page.getByLabel('Instrument file', { exact: true }).setInputFiles(fixture);
    await page.getByText('Chosen: series-comma-mM.csv').waitFor();
    await page.getByRole('button', { name: 'Use these points' }).click();
    const ask = page.getByRole('alertdialog', { name: 'Replace typed points' });
    await ask.getByText(/replaces the 6 points typed by hand with the file’s 6/).waitFor();
    await shot(page, 'flow-replace-confirmation.png');
    await ask.getByRole('button', { name: 'Replace them' }).click();
    // Notices go through one polite live region, so screen readers hear them too.
    const notices = page.locator('section[aria-live="polite"]');
    await notices.getByText('The file’s points replaced 6 typed by hand').waitFor();
    // The draft has no blank yet; the file starts with one.
    const firstConcentration = () => page.getByLabel('Row 1 Concentration', { exact: true }).inputValue();
    await expect.poll(firstConcentration).toBe('0');
    await notices.getByRole('button', { name: 'Bring them back' }).click();
    await notices.getByText('Your typed points are back').waitFor();
    await expect.poll(firstConcentration).not.toBe('0');
    expect(await page.getByLabel(/^Row \d+ Concentration$/).count()).toBe(7); // the 6 typed points and the empty row
    await page.close();
  });
});

/** The text of a PDF as pdf-parse reads it, whitespace folded (as in tests/api/reports.test.ts). */
async function pdfText(bytes: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    return (await parser.getText()).text.replace(/\s+/g, ' ');
  } finally {
    await parser.destroy();
  }
}

describe('every model’s numbers on screen and in the report', () => {
  it.each([
    {
      model: 'combined static + dynamic (lifetimes decide which root is which)',
      title: 'Demo: HL-Cz-2 (carbazole) with the alkene Q-ene-6, static and dynamic',
      headline: ['K_D (dynamic)', 'K_S (static)'],
      also: ['K_D + K_S', 'K_D × K_S', 'kq'],
    },
    {
      model: 'modified (accessible fraction)',
      title: 'Demo: HL-Ru-4 (ruthenium) with the thiol Q-thiol-8, part of the emission out of reach',
      headline: ['K (accessible part)', 'f_a (accessible fraction)'],
      also: ['kq'],
    },
  ])(
    'when the $model study is opened, then its constants are on screen and the same numbers are in its PDF',
    async ({ title, headline, also }) => {
      const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
      await signInThroughPage(page, server.baseUrl, person('priya'));
      await page.goto(`${server.baseUrl}/labs/${labId}/studies`);
      await page.getByRole('link', { name: title }).click();
      const result = page.getByRole('region', { name: 'Result' });
      const shown: Record<string, string> = {};
      for (const label of headline) {
        const text = (await result.getByLabel(`${label} result`).textContent()) ?? '';
        expect(text, label).toMatch(/ ± /);
        shown[label] = text;
      }
      for (const label of [...headline, ...also]) {
        const text = (await page.getByLabel(label, { exact: true }).textContent()) ?? '';
        expect(text, label).toMatch(/ ± .*95 % interval/);
        // The panel's first line is the estimate, as in the summary at the top.
        if (shown[label]) expect(text.startsWith(shown[label])).toBe(true);
        shown[label] ??= text.slice(0, text.indexOf('95 % interval'));
      }
      await shot(page, `model-numbers-${headline[0]!.startsWith('K_D') ? 'combined' : 'modified'}.png`);
      const studyId = /studies\/([0-9a-f-]{36})/.exec(page.url())![1]!;
      const response = await page.request.get(`${server.baseUrl}/api/labs/${labId}/studies/${studyId}/report.pdf`);
      expect(response.status()).toBe(200);
      const text = await pdfText(await response.body());
      for (const [label, value] of Object.entries(shown)) expect(text, label).toContain(`${label}: ${value.trim()}`);
      await page.close();
    },
  );
});
