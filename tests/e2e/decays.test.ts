import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLabWithMembers } from '../support/accounts';
import { createStudyThroughPage, launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { pngFacts, saveFigure, svgFacts } from '../support/figures';
import { startLiveServer } from '../support/live-server';
import { syntheticDecay } from '../unit/engine/support/synthetic-decay';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let people: Awaited<ReturnType<typeof createLabWithMembers>>['users'];
const shot = (page: Page, name: string) => page.screenshot({ path: path.join(screenshotDir, name), fullPage: true });

/*
 * An invented titration: tau0 = 6.0 ns and K_SV = 250 M^-1 (tau = tau0/(1 + 250 [Q]), Lakowicz
 * 3rd ed. eq. 8.2), decays made by the test's own generator (Gaussian response, Poisson noise,
 * peak 10^4 counts), one column per concentration with [Q] in the header and the response as a column.
 */
const TAU0 = 6e-9;
const K_SV = 250;
const WIDTH = 25e-12;
const CHANNELS = 1024;
const concentrationsMm = [0, 1, 2, 3];
function titrationFile(): string {
  const decays = concentrationsMm.map((mM, i) =>
    syntheticDecay({
      channels: CHANNELS,
      channelWidth: WIDTH,
      responseCentre: 2e-9,
      responseFwhm: 150e-12,
      components: [{ lifetime: TAU0 / (1 + K_SV * mM * 1e-3), fraction: 1 }],
      seed: 4200 + i,
    }),
  );
  const lines = [['time (ns)', 'IRF', ...concentrationsMm.map((mM) => `[Q] ${mM} mM`)].join(',')];
  for (let c = 0; c < CHANNELS; c++)
    lines.push([(c * WIDTH * 1e9).toFixed(4), decays[0]!.response[c], ...decays.map((d) => d.counts[c])].join(','));
  const file = path.join(screenshotDir, 'e2e-decay-titration.csv');
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

describe('decays in Chromium', () => {
  it('when a decay set is uploaded to a study, fitted, kept and used, then tau0 and the lifetime K_SV are on screen and the decay and lifetime plots save as figures', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signInThroughPage(page, server.baseUrl, people.researcher);
    await createStudyThroughPage(page, {
      emitter: 'E2E-Ir-decay',
      quencher: 'E2E-amine-decay',
      title: 'E2E decays: Ir/amine',
    });

    // The pickers are the app's own buttons, not the browser's bare control (its text differs by browser
    // and language): every file input is visually hidden behind a "Choose a file" label.
    const bareInputs = await page
      .locator('input[type="file"]')
      .evaluateAll((inputs) => inputs.filter((input) => input.getBoundingClientRect().width > 1).length);
    expect(bareInputs).toBe(0);
    await page.getByText('Choose a file').first().waitFor();
    await page.getByLabel(/Decay file/).setInputFiles(titrationFile());
    // The chosen file's name stands beside its button.
    await page.getByText('e2e-decay-titration.csv', { exact: true }).waitFor();
    await page.getByRole('table', { name: 'Fitted decays' }).waitFor();
    await page.getByRole('figure', { name: 'Decay plot of [Q] 0 mM' }).waitFor();
    await expect.poll(() => page.getByRole('table', { name: 'Fitted decays' }).textContent()).toContain('[Q] 3 mM');
    await shot(page, 'decays-preview.png');
    await page.getByRole('button', { name: 'Keep this decay set' }).click();
    await page.getByRole('button', { name: 'Use these lifetimes in the study' }).click();
    // tau0 within 1 % of 6.0 ns and K_SV within 5 % of 250 M^-1 (the numbers the decays were made with)
    await expect
      .poll(async () => (await page.getByLabel('Decay τ0').textContent()) ?? '')
      .toMatch(/^(5\.9|6\.0)\d* ± /);
    const kSv = Number(((await page.getByLabel('Lifetime K_SV').textContent()) ?? '').split(' ')[0]);
    expect(Math.abs(kSv / K_SV - 1)).toBeLessThan(0.05);
    await expect.poll(() => page.getByText(/ns \(from decay e2e-decay-titration\.csv\)/).count()).toBe(1);
    await page.getByRole('figure', { name: 'Lifetime Stern–Volmer plot' }).scrollIntoViewIfNeeded();
    await shot(page, 'decays-used.png');

    // The decay and the lifetime Stern–Volmer plot are saved like every other chart ("Save figure").
    const decayPng = await saveFigure(
      page,
      'decay of [Q] 0 mM',
      { kind: 'png', widthCm: 8.5, dpi: 600 },
      screenshotDir,
    );
    expect(decayPng.download.suggestedFilename()).toBe('e2e-decays-ir-amine-q-0-mm-decay-85mm-600dpi.png');
    const png = pngFacts(decayPng.file);
    expect(png.signature).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]); // ISO/IEC 15948, 5.2
    // 8.5 cm / 2.54 cm per inch × 600 dpi = 2008 px (common practice); 600 dpi = 23 622 pixels per metre (ISO/IEC 15948, 11.3.5.3)
    expect(png.width).toBe(2008);
    expect(png.pixelsPerMetre).toBe(23622);
    expect(png.size).toBeGreaterThan(8000); // a drawn chart, not an empty canvas
    const sternVolmerSvg = await saveFigure(
      page,
      'lifetime Stern–Volmer plot',
      { kind: 'svg', widthCm: 8.5 },
      screenshotDir,
    );
    expect(sternVolmerSvg.download.suggestedFilename()).toBe('e2e-decays-ir-amine-lifetime-stern-volmer-85mm.svg');
    const svg = await svgFacts(page, sternVolmerSvg.file);
    expect(svg.error).toBeNull();
    expect(svg.width).toBe('8.5cm');
    expect(svg.title).toBe('Lifetime Stern–Volmer plot');
    expect(svg.lines).toBeGreaterThanOrEqual(1); // the line 1 + K_SV[Q]
    // One mark per decay at its [Q] in mM, tau0/tau within 5 % of 1 + 250 M⁻¹ [Q] (the numbers the decays were made with)
    const marks = svg.marks.filter((mark) => mark.series === 'τ0/τ');
    expect(marks.map((mark) => mark.x)).toEqual(concentrationsMm.map((mM) => expect.closeTo(mM, 6)));
    marks.forEach((mark, i) =>
      expect(Math.abs(mark.y / (1 + K_SV * concentrationsMm[i]! * 1e-3) - 1)).toBeLessThan(0.05),
    );

    // Refit the kept set as a tail fit from channel 160 (4 ns, 2 ns after the pulse): the study's
    // lifetimes and tau0 follow, and the screen says so. tau0 still within 1 % of 6.0 ns.
    const kept = page.getByRole('article', { name: 'Decay set e2e-decay-titration.csv' });
    await kept.getByText('Fit this set again with another model').click();
    await kept.getByLabel('Fit', { exact: true }).selectOption('tail');
    await kept.getByLabel('Start channel').fill('160');
    await kept.getByRole('button', { name: 'Refit this set' }).click();
    await expect
      .poll(async () => (await kept.getByRole('status').textContent()) ?? '')
      .toContain('4 lifetimes and τ0 of the study now come from the new fit');
    await expect
      .poll(async () => (await page.getByLabel('Decay τ0').textContent()) ?? '')
      .toMatch(/^(5\.9|6\.0)\d* ± /);
    await kept.getByRole('status').scrollIntoViewIfNeeded();
    await shot(page, 'decays-refitted.png');
    await page.close();
  });

  it('when one decay of an emitter is fitted on its library page and kept, then its lifetime record is within 1 % of the generated tau, names its file, and follows a refit', async () => {
    // tau = 4.2 ns (invented), convolved with a 150 ps Gaussian response, Poisson noise, peak 10^4
    // counts, made by the test's own generator with seed 5150, independent of the engine.
    const tau = 4.2e-9;
    const decay = syntheticDecay({
      channels: CHANNELS,
      channelWidth: WIDTH,
      responseCentre: 2e-9,
      responseFwhm: 150e-12,
      components: [{ lifetime: tau, fraction: 1 }],
      seed: 5150,
    });
    const lines = ['time (ns),IRF,emitter in MeCN'];
    for (let c = 0; c < CHANNELS; c++)
      lines.push(`${(c * WIDTH * 1e9).toFixed(4)},${decay.response[c]},${decay.counts[c]}`);
    const file = path.join(screenshotDir, 'e2e-emitter-decay.csv');
    fs.writeFileSync(file, `${lines.join('\n')}\n`);
    const sha256 = crypto.createHash('sha256').update(fs.readFileSync(file)).digest('hex');

    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signInThroughPage(page, server.baseUrl, people.researcher);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Library' }).click();
    const add = page.getByRole('form', { name: 'Add compound' });
    await add.getByLabel('Name or code').fill('E2E-Ir-lifetime');
    await add.getByRole('button', { name: 'Add compound' }).click();
    await page.getByRole('heading', { name: 'E2E-Ir-lifetime', level: 1 }).waitFor();

    const lifetimes = page.getByRole('region', { name: 'Excited-state lifetimes' });
    await lifetimes.getByLabel(/Decay file of the emitter/).setInputFiles(file);
    const preview = lifetimes.getByLabel('Decay preview');
    await preview.getByRole('figure', { name: 'Decay plot of emitter in MeCN' }).waitFor();
    // The model picker refits the preview: one exponential by reconvolution with the response column.
    await lifetimes.getByLabel('Fit', { exact: true }).selectOption('reconvolution');
    await lifetimes.getByRole('button', { name: 'Fit again with these choices' }).click();
    await preview.getByText('Reconvolution with the measured response').waitFor();
    await preview.getByLabel('Atmosphere').selectOption('nitrogen');
    await preview.getByLabel('Notes').fill('degassed by three freeze-pump-thaw cycles');
    await shot(page, 'library-decay-preview.png');
    await preview.getByRole('button', { name: 'Keep as a lifetime record' }).click();

    const kept = lifetimes.getByRole('article', { name: 'Decay e2e-emitter-decay.csv' });
    const shown = (await kept.getByLabel('Lifetime from e2e-emitter-decay.csv').textContent()) ?? '';
    const keptTau = Number(shown.split(' ')[0]) * 1e-9;
    // Within 1 % of the 4.2 ns the decay was made with.
    expect(Math.abs(keptTau / tau - 1)).toBeLessThan(0.01);
    expect(await kept.getByLabel('SHA-256 of e2e-emitter-decay.csv').textContent()).toBe(sha256);
    const href = await kept.getByRole('link', { name: 'e2e-emitter-decay.csv' }).getAttribute('href');
    const download = await page.request.get(`${server.baseUrl}${href}`);
    expect(
      crypto
        .createHash('sha256')
        .update(await download.body())
        .digest('hex'),
    ).toBe(sha256);
    // The record itself, in the list of lifetimes, names its file and conditions.
    const record = lifetimes.getByRole('list', { name: 'Lifetimes' }).getByRole('listitem');
    await expect.poll(() => record.count()).toBe(1);
    expect(await record.textContent()).toMatch(
      /nitrogen.*TCSPC decay fit: 1 exponential by reconvolution.*from decay e2e-emitter-decay\.csv/,
    );
    await kept.getByRole('button', { name: 'Show the fit' }).click();
    await kept.getByRole('figure', { name: 'Decay plot of emitter in MeCN' }).waitFor();
    await kept.scrollIntoViewIfNeeded();
    await shot(page, 'library-decay-kept.png');

    // Refit as a tail fit from channel 160 (4 ns, 2 ns after the pulse): the record takes the new
    // value, the screen says so, and tau stays within 1 % of 4.2 ns.
    await kept.getByText('Fit this decay again with another model').click();
    await kept.getByLabel('Fit', { exact: true }).selectOption('tail');
    await kept.getByLabel('Start channel').fill('160');
    await kept.getByRole('button', { name: 'Refit this decay' }).click();
    await expect
      .poll(async () => (await kept.getByRole('status').textContent()) ?? '')
      .toContain('The lifetime record took the new value');
    await expect
      .poll(async () => (await record.textContent()) ?? '')
      .toMatch(/TCSPC decay fit: 1 exponential as a tail fit/);
    const refitTau =
      Number(((await kept.getByLabel('Lifetime from e2e-emitter-decay.csv').textContent()) ?? '').split(' ')[0]) * 1e-9;
    expect(Math.abs(refitTau / tau - 1)).toBeLessThan(0.01);
    await shot(page, 'library-decay-refitted.png');
    await page.close();
  });
});
