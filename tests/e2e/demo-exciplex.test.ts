import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoExciplexFileName } from '../../server/seed/demo-exciplex';
import { screenshotDir } from '../support/browser';
import { openDemoAsResearcher, type DemoInBrowser } from '../support/demo-browser';

let opened: DemoInBrowser;
let server: DemoInBrowser['server'];
let page: Page;
let labId = '';

beforeAll(async () => {
  opened = await openDemoAsResearcher({ width: 1360, height: 900 });
  ({ server, page, labId } = opened);
});

afterAll(async () => {
  await opened?.close();
});

describe('the demo exciplex, in Chromium', () => {
  it('when the iridium/amine dilution study is opened, then the spectra panel and the mechanism panel both say a new emission grows with [Q]', async () => {
    await page.goto(`${server.baseUrl}/labs/${labId}/studies`);
    await page
      .getByRole('link', { name: 'Demo: HL-Ir-7 (iridium) with the amine Q-amine-3, stock without emitter' })
      .click();
    // The spectra panel: the kept demo matrix carries the flag (the engine's words, analyse-spectrum-matrix.ts).
    const kept = page.getByRole('article', { name: `Spectra ${demoExciplexFileName}` });
    await kept.waitFor();
    await expect
      .poll(() => kept.textContent())
      .toContain('A new emission grows with the quencher (exciplex or product)');
    // The mechanism panel reads the same matrix: its wavelength piece names the exciplex, and so does the verdict.
    const panel = page.getByRole('region', { name: 'Mechanism' });
    const piece = panel.getByRole('article', { name: 'Same K_SV at every wavelength' });
    await piece.waitFor();
    expect(await piece.textContent()).toMatch(
      /A new emission grows with the quencher .*an exciplex or an emitting product/,
    );
    expect(await panel.getByRole('group', { name: 'Combined verdict' }).textContent()).toMatch(
      /Two emitters or an exciplex/,
    );
    await panel.scrollIntoViewIfNeeded();
    await panel.screenshot({ path: path.join(screenshotDir, 'mechanism-panel-exciplex.png') });
  });
});
