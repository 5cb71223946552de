import { UNITS } from '@shared/format';
import { toMicroseconds, toNanoseconds } from '@shared/units/units';
import type { DecayCurves } from '@shared/schemas/decays';
import type { Pdf } from './pdf-document';
import { axes } from './plot-drawing';
import { chartInk, drawAxes, niceScale, plotArea, type Box } from './report-charts';

/** ns up to a few µs, then µs: tick labels stay short either way. */
const timeUnitFor = (seconds: number) =>
  seconds > 5e-6
    ? { convert: toMicroseconds, label: UNITS.microsecond }
    : { convert: toNanoseconds, label: UNITS.nanosecond };

/** A polyline through the points that exist (a null or non-positive count leaves a gap on the log axis). */
function polyline(doc: Pdf, points: Array<readonly [number, number] | null>, colour: string, width: number) {
  let drawing = false;
  for (const point of points) {
    if (!point) {
      drawing = false;
      continue;
    }
    if (drawing) doc.lineTo(...point);
    else doc.moveTo(...point);
    drawing = true;
  }
  doc.lineWidth(width).strokeColor(colour).stroke();
}

/**
 * One decay as on screen (src/features/decays/components/decay-plot.tsx): counts on a log axis
 * (decades from 1 count) with the measured response and the fitted curve, and the weighted
 * residuals (c − m)/√m beneath, all from the kept file and the stored fit parameters.
 */
export function drawDecay(doc: Pdf, title: string, curves: DecayCurves): void {
  if (doc.y > doc.page.height - 310) doc.addPage();
  doc.font('Lato-Bold').fontSize(10).fillColor(chartInk.line).text(title).font('Lato');
  const top = doc.y + 20;
  const main: Box = { x: 100, y: top, width: 380, height: 150 };
  const residualBox: Box = { x: 100, y: top + 200, width: 380, height: 50 };
  const unit = timeUnitFor(curves.time.at(-1) ?? 0);
  const times = curves.time.map(unit.convert);
  const xTitle = `time (${unit.label})`;
  const x = niceScale(Math.min(0, ...times), Math.max(...times));
  const highest = Math.max(1, ...curves.counts, ...(curves.response ?? []), ...(curves.model ?? []).map((m) => m ?? 0));
  const decades = Math.max(1, Math.ceil(Math.log10(highest)));
  const y = { min: 0, max: decades, step: 1, ticks: Array.from({ length: decades + 1 }, (_, i) => i) };
  // Plain digits (1, 10 … 100000): a "× 10ⁿ" label mixes fonts, which pdfkit cannot right-align.
  drawAxes(doc, main, x, y, xTitle, 'counts per channel', (tick) => String(10 ** tick));
  const at = plotArea(main, x, y);
  const onLog = (values: ReadonlyArray<number | null>) =>
    values.map((value, i) => (value !== null && value >= 1 ? at(times[i]!, Math.log10(value)) : null));
  onLog(curves.counts).forEach((point) => point && doc.circle(...point, 0.9).fill(chartInk.points));
  if (curves.response) polyline(doc, onLog(curves.response), chartInk.band, 0.8);
  if (curves.model) polyline(doc, onLog(curves.model), chartInk.line, 1.2);

  const residuals = curves.weightedResiduals ?? [];
  if (residuals.length > 0) {
    const start = curves.startChannel ?? 0;
    const extent = Math.max(1e-12, ...residuals.map(Math.abs));
    const onResiduals = axes(doc, residualBox, times, [-extent, extent], xTitle, 'weighted residual');
    residuals.forEach((value, i) => doc.circle(...onResiduals(times[start + i]!, value), 0.7).fill(chartInk.excluded));
  }
  doc.fillColor(chartInk.line);
  doc.x = 50;
  doc.y = (residuals.length > 0 ? residualBox.y + residualBox.height : main.y + main.height) + 34;
}
