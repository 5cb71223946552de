import type { StudyFit } from '@shared/schemas/study-fits';
import type { Estimate } from '@shared/schemas/study-fits';
import {
  fitParameterLines,
  rSquaredLines,
  tau0Text,
  weightingText,
  replicateRunsText,
  weightingComparisonText,
  formatDateTime,
  formatEstimate,
  formatInterval,
  formatQuantity,
  UNITS,
} from '@shared/format';
import { concentrationDisplayUnit, fromSi, unitLabel } from '@shared/units/units';
import { modelLabels } from './format';

function Row({ label, estimate, unit }: { label: string; estimate: Estimate | undefined; unit: string }) {
  if (!estimate) return null;
  return (
    <div className="grid grid-cols-[9rem_1fr] gap-2 py-1">
      <dt className="font-bold text-ink-900">{label}</dt>
      <dd aria-label={label}>
        <span className="text-lead font-black text-ink-950">
          {formatEstimate(estimate.value, estimate.standardError, unit)}
        </span>
        <span className="block text-caption text-ink-500">
          95 % interval{' '}
          {formatInterval(
            estimate.interval95.lower,
            estimate.interval95.upper,
            estimate.standardError,
            estimate.value,
            unit,
          )}
        </span>
        {estimate.includes && <span className="block text-caption text-ink-500">SE includes {estimate.includes}</span>}
      </dd>
    </div>
  );
}

/** Several runs pooled: each run's I0, mean ± SD per concentration, and the weighted fit beside the unweighted one. */
function Replicates({ replicates }: { replicates: NonNullable<StudyFit['result']['replicates']> }) {
  const { summary, weighting } = replicates;
  const unit = concentrationDisplayUnit(Math.max(...summary.map((row) => row.concentration)));
  return (
    <section aria-label="Replicate runs" className="space-y-1">
      <p>{replicateRunsText(replicates)}</p>
      <table className="text-caption">
        <thead>
          <tr>
            <th scope="col" className="pr-3 text-left">
              [Q] ({unitLabel(unit)})
            </th>
            <th scope="col" className="pr-3 text-left">
              n
            </th>
            <th scope="col" className="text-left">
              I0/I mean ± SD
            </th>
          </tr>
        </thead>
        <tbody>
          {summary.map((row) => (
            <tr key={row.concentration}>
              <td className="pr-3">{formatQuantity(fromSi(row.concentration, unit), '')}</td>
              <td className="pr-3">{row.n}</td>
              <td>{row.sd === null ? formatQuantity(row.mean, '') : formatEstimate(row.mean, row.sd, '')}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {weighting && (
        <p aria-label="Weighted fit" className={weighting.beyondStandardError ? 'font-bold' : undefined}>
          {weightingComparisonText(weighting)}
        </p>
      )}
    </section>
  );
}

/** The newest fit in numbers: constants with SE and interval, statistics, the diffusion limit, every flag explained. */
export function ResultsPanel({ fit }: { fit: StudyFit }) {
  const { statistics, diffusionLimit, tau0, flags, notes } = fit.result;
  const { lines, note: rootNote } = fitParameterLines(fit.model, fit.result);
  return (
    <div className="space-y-3 text-body text-ink-800">
      <p className="text-caption text-ink-500">
        {modelLabels[fit.model]} · engine {fit.engineVersion} · {formatDateTime(fit.createdAt)}
      </p>
      {fit.result.intensity === 'no-intensity-data' && (
        <p aria-label="Intensity fit">
          Intensity fit: <strong>no intensity data</strong>. K_SV and kq come from the lifetime Stern–Volmer fit (τ0/τ).
        </p>
      )}
      <p aria-label="Weighting">Weighting: {weightingText(fit.result.weighting)}</p>
      <dl>
        {lines.map((line) => (
          <Row key={line.key} label={line.label} estimate={line.estimate} unit={line.unit} />
        ))}
      </dl>
      {rootNote && <p className="text-caption text-ink-500">{rootNote}</p>}
      <p>
        n = {statistics.n}
        {rSquaredLines(statistics).map((line) => (
          <span key={line.key}>
            {' '}
            · {line.label} = {line.value.toFixed(4)}
          </span>
        ))}
        {statistics.curvature && <> · shape: {statistics.curvature}</>}
      </p>
      {tau0 && <p>τ0 = {tau0Text(tau0)}</p>}
      {diffusionLimit && (
        <p>
          Diffusion limit k_diff = {formatQuantity(diffusionLimit.value, UNITS.perMolarPerSecond)}
          {diffusionLimit.ratio !== null && (
            <>
              {' '}
              · kq/k_diff = <strong>{diffusionLimit.ratio.toFixed(2)}</strong>
            </>
          )}
          <span className="block text-caption text-ink-500">8RT/(3η), {diffusionLimit.basis}</span>
        </p>
      )}
      {fit.result.replicates && <Replicates replicates={fit.result.replicates} />}
      {fit.result.lifetime?.verdict && <p className="font-bold">{fit.result.lifetime.verdict}</p>}
      {flags.length > 0 && (
        <ul aria-label="Flags" className="space-y-2">
          {flags.map((flag) => (
            <li
              key={flag.code}
              className={`rounded-md border px-3 py-2 ${flag.severity === 'error' ? 'border-brick-500 bg-brick-100' : 'border-glow-300 bg-glow-50'}`}
            >
              <p className="font-bold">
                {flag.title}
                {flag.detail && <span className="font-normal text-ink-500"> — {flag.detail}</span>}
              </p>
              <p>{flag.explanation}</p>
              {flag.whatToDo && (
                <p>
                  <strong>What to do:</strong> {flag.whatToDo}
                </p>
              )}
              <p className="text-caption">Check: {flag.whatToCheck.join('; ')}.</p>
            </li>
          ))}
        </ul>
      )}
      {notes.map((note) => (
        <p key={note} className="text-caption text-ink-500">
          {note}
        </p>
      ))}
    </div>
  );
}
