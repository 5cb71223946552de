import { forwardRef } from 'react';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { fitParameterLines, formatEstimate, UNITS } from '@shared/format';
import { modelLabels } from './format';
import { StatusSignal } from './status-signal';

/** The latest "returned" review, whose comment says what to change. */
const returnReasonOf = (study: StudyDetail) =>
  study.status === 'returned'
    ? ([...study.reviews].reverse().find((entry) => entry.action === 'return') ?? null)
    : null;

/**
 * The study's answer at the top of its screen: K_SV and kq with their SE, the flags, the review
 * status and, for a returned study, the reviewer's reason. It takes the focus when a fit arrives.
 */
export const ResultSummary = forwardRef<HTMLElement, { study: StudyDetail }>(function ResultSummary({ study }, ref) {
  const fit = study.latestFit;
  const headline = fit ? fitParameterLines(fit.model, fit.result).lines.filter((line) => line.headline) : [];
  const kq = fit?.result.parameters.kq;
  const returned = returnReasonOf(study);
  return (
    <section
      ref={ref}
      tabIndex={-1}
      aria-label="Result"
      className="scroll-mt-4 rounded-card border border-ink-200 bg-white p-4 shadow-card outline-none focus-visible:ring-2 focus-visible:ring-glow-400"
    >
      {returned && (
        <div role="note" className="mb-3 rounded-md border border-brick-500 bg-brick-100 px-3 py-2 text-body">
          <strong>Returned by {returned.author ?? 'a reviewer'}:</strong> {returned.comment || 'no reason given.'}
        </div>
      )}
      <div className="flex flex-wrap items-baseline gap-x-8 gap-y-2">
        {headline.length === 0 && (
          <p>
            <span className="block text-caption text-ink-600">K_SV</span>
            <span aria-label="K_SV result" className="text-title font-black text-ink-950">
              —
            </span>
          </p>
        )}
        {headline.map((line) => (
          <p key={line.key}>
            <span className="block text-caption text-ink-600">{line.label}</span>
            <span aria-label={`${line.label} result`} className="text-title font-black text-ink-950">
              {formatEstimate(line.estimate.value, line.estimate.standardError, line.unit)}
            </span>
          </p>
        ))}
        <p>
          <span className="block text-caption text-ink-600">kq</span>
          <span aria-label="kq result" className="text-title font-black text-ink-950">
            {kq ? formatEstimate(kq.value, kq.standardError, UNITS.perMolarPerSecond) : fit ? 'needs τ0' : '—'}
          </span>
        </p>
        <p className="text-body text-ink-700">
          <StatusSignal status={study.status} />
          {fit && <span className="ml-2">{modelLabels[fit.model]}</span>}
        </p>
      </div>
      {!fit && (
        <p className="mt-2 text-body text-ink-600">
          {study.fitProblem ?? 'No fit yet: add points (type, paste or upload) and the fit appears here.'}
        </p>
      )}
      {fit && fit.result.flags.length > 0 && (
        <ul aria-label="Flags in brief" className="mt-2 flex flex-wrap gap-2 text-body">
          {fit.result.flags.map((flag) => (
            <li
              key={flag.code}
              className={`rounded-md border px-2 py-0.5 ${flag.severity === 'error' ? 'border-brick-500 bg-brick-100' : 'border-glow-300 bg-glow-50'}`}
            >
              {flag.title}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
});
