import { Link } from 'react-router-dom';
import { formatEstimate, formatNumber, titled, UNITS } from '@shared/format';
import { toMillipascalSeconds } from '@shared/units/units';
import type { TemperatureSeriesAnalysis } from '@shared/schemas/temperature-series';

/** One row per study: temperature, K_SV, kq, η(T) and k_diff(T), each study linked. */
export function SeriesTable({
  analysis,
  studyPath,
}: {
  analysis: TemperatureSeriesAnalysis;
  studyPath: (studyId: string) => string;
}) {
  return (
    <table className="w-full text-left text-body">
      <thead className="text-caption text-ink-600">
        <tr>
          <th className="py-1">Study</th>
          <th>{titled('T', UNITS.kelvin)}</th>
          <th>{titled('K_SV', UNITS.perMolar)}</th>
          <th>{titled('kq', UNITS.perMolarPerSecond)}</th>
          <th>{titled('η', UNITS.millipascalSecond)}</th>
          <th>{titled('k_diff', UNITS.perMolarPerSecond)}</th>
        </tr>
      </thead>
      <tbody className="divide-y divide-paper-200">
        {analysis.points.map((point) => (
          <tr key={point.studyId}>
            <td className="py-1">
              <Link to={studyPath(point.studyId)} className="underline decoration-glow-400">
                {point.title}
              </Link>
            </td>
            <td>{formatNumber(point.temperature, 5)}</td>
            <td>{formatEstimate(point.kSv.value, point.kSv.standardError)}</td>
            <td>{point.kq ? formatEstimate(point.kq.value, point.kq.standardError) : '—'}</td>
            <td title={point.viscositySource}>{formatNumber(toMillipascalSeconds(point.viscosity))}</td>
            <td>{formatNumber(point.diffusionLimit)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
