import { Link } from 'react-router-dom';
import type { Comparison } from '@shared/schemas/comparisons';
import { MECHANISM_VERDICT_WORDS } from '@shared/schemas/mechanism-evidence';
import { formatEstimate, formatFixed, formatNumber, SYMBOLS, UNITS } from '@shared/format';
import { Signal } from '@/components/signal';
import { Subscripted } from '@/components/subscripted';
import { paths } from '@/lib/paths';
import { TableHead } from '@/components/table-head';
import { TableScroll } from '@/components/table-scroll';

/**
 * One row per study: the other compound, kq ± SE, K_SV, solvent, driving force, flags, mechanism
 * verdict and review state. Values and headings stay on one line (a number broken over four lines
 * at 360 px reads as four numbers) and the table scrolls inside its card instead; only the flags,
 * free text, wrap, at a readable width: 14rem on a phone, 12rem from the xl breakpoint, where that
 * lets the whole table (Review column included) fit a 1440 px window.
 */
export function ComparisonTable({ comparison, labId }: { comparison: Comparison; labId: string }) {
  const partner = comparison.side === 'emitter' ? 'Quencher' : 'Emitter';
  return (
    <TableScroll label="Comparison, scroll sideways">
      <table className="w-full whitespace-nowrap text-left text-body">
        <caption className="sr-only">Studies of {comparison.compound.name}</caption>
        <TableHead
          look="ruled"
          columns={[
            partner,
            `kq (${UNITS.perMolarPerSecond})`,
            `K_SV (${UNITS.perMolar})`,
            'Solvent',
            <>
              <Subscripted symbol={SYMBOLS.drivingForce} /> ({UNITS.electronvolt})
            </>,
            'Flags',
            'Mechanism',
            'Review',
          ]}
        />
        <tbody>
          {comparison.rows.map((row) => (
            <tr
              key={row.studyId}
              className={`border-b border-paper-200 tabular-nums ${row.status === 'approved' ? '' : 'text-ink-600'}`}
            >
              <th scope="row" className="py-1.5 pr-3 font-bold">
                <Link to={paths.study(labId, row.studyId)} className="underline decoration-glow-400">
                  {row.partner.name}
                </Link>
              </th>
              <td className="pr-3">{row.kq ? formatEstimate(row.kq.value, row.kq.standardError) : '—'}</td>
              <td className="pr-3">{row.kSv ? formatNumber(row.kSv.value) : '—'}</td>
              <td className="pr-3">
                {row.solvent}, {row.temperature} {UNITS.kelvin}
              </td>
              <td className="pr-3" title={row.drivingForceMissing ?? undefined}>
                {row.drivingForce
                  ? `${formatFixed(row.drivingForce.electronvolts, 2, { signed: true })} (${row.drivingForce.pathway === 'oxidative' ? 'ox.' : 'red.'})`
                  : 'missing'}
              </td>
              <td className="whitespace-normal py-1.5 pr-3 text-caption">
                <div className="min-w-56 text-pretty xl:min-w-48">
                  {row.flags.map((flag) => flag.title).join('; ') || '—'}
                </div>
              </td>
              <td className="pr-3">{MECHANISM_VERDICT_WORDS[row.mechanism]}</td>
              <td>
                {row.status === 'approved' ? (
                  <Signal tone="good">approved</Signal>
                ) : (
                  <Signal tone="waiting">{row.status}</Signal>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </TableScroll>
  );
}
