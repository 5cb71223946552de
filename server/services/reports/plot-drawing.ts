import type { FitResult } from '@shared/schemas/study-fits';
import type { Pdf } from './pdf-document';
import { chartInk, drawAxes, MIN_TICK_GAP, niceScaleWithin, plotArea, type Box } from './report-charts';

/**
 * Round-valued axes around the data (niceScale), with no more ticks than the box has room for
 * (a 55 pt residual strip gets three), drawn as on screen; returns where a value lands.
 */
export function axes(doc: Pdf, box: Box, xValues: number[], yValues: number[], xLabel: string, yLabel: string) {
  const x = niceScaleWithin(Math.min(0, ...xValues), Math.max(...xValues), box.width, MIN_TICK_GAP.x);
  const y = niceScaleWithin(Math.min(...yValues), Math.max(...yValues), box.height, MIN_TICK_GAP.y);
  drawAxes(doc, box, x, y, xLabel, yLabel);
  return plotArea(box, x, y);
}

/** A left-out point: an unfilled cross in the excluded colour, as on screen. */
function leftOutMark(doc: Pdf, cx: number, cy: number): void {
  doc
    .moveTo(cx - 3.5, cy - 3.5)
    .lineTo(cx + 3.5, cy + 3.5)
    .moveTo(cx - 3.5, cy + 3.5)
    .lineTo(cx + 3.5, cy - 3.5)
    .lineWidth(1.2)
    .strokeColor(chartInk.excluded)
    .stroke();
}

/**
 * The Stern–Volmer plot (points, fit line, 95 % band, left-out points as crosses) with the residuals
 * beneath, as vector graphics in the screen's colours, from the stored series and its axis
 * (x × xAxis.scale, titled xAxis.label: [Q] or 1/[Q] with the unit), as on screen.
 */
export function drawSternVolmer(doc: Pdf, result: FitResult): void {
  const { label: xLabel, scale: concentrationScale } = result.plot.xAxis;
  // The plot, the residual strip and its axis take 330 pt below doc.y; all of it above the 50 pt margin,
  // or the strip's labels spill one per page.
  if (doc.y > doc.page.height - 380) doc.addPage();
  const top = doc.y + 20;
  const main: Box = { x: 100, y: top, width: 380, height: 170 };
  const residualBox: Box = { x: 100, y: top + 225, width: 380, height: 55 };
  const xs = [
    ...result.plot.points.map((p) => p.x),
    ...result.plot.excluded.map((p) => p.x),
    ...result.plot.line.map((p) => p.x),
  ].map((x) => x * concentrationScale);
  const ys = [
    ...result.plot.points.map((p) => p.y),
    ...result.plot.excluded.map((p) => p.y),
    ...result.plot.line.flatMap((p) => [p.lower, p.upper]),
  ];
  const at = axes(doc, main, xs, ys, xLabel, result.plot.yLabel);
  const onMain = (x: number, y: number) => at(x * concentrationScale, y);
  // 95 % band, then the line, then the points.
  const band = [
    ...result.plot.line.map((p) => onMain(p.x, p.upper)),
    ...[...result.plot.line].reverse().map((p) => onMain(p.x, p.lower)),
  ];
  if (band.length > 2) {
    doc.moveTo(...band[0]!);
    band.slice(1).forEach((point) => doc.lineTo(...point));
    doc.closePath().fillOpacity(0.18).fill(chartInk.band).fillOpacity(1);
  }
  result.plot.line.forEach((p, index) =>
    index === 0 ? doc.moveTo(...onMain(p.x, p.y)) : doc.lineTo(...onMain(p.x, p.y)),
  );
  doc.lineWidth(1.2).strokeColor(chartInk.line).stroke();
  result.plot.points.forEach((p) => doc.circle(...onMain(p.x, p.y), 2.6).fill(chartInk.points));
  result.plot.excluded.forEach((p) => leftOutMark(doc, ...onMain(p.x, p.y)));

  const residuals = result.plot.points.map((p) => p.residual);
  const extent = Math.max(1e-12, ...residuals.map(Math.abs));
  const onResiduals = axes(doc, residualBox, xs, [-extent, extent], xLabel, 'residual');
  const zero = onResiduals(0, 0)[1];
  doc
    .moveTo(residualBox.x, zero)
    .lineTo(residualBox.x + residualBox.width, zero)
    .lineWidth(0.5)
    .strokeColor(chartInk.text)
    .stroke();
  result.plot.points.forEach((p) =>
    doc.circle(...onResiduals(p.x * concentrationScale, p.residual), 2.2).fill(chartInk.line),
  );
  doc.x = 50;
  doc.y = residualBox.y + residualBox.height + 34;
}

/** What a lifetime Stern–Volmer plot needs: a study fit's lifetime part, or a decay set's own line. */
export interface LifetimeLine {
  xAxis: { label: string; scale: number };
  points: ReadonlyArray<{ x: number; y: number }>;
  /** lifetimes the chemist left out, at their plotted coordinates (drawn hollow) */
  excluded?: ReadonlyArray<{ x: number; y: number }> | undefined;
  kSv: { value: number };
}

/** τ0/τ against [Q] with the line 1 + K_SV(τ)[Q] (Lakowicz, 3rd ed., ch. 8), when lifetimes were measured; left-out lifetimes as crosses. */
export function drawLifetime(doc: Pdf, lifetime: LifetimeLine): void {
  const { label: xLabel, scale: concentrationScale } = lifetime.xAxis;
  if (doc.y > doc.page.height - 260) doc.addPage();
  const box: Box = { x: 100, y: doc.y + 20, width: 380, height: 150 };
  const excluded = lifetime.excluded ?? [];
  const xs = [...lifetime.points, ...excluded].map((p) => p.x * concentrationScale);
  const line = (x: number) => 1 + lifetime.kSv.value * (x / concentrationScale);
  const low = Math.min(0, ...xs);
  const high = Math.max(...xs);
  const ys = [...lifetime.points, ...excluded].map((p) => p.y);
  const at = axes(doc, box, xs, [...ys, line(low), line(high)], xLabel, 'τ0/τ');
  doc
    .moveTo(...at(low, line(low)))
    .lineTo(...at(high, line(high)))
    .lineWidth(1.2)
    .strokeColor(chartInk.line)
    .stroke();
  lifetime.points.forEach((p) => doc.circle(...at(p.x * concentrationScale, p.y), 2.6).fill(chartInk.points));
  excluded.forEach((p) => leftOutMark(doc, ...at(p.x * concentrationScale, p.y)));
  doc.x = 50;
  doc.y = box.y + box.height + 34;
}
