import {
  CONCENTRATION_UNITS as CONCENTRATION_FACTORS,
  normaliseMicro as micro,
  TIME_UNITS as TIME_FACTORS,
  VOLUME_UNITS as VOLUME_FACTORS,
} from '@shared/units/units';

// The factors live in the shared units module; "u", "µ" (micro sign) and "μ" (Greek mu) all mean micro.
export { CONCENTRATION_FACTORS, TIME_FACTORS, VOLUME_FACTORS };

const KNOWN_UNITS = new Set<string>([
  ...Object.keys(CONCENTRATION_FACTORS),
  ...Object.keys(TIME_FACTORS),
  ...Object.keys(VOLUME_FACTORS),
]);

/** The unit written in a header, e.g. "[Q] (mM)", "conc / µM", "tau_ns", "lifetime [us]"; the last known unit wins. */
export function headerUnit(header: string): string | null {
  const candidates = [...header.matchAll(/[([]\s*([a-zA-Zµμ]{1,3})\s*[)\]]/g)].map((match) => match[1]!);
  const trailing = header.match(/(?:[/_ ]|^)([a-zA-Zµμ]{1,3})\s*$/);
  if (trailing) candidates.push(trailing[1]!);
  return (
    candidates
      .map(micro)
      .filter((unit) => KNOWN_UNITS.has(unit))
      .at(-1) ?? null
  );
}

export const concentrationUnitOf = (header: string) => {
  const unit = headerUnit(header);
  return unit && unit in CONCENTRATION_FACTORS ? (unit as keyof typeof CONCENTRATION_FACTORS) : null;
};
export const timeUnitOf = (header: string) => {
  const unit = headerUnit(header);
  return unit && unit in TIME_FACTORS ? (unit as keyof typeof TIME_FACTORS) : null;
};
export const volumeUnitOf = (header: string) => {
  const unit = headerUnit(header);
  return unit && unit in VOLUME_FACTORS ? (unit as keyof typeof VOLUME_FACTORS) : null;
};

/**
 * A sample's concentration written in a spectrum column header, e.g. "0.5 mM", "[Q]=2,0 uM",
 * "c = 1e-3 M"; returns mol/L, or null when the header names none.
 */
export function concentrationInHeader(header: string): number | null {
  const match = header.match(/([+-]?\d+(?:[.,]\d+)?(?:[eE][+-]?\d+)?)\s*(mM|uM|µM|μM|nM|M)(?![a-zA-Z])/);
  if (!match) return null;
  const value = Number(match[1]!.replace(',', '.'));
  const unit = micro(match[2]!) as keyof typeof CONCENTRATION_FACTORS;
  return Number.isFinite(value) ? value * CONCENTRATION_FACTORS[unit] : null;
}
