import fs from 'node:fs';
import path from 'node:path';
import { AxeBuilder } from '@axe-core/playwright';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signInThroughPage } from '../support/browser';
import { demoAdmin, publicScreens, signedInScreens } from '../support/every-screen';
import type { Screen } from '../support/every-screen';
import { startLiveServer } from '../support/live-server';
import { nonTextContrastProblems, transformedText } from '../support/page-audits';
import type { ContrastProblem } from '../support/page-audits';

/*
 * Every screen at a desktop and two phone sizes: it fits each phone's width (390 px, and 360 px,
 * the narrowest common Android width), axe finds no serious or critical violation of WCAG 2.2
 * A/AA, and a screenshot of each is kept under test-output/screens/. Axe runs at the desktop and
 * the 390 px sizes only: the 360 px pass checks width, heading and page errors.
 */
const viewports = [
  { name: 'wide', width: 1440, height: 900, audit: true },
  { name: 'phone', width: 390, height: 844, audit: true },
  { name: 'narrow', width: 360, height: 740, audit: false },
] as const;
const phoneSizes = viewports.filter((viewport) => viewport.name !== 'wide');
const shotRoot = 'test-output/screens';
/** The figures this test reports (axe counts, widths) go to the log for the record. */
const say = (line: string) => process.stdout.write(`${line}\n`);

interface Finding {
  screen: string;
  viewport: string;
  rule: string;
  impact: string;
  nodes: number;
}

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let screens: Screen[];
const findings: Finding[] = [];
const widths: Array<{ screen: string; viewport: string; width: number; viewportWidth: number }> = [];
const contrast: Array<ContrastProblem & { screen: string }> = [];
const transformed: string[] = [];
const titles: Array<{ screen: string; title: string; heading: string }> = [];
const pageErrors: string[] = [];

beforeAll(async () => {
  server = await startLiveServer();
  screens = await signedInScreens(server.sequelize);
  browser = await launchBrowser();
  for (const viewport of viewports) fs.mkdirSync(path.join(shotRoot, viewport.name), { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

/** Opens a screen, waits for its heading and quiet network, and records width, axe findings and a screenshot. */
async function examine(page: Page, screen: Screen, viewport: (typeof viewports)[number]) {
  await page.goto(server.baseUrl + screen.path);
  await page.getByRole('heading', { name: screen.heading, level: 1 }).waitFor();
  await page.waitForLoadState('networkidle');
  const size = await page.evaluate(() => ({
    width: document.documentElement.scrollWidth,
    viewportWidth: window.innerWidth,
  }));
  widths.push({ screen: screen.name, viewport: viewport.name, ...size });
  const heading = (await page.locator('#main h1').textContent())?.trim() ?? '';
  // Still the screen asked for once everything (charts included) has loaded, not the error screen.
  expect(heading).toMatch(screen.heading);
  expect(await page.getByText('This screen ran into a problem').count()).toBe(0);
  titles.push({ screen: screen.name, title: await page.title(), heading });
  if (!viewport.audit) {
    await page.screenshot({ path: path.join(shotRoot, viewport.name, `${screen.name}.png`), fullPage: true });
    return;
  }
  transformed.push(...(await transformedText(page)).map((text) => `${screen.name}: ${text}`));
  const result = await new AxeBuilder({ page })
    .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'])
    // "Label in name" (WCAG 2.5.3) is marked experimental in axe and off unless asked for.
    .options({ rules: { 'label-content-name-mismatch': { enabled: true } } })
    .analyze();
  for (const violation of result.violations) {
    findings.push({
      screen: screen.name,
      viewport: viewport.name,
      rule: violation.id,
      impact: violation.impact ?? 'unknown',
      nodes: violation.nodes.length,
    });
  }
  await page.screenshot({ path: path.join(shotRoot, viewport.name, `${screen.name}.png`), fullPage: true });
  if (viewport.name === 'wide') {
    for (const problem of await nonTextContrastProblems(page)) contrast.push({ screen: screen.name, ...problem });
  }
}

async function visitAll(viewport: (typeof viewports)[number]) {
  const signedOut: BrowserContext = await browser.newContext({ viewport });
  const outPage = await signedOut.newPage();
  outPage.on('pageerror', (error) => pageErrors.push(`${outPage.url()}: ${error.message}`));
  for (const screen of publicScreens) await examine(outPage, screen, viewport);
  await signedOut.close();
  const signedIn = await browser.newContext({ viewport });
  const inPage = await signedIn.newPage();
  inPage.on('pageerror', (error) => pageErrors.push(`${inPage.url()}: ${error.message}`));
  await signInThroughPage(inPage, server.baseUrl, demoAdmin);
  for (const screen of screens) await examine(inPage, screen, viewport);
  await signedIn.close();
}

describe('every screen, wide and on a phone, in Chromium', () => {
  for (const viewport of viewports.filter((size) => size.audit)) {
    it(`when each screen opens at ${viewport.width}x${viewport.height}, then axe finds nothing serious or critical`, async () => {
      await visitAll(viewport);
      const here = findings.filter((finding) => finding.viewport === viewport.name);
      const byImpact = (impact: string) =>
        here.filter((finding) => finding.impact === impact).reduce((sum, finding) => sum + finding.nodes, 0);
      say(
        `axe ${viewport.name}: ${here.length} violations on ${new Set(here.map((f) => f.screen)).size} screens; ` +
          `nodes critical ${byImpact('critical')}, serious ${byImpact('serious')}, ` +
          `moderate ${byImpact('moderate')}, minor ${byImpact('minor')}`,
      );
      for (const finding of here)
        say(`  ${finding.screen}: ${finding.rule} (${finding.impact}, ${finding.nodes} nodes)`);
      expect(here.filter((finding) => finding.impact === 'serious' || finding.impact === 'critical')).toEqual([]);
    }, 300_000);
  }

  it('when each screen opens at 360x740, then it shows the screen asked for, not the error screen', async () => {
    await visitAll(viewports[2]);
  }, 300_000);

  it('when each screen opened, then focus rings and field borders stand out 3:1 from their surface', () => {
    for (const problem of contrast)
      say(`contrast ${problem.screen}: ${problem.what} ${problem.element} ${problem.ratio}`);
    expect(contrast).toEqual([]);
  });

  it('when each screen opened, then no text was changed by CSS on its way to the screen (units stay exact)', () => {
    expect(transformed).toEqual([]);
  });

  it('when each screen ran, then no script failed in the page', () => {
    expect(pageErrors).toEqual([]);
  });

  it('when each screen opened, then the tab title named the screen by its heading', () => {
    expect(titles.filter((entry) => entry.title !== `${entry.heading} · Halflight`)).toEqual([]);
  });

  for (const size of phoneSizes) {
    it(`when each screen opens at ${size.width} px, then the document is exactly as wide as the viewport`, () => {
      const phone = widths.filter((entry) => entry.viewport === size.name);
      for (const entry of phone) say(`width ${size.name} ${entry.screen}: ${entry.width} / ${entry.viewportWidth}`);
      expect(phone.length).toBe(publicScreens.length + screens.length);
      expect(phone.every((entry) => entry.viewportWidth === size.width)).toBe(true);
      expect(phone.filter((entry) => entry.width !== entry.viewportWidth)).toEqual([]);
    });
  }
});
