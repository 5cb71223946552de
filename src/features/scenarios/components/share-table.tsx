import { Link } from 'react-router-dom';
import type { Scenario } from '@shared/schemas/scenarios';
import { formatEstimate, formatNumber, UNITS } from '@shared/format';
import { toMillimolar } from '@shared/units/units';
import { paths } from '@/lib/paths';
import { TableHead } from '@/components/table-head';
import { TableScroll } from '@/components/table-scroll';

const percent = (fraction: number) => `${(fraction * 100).toFixed(fraction < 0.001 ? 3 : 1)} %`;

/** Who intercepts the excited emitter: each component's kq, its source and its share. */
export function ShareTable({ scenario, labId }: { scenario: Scenario; labId: string }) {
  const largest = Math.max(...scenario.shares.map((share) => share.fraction ?? 0));
  return (
    <TableScroll label="Shares, scroll sideways">
      <table className="w-full text-left text-body">
        <caption className="sr-only">Share of excited emitter intercepted by each component</caption>
        <TableHead
          look="ruled"
          columns={[
            'Component',
            `In reaction (${UNITS.millimolar})`,
            `kq (${UNITS.perMolarPerSecond})`,
            'kq from',
            'Share',
          ]}
        />
        <tbody>
          {scenario.shares.map((share) => (
            <tr key={share.componentId} className="border-b border-paper-200 tabular-nums">
              <th scope="row" className="py-1.5 pr-3 font-bold text-ink-900">
                {share.label}
              </th>
              <td className="pr-3">{formatNumber(toMillimolar(share.concentration), 4)}</td>
              <td className="pr-3">{share.kq === null ? '—' : formatEstimate(share.kq, share.kqStandardError)}</td>
              <td className="pr-3 text-caption">
                {share.kqSource?.kind === 'study' && (
                  <Link className="underline decoration-glow-400" to={paths.study(labId, share.kqSource.studyId)}>
                    {share.kqSource.title} ({share.kqSource.status})
                  </Link>
                )}
                {share.kqSource?.kind === 'study' && share.kqSource.solvent !== scenario.solvent && (
                  <span className="block font-bold text-brick-700">
                    measured in {share.kqSource.solvent ?? 'another solvent'}, not {scenario.solvent}
                  </span>
                )}
                {share.kqSource?.kind === 'manual' && <span>by hand: {share.kqSource.note || 'no source given'}</span>}
                {share.kqSource === null && <span className="font-bold text-brick-700">no kq yet</span>}
              </td>
              <td className={share.fraction !== null && share.fraction === largest ? 'font-black text-glow-700' : ''}>
                {share.fraction === null ? '—' : percent(share.fraction)}
              </td>
            </tr>
          ))}
          <tr className="tabular-nums">
            <th scope="row" className="py-1.5 pr-3 font-bold text-ink-600">
              Decays unquenched
            </th>
            <td colSpan={3} className="pr-3 text-caption text-ink-500">
              1/τ0 against the total decay rate
            </td>
            <td>{percent(scenario.unquenched)}</td>
          </tr>
        </tbody>
      </table>
    </TableScroll>
  );
}
