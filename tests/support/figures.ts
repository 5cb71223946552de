import fs from 'node:fs';
import path from 'node:path';
import type { Download, Page } from 'playwright-core';

/**
 * Saves one chart through its "Save figure" disclosure (src/components/save-png-button.tsx), the
 * way a person would: opens it, picks the width (and the resolution for a PNG), presses the button
 * and keeps the download under `folder`.
 */
export async function saveFigure(
  page: Page,
  what: string,
  choice: { kind: 'png'; widthCm: 8.5 | 17; dpi: 300 | 600 } | { kind: 'svg'; widthCm: 8.5 | 17 },
  folder: string,
): Promise<{ download: Download; file: string }> {
  const panel = page.getByRole('group', { name: `Save the ${what}`, exact: true });
  if (!(await panel.isVisible()))
    await page
      .locator('summary')
      .filter({ hasText: `Save figure: the ${what}` })
      .click();
  await panel
    .getByRole('radio', { name: choice.widthCm === 8.5 ? '8.5 cm, one column' : '17 cm, two columns' })
    .check();
  if (choice.kind === 'png')
    await panel.getByRole('radio', { name: choice.dpi === 300 ? '300 dpi' : '600 dpi, for line art' }).check();
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    panel.getByRole('button', { name: `Save ${choice.kind.toUpperCase()} of the ${what}`, exact: true }).click(),
  ]);
  const file = path.join(folder, download.suggestedFilename());
  await download.saveAs(file);
  return { download, file };
}

/**
 * What a saved PNG says of itself (PNG specification, ISO/IEC 15948): the signature (section 5.2),
 * IHDR's width and height (bytes 16-23) and, when a pHYs chunk follows IHDR, its pixels per metre.
 */
export function pngFacts(file: string) {
  const bytes = fs.readFileSync(file);
  return {
    signature: [...bytes.subarray(0, 8)],
    width: bytes.readUInt32BE(16),
    height: bytes.readUInt32BE(20),
    pixelsPerMetre: bytes.toString('latin1', 37, 41) === 'pHYs' ? bytes.readUInt32BE(41) : null,
    size: bytes.length,
  };
}

/** What a saved SVG says of itself, read by the browser's own XML parser. */
export function svgFacts(page: Page, file: string) {
  return page.evaluate(
    (text) => {
      const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
      const root = doc.documentElement;
      return {
        error: doc.querySelector('parsererror')?.textContent ?? null,
        root: root.localName,
        width: root.getAttribute('width'),
        height: root.getAttribute('height'),
        viewBox: root.getAttribute('viewBox'),
        title: doc.querySelector('title')?.textContent ?? '',
        marks: [...doc.querySelectorAll('[data-series][data-x]')].map((mark) => ({
          series: mark.getAttribute('data-series'),
          x: Number(mark.getAttribute('data-x')),
          y: Number(mark.getAttribute('data-y')),
        })),
        bars: [...doc.querySelectorAll('rect[data-label]')].map((bar) => ({
          label: bar.getAttribute('data-label'),
          value: Number(bar.getAttribute('data-value')),
          width: Number(bar.getAttribute('width')),
        })),
        lines: doc.querySelectorAll('polyline').length,
      };
    },
    fs.readFileSync(file, 'utf8'),
  );
}
