import { useState } from 'react';
import { formatEstimate, formatNumber, UNITS } from '@shared/format';
import type {
  AbsorptionComparisonAnswer,
  AbsorptionPreview,
  AbsorptionTitration,
} from '@shared/schemas/absorption-titrations';
import type { MechanismVerdictChange } from '@shared/schemas/mechanism-evidence';
import { fromMicromolar } from '@shared/units/units';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { FileField } from '@/components/file-field';
import { FormAlert } from '@/components/form-alert';
import { Signal } from '@/components/signal';
import { TextField } from '@/components/text-field';
import { describeError } from '@/lib/form-errors';
import type { AbsorptionInput } from '../api/absorption-upload-form';
import { useAbsorptionTitrations } from '../api/get-absorption-titrations';
import { useKeepAbsorptionTitration } from '../api/keep-absorption-titration';
import { usePreviewAbsorptionTitration } from '../api/preview-absorption-titration';
import { AbsorptionPlots } from './absorption-plots';
import { TitrationChanges } from './titration-changes';
import { VerdictChangeNotice } from './verdict-change-notice';
import { BandWidthField } from './band-width-field';

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
function TitrationView({ answer, title }: { answer: AbsorptionPreview; title: string }) {
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
      {analysis.notes.length > 0 && (
        <ul className="list-disc space-y-1 pl-5 text-caption">
          {analysis.notes.map((note) => (
            <li key={note}>{note}</li>
          ))}
        </ul>
      )}
      <AbsorptionPlots plot={answer.plot} analysis={analysis} />
    </div>
  );
}

function KeptTitration({
  labId,
  studyId,
  titration,
  editable,
  onDiscarded,
}: {
  labId: string;
  studyId: string;
  titration: AbsorptionTitration;
  editable: boolean;
  onDiscarded: (change: MechanismVerdictChange) => void;
}) {
  return (
    <article aria-label={`Absorption ${titration.title}`} className="space-y-2 rounded-md border border-paper-300 p-3">
      <TitrationView answer={titration} title={titration.title} />
      <div className="flex flex-wrap items-center gap-3">
        <a className="text-caption underline" href={`/api/labs/${labId}/mechanism-files/${titration.file.id}`}>
          Raw file
        </a>
        {titration.quencherFile && (
          <a
            className="text-caption underline"
            href={`/api/labs/${labId}/mechanism-files/${titration.quencherFile.id}`}
          >
            Quencher file
          </a>
        )}
      </div>
      {editable && <TitrationChanges labId={labId} studyId={studyId} titration={titration} onDiscarded={onDiscarded} />}
    </article>
  );
}

/**
 * UV-vis spectra of the emitter with increasing quencher: whether the absorption changes beyond
 * emitter plus quencher (a ground-state complex), K_a by Benesi–Hildebrand and by the 1:1
 * isotherm, and K_a against K_S of the study's combined fit. A file is previewed first and kept
 * only on request.
 */
export function AbsorptionPanel({ labId, studyId, editable }: { labId: string; studyId: string; editable: boolean }) {
  const [file, setFile] = useState<File | null>(null);
  const [quencher, setQuencher] = useState<File | null>(null);
  const [bandWidth, setBandWidth] = useState('5');
  const [pathLength, setPathLength] = useState('1');
  const [emitterMicromolar, setEmitterMicromolar] = useState('');
  const titrations = useAbsorptionTitrations(labId, studyId);
  const preview = usePreviewAbsorptionTitration(labId, studyId);
  const keep = useKeepAbsorptionTitration(labId, studyId);
  const [discarded, setDiscarded] = useState<{ title: string; change: MechanismVerdictChange } | null>(null);
  const items = titrations.data?.items ?? [];
  const micromolar = Number(emitterMicromolar.replace(',', '.'));
  const input = (chosen: File): AbsorptionInput => ({
    file: chosen,
    quencher,
    bandWidth,
    pathLength,
    // An entry that is not a number goes as typed, so the server names the field.
    emitterConcentration:
      emitterMicromolar.trim() === ''
        ? ''
        : Number.isFinite(micromolar)
          ? String(fromMicromolar(micromolar))
          : emitterMicromolar,
  });
  const reset = () => {
    preview.reset();
    setFile(null);
    setQuencher(null);
  };
  return (
    <div className="space-y-4">
      {editable && (
        <div className="space-y-3">
          <div className="grid gap-3 sm:grid-cols-2">
            <FileField
              label="UV-vis spectra file"
              hint="Wavelength in nm in the first column, one absorbance spectrum per column with its [Q] in the header (0 mM and at least 3 more), all on one grid."
              fileName={file?.name ?? null}
              onFile={(chosen) => {
                preview.reset();
                setFile(chosen);
              }}
            />
            <FileField
              label="Quencher alone (optional)"
              hint='Same grid, one column headed with its [Q] ("quencher 10 mM") or with ε ("ε (M-1 cm-1)").'
              fileName={quencher?.name ?? null}
              onFile={(chosen) => {
                preview.reset();
                setQuencher(chosen);
              }}
            />
          </div>
          <div className="grid gap-3 sm:grid-cols-3">
            <BandWidthField value={bandWidth} onChange={setBandWidth} />
            <TextField
              label="Path length (cm)"
              inputMode="decimal"
              value={pathLength}
              onChange={(event) => setPathLength(event.target.value)}
            />
            <TextField
              label="Emitter concentration (µM)"
              hint="For the exact 1:1 isotherm and Δε; leave empty if [Q] is in large excess"
              inputMode="decimal"
              value={emitterMicromolar}
              onChange={(event) => setEmitterMicromolar(event.target.value)}
            />
          </div>
          {preview.isError && <FormAlert>{describeError(preview.error)}</FormAlert>}
          {keep.isError && <FormAlert>{describeError(keep.error)}</FormAlert>}
          <div className="flex flex-wrap gap-3">
            <Button
              disabled={!file}
              pending={preview.isPending}
              pendingLabel="Reading…"
              onClick={() => file && preview.mutate(input(file))}
            >
              Preview the absorption
            </Button>
            {preview.data && file && (
              <>
                <Button pending={keep.isPending} onClick={() => keep.mutate(input(file), { onSuccess: reset })}>
                  Keep with the study
                </Button>
                <Button variant="quiet" onClick={reset}>
                  Discard the preview
                </Button>
              </>
            )}
          </div>
          {preview.data && file && (
            <section aria-label="Preview" className="rounded-md border border-dashed border-ink-300 p-3">
              <TitrationView answer={preview.data} title={`Preview of ${file.name} (not kept)`} />
            </section>
          )}
        </div>
      )}
      {titrations.isError && <FormAlert>{describeError(titrations.error)}</FormAlert>}
      {discarded && <VerdictChangeNotice what={`Discarded ${discarded.title}`} change={discarded.change} />}
      {titrations.isSuccess && items.length === 0 && (
        <EmptyState title="No absorption titration yet">
          UV-vis spectra at each [Q] show whether emitter and quencher form a complex before the light arrives.
        </EmptyState>
      )}
      {items.map((titration) => (
        <KeptTitration
          key={titration.id}
          labId={labId}
          titration={titration}
          studyId={studyId}
          editable={editable}
          onDiscarded={(change) => setDiscarded({ title: titration.title, change })}
        />
      ))}
    </div>
  );
}
