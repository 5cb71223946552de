import { Chart, type ChartConfiguration } from 'chart.js';
import { chartAsSvg } from './chart-svg';

/** Journal column widths: one column 8.5 cm, two columns 17 cm (common practice in chemistry journals). */
export const figureWidthsCm = [8.5, 17] as const;
export type FigureWidthCm = (typeof figureWidthsCm)[number];

/**
 * Print resolutions offered: 300 dots per inch, the usual minimum for figures with points and
 * text, and 600 for line art, which many journals ask for (common practice in author guidelines).
 */
export const figureDpis = [300, 600] as const;
export type FigureDpi = (typeof figureDpis)[number];
export const figureDpi: FigureDpi = 300;
const cssPixelsPerInch = 96; // CSS Values and Units, section 6.2: 1in = 96px
const cmPerInch = 2.54;

/** The PNG's size in pixels for a width in centimetres: 8.5 cm is 1004 px at 300 dpi, 2008 px at 600. */
export function figurePixels(widthCm: number, dpi: number = figureDpi): number {
  return Math.round((widthCm / cmPerInch) * dpi);
}

/**
 * Draws a chart again at its printed width, off screen, and hands the copy to `use`. The copy is
 * laid out at the printed width in CSS pixels, so its 12 px text prints at 9 pt: the type keeps
 * its size on paper instead of shrinking with a wide screen chart. `devicePixelRatio` sets how
 * many canvas pixels each CSS pixel gets.
 */
async function withPrintCopy<T>(
  chart: Chart,
  widthCm: FigureWidthCm,
  devicePixelRatio: number | ((cssWidth: number) => number),
  use: (copy: Chart, canvas: HTMLCanvasElement) => Promise<T> | T,
): Promise<T> {
  const cssWidth = Math.round((widthCm / cmPerInch) * cssPixelsPerInch);
  // The plot area keeps the screen's proportions up to 3:4, at least 0.55 for a main plot (a wide
  // screen's flat plot would be a sliver in one column) and 0.3 for a strip under another (residuals,
  // under 200 px high on screen); the legend and axes get their room on top of that (below).
  const area = chart.chartArea;
  const least = chart.height < 200 ? 0.3 : 0.55;
  const aspect = Math.min(0.75, Math.max(least, (area.bottom - area.top) / Math.max(1, area.right - area.left)));
  const cssHeight = Math.round(cssWidth * aspect);
  const holder = document.createElement('div');
  holder.setAttribute('aria-hidden', 'true');
  holder.style.cssText = `position:fixed;left:-20000px;top:0;width:${cssWidth}px;height:${cssHeight}px`;
  const canvas = document.createElement('canvas');
  canvas.width = cssWidth;
  canvas.height = cssHeight;
  holder.append(canvas);
  document.body.append(holder);
  const { data, options, plugins, type } = chart.config as ChartConfiguration;
  const copy = new Chart(canvas, {
    type,
    data: {
      ...(data.labels ? { labels: [...data.labels] } : {}),
      datasets: data.datasets.map((dataset) => ({ ...dataset, data: [...dataset.data] })),
    },
    options: {
      ...options,
      responsive: false,
      maintainAspectRatio: false,
      animation: false,
      devicePixelRatio: typeof devicePixelRatio === 'number' ? devicePixelRatio : devicePixelRatio(cssWidth),
    },
    plugins: [...(plugins ?? [])],
  });
  try {
    // A legend that wraps at column width (the comparison's) would squeeze the plot to a line: grow
    // the figure by what the legend and axes take, so the plot area has the proportions asked.
    const plotHeight = copy.chartArea.bottom - copy.chartArea.top;
    const fitted = Math.round((copy.chartArea.right - copy.chartArea.left) * aspect + (cssHeight - plotHeight));
    if (fitted > cssHeight) {
      holder.style.height = `${fitted}px`;
      copy.resize(cssWidth, fitted);
    }
    return await use(copy, canvas);
  } finally {
    copy.destroy();
    holder.remove();
  }
}

/**
 * The chart as a PNG at its printed width and `dpi` (300 or 600), with a pHYs chunk that says so,
 * so a word processor or LaTeX places it at the intended width.
 */
export function chartAsPrintPng(chart: Chart, widthCm: FigureWidthCm, dpi: FigureDpi = figureDpi): Promise<Blob> {
  // rounded so the PNG is exactly the column's width in pixels (1004 or 2008 at 300 dpi)
  return withPrintCopy(
    chart,
    widthCm,
    (cssWidth) => figurePixels(widthCm, dpi) / cssWidth,
    async (_copy, canvas) => {
      const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
      if (!blob) throw new Error('The browser could not encode the figure as PNG.');
      return new Blob([withResolution(new Uint8Array(await blob.arrayBuffer()), dpi)], { type: 'image/png' });
    },
  );
}

/**
 * The chart as SVG at its printed width: laid out like the PNG, its width and height attributes in
 * centimetres (8.5cm or 17cm wide) over a viewBox in CSS pixels, so it is placed at column width
 * with 9 pt type.
 */
export function chartAsPrintSvg(chart: Chart, widthCm: FigureWidthCm, title: string): Promise<string> {
  return withPrintCopy(chart, widthCm, 1, (copy) => chartAsSvg(copy, title, { widthCm }));
}

// CRC-32 as the PNG specification defines it (ISO/IEC 15948, annex D), over chunk type and data.
const crcTable = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function crc32(bytes: Uint8Array): number {
  let c = 0xffffffff;
  for (const byte of bytes) c = crcTable[(c ^ byte) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

/**
 * Adds a pHYs chunk (ISO/IEC 15948, section 11.3.5.3: pixels per metre on both axes, unit 1)
 * right after IHDR, which always ends at byte 33; a PNG that already has one is returned as is.
 */
export function withResolution(png: Uint8Array<ArrayBuffer>, dpi: number): Uint8Array<ArrayBuffer> {
  const ascii = new TextDecoder('latin1').decode(png.subarray(0, Math.min(png.length, 256)));
  if (ascii.includes('pHYs')) return png;
  const pixelsPerMetre = Math.round(dpi / 0.0254);
  const chunk = new Uint8Array(4 + 4 + 9 + 4);
  const view = new DataView(chunk.buffer);
  view.setUint32(0, 9);
  chunk.set([0x70, 0x48, 0x59, 0x73], 4); // "pHYs"
  view.setUint32(8, pixelsPerMetre);
  view.setUint32(12, pixelsPerMetre);
  chunk[16] = 1; // unit: the metre
  view.setUint32(17, crc32(chunk.subarray(4, 17)));
  const out = new Uint8Array(png.length + chunk.length);
  out.set(png.subarray(0, 33), 0);
  out.set(chunk, 33);
  out.set(png.subarray(33), 33 + chunk.length);
  return out;
}
