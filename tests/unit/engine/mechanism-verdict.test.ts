import quantile from '@stdlib/stats-base-dists-t-quantile';
import { describe, expect, it } from 'vitest';
import {
  combineMechanismEvidence,
  EngineError,
  readMechanismPieces,
  type DiffusionEvidence,
  type LifetimeEvidence,
  type MechanismEvidenceInput,
  type TemperatureEvidence,
  type WavelengthEvidence,
} from '@shared/engine';

/*
 * Synthetic evidence (invented numbers). The rules checked: Lakowicz, Principles of Fluorescence
 * Spectroscopy, 3rd ed., 2006, ch. 8 (from memory): dynamic quenching gives tau0/tau = I0/I; a
 * dark ground-state complex raises I0/I above tau0/tau and leaves tau alone; dynamic K_SV rises
 * with T, static falls; a complex may change the absorption; kq above the diffusion limit is more
 * than collisions give; two emitters or an exciplex show as a K_SV that varies with wavelength.
 */
const none: MechanismEvidenceInput = {
  lifetime: null,
  temperature: null,
  wavelength: null,
  absorption: null,
  diffusion: null,
};
const estimate = (value: number, standardError: number, degreesOfFreedom = 5) => ({
  value,
  standardError,
  degreesOfFreedom,
});
const slopes = (intensity: number, lifetime: number, seI = 3, seT = 3): LifetimeEvidence => ({
  intensityKsv: estimate(intensity, seI),
  lifetimeKsv: estimate(lifetime, seT),
  intercept: 'fixed-at-one',
  combined: null,
});
const trend = (verdict: TemperatureEvidence['verdict'], ea: number): TemperatureEvidence => ({
  verdict,
  kSvActivationEnergy: { value: ea, standardError: 1500 },
  diffusionActivationEnergy: 10_500,
  temperatures: [283.15, 298.15, 313.15],
});
const oneEmitter: WavelengthEvidence = {
  flags: [],
  homogeneity: {
    weightedMean: 101,
    weightedMeanStandardError: 2,
    chiSquare: 4.1,
    degreesOfFreedom: 6,
    pValue: 0.66,
    homogeneous: true,
  },
  significantComponents: 1,
  bandWidth: 10,
};
// k_diff of acetonitrile at 298.15 K is about 1.9e10 M⁻¹ s⁻¹ (8RT/3η with η = 0.34 mPa s; common practice)
const kq = (value: number, half: number): DiffusionEvidence => ({
  kq: { value, standardError: half / 2.57, interval95: { lower: value - half, upper: value + half } },
  diffusionLimit: 1.9e10,
  temperature: 298.15,
});

describe('lifetime against intensity', () => {
  it('when the slopes are equal within error, then the piece and the verdict say dynamic', () => {
    const result = combineMechanismEvidence({ ...none, lifetime: slopes(100, 98) });
    expect(result.pieces[0]).toMatchObject({ kind: 'lifetime', reading: 'dynamic' });
    expect(result.verdict).toBe('dynamic');
    expect(result.reasons[0]).toMatch(/equal within error/);
    expect(result.pieces[0]!.numbers.map((n) => n.label)).toContain('K_SV from τ0/τ');
  });

  it('when the difference sits just inside or just outside t(0.975, Welch df) times its SE, then dynamic or both', () => {
    // SE_I = 3, SE_τ = 4 at 4 df each: SE of the difference 5; Welch df = 25² / (3⁴/4 + 4⁴/4) = 7.418…
    const df = 625 / (81 / 4 + 256 / 4);
    const half = quantile(0.975, df) * 5; // @stdlib/stats-base-dists-t-quantile: 11.6…
    const at = (difference: number): LifetimeEvidence => ({
      intensityKsv: estimate(100 + difference, 3, 4),
      lifetimeKsv: estimate(100, 4, 4),
      intercept: 'free',
      combined: null,
    });
    expect(readMechanismPieces({ ...none, lifetime: at(half * 0.99) })[0]!.reading).toBe('dynamic');
    expect(readMechanismPieces({ ...none, lifetime: at(half * 1.01) })[0]!.reading).toBe('both');
  });

  it('when the intensity falls and the lifetime does not, then static', () => {
    const result = combineMechanismEvidence({ ...none, lifetime: slopes(120, 1, 3, 2) });
    expect(result.pieces[0]!.reading).toBe('static');
    expect(result.verdict).toBe('static');
  });

  it('when the intensity falls faster than a falling lifetime, then both, with K_S of the combined fit quoted', () => {
    const lifetime = { ...slopes(150, 100, 4, 3), combined: { kD: estimate(100, 5, 4), kS: estimate(48, 6, 4) } };
    const result = combineMechanismEvidence({ ...none, lifetime });
    expect(result.verdict).toBe('both');
    expect(result.pieces[0]!.summary).toMatch(/K_S at 48 ± 6 M⁻¹/);
    expect(result.pieces[0]!.numbers.map((n) => n.label)).toContain('K_S (combined fit)');
  });

  it('when only the combined fit is there (no straight line), then its K_S decides', () => {
    const combined = { kD: estimate(100, 5, 4), kS: estimate(2, 4, 4) };
    const lifetime: LifetimeEvidence = {
      intensityKsv: null,
      lifetimeKsv: estimate(99, 3),
      intercept: 'free',
      combined,
    };
    expect(readMechanismPieces({ ...none, lifetime })[0]!.reading).toBe('dynamic');
    const withStatic = { ...lifetime, combined: { ...combined, kS: estimate(40, 4, 4) } };
    expect(readMechanismPieces({ ...none, lifetime: withStatic })[0]!.reading).toBe('both');
  });

  it('when the lifetimes fall faster than the intensities, then unclear and the data are to be checked', () => {
    const result = combineMechanismEvidence({ ...none, lifetime: slopes(60, 100) });
    expect(result.pieces[0]!.reading).toBe('unclear');
    expect(result.verdict).toBe('unclear');
    expect(result.reasons.join(' ')).toMatch(/check both data sets/);
  });
});

describe('the combined verdict', () => {
  it('when K_SV varies with wavelength, then two emitters or an exciplex, even with equal slopes', () => {
    const wavelength: WavelengthEvidence = {
      ...oneEmitter,
      flags: ['KSV_VARIES_WITH_WAVELENGTH'],
      homogeneity: { ...oneEmitter.homogeneity!, chiSquare: 88, pValue: 1e-12, homogeneous: false },
    };
    const result = combineMechanismEvidence({ ...none, lifetime: slopes(100, 98), wavelength });
    expect(result.verdict).toBe('two-emitters');
    expect(result.reasons[0]).toMatch(/two emitting species, or an exciplex/);
  });

  it('when a new emission grows with [Q], then two emitters or an exciplex', () => {
    const wavelength: WavelengthEvidence = { ...oneEmitter, flags: ['NEW_COMPONENT_GROWS'], significantComponents: 2 };
    const result = combineMechanismEvidence({ ...none, wavelength });
    expect(result.verdict).toBe('two-emitters');
    expect(result.pieces[0]!.summary).toMatch(/exciplex/);
  });

  it('when every piece agrees on dynamic quenching, then dynamic with each piece among the reasons', () => {
    const result = combineMechanismEvidence({
      lifetime: slopes(100, 98),
      temperature: trend('dynamic', 11_000),
      wavelength: oneEmitter,
      absorption: { changed: false, detail: 'The spectra add up.', associationConstant: null },
      diffusion: kq(5e9, 1e9),
    });
    expect(result.verdict).toBe('dynamic');
    expect(result.missing).toEqual([]);
    expect(result.reasons).toHaveLength(5);
    expect(result.pieces.map((piece) => piece.reading)).toEqual([
      'dynamic',
      'dynamic',
      'neutral',
      'neutral',
      'neutral',
    ]);
  });

  it('when equal slopes meet a falling K_SV with temperature, then unclear, naming the conflict', () => {
    const result = combineMechanismEvidence({
      ...none,
      lifetime: slopes(100, 98),
      temperature: trend('static', -9000),
    });
    expect(result.verdict).toBe('unclear');
    expect(result.reasons.some((reason) => reason.startsWith('But K_SV falls'))).toBe(true);
  });

  it('when equal slopes meet kq above k_diff, then dynamic at long range', () => {
    const result = combineMechanismEvidence({ ...none, lifetime: slopes(100, 98), diffusion: kq(6e10, 1e10) });
    expect(result.pieces[1]!.reading).toBe('static-or-long-range');
    expect(result.verdict).toBe('dynamic');
    expect(result.reasons.join(' ')).toMatch(/long range/);
  });

  it('when kq is above k_diff but within its own 95 % interval of it, then the diffusion piece is neutral', () => {
    expect(readMechanismPieces({ ...none, diffusion: kq(2.1e10, 0.5e10) })[0]!.reading).toBe('neutral');
  });

  it('without lifetimes, a falling K_SV alone leans static and says lifetimes would decide', () => {
    const result = combineMechanismEvidence({ ...none, temperature: trend('static', -9000) });
    expect(result.verdict).toBe('static');
    expect(result.reasons.at(-1)).toMatch(/Lifetimes against intensities would decide/);
  });

  it('without lifetimes, a dynamic trend beside an absorption change leans both', () => {
    const result = combineMechanismEvidence({
      ...none,
      temperature: trend('dynamic', 11_000),
      absorption: {
        changed: true,
        detail: 'A band grows at 480 nm.',
        associationConstant: { value: 35, standardError: 4 },
      },
    });
    expect(result.verdict).toBe('both');
    expect(result.pieces[1]!.summary).toMatch(/K_a = 35 ± 4 M⁻¹/);
  });

  it('when nothing points either way, then unclear', () => {
    const result = combineMechanismEvidence({ ...none, wavelength: oneEmitter, diffusion: kq(5e9, 1e9) });
    expect(result.verdict).toBe('unclear');
    expect(result.reasons).toContain('Nothing here points either way.');
  });

  it('when no evidence exists, then unclear and all five pieces are named as missing, with the caller’s reasons', () => {
    const result = combineMechanismEvidence({
      ...none,
      missingBecause: { temperature: 'Only 2 temperatures so far.' },
    });
    expect(result.verdict).toBe('unclear');
    expect(result.missing.map((piece) => piece.kind)).toEqual([
      'lifetime',
      'temperature',
      'wavelength',
      'absorption',
      'diffusion',
    ]);
    expect(result.missing[1]!.reason).toBe('Only 2 temperatures so far.');
    expect(result.missing[0]!.reason).toMatch(/lifetimes at each \[Q\]/);
  });

  it('when an estimate is not a number, then an EngineError names the field', () => {
    const bad = { ...slopes(100, 98), lifetimeKsv: estimate(Number.NaN, 1) };
    expect(() => combineMechanismEvidence({ ...none, lifetime: bad })).toThrow(EngineError);
    expect(() => combineMechanismEvidence({ ...none, lifetime: bad })).toThrow(/lifetime.lifetimeKsv/);
  });
});
