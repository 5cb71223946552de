import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { demoAdmin, signedInScreens } from '../support/every-screen';
import type { Screen } from '../support/every-screen';
import { pngFacts, saveFigure, svgFacts } from '../support/figures';
import { startLiveServer } from '../support/live-server';

/*
 * The comparison's trend plot (log kq against ΔG, with the fitted curve when λ is determined)
 * and a scenario's chart of shares are saved from the screen as figures for a paper, like the
 * study plots: PNG one or two columns wide at 300 or 600 dpi, SVG sized in centimetres. Demo
 * data (server/seed/demo.ts).
 */
let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let screens: Screen[];
let page: Page;
const folder = path.join(screenshotDir, 'figures');

beforeAll(async () => {
  server = await startLiveServer();
  screens = await signedInScreens(server.sequelize);
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await signInThroughPage(page, server.baseUrl, demoAdmin);
  fs.mkdirSync(folder, { recursive: true });
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function open(name: string) {
  const screen = screens.find((entry) => entry.name === name)!;
  await page.goto(server.baseUrl + screen.path);
  await page.getByRole('heading', { name: screen.heading, level: 1 }).waitFor();
  return screen;
}

describe('saving the comparison and scenario charts as figures', () => {
  it('when the trend plot is saved at 8.5 cm, then the PNG is 1004 px at 300 dpi and 2008 px at 600 dpi and the SVG is 8.5cm wide with the diffusion limit drawn', async () => {
    await open('compare');
    const what = 'plot of log kq against driving force';
    for (const [dpi, pixels, pixelsPerMetre] of [
      // 8.5 cm / 2.54 cm per inch × dpi (common practice); pixels per metre = dpi / 0.0254 (ISO/IEC 15948, 11.3.5.3)
      [300, 1004, 11811],
      [600, 2008, 23622],
    ] as const) {
      const { download, file } = await saveFigure(page, what, { kind: 'png', widthCm: 8.5, dpi }, folder);
      expect(download.suggestedFilename()).toMatch(new RegExp(`-comparison-kq-driving-force-85mm-${dpi}dpi\\.png$`));
      const png = pngFacts(file);
      expect(png.signature).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]); // ISO/IEC 15948, 5.2
      expect(png.width).toBe(pixels);
      expect(png.pixelsPerMetre).toBe(pixelsPerMetre);
      expect(png.size).toBeGreaterThan(8000); // a drawn chart, not an empty canvas
    }
    const { file } = await saveFigure(page, what, { kind: 'svg', widthCm: 8.5 }, folder);
    const svg = await svgFacts(page, file);
    expect(svg.error).toBeNull();
    expect(svg.width).toBe('8.5cm');
    expect(svg.viewBox).toMatch(/^0 0 321 /); // 8.5 cm at 96 CSS px to the inch = 321 px (CSS Values and Units, 6.2)
    expect(svg.marks.length).toBeGreaterThan(0); // the measured points
    // the diffusion limit; no fitted curve: the demo's kq do not determine λ (fitRehmWeller, NOT_DETERMINED)
    expect(svg.lines).toBeGreaterThan(0);
  }, 120_000);

  it('when the scenario chart is saved, then the PNG has the asked width and the SVG holds one bar per share', async () => {
    await open('scenario');
    const what = 'chart of shares';
    const { download, file } = await saveFigure(page, what, { kind: 'png', widthCm: 17, dpi: 300 }, folder);
    expect(download.suggestedFilename()).toBe('demo-coupling-at-reaction-strength-shares-170mm-300dpi.png');
    // 17 cm / 2.54 × 300 = 2007.9 px (common practice)
    expect(pngFacts(file).width).toBe(2008);
    const svgFile = (await saveFigure(page, what, { kind: 'svg', widthCm: 17 }, folder)).file;
    const svg = await svgFacts(page, svgFile);
    expect(svg.error).toBeNull();
    expect(svg.width).toBe('17cm');
    // The shares in the table beside the chart, bar for bar, with what decays unquenched; they add up to 100 %.
    const labels = svg.bars.map((bar) => bar.label);
    expect(labels).toContain('decays unquenched');
    expect(svg.bars.reduce((sum, bar) => sum + bar.value, 0)).toBeCloseTo(100, 6);
    expect(svg.bars.every((bar) => bar.width >= 0)).toBe(true);
  }, 120_000);
});
