import { readFileSync } from 'node:fs';
import path from 'node:path';
import PDFDocument from 'pdfkit';
import { ENGINE_VERSION } from '@shared/engine';
import { formatNumber, isoDateTime, withTrueMinus } from '@shared/format';
import { projectRoot } from '../../config/env';
import { appVersion } from '../../lib/version';

const fontDir = path.join(projectRoot, 'node_modules', '@fontsource', 'lato', 'files');
// DejaVu Sans (shipped by @fontsource/dejavu-sans) writes what Lato's Latin file lacks: superscript
// digits and minus (M⁻¹ s⁻¹, × 10⁷), Greek (τ0, ΔG, η), arrows. Runs of such characters switch font.
const fallbackDir = path.join(projectRoot, 'node_modules', '@fontsource', 'dejavu-sans', 'files');

/** The code points Lato's Latin file covers, from the ranges @fontsource/lato publishes for it. */
const latoRanges: Array<[number, number]> = (
  JSON.parse(readFileSync(path.join(fontDir, '..', 'unicode.json'), 'utf8')) as Record<string, string>
)
  .latin!.split(',')
  .map((range) =>
    range
      .replace('U+', '')
      .split('-')
      .map((hex) => parseInt(hex, 16)),
  )
  .map(([low, high]) => [low!, high ?? low!]);
const latoHas = (codePoint: number) => latoRanges.some(([low, high]) => codePoint >= low && codePoint <= high);

/** Splits text into runs that Lato can write and runs that need the fallback. */
export function fontRuns(text: string): Array<{ text: string; fallback: boolean }> {
  const runs: Array<{ text: string; fallback: boolean }> = [];
  for (const char of text) {
    const fallback = !latoHas(char.codePointAt(0)!);
    const last = runs.at(-1);
    if (last && last.fallback === fallback) last.text += char;
    else runs.push({ text: char, fallback });
  }
  return runs;
}

type TextOptions = PDFKit.Mixins.TextOptions;

/**
 * Replaces doc.text with one that writes each run in the font that has its glyphs, so the PDF
 * holds the same Unicode text as the screen (and a text search for "M⁻¹" finds it).
 */
function withFallbackFont(doc: Pdf): void {
  const write = doc.text.bind(doc) as (...args: unknown[]) => Pdf;
  const setFont = doc.font.bind(doc) as (...args: unknown[]) => Pdf;
  let current = 'Lato';
  doc.font = ((name: unknown, ...rest: unknown[]) => {
    if (typeof name === 'string') current = name;
    return setFont(name, ...rest);
  }) as Pdf['font'];
  doc.text = ((text: unknown, ...rest: unknown[]) => {
    const runs = typeof text === 'string' ? fontRuns(text) : [];
    if (runs.length < 2 && !runs.some((run) => run.fallback)) return write(text, ...rest);
    const positioned = typeof rest[0] === 'number';
    const position = positioned ? rest.slice(0, 2) : [];
    const options = ((positioned ? rest[2] : rest[0]) ?? {}) as TextOptions;
    const base = current;
    const fallbackFont = /Bold|Black/.test(base) ? 'Symbols-Bold' : 'Symbols';
    runs.forEach((run, index) => {
      setFont(run.fallback ? fallbackFont : base);
      const last = index === runs.length - 1;
      const runOptions = { ...options, continued: last ? (options.continued ?? false) : true };
      if (index === 0) write(run.text, ...position, runOptions);
      else write(run.text, runOptions);
    });
    setFont(base);
    return doc;
  }) as Pdf['text'];
}

export const ink = '#1c1938';
export const muted = '#625ba3';
export const glow = '#d97d10';

export type Pdf = InstanceType<typeof PDFDocument>;

/**
 * An A4 report with Lato embedded (shipped with the app by @fontsource/lato), a title block
 * and a footer naming Halflight and the engine version on every page.
 */
export function createReport(title: string, subtitle: string): Pdf {
  const doc = new PDFDocument({
    size: 'A4',
    margin: 50,
    bufferPages: true,
    info: { Title: title, Creator: `Halflight ${appVersion}` },
  });
  doc.registerFont('Lato', path.join(fontDir, 'lato-latin-400-normal.woff'));
  doc.registerFont('Lato-Bold', path.join(fontDir, 'lato-latin-700-normal.woff'));
  doc.registerFont('Lato-Black', path.join(fontDir, 'lato-latin-900-normal.woff'));
  doc.registerFont('Symbols', path.join(fallbackDir, 'dejavu-sans-latin-400-normal.woff'));
  doc.registerFont('Symbols-Bold', path.join(fallbackDir, 'dejavu-sans-latin-700-normal.woff'));
  withFallbackFont(doc);
  doc.font('Lato-Black').fontSize(20).fillColor(ink).text(title);
  doc.font('Lato').fontSize(10).fillColor(muted).text(subtitle).moveDown(0.8);
  return doc;
}

export function heading(doc: Pdf, text: string): void {
  if (doc.y > doc.page.height - 120) doc.addPage();
  doc.moveDown(0.6).font('Lato-Bold').fontSize(13).fillColor(ink).text(text).moveDown(0.2);
  doc.font('Lato').fontSize(10).fillColor(ink);
}

/** Label: value lines, two columns of facts. */
export function facts(doc: Pdf, rows: Array<[string, string]>): void {
  for (const [label, value] of rows) {
    doc.font('Lato-Bold').fontSize(10).fillColor(muted).text(`${label}: `, { continued: true });
    doc.font('Lato').fillColor(ink).text(value);
  }
}

/**
 * A table with fixed column widths (points) that paginates: each row is measured before it is
 * drawn and goes whole to the next page when it would not fit, the header is repeated at the top
 * of every page the table continues on, and a header never stands alone at the foot of a page
 * (it starts on a new page unless it and two rows fit).
 */
export function table(doc: Pdf, header: string[], rows: string[][], widths: number[]): void {
  const left = doc.page.margins.left;
  const fontOf = (bold: boolean) => doc.font(bold ? 'Lato-Bold' : 'Lato').fontSize(8.5);
  const heightOf = (cells: string[], bold: boolean) => {
    fontOf(bold);
    return Math.max(...cells.map((cell, index) => doc.heightOfString(cell || ' ', { width: widths[index]! - 4 })));
  };
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  const drawRow = (cells: string[], bold: boolean, height: number) => {
    const top = doc.y;
    let x = left;
    fontOf(bold).fillColor(ink);
    cells.forEach((cell, index) => {
      doc.text(cell, x, top, { width: widths[index]! - 4 });
      x += widths[index]!;
    });
    if (bold) {
      const total = widths.reduce((sum, width) => sum + width, 0);
      doc
        .moveTo(left, top + height + 1)
        .lineTo(left + total, top + height + 1)
        .lineWidth(0.5)
        .strokeColor(muted)
        .stroke();
    }
    doc.x = left;
    doc.y = top + height + (bold ? 4 : 2);
  };
  const headerHeight = heightOf(header, true) + 4;
  const firstRows = rows.slice(0, 2).reduce((sum, row) => sum + heightOf(row, false) + 2, 0);
  if (doc.y + headerHeight + firstRows > bottom()) doc.addPage();
  drawRow(header, true, headerHeight - 4);
  for (const row of rows) {
    const height = heightOf(row, false);
    if (doc.y + height > bottom()) {
      doc.addPage();
      drawRow(header, true, headerHeight - 4);
    }
    drawRow(row, false, height);
  }
  doc.x = left;
  doc.moveDown(0.3);
}

/** Numbers the pages and names the software and engine version in every footer, then ends the file. */
export function finish(doc: Pdf): Promise<Buffer> {
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const range = doc.bufferedPageRange();
  for (let index = range.start; index < range.start + range.count; index++) {
    doc.switchToPage(index);
    const bottom = doc.page.height - 35;
    doc.page.margins.bottom = 0;
    doc
      .font('Lato')
      .fontSize(8)
      .fillColor(muted)
      .text(
        `Halflight ${appVersion} · engine ${ENGINE_VERSION} · generated ${isoDateTime(new Date())} · page ${index + 1} of ${range.count}`,
        50,
        bottom,
        { width: doc.page.width - 100, align: 'center', lineBreak: false },
      );
  }
  doc.end();
  return done;
}

/** A number as everywhere in Halflight (shared/format): "1.07 × 10⁷", plain from 0.01 to below 10 000. */
export const sci = (value: number | null | undefined, digits = 3) => formatNumber(value, digits);
/** `digits` significant figures written plainly, a negative value with the true minus sign ("−0.57"). */
export const fixed = (value: number | null | undefined, digits = 3) =>
  value === null || value === undefined ? '—' : withTrueMinus(String(Number(value.toPrecision(digits))));
