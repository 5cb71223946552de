import type { FitResult } from '@shared/schemas/study-fits';
import { glow, ink, muted } from './pdf-document';
import type { Pdf } from './pdf-document';

interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

function axes(doc: Pdf, box: Box, xRange: [number, number], yRange: [number, number], xLabel: string, yLabel: string) {
  doc.lineWidth(0.7).strokeColor(ink).rect(box.x, box.y, box.width, box.height).stroke();
  doc.font('Lato').fontSize(7.5).fillColor(muted);
  for (let i = 0; i <= 4; i++) {
    const xValue = xRange[0] + ((xRange[1] - xRange[0]) * i) / 4;
    const yValue = yRange[0] + ((yRange[1] - yRange[0]) * i) / 4;
    doc.text(Number(xValue.toPrecision(3)).toString(), box.x + (box.width * i) / 4 - 15, box.y + box.height + 3, {
      width: 30,
      align: 'center',
    });
    doc.text(Number(yValue.toPrecision(3)).toString(), box.x - 42, box.y + box.height - (box.height * i) / 4 - 4, {
      width: 38,
      align: 'right',
    });
  }
  doc
    .fontSize(8.5)
    .fillColor(ink)
    .text(xLabel, box.x, box.y + box.height + 14, { width: box.width, align: 'center' });
  doc.text(yLabel, box.x, box.y - 12, { width: box.width });
}

const scale = (value: number, [low, high]: [number, number], from: number, size: number) =>
  from + ((value - low) / (high - low || 1)) * size;

/** The Stern–Volmer plot (points, fit line, 95 % band) with the residuals beneath, as vector graphics. */
export function drawSternVolmer(doc: Pdf, result: FitResult, concentrationScale = 1e3): void {
  if (doc.y > doc.page.height - 330) doc.addPage();
  const top = doc.y + 16;
  const main: Box = { x: 100, y: top, width: 380, height: 170 };
  const residualBox: Box = { x: 100, y: top + 215, width: 380, height: 55 };
  const xs = [...result.plot.points.map((p) => p.x), ...result.plot.line.map((p) => p.x)].map(
    (x) => x * concentrationScale,
  );
  const ys = [...result.plot.points.map((p) => p.y), ...result.plot.line.flatMap((p) => [p.lower, p.upper])];
  const xRange: [number, number] = [Math.min(0, ...xs), Math.max(...xs)];
  const yRange: [number, number] = [Math.min(...ys), Math.max(...ys)];
  axes(doc, main, xRange, yRange, '[Q] (mM)', result.plot.yLabel);
  const at = (x: number, y: number, box: Box, yr: [number, number]) =>
    [
      scale(x * concentrationScale, xRange, box.x, box.width),
      box.y + box.height - scale(y, yr, 0, box.height),
    ] as const;
  // 95 % band, then the line, then the points.
  const band = [
    ...result.plot.line.map((p) => at(p.x, p.upper, main, yRange)),
    ...[...result.plot.line].reverse().map((p) => at(p.x, p.lower, main, yRange)),
  ];
  if (band.length > 2) {
    doc.moveTo(...band[0]!);
    band.slice(1).forEach((point) => doc.lineTo(...point));
    doc.closePath().fillOpacity(0.18).fill(glow).fillOpacity(1);
  }
  result.plot.line.forEach((p, index) =>
    index === 0 ? doc.moveTo(...at(p.x, p.y, main, yRange)) : doc.lineTo(...at(p.x, p.y, main, yRange)),
  );
  doc.lineWidth(1.2).strokeColor(glow).stroke();
  result.plot.points.forEach((p) => doc.circle(...at(p.x, p.y, main, yRange), 2.6).fill(ink));

  const residuals = result.plot.points.map((p) => p.residual);
  const extent = Math.max(1e-12, ...residuals.map(Math.abs));
  const rRange: [number, number] = [-extent, extent];
  axes(doc, residualBox, xRange, rRange, '[Q] (mM)', 'residual');
  const zero = at(0, 0, residualBox, rRange)[1];
  doc
    .moveTo(residualBox.x, zero)
    .lineTo(residualBox.x + residualBox.width, zero)
    .lineWidth(0.5)
    .strokeColor(muted)
    .stroke();
  result.plot.points.forEach((p) => doc.circle(...at(p.x, p.residual, residualBox, rRange), 2.2).fill(ink));
  doc.x = 50;
  doc.y = residualBox.y + residualBox.height + 30;
}

/** tau0/tau against [Q] with the line 1 + K_SV(tau)[Q] (Lakowicz, 3rd ed., ch. 8), when lifetimes were measured. */
export function drawLifetime(doc: Pdf, lifetime: NonNullable<FitResult['lifetime']>, concentrationScale = 1e3): void {
  if (doc.y > doc.page.height - 250) doc.addPage();
  const box: Box = { x: 100, y: doc.y + 16, width: 380, height: 150 };
  const xs = lifetime.points.map((p) => p.x * concentrationScale);
  const line = (x: number) => 1 + lifetime.kSv.value * (x / concentrationScale);
  const xRange: [number, number] = [Math.min(0, ...xs), Math.max(...xs)];
  const ys = [...lifetime.points.map((p) => p.y), line(xRange[0]), line(xRange[1])];
  const yRange: [number, number] = [Math.min(...ys), Math.max(...ys)];
  axes(doc, box, xRange, yRange, '[Q] (mM)', 'tau0/tau');
  const at = (x: number, y: number) =>
    [scale(x, xRange, box.x, box.width), box.y + box.height - scale(y, yRange, 0, box.height)] as const;
  doc
    .moveTo(...at(xRange[0], line(xRange[0])))
    .lineTo(...at(xRange[1], line(xRange[1])))
    .lineWidth(1.2)
    .strokeColor(glow)
    .stroke();
  lifetime.points.forEach((p) => doc.circle(...at(p.x * concentrationScale, p.y), 2.6).fill(ink));
  doc.x = 50;
  doc.y = box.y + box.height + 30;
}
