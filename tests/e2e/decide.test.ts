import fs from 'node:fs';
import path from 'node:path';
import { Op } from 'sequelize';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Compound, Lab, Study } from '../../server/models';
import { demoLabs, demoPassword, demoPeople, seedDemoData } from '../../server/seed/demo';
import { launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { startLiveServer } from '../support/live-server';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let page: Page;
let labId = '';
const cspRefusals: string[] = [];
const shot = (name: string) => page.screenshot({ path: path.join(screenshotDir, name), fullPage: true });

beforeAll(async () => {
  server = await startLiveServer();
  await seedDemoData(server.sequelize);
  labId = (await Lab.findOne({ where: { slug: demoLabs[0].slug } }))!.id;
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1360, height: 900 }, acceptDownloads: true });
  page.on('console', (message) => {
    if (/Content Security Policy|Refused to/i.test(message.text())) cspRefusals.push(message.text());
  });
  fs.mkdirSync(screenshotDir, { recursive: true });
  await signInThroughPage(page, server.baseUrl, { email: demoPeople[0]!.email, password: demoPassword });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('deciding who quenches, in Chromium', () => {
  it('when the lab lead lands on the overview, then the dashboard shows reviews waiting, flags and activity', async () => {
    const submitted = await Study.count({ where: { labId, isCurrent: true, status: 'submitted' } });
    await page.goto(`${server.baseUrl}/`);
    const waiting = page.getByRole('region', { name: 'Waiting for your review' });
    await waiting.waitFor();
    expect(await waiting.getByRole('listitem').count()).toBe(submitted);
    await page.getByRole('region', { name: 'Recently flagged' }).waitFor();
    await page.getByRole('region', { name: 'Recent activity' }).waitFor();
    await shot('overview-dashboard.png');
  });

  it('when a scenario is built from the demo lab, then the largest share is shown for the right component', async () => {
    // The demo emitter with the most studied quenchers, and two of those quenchers.
    const studies = await Study.findAll({ where: { labId, isCurrent: true, kq: { [Op.ne]: null } } });
    const byEmitter = new Map<string, Study[]>();
    for (const study of studies) byEmitter.set(study.emitterId, [...(byEmitter.get(study.emitterId) ?? []), study]);
    const [emitterId, emitterStudies] = [...byEmitter.entries()].sort((a, b) => b[1].length - a[1].length)[0]!;
    const quencherIds = [...new Set(emitterStudies.map((study) => study.quencherId))].slice(0, 2);
    const emitter = (await Compound.findByPk(emitterId))!;
    const quenchers = await Promise.all(quencherIds.map((id) => Compound.findByPk(id)));

    await page.goto(`${server.baseUrl}/labs/${labId}/scenarios/new`);
    await page.getByLabel('Name').fill('Demo coupling as run');
    await page.getByLabel('Emitter (catalyst)').selectOption({ label: emitter.name });
    await page.getByLabel('τ0 (ns)').fill('1000');
    await page.getByLabel('Compound').first().selectOption({ label: quenchers[0]!.name });
    await page.getByLabel('In reaction (mM)').first().fill('50');
    if (quenchers[1]) {
      await page.getByRole('button', { name: 'Add a component' }).click();
      await page.getByLabel('Compound').nth(1).selectOption({ label: quenchers[1].name });
      await page.getByLabel('In reaction (mM)').nth(1).fill('5');
    }
    await page.getByRole('button', { name: 'Add dissolved O₂' }).click();
    await page.getByLabel('kq of O₂ (M⁻¹ s⁻¹)').fill('2.4e9');
    await page.getByLabel('In reaction (mM)').last().fill('1.9');
    await page.getByRole('button', { name: 'Save and estimate' }).click();
    await page.getByRole('heading', { name: 'Demo coupling as run' }).waitFor();

    // Expected shares from the API answer the screen was drawn from.
    const scenarioId = page.url().split('/').pop()!;
    const scenario = await page.evaluate(
      async (url) => (await fetch(url)).json(),
      `/api/labs/${labId}/scenarios/${scenarioId}`,
    );
    const largest = [...scenario.shares].sort(
      (a: { fraction: number }, b: { fraction: number }) => b.fraction - a.fraction,
    )[0];
    const row = page.getByRole('row', { name: new RegExp(largest.label) });
    await expect(row.getByText(`${(largest.fraction * 100).toFixed(1)} %`).isVisible()).resolves.toBe(true);
    await expect(page.getByText(/not that the encounter leads to product/).isVisible()).resolves.toBe(true);
    await shot('scenario.png');
  });

  it('when an emitter is compared, then its quenchers are listed with kq and the trend plot is drawn', async () => {
    const emitter =
      (await Compound.findOne({ where: { labId, name: 'HL-Ir-7' } })) ??
      (await Compound.findOne({ where: { labId, roleHint: 'photocatalyst' } }));
    const studied = await Study.count({ where: { labId, emitterId: emitter!.id, isCurrent: true } });
    await page.goto(`${server.baseUrl}/labs/${labId}/compare?side=emitter&compoundId=${emitter!.id}`);
    await page.getByRole('heading', { name: `Studies of ${emitter!.name}` }).waitFor();
    const rows = page.getByRole('table', { name: `Studies of ${emitter!.name}` }).getByRole('row');
    expect(await rows.count()).toBe(studied + 1);
    await expect(page.getByRole('img', { name: /log kq against the driving force/ }).isVisible()).resolves.toBe(true);
    await shot('compare.png');
  });

  it('when a titration is planned and exported, then the CSV holds the additions shown on screen', async () => {
    await page.goto(`${server.baseUrl}/labs/${labId}/planner`);
    await page.getByLabel('Quencher stock (mM)').fill('50');
    await page.getByLabel('Highest [Q] (mM)').fill('10');
    await page.getByLabel('Number of additions').fill('5');
    await page.getByRole('button', { name: 'Work out the additions' }).click();
    await page.getByRole('region', { name: 'Additions' }).waitFor();
    // 10 mM from a 50 mM stock into 2 mL: V = 0.010 x 2 / 0.040 = 0.5 mL, a 20 % dilution (mass balance).
    await expect(page.getByText('Sample diluted by more than about 10 %').isVisible()).resolves.toBe(true);
    await expect(page.getByRole('cell', { name: '500', exact: true }).isVisible()).resolves.toBe(true);
    await shot('planner.png');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download CSV' }).click(),
    ]);
    const csv = fs.readFileSync((await download.path())!, 'utf8');
    expect(download.suggestedFilename()).toBe('titration-plan.csv');
    expect(csv.trim().split('\n').at(-1)).toMatch(/^5,10,/);

    await page.getByRole('link', { name: 'Start a study from this plan' }).click();
    await page.getByRole('heading', { name: 'New quenching study' }).waitFor();
    await expect(page.getByLabel('Starting volume V0 (mL)').inputValue()).resolves.toBe('2');
    await expect(page.getByLabel('Stock concentration (mM)').inputValue()).resolves.toBe('50');
    await expect(page.getByLabel('Dilution correction (needs volumes added)').isChecked()).resolves.toBe(true);
  });

  it('when the charts and forms ran, then the content security policy refused nothing', () => {
    expect(cspRefusals).toEqual([]);
  });
});
