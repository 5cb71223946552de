import { pointAt } from '@shared/schemas/study-points';
import type { StudyFitPoint, StudyFitSettings } from '@shared/engine';

/**
 * The study settings the study-fit tests start from: acetonitrile at 25 °C, intensities, no I0,
 * no τ0 and every correction off; each test overrides what it is about.
 */
export const fitSettings = (overrides: Partial<StudyFitSettings> = {}): StudyFitSettings => ({
  solventId: 'acetonitrile',
  customSolventName: null,
  customViscosity: null,
  temperature: 298.15,
  tau0: null,
  tau0Uncertainty: null,
  tau0LifetimeId: null,
  dataKind: 'intensity',
  i0: null,
  dilutionCorrection: false,
  initialVolume: null,
  stockConcentration: null,
  stockContainsEmitter: false,
  innerFilterCorrection: false,
  ...overrides,
});

/** A point at its place in the series: [Q] (mol/L), its intensity (or I0/I) and any other values. */
export const fitPoint = (
  position: number,
  concentration: number,
  intensity: number | null,
  extra: Partial<StudyFitPoint> = {},
): StudyFitPoint => ({ ...pointAt(concentration), position, intensity, ...extra });
