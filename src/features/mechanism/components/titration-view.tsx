import { formatEstimate, formatNumber, UNITS } from '@shared/format';
import type { AbsorptionComparisonAnswer, AbsorptionPreview } from '@shared/schemas/absorption-titrations';
import { FormAlert } from '@/components/form-alert';
import { NotesList } from '@/components/notes-list';
import { Signal } from '@/components/signal';
import { AbsorptionPlots } from './absorption-plots';

const EPSILON_UNIT = 'M⁻¹ cm⁻¹';

/** K_a against K_S in words: the numbers, the difference in combined SEs, and whether they agree. */
function comparisonWords(comparison: AbsorptionComparisonAnswer): string {
  if (!comparison.kS) return comparison.source;
  const kS = `K_S = ${formatEstimate(comparison.kS.value, comparison.kS.standardError, UNITS.perMolar)}`;
  const agreement = comparison.isotherm ?? comparison.benesiHildebrand;
  if (!agreement) return `${kS}. ${comparison.source}`;
  const method = comparison.isotherm ? 'the isotherm' : 'Benesi–Hildebrand';
  return `${kS}. K_a from ${method} ${agreement.agree ? 'agrees with it' : 'differs from it'}: the two are ${formatNumber(agreement.z, 2)} combined standard errors apart (they agree up to 1.96). ${comparison.source}`;
}

/** What one titration (kept or previewed) says: the flag in words, K_a both ways, the comparison and the plots. */
export function TitrationView({ answer, title }: { answer: AbsorptionPreview; title: string }) {
  const { analysis, reading, quencher, comparison } = answer;
  const binding = analysis.binding;
  const width = analysis.bandWidth === 0 ? 'one band per wavelength' : `${formatNumber(analysis.bandWidth)} nm bands`;
  const isotherm = binding?.isotherm.fit ?? null;
  const bh = binding?.benesiHildebrand.fit ?? null;
  return (
    <div className="space-y-3">
      <header className="flex flex-wrap items-baseline justify-between gap-3">
        <p className="text-body">
          <strong>{title}</strong>: {reading.samples.length} spectra, {formatNumber(reading.firstWavelength)}–
          {formatNumber(reading.lastWavelength)} {UNITS.nanometre}, {width},{' '}
          {quencher
            ? `the quencher's own ${quencher.kind === 'absorptivity' ? 'ε' : 'spectrum'} taken out`
            : "the quencher's own absorbance not taken out"}
          .
        </p>
        {analysis.flags.length > 0 ? (
          <Signal tone="bad">A ground-state complex may form</Signal>
        ) : (
          <Signal tone="good">No change beyond the sum of the parts</Signal>
        )}
      </header>
      {analysis.flags.map((flag) => (
        <FormAlert key={flag.code} tone="note">
          <strong>{flag.title}.</strong> {flag.detail}
        </FormAlert>
      ))}
      {analysis.flags.length === 0 && (
        <p className="text-body">
          {`The absorption is the emitter's plus the quencher's within the noise: the largest change, ΔA = ${formatNumber(analysis.largestChange.change, 2)} near ${formatNumber(analysis.largestChange.centre)} ${UNITS.nanometre}, is ${formatNumber(analysis.largestChange.z, 2)} noise standard deviations; a change counts beyond ${formatNumber(analysis.threshold.z, 3)}. No association constant is fitted.`}
        </p>
      )}
      {binding && (
        <dl className="grid gap-x-6 gap-y-1 text-body sm:grid-cols-[auto_1fr]">
          <dt className="font-bold">Band of largest change</dt>
          <dd>{`${formatNumber(binding.band.start)}–${formatNumber(binding.band.end)} ${UNITS.nanometre}`}</dd>
          <dt className="font-bold">K_a, 1:1 isotherm</dt>
          <dd>
            {isotherm
              ? `${formatEstimate(isotherm.kA.value, isotherm.kA.standardError, UNITS.perMolar)} (${isotherm.form === 'exact' ? 'exact mass balance with [E]0' : '[Q] taken as in large excess'})`
              : binding.isotherm.problem}
          </dd>
          <dt className="font-bold">K_a, Benesi–Hildebrand</dt>
          <dd>
            {bh
              ? `${formatEstimate(bh.kA.value, bh.kA.standardError, UNITS.perMolar)} (double reciprocal, R² = ${formatNumber(bh.rSquared, 4)})`
              : binding.benesiHildebrand.problem}
          </dd>
          {binding.deltaEpsilon && (
            <>
              <dt className="font-bold">Δε of the complex</dt>
              <dd>{formatEstimate(binding.deltaEpsilon.value, binding.deltaEpsilon.standardError, EPSILON_UNIT)}</dd>
            </>
          )}
          <dt className="font-bold">Against K_S of the study</dt>
          <dd>{comparisonWords(comparison)}</dd>
        </dl>
      )}
      <NotesList items={analysis.notes} />
      <AbsorptionPlots plot={answer.plot} analysis={analysis} />
    </div>
  );
}
