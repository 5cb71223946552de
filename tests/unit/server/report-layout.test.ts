import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';
import { createReport, finish, table } from '../../../server/services/reports/pdf-document';
import { fitStudy } from '@shared/engine';
import { niceScale } from '../../../server/services/reports/report-charts';
import { drawLifetime, drawSternVolmer } from '../../../server/services/reports/plot-drawing';
import { fitPoint, fitSettings } from '../engine/support/study-fit-fixture';

async function pageTexts(pdf: Buffer): Promise<string[]> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getText()).pages.map((page) => page.text.replace(/\s+/g, ' '));
  } finally {
    await parser.destroy();
  }
}

describe('report tables', () => {
  it('when a table runs over pages, then every page starts with its header and no row is split or lost', async () => {
    const doc = createReport('Table check', 'many rows');
    doc.moveDown(38); // start near the foot of the first page, where a header used to be left alone
    const rows = Array.from({ length: 140 }, (_, i) => [
      `row ${i + 1}`,
      String(i * 2),
      i % 7 === 0 ? 'a longer note that wraps onto a second line in its narrow column' : '',
    ]);
    table(doc, ['Point', 'Intensity', 'Note'], rows, [80, 80, 120]);
    const pages = await pageTexts(await finish(doc));
    expect(pages.length).toBeGreaterThan(2);
    const tablePages = pages.filter((text) => text.includes('row '));
    for (const text of tablePages) expect(text).toMatch(/Point Intensity Note/);
    // Every row once, in order, across the pages.
    const seen = tablePages.flatMap((text) => [...text.matchAll(/row (\d+)\b/g)].map((match) => Number(match[1])));
    expect(seen).toEqual(rows.map((_, i) => i + 1));
    // No page holds the header with fewer than two rows under it.
    for (const text of tablePages) expect([...text.matchAll(/row \d+\b/g)].length).toBeGreaterThanOrEqual(2);
  });
});

describe('nice axis scales', () => {
  it('when the data run from 105 to 543, then the axis runs 100 to 600 in steps of 100', () => {
    // Heckbert's loose-labelling example (Graphics Gems, 1990), as remembered: 105-543 -> 100-600 by 100.
    expect(niceScale(105, 543)).toEqual({ min: 100, max: 600, step: 100, ticks: [100, 200, 300, 400, 500, 600] });
  });

  it('when a Stern–Volmer axis spans 1.37 to 2.13, then the ticks are round values that enclose the data', () => {
    const scale = niceScale(1.37, 2.13);
    expect(scale.ticks).toEqual([1.2, 1.4, 1.6, 1.8, 2, 2.2]);
  });

  it('when any range is scaled, then each step is 1, 2 or 5 × 10ⁿ and the ticks enclose the range', () => {
    // Property check of the definition (common practice for axis labels): steps from {1, 2, 5} × 10ⁿ.
    for (const [low, high] of [
      [0, 0.8],
      [-0.6, 0.64],
      [8.9, 10.4],
      [0, 1e-7],
      [3, 3],
      [-2e9, 5e10],
    ] as const) {
      const scale = niceScale(low, high);
      const mantissa = scale.step / 10 ** Math.floor(Math.log10(scale.step));
      expect([1, 2, 5]).toContainEqual(Number(mantissa.toPrecision(6)));
      expect(scale.min).toBeLessThanOrEqual(Math.min(low, high));
      expect(scale.max).toBeGreaterThanOrEqual(Math.max(low, high));
      expect(scale.ticks.length).toBeLessThanOrEqual(12);
    }
  });
});

describe('plot tick labels in the study PDF', () => {
  // Invented series with ±2 % scatter: its residuals span about ±0.05, which asked seven ticks of
  // the 55 pt residual strip (9 pt apart, for 7.5 pt labels) before the tick count followed the box.
  const scatter = [0, 0.013, -0.021, 0.017, -0.009, 0.024, -0.016, 0.011];
  const points = [0, 0.5e-3, 1e-3, 1.5e-3, 2e-3, 3e-3, 4e-3, 5e-3].map((q, i) =>
    fitPoint(i, q, (1000 / (1 + 480 * q)) * (1 + scatter[i]!), {
      lifetime: (1e-6 / (1 + 450 * q)) * (1 - scatter[i]!),
      excluded: i === 5,
    }),
  );
  const result = fitStudy(fitSettings({ tau0: 1e-6 }), points, 'linear-free').result;

  /** Where the PDF writes each text: pdfkit's text(), watched. */
  function drawnTexts(draw: (doc: ReturnType<typeof createReport>) => void) {
    const doc = createReport('Ticks', 'check');
    const written: Array<{ text: string; x: number; y: number }> = [];
    const text = doc.text.bind(doc);
    doc.text = ((value: string, x?: number, y?: number, options?: object) => {
      if (typeof x === 'number' && typeof y === 'number') written.push({ text: String(value), x, y });
      return text(value, x, y, options);
    }) as typeof doc.text;
    draw(doc);
    return written;
  }

  it('when the residual strip is drawn, then no two y tick labels are closer than 12 pt (7.5 pt type, common practice)', () => {
    const written = drawnTexts((doc) => drawSternVolmer(doc, result));
    // y tick labels are numbers written right-aligned in a 44 pt column 48 pt left of the plot (x = 52)
    const yTicks = written.filter((entry) => entry.x === 52 && /^[−-]?\d/.test(entry.text)).map((entry) => entry.y);
    expect(yTicks.length).toBeGreaterThan(6);
    const sorted = [...yTicks].sort((a, b) => a - b);
    const gaps = sorted.slice(1).map((y, i) => y - sorted[i]!);
    expect(Math.min(...gaps)).toBeGreaterThanOrEqual(12);
  });

  it('when a lifetime was left out, then the lifetime plot keeps room for it at τ0/τ', () => {
    const lifetime = result.lifetime!;
    // τ0 = 1 µs from the blank; the left-out point at 3 mM: τ0/τ = (1 + 450 × 0.003)/(1 − 0.024) by construction
    expect(lifetime.excluded).toEqual([{ position: 5, x: 3e-3, y: expect.closeTo((1 + 450 * 3e-3) / (1 - 0.024), 9) }]);
    expect(lifetime.points).toHaveLength(7);
    expect(() => drawnTexts((doc) => drawLifetime(doc, lifetime))).not.toThrow();
  });
});
