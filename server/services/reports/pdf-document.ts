import path from 'node:path';
import PDFDocument from 'pdfkit';
import { ENGINE_VERSION } from '@shared/engine';
import { projectRoot } from '../../config/env';
import { appVersion } from '../../lib/version';

const fontDir = path.join(projectRoot, 'node_modules', '@fontsource', 'lato', 'files');
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

/** A simple table: fixed column widths (points), header in bold, a new page when full. */
export function table(doc: Pdf, header: string[], rows: string[][], widths: number[]): void {
  const left = doc.page.margins.left;
  const drawRow = (cells: string[], bold: boolean) => {
    if (doc.y > doc.page.height - 80) doc.addPage();
    const top = doc.y;
    let x = left;
    let bottom = top;
    doc
      .font(bold ? 'Lato-Bold' : 'Lato')
      .fontSize(8.5)
      .fillColor(ink);
    cells.forEach((cell, index) => {
      doc.text(cell, x, top, { width: widths[index]! - 4 });
      bottom = Math.max(bottom, doc.y);
      x += widths[index]!;
    });
    doc.x = left;
    doc.y = bottom + 2;
  };
  drawRow(header, true);
  rows.forEach((row) => drawRow(row, false));
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
        `Halflight ${appVersion} · engine ${ENGINE_VERSION} · generated ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC · page ${index + 1} of ${range.count}`,
        50,
        bottom,
        { width: doc.page.width - 100, align: 'center', lineBreak: false },
      );
  }
  doc.end();
  return done;
}

export const sci = (value: number | null | undefined, digits = 3) =>
  value === null || value === undefined ? '—' : value.toExponential(digits - 1);
export const fixed = (value: number | null | undefined, digits = 3) =>
  value === null || value === undefined ? '—' : String(Number(value.toPrecision(digits)));
