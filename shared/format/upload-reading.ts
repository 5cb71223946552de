import type { UploadMapping } from '../schemas/study-uploads';
import { unitLabel } from '../units/units';
import { formatNumber } from './format-number';

const nm = (value: number) => formatNumber(value, 6);

/**
 * How an applied file was read, in one line for the study's files, history and report: for
 * spectra the reduction and the baseline taken off, for a series the concentration unit.
 * @example describeUploadReading({ layout: 'spectrum', ..., reduction: { kind: 'window', start: 560, end: 680 }, baseline: null })
 * // 'spectra integrated over 560–680 nm (trapezoid), no baseline subtracted'
 */
export function describeUploadReading(mapping: UploadMapping): string {
  if (mapping.layout === 'series')
    return mapping.concentrationUnit === null
      ? 'series, concentration unit not chosen'
      : `series, [Q] in ${unitLabel(mapping.concentrationUnit)}${mapping.intensityIsRatio ? ', I0/I as given' : ''}`;
  const { reduction, baseline } = mapping;
  const reduced =
    reduction.kind === 'window'
      ? `spectra integrated over ${nm(reduction.start)}–${nm(reduction.end)} nm (trapezoid)`
      : `spectra read at ${nm(reduction.at)} nm`;
  return `${reduced}, ${baseline ? `baseline ${nm(baseline.start)}–${nm(baseline.end)} nm subtracted (its mean)` : 'no baseline subtracted'}`;
}
