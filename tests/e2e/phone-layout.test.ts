import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { saveFigure } from '../support/figures';
import { demoAdmin, signedInScreens } from '../support/every-screen';
import type { Screen } from '../support/every-screen';
import { startLiveServer } from '../support/live-server';

/*
 * Close looks at the sizes that every-screen.test.ts only measures for overall width: the
 * comparison screen at 360 px (the narrowest common Android width) and at 1440 px, and every
 * screen with charts narrowed from 1440 to 390 px without a reload, with the demo data
 * (server/seed/demo.ts).
 * Screenshots under test-output/e2e/phone-layout/.
 */
let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let screens: Screen[];
let page: Page;
const folder = path.join(screenshotDir, 'phone-layout');

beforeAll(async () => {
  server = await startLiveServer();
  screens = await signedInScreens(server.sequelize);
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 360, height: 740 } });
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
  await page.waitForLoadState('networkidle');
}

const documentWidth = () => page.evaluate(() => document.documentElement.scrollWidth);

describe('the comparison screen at 360 px', () => {
  it('when the table is wider than the phone, then it scrolls inside its card and its values and headings stay on one line', async () => {
    await page.setViewportSize({ width: 360, height: 740 });
    await open('compare');
    const card = page.getByRole('region', { name: /^Studies of / });
    const table = card.getByRole('table');
    await table.waitFor();
    await page.screenshot({ path: path.join(folder, 'compare-360.png'), fullPage: true });
    expect(await documentWidth()).toBe(360);
    const facts = await table.evaluate((element) => {
      const scroller = element.parentElement!;
      const box = element.closest('section')!.getBoundingClientRect();
      const lines = (cell: Element) => {
        const range = document.createRange();
        range.selectNodeContents(cell);
        // rendered text height over the line height: 1 for one line (a pill's padding stays below 1.8)
        return range.getBoundingClientRect().height / parseFloat(getComputedStyle(cell).lineHeight);
      };
      const cells = [...element.querySelectorAll('th, td')];
      const flagColumn = [...element.querySelectorAll('thead th')].findIndex((th) => th.textContent === 'Flags');
      const isFlag = (cell: Element) => (cell as HTMLTableCellElement).cellIndex === flagColumn;
      return {
        cardRight: box.right,
        scrolls: scroller.scrollWidth > scroller.clientWidth,
        scrollerRole: scroller.getAttribute('role'),
        wrapped: cells.filter((cell) => !isFlag(cell) && lines(cell) >= 1.8).map((cell) => cell.textContent),
        narrowestFlags: Math.min(
          ...cells.filter((cell) => isFlag(cell) && cell.tagName === 'TD').map((cell) => cell.clientWidth),
        ),
        rows: element.querySelectorAll('tbody tr').length,
      };
    });
    expect(facts.rows).toBeGreaterThanOrEqual(5); // the demo's studies of its first emitter
    expect(facts.cardRight).toBeLessThanOrEqual(360);
    expect(facts.scrolls).toBe(true);
    expect(facts.scrollerRole).toBe('region'); // named and focusable, so the arrow keys scroll it
    expect(facts.wrapped).toEqual([]);
    // Free-text flags wrap, at 14rem (224 px) or more, not one word per line.
    expect(facts.narrowestFlags).toBeGreaterThanOrEqual(224);
  }, 60_000);

  it('when the choices are drawn, then each drop-down is wide enough for the option it shows', async () => {
    await page.setViewportSize({ width: 360, height: 740 });
    await open('compare');
    const choices = page.getByRole('region', { name: 'What to compare' });
    for (const label of ['Look at one', 'Emitter', 'Order by']) {
      const select = choices.getByLabel(label, { exact: true });
      const fit = await select.evaluate((element: HTMLSelectElement) => {
        const style = getComputedStyle(element);
        const probe = document.createElement('span');
        probe.style.cssText = `position:absolute;visibility:hidden;white-space:pre;font:${style.font}`;
        probe.textContent = element.selectedOptions[0]!.text;
        document.body.append(probe);
        const text = probe.getBoundingClientRect().width;
        probe.remove();
        // the room for text: the box less its padding and the drop-down arrow (about 1em, common practice)
        const room =
          element.clientWidth -
          parseFloat(style.paddingLeft) -
          parseFloat(style.paddingRight) -
          parseFloat(style.fontSize);
        return { text, room, right: element.getBoundingClientRect().right };
      });
      expect(fit.text, label).toBeLessThanOrEqual(fit.room);
      expect(fit.right, label).toBeLessThanOrEqual(360);
    }
    await choices.screenshot({ path: path.join(folder, 'compare-choices-360.png') });
  }, 60_000);
});

describe('the comparison screen at 1440 px', () => {
  it('when the window is a usual laptop width, then the whole table fits its card without scrolling, Review column included', async () => {
    await page.setViewportSize({ width: 1440, height: 900 });
    await open('compare');
    const card = page.getByRole('region', { name: /^Studies of / });
    const table = card.getByRole('table');
    await table.waitFor();
    await card.screenshot({ path: path.join(folder, 'compare-1440.png') });
    const facts = await table.evaluate((element) => {
      const scroller = element.parentElement!;
      const headings = [...element.querySelectorAll('thead th')];
      const review = headings.find((th) => th.textContent === 'Review')!.getBoundingClientRect();
      return {
        overflow: scroller.scrollWidth - scroller.clientWidth,
        reviewRight: review.right,
        scrollerRight: scroller.getBoundingClientRect().right,
        wrapped: [...element.querySelectorAll('tbody td')]
          .filter((cell) => cell.querySelector('.min-w-56') === null)
          .filter((cell) => {
            const range = document.createRange();
            range.selectNodeContents(cell);
            return range.getBoundingClientRect().height / parseFloat(getComputedStyle(cell).lineHeight) >= 1.8;
          })
          .map((cell) => cell.textContent),
      };
    });
    expect(facts.overflow, 'px of table past the card').toBeLessThanOrEqual(0);
    expect(facts.reviewRight).toBeLessThanOrEqual(facts.scrollerRight);
    expect(facts.wrapped).toEqual([]); // values stay on one line here too
  }, 60_000);
});

describe('the kq–driving-force plot on a phone', () => {
  it('when four solvent-and-temperature trends are drawn, then the legend names each in a few rows and leaves the plot most of the figure', async () => {
    await page.setViewportSize({ width: 390, height: 844 });
    await open('compare');
    const figure = page.getByRole('img', { name: /^Plot of log kq against the driving force/ });
    await figure.waitFor();
    await figure.scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(folder, 'compare-trends-390.png') });
    const trends = await page
      .getByRole('region', { name: 'kq against driving force' })
      .getByRole('listitem')
      .allTextContents();
    expect(trends.length).toBeGreaterThanOrEqual(4); // the demo's acetonitrile series at four temperatures
    // The legend is drawn in the canvas; its layout is measured on the saved figure at one journal
    // column (8.5 cm = 321 CSS px), about the chart's width on this phone.
    const saved = await saveFigure(page, 'plot of log kq against driving force', { kind: 'svg', widthCm: 8.5 }, folder);
    const layout = await page.evaluate(
      (text) => {
        const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
        // legend entries: text beside a marker, neither anchored (axis ticks) nor bold (axis titles)
        const entries = [...doc.querySelectorAll('text[dominant-baseline="middle"]:not([text-anchor])')];
        // the legend's title, centred over the entries (src/components/chart-svg.ts)
        const title = doc.querySelector('text[font-weight="bold"][dominant-baseline="middle"]');
        const rows = new Set([...entries, ...(title ? [title] : [])].map((entry) => entry.getAttribute('y')));
        // the plot area: the x axis's grid lines run from its top to its bottom
        const grid = [...doc.querySelectorAll('line')].find(
          (line) => line.getAttribute('x1') === line.getAttribute('x2'),
        )!;
        return {
          title: title?.textContent ?? null,
          entries: entries.map((entry) => entry.textContent ?? ''),
          rows: rows.size,
          plotTop: Number(grid.getAttribute('y1')),
          plotHeight: Number(grid.getAttribute('y2')) - Number(grid.getAttribute('y1')),
        };
      },
      fs.readFileSync(saved.file, 'utf8'),
    );
    // Each trend is named: in full, or by the legend's title (its solvent) and an entry (its temperature).
    for (const trend of trends) {
      const label = trend.slice(0, trend.indexOf(':'));
      const named = layout.entries.some((entry) => entry === label || `${layout.title} at ${entry}` === label);
      expect(named, `${label} in ${layout.title} | ${layout.entries.join(' | ')}`).toBe(true);
    }
    // Before: one row per trend and kind of mark, 8 rows whose entries spanned 88 px over a plot
    // 111 px high at this width.
    expect(layout.rows, layout.entries.join(' | ')).toBeLessThanOrEqual(4);
    expect(layout.plotTop, 'px above the plot (legend and padding)').toBeLessThan(layout.plotHeight / 2);
  }, 60_000);
});

describe('charts when the window narrows', () => {
  it('when a screen with charts goes from 1440 to 390 px wide without a reload, then every chart shrinks to the window', async () => {
    const problems: string[] = [];
    let checked = 0;
    for (const screen of screens) {
      await page.setViewportSize({ width: 1440, height: 900 });
      await open(screen.name);
      const canvases = page.locator('#main canvas');
      // charts are drawn after the first paint and some panels load after the screen
      await page.waitForTimeout(500);
      const wide = await canvases.evaluateAll((all) => all.map((canvas) => canvas.getBoundingClientRect().width));
      if (wide.length === 0) continue;
      checked += 1;
      await page.setViewportSize({ width: 390, height: 844 });
      const settled = async () => {
        const narrow = await canvases.evaluateAll((all) =>
          all.map((canvas) => Math.round(canvas.getBoundingClientRect().right)),
        );
        return { page: await documentWidth(), widest: Math.max(...narrow) };
      };
      try {
        await expect.poll(settled, { timeout: 5_000 }).toEqual({ page: 390, widest: expect.any(Number) });
        const { widest } = await settled();
        if (widest > 390) problems.push(`${screen.name}: a chart ends at ${widest} px`);
      } catch {
        const { page: width, widest } = await settled();
        problems.push(`${screen.name}: page ${width} px wide, a chart ends at ${widest} px (wide: ${wide.join(', ')})`);
        await page.screenshot({ path: path.join(folder, `narrowed-${screen.name}.png`), fullPage: true });
      }
    }
    expect(checked).toBeGreaterThanOrEqual(4); // two studies, the comparison, the scenario, the temperature series
    expect(problems).toEqual([]);
  }, 240_000);
});
