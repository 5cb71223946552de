import { Chart, type ChartConfiguration } from 'chart.js';

/** Journal column widths: one column 8.5 cm, two columns 17 cm (common practice in chemistry journals). */
export const figureWidthsCm = [8.5, 17] as const;
export type FigureWidthCm = (typeof figureWidthsCm)[number];

/** Print resolution of a saved figure: 300 dots per inch, the usual minimum for line art with points. */
export const figureDpi = 300;
const cssPixelsPerInch = 96; // CSS Values and Units, section 6.2: 1in = 96px
const cmPerInch = 2.54;

/** The PNG's size in pixels for a width in centimetres at 300 dpi: 8.5 cm is 1004 px, 17 cm 2008 px. */
export function figurePixels(widthCm: number, dpi = figureDpi): number {
  return Math.round((widthCm / cmPerInch) * dpi);
}

/**
 * Draws a chart again at its printed size and 300 dpi, off screen, and returns it as a PNG that
 * says 300 dpi (pHYs chunk), so a word processor or LaTeX places it at the intended width. The
 * chart is laid out at the printed width in CSS pixels, so its 12 px text prints at 9 pt: the
 * type keeps its size on paper instead of shrinking with a wide screen chart.
 */
export async function chartAsPrintPng(chart: Chart, widthCm: FigureWidthCm): Promise<Blob> {
  const cssWidth = Math.round((widthCm / cmPerInch) * cssPixelsPerInch);
  // The screen's proportions, kept between a strip (residuals) and 3:4, so a narrow figure is not a sliver.
  const aspect = Math.min(0.75, Math.max(0.3, chart.height / chart.width));
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
      // 300 dpi, rounded so the PNG is exactly the column's width in pixels (1004 or 2008)
      devicePixelRatio: figurePixels(widthCm) / cssWidth,
    },
    plugins: [...(plugins ?? [])],
  });
  try {
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (!blob) throw new Error('The browser could not encode the figure as PNG.');
    return new Blob([withResolution(new Uint8Array(await blob.arrayBuffer()), figureDpi)], { type: 'image/png' });
  } finally {
    copy.destroy();
    holder.remove();
  }
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
