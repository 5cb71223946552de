import path from 'node:path';
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { screenshotDir } from '../support/browser';
import { openDemoAsResearcher, type DemoInBrowser } from '../support/demo-browser';

let opened: DemoInBrowser;
let server: DemoInBrowser['server'];
let page: Page;
let labId = '';
const shot = (name: string) => page.screenshot({ path: path.join(screenshotDir, name), fullPage: true });

beforeAll(async () => {
  opened = await openDemoAsResearcher({ width: 1360, height: 900 });
  ({ server, page, labId } = opened);
});

afterAll(async () => {
  await opened?.close();
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

  it('when the demo study of the amine is opened, then the mechanism panel reads dynamic from lifetimes and temperature, and fits a phone', async () => {
    await page.goto(`${server.baseUrl}/labs/${labId}/studies`);
    await page.getByRole('link', { name: 'Demo: HL-Ir-7 (iridium) with the amine Q-amine-3 in MeCN' }).click();
    const panel = page.getByRole('region', { name: 'Mechanism' });
    const verdict = panel.getByRole('group', { name: 'Combined verdict' });
    await verdict.waitFor();
    expect(await verdict.textContent()).toMatch(/Dynamic \(collisional\)/);
    for (const title of ['Lifetime against intensity', 'Temperature trend', 'kq against the diffusion limit'])
      await panel.getByRole('article', { name: title }).waitFor();
    const missing = panel.getByRole('list', { name: 'Missing evidence' });
    expect(await missing.textContent()).toMatch(/Absorption change/);
    await missing.getByRole('link', { name: 'Emission by wavelength' }).click();
    expect(page.url()).toMatch(/#emission-by-wavelength$/);
    await panel.scrollIntoViewIfNeeded();
    await panel.screenshot({ path: path.join(screenshotDir, 'mechanism-panel-wide.png') });
    // A phone opens the screen afresh (the every-screen test's way): nothing wider than 390 px, and axe
    // (in a context of its own, as it needs) finds nothing serious in the panel.
    const phoneContext = await opened.browser.newContext({
      storageState: await page.context().storageState(),
      viewport: { width: 390, height: 844 },
    });
    const phone = await phoneContext.newPage();
    await phone.goto(page.url().replace(/#.*$/, ''));
    const phonePanel = phone.getByRole('region', { name: 'Mechanism' });
    await phonePanel.getByRole('group', { name: 'Combined verdict' }).waitFor();
    expect(await phone.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    const axe = await new AxeBuilder({ page: phone })
      .include('section[aria-label="Mechanism"]')
      .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'])
      .analyze();
    expect(axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')).toEqual([]);
    await phonePanel.screenshot({ path: path.join(screenshotDir, 'mechanism-panel-phone.png') });
    await phoneContext.close();
  });
});
