import type { Comparison } from '@shared/schemas/comparisons';
import { SYMBOLS, symbolPlain, titled, UNITS } from '@shared/format';
import { csvTable } from '../../lib/csv-cells';

/** The comparison table as CSV, SI units in the headers; approved results are marked in their own column. */
export function comparisonCsv(comparison: Comparison): string {
  const partner = comparison.side === 'emitter' ? 'quencher' : 'emitter';
  const header = [
    partner,
    'study',
    'solvent',
    'status',
    'approved',
    titled('kq', UNITS.perMolarPerSecond),
    titled('kq SE', UNITS.perMolarPerSecond),
    titled('K_SV', UNITS.perMolar),
    titled('K_SV SE', UNITS.perMolar),
    titled(symbolPlain(SYMBOLS.drivingForce), UNITS.electronvolt),
    'pathway',
    titled(`${symbolPlain(SYMBOLS.drivingForce)} with Coulomb term`, UNITS.electronvolt),
    'flags',
    titled('temperature', UNITS.kelvin),
    titled('k_diff', UNITS.perMolarPerSecond),
    'mechanism',
  ];
  const rows = comparison.rows.map((row) => [
    row.partner.name,
    row.title,
    row.solvent,
    row.status,
    row.status === 'approved' ? 'yes' : 'no',
    row.kq?.value,
    row.kq?.standardError,
    row.kSv?.value,
    row.kSv?.standardError,
    row.drivingForce?.electronvolts,
    row.drivingForce?.pathway,
    row.drivingForce?.withWorkTerm,
    row.flags.map((flag) => flag.code).join(' '),
    row.temperature,
    row.diffusionLimit?.value,
    row.mechanism,
  ]);
  return csvTable([
    [`# ${comparison.side}`, comparison.compound.name],
    [`# engine`, comparison.engineVersion],
    header,
    ...rows,
  ]);
}
