import { describe, expect, it } from 'vitest';
import { decayFlag, EngineError, fitDecay, type DecayFlagCode } from '@shared/engine';
import { syntheticDecay } from '../support/synthetic-decay';

const TCSPC = { channels: 512, channelWidth: 50e-12, responseCentre: 3e-9, responseFwhm: 200e-12 } as const;
const mono = (lifetime: number, seed: number, extra: { peak?: number; background?: number } = {}) =>
  syntheticDecay({ ...TCSPC, components: [{ lifetime, fraction: 1 }], seed, ...extra });
const codes = (flags: Array<{ code: DecayFlagCode }>) => flags.map((flag) => flag.code);

function refusal(run: () => unknown): EngineError {
  try {
    run();
  } catch (error) {
    if (error instanceof EngineError) return error;
    throw error;
  }
  throw new Error('expected an EngineError');
}

describe('fitDecay refuses bad input with a named field', () => {
  const { counts, response } = mono(4e-9, 1);

  it('a negative count names its channel', () => {
    const bad = [...counts];
    bad[7] = -2;
    const error = refusal(() => fitDecay({ counts: bad, channelWidth: 50e-12, response }));
    expect(error.code).toBe('NEGATIVE_VALUE');
    expect(error.field).toBe('counts[7]');
  });

  it('a decay of zeros', () => {
    const error = refusal(() => fitDecay({ counts: counts.map(() => 0), channelWidth: 50e-12, response }));
    expect(error.code).toBe('DEGENERATE_DATA');
    expect(error.message).toMatch(/every channel is zero/);
  });

  it('reconvolution without a response', () => {
    const error = refusal(() => fitDecay({ counts, channelWidth: 50e-12 }, { method: 'reconvolution' }));
    expect(error.code).toBe('INVALID_ARGUMENT');
    expect(error.field).toBe('response');
    expect(error.message).toMatch(/reconvolution needs the instrument response/);
  });

  it('fewer than 20 channels above the background', () => {
    // 0.2 ns at 50 ps channels and 30 counts of peak over 3 of background: a handful of channels stand out
    const { counts: faint, response: prompt } = mono(0.2e-9, 2, { peak: 30 });
    const error = refusal(() => fitDecay({ counts: faint, channelWidth: 50e-12, response: prompt }));
    expect(error.code).toBe('TOO_FEW_POINTS');
    expect(error.message).toMatch(/at least 20/);
  });

  it('four exponentials, a response of another length, a start channel outside the record', () => {
    expect(refusal(() => fitDecay({ counts, channelWidth: 50e-12, response }, { components: 4 as 3 })).field).toBe(
      'components',
    );
    expect(refusal(() => fitDecay({ counts, channelWidth: 50e-12, response: response.slice(1) })).code).toBe(
      'LENGTH_MISMATCH',
    );
    expect(refusal(() => fitDecay({ counts, channelWidth: 50e-12, response }, { startChannel: 600 })).field).toBe(
      'startChannel',
    );
  });
});

describe('fitDecay flags', () => {
  it('a clean single exponential carries no flag', () => {
    const { counts, response } = mono(4e-9, 3);
    expect(fitDecay({ counts, channelWidth: 50e-12, response }).flags).toEqual([]);
  });

  it('one exponential fitted to two: chi-squared far from 1 and structured residuals', () => {
    const { counts, response } = syntheticDecay({
      ...TCSPC,
      components: [
        { lifetime: 1e-9, fraction: 0.5 },
        { lifetime: 6e-9, fraction: 0.5 },
      ],
      seed: 4,
    });
    const fit = fitDecay({ counts, channelWidth: 50e-12, response }, { components: 1 });
    expect(codes(fit.flags)).toEqual(expect.arrayContaining(['CHI_SQUARED_FAR_FROM_ONE', 'STRUCTURED_RESIDUALS']));
  });

  it('count rate 5 % of the repetition rate: pile-up risk; 1 %: none', () => {
    const { counts, response } = mono(4e-9, 5);
    const at = (share: number) =>
      codes(
        fitDecay({ counts, channelWidth: 50e-12, response }, { countRate: share * 1e7, repetitionRate: 1e7 }).flags,
      );
    expect(at(0.05)).toContain('PILE_UP_RISK');
    expect(at(0.01)).not.toContain('PILE_UP_RISK');
  });

  it('a peak of 500 counts: few counts', () => {
    const { counts, response } = mono(4e-9, 6, { peak: 500, background: 1 });
    expect(codes(fitDecay({ counts, channelWidth: 50e-12, response }).flags)).toContain('FEW_PEAK_COUNTS');
  });

  it('a tail fit of a 0.3 ns lifetime with a 200 ps response: response too wide', () => {
    const { counts, response } = mono(0.3e-9, 7);
    const fit = fitDecay({ counts, channelWidth: 50e-12, response }, { method: 'tail' });
    expect(codes(fit.flags)).toContain('RESPONSE_TOO_WIDE');
  });

  it('a 100 ps lifetime on 50 ps channels: within a few channels', () => {
    const { counts, response } = mono(0.1e-9, 8);
    expect(codes(fitDecay({ counts, channelWidth: 50e-12, response }).flags)).toContain('LIFETIME_WITHIN_FEW_CHANNELS');
  });

  it('counts that are not whole numbers', () => {
    const { counts, response } = mono(4e-9, 9);
    const scaled = counts.map((c) => c * 0.37);
    expect(codes(fitDecay({ counts: scaled, channelWidth: 50e-12, response }).flags)).toContain('COUNTS_NOT_WHOLE');
  });

  it('two exponentials for one: the second is not supported by the data', () => {
    const { counts, response } = mono(4e-9, 10);
    const fit = fitDecay({ counts, channelWidth: 50e-12, response }, { components: 2 });
    expect(codes(fit.flags)).toContain('COMPONENT_NOT_SUPPORTED');
  });
});

describe('decay flags say what to do, like the Stern–Volmer flags', () => {
  const codes: DecayFlagCode[] = [
    'CHI_SQUARED_FAR_FROM_ONE',
    'STRUCTURED_RESIDUALS',
    'RESPONSE_TOO_WIDE',
    'FEW_PEAK_COUNTS',
    'PILE_UP_RISK',
    'LIFETIME_WITHIN_FEW_CHANNELS',
    'COMPONENT_NOT_SUPPORTED',
    'NOT_CONVERGED',
    'COUNTS_NOT_WHOLE',
  ];
  it.each(codes)('when %s is raised, then it carries a next step in one sentence', (code) => {
    const flag = decayFlag(code);
    expect(flag.whatToDo).toMatch(/^[A-Z].+\.$/);
    expect(flag.whatToDo).not.toContain('\n');
  });
  it('when a caller changes one flag’s check-list, then the next flag of that code keeps the standard list', () => {
    // common practice: a result's flags are values, never views into the shared table of words
    const first = decayFlag('NOT_CONVERGED');
    first.whatToCheck.push('added by a caller');
    expect(decayFlag('NOT_CONVERGED').whatToCheck).not.toContain('added by a caller');
  });
});
