import { formatNumber, SYMBOLS, symbolText, UNITS } from '@shared/format';
import type { Comparison } from '@shared/schemas/comparisons';
import type { Scenario } from '@shared/schemas/scenarios';
import type { Pdf } from './pdf-document';

/**
 * The screen's plot colours (src/components/chart-theme.ts, from tailwind.config.ts), so a chart
 * in a PDF reads like the one on screen: measured points in glow, fitted lines in ink.
 */
export const chartInk = {
  points: '#f09a27',
  line: '#1c1938',
  band: '#625ba3',
  excluded: '#b4432f',
  grid: '#ece7db',
  text: '#3c376c',
  series: ['#d97d10', '#4d4788', '#3f8a58', '#b4432f'],
  unquenched: '#dcd4c3',
};

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface NiceScale {
  min: number;
  max: number;
  step: number;
  ticks: number[];
}

/** The "nice" number nearest `value`: 1, 2 or 5 times a power of ten (Heckbert, Graphics Gems, 1990). */
function niceNumber(value: number, round: boolean): number {
  const exponent = Math.floor(Math.log10(value));
  const fraction = value / 10 ** exponent;
  const nice = round
    ? fraction < 1.5
      ? 1
      : fraction < 3
        ? 2
        : fraction < 7
          ? 5
          : 10
    : fraction <= 1
      ? 1
      : fraction <= 2
        ? 2
        : fraction <= 5
          ? 5
          : 10;
  return nice * 10 ** exponent;
}

/**
 * Axis limits and ticks on round values around [low, high] (Heckbert's loose labelling, Graphics
 * Gems, 1990): a step of 1, 2 or 5 × 10ⁿ, the axis running from the tick at or below the lowest
 * value to the tick at or above the highest, so 1.37 and 2.13 never appear as tick labels.
 */
export function niceScale(low: number, high: number, tickCount = 5): NiceScale {
  if (!Number.isFinite(low) || !Number.isFinite(high)) return niceScale(0, 1, tickCount);
  if (high < low) [low, high] = [high, low];
  if (high === low) {
    const pad = low === 0 ? 1 : Math.abs(low) * 0.1;
    return niceScale(low - pad, high + pad, tickCount);
  }
  const range = niceNumber(high - low, false);
  const step = niceNumber(range / Math.max(1, tickCount - 1), true);
  const min = Math.floor(low / step) * step;
  const max = Math.ceil(high / step) * step;
  const ticks: number[] = [];
  // Rounded to the step's decimals, so 0.1 + 0.2 prints as 0.3.
  const decimals = Math.max(0, -Math.floor(Math.log10(step)) + 1);
  for (let value = min; value <= max + step / 2; value += step) ticks.push(Number(value.toFixed(decimals)));
  return { min: ticks[0]!, max: ticks.at(-1)!, step, ticks };
}

/** Closest two tick labels may sit on an axis, in points: 7.5 pt labels with a gap (common practice). */
export const MIN_TICK_GAP = { x: 48, y: 12 } as const;

/**
 * niceScale with as many ticks as fit `length` points at `minGap` apart: fewer asked until they
 * fit (a short residual strip gets three ticks, a full plot five or six), never fewer than two.
 */
export function niceScaleWithin(low: number, high: number, length: number, minGap: number): NiceScale {
  let scale = niceScale(low, high);
  for (let tickCount = 4; tickCount >= 2 && length / Math.max(1, scale.ticks.length - 1) < minGap; tickCount--)
    scale = niceScale(low, high, tickCount);
  return scale;
}

const place = (value: number, scale: NiceScale, from: number, size: number) =>
  from + ((value - scale.min) / (scale.max - scale.min || 1)) * size;

/** Maps data to points on the page inside a box. */
export function plotArea(box: Box, x: NiceScale, y: NiceScale) {
  return (xValue: number, yValue: number) =>
    [place(xValue, x, box.x, box.width), box.y + box.height - place(yValue, y, 0, box.height)] as const;
}

/**
 * A frame with grid lines at the nice ticks, tick labels through the shared number formatter
 * (3 significant figures, × 10ⁿ beyond 10 000) and axis titles with their units. A log axis
 * passes its decades as ticks (log₁₀ of the value) and `yTickLabel` writes the value itself.
 */
export function drawAxes(
  doc: Pdf,
  box: Box,
  x: NiceScale,
  y: NiceScale,
  xTitle: string,
  yTitle: string,
  yTickLabel: (tick: number) => string = formatNumber,
): void {
  doc.save();
  doc.lineWidth(0.4).strokeColor(chartInk.grid);
  for (const tick of x.ticks) {
    const px = place(tick, x, box.x, box.width);
    doc
      .moveTo(px, box.y)
      .lineTo(px, box.y + box.height)
      .stroke();
  }
  for (const tick of y.ticks) {
    const py = box.y + box.height - place(tick, y, 0, box.height);
    doc
      .moveTo(box.x, py)
      .lineTo(box.x + box.width, py)
      .stroke();
  }
  doc.lineWidth(0.7).strokeColor(chartInk.line).rect(box.x, box.y, box.width, box.height).stroke();
  doc.restore();
  doc.font('Lato').fontSize(7.5).fillColor(chartInk.text);
  for (const tick of x.ticks) {
    doc.text(formatNumber(tick), place(tick, x, box.x, box.width) - 22, box.y + box.height + 3, {
      width: 44,
      align: 'center',
      lineBreak: false,
    });
  }
  for (const tick of y.ticks) {
    doc.text(yTickLabel(tick), box.x - 48, box.y + box.height - place(tick, y, 0, box.height) - 4, {
      width: 44,
      align: 'right',
      lineBreak: false,
    });
  }
  // Centred by hand: a title mixing Lato and the symbol font is written in runs, which pdfkit cannot centre.
  doc.font('Lato-Bold').fontSize(8.5).fillColor(chartInk.text);
  const titleWidth = doc.widthOfString(xTitle);
  doc.text(xTitle, box.x + Math.max(0, (box.width - titleWidth) / 2), box.y + box.height + 15, { lineBreak: false });
  doc.text(yTitle, box.x - 48, box.y - 14, { lineBreak: false });
  doc.font('Lato').fillColor(chartInk.line);
}

/** A row of legend keys (a swatch and its words) under a chart. */
function legend(
  doc: Pdf,
  entries: Array<{ label: string; colour: string; open?: boolean; dashed?: boolean }>,
  y: number,
) {
  let x = doc.page.margins.left + 50;
  doc.font('Lato').fontSize(7.5);
  for (const entry of entries) {
    if (entry.dashed !== undefined) {
      doc.save();
      if (entry.dashed) doc.dash(3, { space: 2 });
      doc
        .moveTo(x, y + 4)
        .lineTo(x + 12, y + 4)
        .lineWidth(1.2)
        .strokeColor(entry.colour)
        .stroke();
      doc.restore();
    } else if (entry.open) {
      doc
        .circle(x + 6, y + 4, 2.6)
        .lineWidth(1)
        .strokeColor(entry.colour)
        .stroke();
    } else {
      doc.circle(x + 6, y + 4, 2.6).fill(entry.colour);
    }
    const width = doc.widthOfString(entry.label);
    if (x + 16 + width > doc.page.width - doc.page.margins.right) {
      x = doc.page.margins.left + 50;
      y += 11;
    }
    doc.fillColor(chartInk.text).text(entry.label, x + 16, y, { lineBreak: false });
    x += 16 + width + 14;
  }
  return y + 12;
}

/**
 * log₁₀ kq against ΔGₑₜ, one hue per solvent as on screen: filled points for approved results,
 * open ones for the rest, the fitted Rehm–Weller/Marcus curve and the diffusion limit dashed.
 */
export function drawComparisonChart(doc: Pdf, comparison: Comparison): void {
  const trends = comparison.trends.filter((trend) => trend.points.length > 0);
  if (trends.length === 0) return;
  if (doc.y > doc.page.height - 300) doc.addPage();
  const box: Box = { x: doc.page.margins.left + 50, y: doc.y + 22, width: 390, height: 190 };
  const xs = trends.flatMap((trend) => [
    ...trend.points.map((point) => point.drivingForce),
    ...(trend.fit?.curve ?? []).map((point) => point.drivingForce),
  ]);
  const ys = trends.flatMap((trend) => [
    ...trend.points.map((point) => point.log10Kq),
    ...(trend.fit?.curve ?? []).map((point) => point.log10Kq),
    ...(trend.diffusionLimit ? [Math.log10(trend.diffusionLimit)] : []),
  ]);
  const x = niceScale(Math.min(...xs), Math.max(...xs));
  const y = niceScale(Math.min(...ys), Math.max(...ys));
  drawAxes(
    doc,
    box,
    x,
    y,
    `${symbolText(SYMBOLS.drivingForce)} (${UNITS.electronvolt})`,
    `log₁₀ kq (kq in ${UNITS.perMolarPerSecond})`,
  );
  const at = plotArea(box, x, y);
  const keys: Array<{ label: string; colour: string; open?: boolean; dashed?: boolean }> = [];
  trends.forEach((trend, index) => {
    const hue = chartInk.series[index % chartInk.series.length]!;
    if (trend.diffusionLimit) {
      const level = at(x.min, Math.log10(trend.diffusionLimit))[1];
      doc.save().dash(4, { space: 3 });
      doc
        .moveTo(box.x, level)
        .lineTo(box.x + box.width, level)
        .lineWidth(0.8)
        .strokeColor(hue)
        .stroke();
      doc.restore();
      keys.push({ label: `${trend.label}: diffusion limit`, colour: hue, dashed: true });
    }
    if (trend.fit && trend.fit.curve.length > 1) {
      trend.fit.curve.forEach((point, i) =>
        i === 0
          ? doc.moveTo(...at(point.drivingForce, point.log10Kq))
          : doc.lineTo(...at(point.drivingForce, point.log10Kq)),
      );
      doc.lineWidth(1.2).strokeColor(hue).stroke();
      keys.push({ label: `${trend.label}: fit`, colour: hue, dashed: false });
    }
    for (const point of trend.points) {
      const [px, py] = at(point.drivingForce, point.log10Kq);
      if (point.approved) doc.circle(px, py, 2.8).fill(hue);
      else doc.circle(px, py, 2.8).lineWidth(1).strokeColor(hue).stroke();
    }
    keys.push({ label: `${trend.label}: measured`, colour: hue });
  });
  const below = legend(doc, keys, box.y + box.height + 30);
  doc
    .font('Lato')
    .fontSize(7.5)
    .fillColor(chartInk.text)
    .text('Filled points are approved results, open points the rest.', box.x, below, { width: box.width });
  doc.x = doc.page.margins.left;
  doc.y = below + 16;
  doc.fontSize(10).fillColor(chartInk.line);
}

/**
 * Horizontal bars as on screen: the percentage of excited emitter each component intercepts and
 * what decays unquenched; quenchers in glow, oxygen in ink, the unquenched rest in paper.
 */
export function drawShareChart(doc: Pdf, scenario: Scenario): void {
  const known = scenario.shares.filter((share) => share.fraction !== null);
  const bars = [
    ...known.map((share) => ({
      label: share.label,
      percent: share.fraction! * 100,
      colour: share.kind === 'oxygen' ? chartInk.band : chartInk.points,
    })),
    { label: 'decays unquenched', percent: scenario.unquenched * 100, colour: chartInk.unquenched },
  ];
  const barHeight = 14;
  const gap = 6;
  const height = bars.length * (barHeight + gap) + gap;
  if (doc.y > doc.page.height - height - 90) doc.addPage();
  const box: Box = { x: doc.page.margins.left + 130, y: doc.y + 10, width: 300, height };
  const x = niceScale(0, 100);
  drawAxes(doc, box, x, { min: 0, max: 1, step: 1, ticks: [] }, '% of excited emitter', '');
  bars.forEach((bar, index) => {
    const top = box.y + gap + index * (barHeight + gap);
    doc
      .font('Lato')
      .fontSize(8.5)
      .fillColor(chartInk.line)
      .text(bar.label, doc.page.margins.left, top + 3, {
        width: 124,
        align: 'right',
        lineBreak: false,
        ellipsis: true,
      });
    const width = (bar.percent / 100) * box.width;
    if (width > 0) doc.roundedRect(box.x, top, Math.max(width, 1), barHeight, 2).fill(bar.colour);
    doc
      .fontSize(7.5)
      .fillColor(chartInk.text)
      .text(`${bar.percent.toFixed(1)} %`, box.x + Math.min(width + 4, box.width - 36), top + 3.5, {
        width: 40,
        lineBreak: false,
      });
  });
  doc.x = doc.page.margins.left;
  doc.y = box.y + box.height + 34;
  doc.fontSize(10).fillColor(chartInk.line);
}
