import type { Chart, ChartDataset, Scale } from 'chart.js';
import { chartColours, chartFont } from './chart-theme';

/*
 * A chart as an SVG file: the same figure as on screen (plot area, grid, ticks and axis titles,
 * legend, each series' line, band and marks), written from what Chart.js has laid out, so a journal
 * or a drawing program gets vectors at any size. Each mark carries the plotted values (data-x,
 * data-y) and its series (data-series), so the file also says what it shows.
 */

const escape = (text: string) =>
  text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const num = (value: number) => String(Math.round(value * 100) / 100);
const colour = (value: unknown, fallback = 'none') => (typeof value === 'string' ? value : fallback);

/** A dashed line's pattern (the diffusion limit, for one) as stroke-dasharray. */
const dash = (dataset: { borderDash?: unknown }) =>
  Array.isArray(dataset.borderDash) && dataset.borderDash.length > 0
    ? ` stroke-dasharray="${dataset.borderDash.map(Number).join(' ')}"`
    : '';

interface Placed {
  x: number;
  y: number;
  options: {
    radius?: number;
    pointStyle?: unknown;
    backgroundColor?: unknown;
    borderColor?: unknown;
    borderWidth?: number;
  };
}

function mark(point: Placed, series: string, value: { x: number; y: number }): string {
  const { radius = 3, pointStyle, backgroundColor, borderColor, borderWidth = 1 } = point.options;
  const data = `data-series="${escape(series)}" data-x="${value.x}" data-y="${value.y}"`;
  const stroke = `stroke="${colour(borderColor)}" stroke-width="${num(borderWidth)}"`;
  if (pointStyle === 'crossRot' || pointStyle === 'cross') {
    const r = num(radius);
    const [dx, dy] = pointStyle === 'cross' ? ['0', r] : [r, r];
    return `<path ${data} d="M${num(point.x - +dx)} ${num(point.y - +dy)}L${num(point.x + +dx)} ${num(point.y + +dy)}M${num(point.x + +dx)} ${num(point.y - +dy)}L${num(point.x - +dx)} ${num(point.y + +dy)}" fill="none" ${stroke}/>`;
  }
  return `<circle ${data} cx="${num(point.x)}" cy="${num(point.y)}" r="${num(radius)}" fill="${colour(backgroundColor)}" ${stroke}/>`;
}

/** A bar as Chart.js placed it: horizontal bars run from `base` to `x`, vertical ones from `base` to `y`. */
function bar(element: unknown, series: string, label: string, value: unknown): string {
  const props = (
    element as { getProps: (keys: string[], final: boolean) => Record<string, number | boolean> }
  ).getProps(['x', 'y', 'base', 'width', 'height', 'horizontal'], true);
  const { x, y, base, width, height } = props as Record<string, number>;
  const options = (element as Placed).options;
  const box = props.horizontal
    ? { left: Math.min(base!, x!), top: y! - height! / 2, w: Math.abs(x! - base!), h: height! }
    : { left: x! - width! / 2, top: Math.min(base!, y!), w: width!, h: Math.abs(y! - base!) };
  return `<rect data-series="${escape(series)}" data-label="${escape(label)}" data-value="${escape(String(value))}" x="${num(box.left)}" y="${num(box.top)}" width="${num(box.w)}" height="${num(box.h)}" fill="${colour(options.backgroundColor)}"/>`;
}

function axis(scale: Scale, area: Chart['chartArea'], vertical: boolean): string[] {
  const parts: string[] = [];
  for (const tick of scale.ticks) {
    const at = num(scale.getPixelForValue(tick.value));
    const label = escape(Array.isArray(tick.label) ? tick.label.join(' ') : String(tick.label ?? ''));
    parts.push(
      vertical
        ? `<line x1="${num(area.left)}" x2="${num(area.right)}" y1="${at}" y2="${at}" stroke="${chartColours.grid}"/>` +
            `<text x="${num(area.left - 6)}" y="${at}" text-anchor="end" dominant-baseline="middle">${label}</text>`
        : `<line x1="${at}" x2="${at}" y1="${num(area.top)}" y2="${num(area.bottom)}" stroke="${chartColours.grid}"/>` +
            `<text x="${at}" y="${num(area.bottom + 16)}" text-anchor="middle">${label}</text>`,
    );
  }
  const title = (scale.options as { title?: { display?: boolean; text?: string | string[] } }).title;
  if (title?.display && title.text) {
    const text = escape(Array.isArray(title.text) ? title.text.join(' ') : title.text);
    parts.push(
      vertical
        ? `<text font-weight="bold" text-anchor="middle" transform="translate(${num(scale.left + 8)} ${num((area.top + area.bottom) / 2)}) rotate(-90)">${text}</text>`
        : `<text font-weight="bold" text-anchor="middle" x="${num((area.left + area.right) / 2)}" y="${num(scale.bottom - 4)}">${text}</text>`,
    );
  }
  return parts;
}

/**
 * The chart as it stands, as an SVG document named by `title` (its accessible name). With
 * `widthCm` the width and height attributes are in centimetres (the viewBox stays in the chart's
 * CSS pixels), so the file is placed at that printed size.
 */
export function chartAsSvg(chart: Chart, title: string, { widthCm }: { widthCm?: number } = {}): string {
  const { width, height, chartArea: area } = chart;
  const body: string[] = [`<rect width="${num(width)}" height="${num(height)}" fill="${chartColours.surface}"/>`];
  const { x, y } = chart.scales;
  if (x) body.push(...axis(x, area, false));
  if (y) body.push(...axis(y, area, true));
  const datasets = chart.data.datasets as Array<ChartDataset<'scatter'> & { showLine?: boolean }>;
  const placed = datasets.map((_, index) => chart.getDatasetMeta(index).data as unknown as Placed[]);
  datasets.forEach((dataset, index) => {
    if (!chart.isDatasetVisible(index)) return;
    const points = placed[index]!;
    if (chart.getDatasetMeta(index).type === 'bar') {
      const labels = chart.data.labels ?? [];
      points.forEach((element, at) =>
        body.push(bar(element, dataset.label ?? '', String(labels[at] ?? ''), dataset.data[at])),
      );
      return;
    }
    const path = (list: Placed[]) => list.map((p) => `${num(p.x)},${num(p.y)}`).join(' ');
    if (dataset.fill === '+1' && placed[index + 1]) {
      const lower = [...placed[index + 1]!].reverse();
      body.push(
        `<polygon points="${path(points)} ${path(lower)}" fill="${colour(dataset.backgroundColor)}" stroke="none"/>`,
      );
    }
    if (dataset.showLine && (dataset.borderWidth ?? 1) !== 0 && points.length > 1)
      body.push(
        `<polyline data-series="${escape(dataset.label ?? '')}" points="${path(points)}" fill="none" stroke="${colour(dataset.borderColor, chartColours.line)}" stroke-width="${num(Number(dataset.borderWidth ?? 1))}"${dash(dataset)}/>`,
      );
    if (!dataset.showLine || Number(dataset.pointRadius ?? 3) > 0)
      points.forEach((point, at) => {
        const value = dataset.data[at] as { x: number; y: number };
        if (point.options.radius !== 0) body.push(mark(point, dataset.label ?? '', value));
      });
  });
  const legend = chart.legend as unknown as
    | {
        legendItems?: Array<{ text: string; fillStyle?: unknown; strokeStyle?: unknown }>;
        legendHitBoxes?: Array<{ left: number; top: number; height: number }>;
        options?: { title?: { display?: boolean; text?: string | string[]; padding?: number | { top?: number } } };
        left: number;
        right: number;
        top: number;
      }
    | undefined;
  // A legend's title, where Chart.js puts a centred one over a legend at the top (its padding, then half a line).
  const legendTitle = legend?.options?.title;
  if (legend && legendTitle?.display && legendTitle.text) {
    const text = escape(Array.isArray(legendTitle.text) ? legendTitle.text.join(' ') : legendTitle.text);
    const padding = legendTitle.padding;
    const y = legend.top + (typeof padding === 'number' ? padding : (padding?.top ?? 0)) + 6;
    body.push(
      `<text font-weight="bold" text-anchor="middle" dominant-baseline="middle" x="${num((legend.left + legend.right) / 2)}" y="${num(y)}">${text}</text>`,
    );
  }
  legend?.legendItems?.forEach((item, at) => {
    const box = legend.legendHitBoxes?.[at];
    if (!box) return;
    const middle = box.top + box.height / 2;
    body.push(
      `<circle cx="${num(box.left + 5)}" cy="${num(middle)}" r="4" fill="${colour(item.fillStyle)}" stroke="${colour(item.strokeStyle)}"/>` +
        `<text x="${num(box.left + 14)}" y="${num(middle)}" dominant-baseline="middle">${escape(item.text)}</text>`,
    );
  });
  const size = widthCm
    ? `width="${num(widthCm)}cm" height="${num((widthCm * height) / width)}cm"`
    : `width="${num(width)}" height="${num(height)}"`;
  return [
    `<?xml version="1.0" encoding="UTF-8"?>`,
    `<svg xmlns="http://www.w3.org/2000/svg" ${size} viewBox="0 0 ${num(width)} ${num(height)}" role="img" aria-label="${escape(title)}" font-family="${escape(chartFont)}" font-size="12" fill="${chartColours.text}">`,
    `<title>${escape(title)}</title>`,
    ...body,
    `</svg>`,
    '',
  ].join('\n');
}
