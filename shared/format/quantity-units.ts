/**
 * Units as people read them, with real superscripts and the micro sign: the same strings on
 * screen, in CSV headers, PNG figures and PDF reports. Keys say what the unit measures.
 */
export const UNITS = {
  perMolar: 'M⁻¹',
  perMolarSquared: 'M⁻²',
  perMolarPerSecond: 'M⁻¹ s⁻¹',
  perSecond: 's⁻¹',
  molar: 'M',
  millimolar: 'mM',
  micromolar: 'µM',
  second: 's',
  microsecond: 'µs',
  nanosecond: 'ns',
  electronvolt: 'eV',
  kilojoulePerMole: 'kJ mol⁻¹',
  volt: 'V',
  nanometre: 'nm',
  kelvin: 'K',
  millipascalSecond: 'mPa s',
  millilitre: 'mL',
  microlitre: 'µL',
} as const;

export type UnitText = (typeof UNITS)[keyof typeof UNITS];

/** "kq (M⁻¹ s⁻¹)": a column or axis title with its unit in brackets; the name alone when unitless. */
export const titled = (name: string, unit: string): string => (unit ? `${name} (${unit})` : name);
