import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export interface RenderedPage {
  /** the page as PNG, saved for a person to look at */
  png: string;
  width: number;
  height: number;
  /** RGB bytes, three per pixel, row by row */
  rgb: Buffer;
}

/** PPM (P6) as pdftoppm writes it: "P6", width, height, 255, then the RGB bytes (Netpbm format). */
function readPpm(file: string): Omit<RenderedPage, 'png'> {
  const bytes = fs.readFileSync(file);
  const fields: string[] = [];
  let offset = 0;
  while (fields.length < 4) {
    while (/\s/.test(String.fromCharCode(bytes[offset]!))) offset++;
    let field = '';
    while (!/\s/.test(String.fromCharCode(bytes[offset]!))) field += String.fromCharCode(bytes[offset++]!);
    fields.push(field);
  }
  offset++; // the single whitespace byte after the maximum value
  const [magic, width, height] = fields;
  if (magic !== 'P6') throw new Error(`not a binary PPM: ${magic}`);
  return { width: Number(width), height: Number(height), rgb: bytes.subarray(offset) };
}

/**
 * Renders every page of a PDF with Debian's pdftoppm (poppler-utils) at `dpi`, saves each as PNG
 * under `outDir` (named `<name>-<page>.png`) and returns the pixels for checks.
 */
export function renderPdfPages(pdf: Buffer, outDir: string, name: string, dpi = 60): RenderedPage[] {
  const work = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-pdf-'));
  try {
    const input = path.join(work, 'report.pdf');
    fs.writeFileSync(input, pdf);
    execFileSync('pdftoppm', ['-r', String(dpi), input, path.join(work, 'page')]);
    execFileSync('pdftoppm', ['-r', '100', '-png', input, path.join(work, 'shot')]);
    fs.mkdirSync(outDir, { recursive: true });
    const ppms = fs
      .readdirSync(work)
      .filter((file) => file.endsWith('.ppm'))
      .sort();
    const pngs = fs
      .readdirSync(work)
      .filter((file) => file.endsWith('.png'))
      .sort();
    return ppms.map((file, index) => {
      const png = path.join(outDir, `${name}-${index + 1}.png`);
      fs.copyFileSync(path.join(work, pngs[index]!), png);
      return { png, ...readPpm(path.join(work, file)) };
    });
  } finally {
    fs.rmSync(work, { recursive: true, force: true });
  }
}

/** How many pixels of a page are within `tolerance` of an RGB colour given as #rrggbb. */
export function pixelsOfColour(page: RenderedPage, hex: string, tolerance = 24): number {
  const [r, g, b] = [1, 3, 5].map((at) => parseInt(hex.slice(at, at + 2), 16));
  let count = 0;
  for (let i = 0; i + 2 < page.rgb.length; i += 3) {
    if (
      Math.abs(page.rgb[i]! - r!) <= tolerance &&
      Math.abs(page.rgb[i + 1]! - g!) <= tolerance &&
      Math.abs(page.rgb[i + 2]! - b!) <= tolerance
    )
      count++;
  }
  return count;
}
