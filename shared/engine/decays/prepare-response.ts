import { EngineError } from '../core/engine-error';
import { estimateDecayBackground } from './estimate-decay-background';

export interface PreparedResponse {
  /** background-free response, normalised to sum 1 */
  response: Float64Array;
  /** channel of the response maximum */
  peakChannel: number;
  /** full width at half maximum, channels (interpolated between channels) */
  widthChannels: number;
}

/**
 * The measured instrument response made ready for reconvolution: its own background
 * (estimateDecayBackground) taken off, channels that are then within three standard deviations
 * of zero set to zero (so dark counts far from the pulse do not feed a long lifetime), only the
 * run of channels above that threshold around the maximum kept (an isolated spike in the
 * background, a cosmic or electronic count, would otherwise be convolved as a second pulse and
 * leave a ghost decay in the fit), and that run normalised to sum 1, so fitted amplitudes are
 * counts per channel (O'Connor & Phillips, Time-Correlated Single Photon Counting, 1984, ch. 6;
 * common practice).
 *
 * @param response - counts per channel (>= 0, validated by the caller)
 * @throws EngineError DEGENERATE_DATA when nothing of the response stands above its background
 * @example prepareResponse([...new Array(20).fill(0), 1, 2, 1, ...new Array(20).fill(0)]).widthChannels // 2
 */
export function prepareResponse(response: ArrayLike<number>): PreparedResponse {
  const n = response.length;
  const background = estimateDecayBackground(response);
  const noise = background > 0 ? 3 * Math.sqrt(background) : 0;
  const cleaned = new Float64Array(n);
  let peakChannel = 0;
  for (let i = 0; i < n; i++) {
    const above = response[i]! - background;
    cleaned[i] = above > noise ? above : 0;
    if (cleaned[i]! > cleaned[peakChannel]!) peakChannel = i;
  }
  // The pulse is the run above the threshold that holds the maximum; everything else is zeroed.
  let first = peakChannel;
  while (first > 0 && cleaned[first - 1]! > 0) first--;
  let last = peakChannel;
  while (last < n - 1 && cleaned[last + 1]! > 0) last++;
  cleaned.fill(0, 0, first);
  cleaned.fill(0, last + 1);
  let sum = 0;
  for (let i = first; i <= last; i++) sum += cleaned[i]!;
  if (!(sum > 0)) {
    throw new EngineError(
      'DEGENERATE_DATA',
      'response',
      'the instrument response holds no counts above its background',
      'Check that the response column or file is the prompt (scatter) measurement',
    );
  }
  for (let i = 0; i < n; i++) cleaned[i]! /= sum;
  const half = cleaned[peakChannel]! / 2;
  let left = peakChannel;
  while (left > 0 && cleaned[left - 1]! > half) left--;
  let right = peakChannel;
  while (right < n - 1 && cleaned[right + 1]! > half) right++;
  // Linear interpolation to the half-maximum crossing on each side.
  const leftEdge = left > 0 ? left - (cleaned[left]! - half) / (cleaned[left]! - cleaned[left - 1]!) : left - 0.5;
  const rightEdge =
    right < n - 1 ? right + (cleaned[right]! - half) / (cleaned[right]! - cleaned[right + 1]!) : right + 0.5;
  return { response: cleaned, peakChannel, widthChannels: rightEdge - leftEdge };
}
