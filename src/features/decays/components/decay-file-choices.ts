import type { DecayModel } from '@shared/schemas/decays';

/** The model a first look fits: one exponential, reconvolution when there is a response, Poisson likelihood. */
export const DEFAULT_DECAY_MODEL: DecayModel = {
  components: 1,
  method: null,
  estimator: 'poisson',
  startChannel: null,
  endChannel: null,
};

/** The time units a person may name when the time column's header names none. */
export const TIME_UNIT_OPTIONS = [
  { value: '', label: 'from the header' },
  { value: 'ps', label: 'ps' },
  { value: 'ns', label: 'ns' },
  { value: 'us', label: 'µs' },
] as const;
