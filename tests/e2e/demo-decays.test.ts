import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoDecayFile } from '../../server/seed/demo-decays';
import { screenshotDir } from '../support/browser';
import { openDemoAsResearcher, type DemoInBrowser } from '../support/demo-browser';
import { saveFigure } from '../support/figures';

let opened: DemoInBrowser;
let server: DemoInBrowser['server'];
let page: Page;
let labId = '';

beforeAll(async () => {
  opened = await openDemoAsResearcher({ width: 1440, height: 900 });
  ({ server, page, labId } = opened);
});

afterAll(async () => {
  await opened?.close();
});

/**
 * The time range a saved SVG figure's x axis covers (src/components/chart-svg.ts): the plot area's
 * left and right edges are the ends of the y axis's grid lines, and two x ticks (label and place)
 * give the scale, so the values at both edges follow by straight-line extrapolation.
 */
function xDomainOf(svgFile: string) {
  return page.evaluate(
    (text) => {
      const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
      const horizontal = [...doc.querySelectorAll('line')].find(
        (line) => line.getAttribute('y1') === line.getAttribute('y2'),
      )!;
      const [left, right] = [Number(horizontal.getAttribute('x1')), Number(horizontal.getAttribute('x2'))];
      // x tick labels: centred under the plot, not bold (the axis title is bold, y ticks are end-anchored)
      const ticks = [...doc.querySelectorAll('text[text-anchor="middle"]:not([font-weight])')].map((label) => ({
        at: Number(label.getAttribute('x')),
        value: Number(label.textContent!.replace(/[,\s\u202f]/g, '')),
      }));
      const [first, last] = [ticks[0]!, ticks[ticks.length - 1]!];
      const perPixel = (last.value - first.value) / (last.at - first.at);
      return {
        from: first.value - (first.at - left) * perPixel,
        to: first.value + (right - first.at) * perPixel,
        ticks: ticks.map((tick) => tick.value),
      };
    },
    fs.readFileSync(svgFile, 'utf8'),
  );
}

describe('the demo decays, in Chromium', () => {
  it('when the decays study is opened, then the residual strip covers the same time range as the decay plot, the file’s own', async () => {
    await page.goto(`${server.baseUrl}/labs/${labId}/studies`);
    await page
      .getByRole('link', { name: 'Demo: HL-Ir-7 (iridium) with the alkene Q-ene-6, lifetimes from decays' })
      .click();
    const figure = page.getByRole('figure', { name: 'Decay plot of [Q] 0 mM' });
    await figure.waitFor();
    await figure.scrollIntoViewIfNeeded();
    await figure.screenshot({ path: path.join(screenshotDir, 'demo-decay-plot.png') });

    // The invented file's time column (server/seed/demo-decays.ts): its first and last channel, in ns.
    const times = demoDecayFile()
      .toString()
      .trim()
      .split('\n')
      .slice(1)
      .map((row) => Number(row.split(',')[0]));
    const [start, end] = [times[0]!, times[times.length - 1]!];

    const decay = await xDomainOf(
      (await saveFigure(page, 'decay of [Q] 0 mM', { kind: 'svg', widthCm: 8.5 }, screenshotDir)).file,
    );
    const residuals = await xDomainOf(
      (await saveFigure(page, 'weighted residuals of [Q] 0 mM', { kind: 'svg', widthCm: 8.5 }, screenshotDir)).file,
    );
    // Within 1 % of the span (the extrapolation is from pixel places written to 0.01 px).
    const tolerance = (end - start) / 100;
    for (const [name, domain] of [
      ['decay plot', decay],
      ['residual strip', residuals],
    ] as const) {
      expect(Math.abs(domain.from - start), `${name} starts at ${domain.from} ns`).toBeLessThan(tolerance);
      expect(Math.abs(domain.to - end), `${name} ends at ${domain.to} ns`).toBeLessThan(tolerance);
    }
    expect(Math.max(...residuals.ticks)).toBeLessThanOrEqual(end);
  });
});
