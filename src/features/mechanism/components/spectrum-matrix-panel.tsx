import { useState, type ReactNode } from 'react';
import { formatEstimate, formatNumber, UNITS } from '@shared/format';
import type { MechanismVerdictChange } from '@shared/schemas/mechanism-evidence';
import type { SpectrumMatrix } from '@shared/schemas/spectrum-matrices';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { FileField } from '@/components/file-field';
import { FormAlert } from '@/components/form-alert';
import { Signal } from '@/components/signal';
import { describeError } from '@/lib/form-errors';
import { useSpectrumMatrices } from '../api/get-spectrum-matrices';
import { useKeepSpectrumMatrix } from '../api/keep-spectrum-matrix';
import { BandWidthField } from './decimal-field';
import { MatrixChanges } from './matrix-changes';
import { SpectrumMatrixPlots } from './spectrum-matrix-plots';
import { VerdictChangeNotice } from './verdict-change-notice';

/** What one kept matrix says: the flags or "one emitter", the χ² test and the component count, then the plots. */
function MatrixView({ labId, matrix, changes }: { labId: string; matrix: SpectrumMatrix; changes?: ReactNode }) {
  const { analysis, reading } = matrix;
  const { homogeneity, components } = analysis;
  const width = analysis.bandWidth === 0 ? 'one band per wavelength' : `${formatNumber(analysis.bandWidth)} nm bands`;
  return (
    <article aria-label={`Spectra ${matrix.title}`} className="space-y-3 rounded-md border border-paper-300 p-3">
      <header className="flex flex-wrap items-baseline justify-between gap-3">
        <p className="text-body">
          <strong>{matrix.title}</strong>: {reading.samples.length} spectra, {formatNumber(reading.firstWavelength)}–
          {formatNumber(reading.lastWavelength)} {UNITS.nanometre}, {width}.{' '}
          <a className="text-caption underline" href={`/api/labs/${labId}/mechanism-files/${matrix.file.id}`}>
            Raw file
          </a>
        </p>
        {analysis.flags.length === 0 ? (
          <Signal tone="good">One emitter: K_SV the same across the emission</Signal>
        ) : (
          <Signal tone="bad">{`${analysis.flags.length} to check`}</Signal>
        )}
      </header>
      {analysis.flags.map((flag) => (
        <FormAlert key={flag.code} tone="note">
          <strong>{flag.title}.</strong> {flag.detail}
        </FormAlert>
      ))}
      <dl className="grid gap-x-6 gap-y-1 text-body sm:grid-cols-[auto_1fr]">
        <dt className="font-bold">K_SV across the bands</dt>
        <dd>
          {homogeneity
            ? `${formatEstimate(homogeneity.weightedMean, homogeneity.weightedMeanStandardError, UNITS.perMolar)} (weighted mean); χ² = ${formatNumber(homogeneity.chiSquare)} with ${homogeneity.degreesOfFreedom} degrees of freedom, ${homogeneity.pValue < 1e-4 ? 'p < 0.0001' : `p = ${formatNumber(homogeneity.pValue, 2)}`}`
            : 'Fewer than two bands strong enough to compare: choose narrower bands.'}
        </dd>
        <dt className="font-bold">Spectral components</dt>
        <dd>
          {`${components.significant} above the noise (singular values ${components.singularValues
            .slice(0, 4)
            .map((value) => formatNumber(value))
            .join(', ')}; noise level ${formatNumber(components.noiseThreshold)})`}
        </dd>
      </dl>
      <SpectrumMatrixPlots matrix={matrix} />
      {changes}
    </article>
  );
}

/**
 * Emission spectra of the study at several [Q] in one file: K_SV band by band, whether it is the
 * same across the emission (one emitter) or not (two emitters, an exciplex), and how many
 * spectral components the spectra hold. The file is kept as received.
 */
export function SpectrumMatrixPanel({
  labId,
  studyId,
  editable,
}: {
  labId: string;
  studyId: string;
  editable: boolean;
}) {
  const [file, setFile] = useState<File | null>(null);
  const [bandWidth, setBandWidth] = useState('10');
  const matrices = useSpectrumMatrices(labId, studyId);
  const keep = useKeepSpectrumMatrix(labId, studyId);
  const [discarded, setDiscarded] = useState<{ title: string; change: MechanismVerdictChange } | null>(null);
  const items = matrices.data?.items ?? [];
  return (
    <div className="space-y-4">
      {editable && (
        <div className="space-y-3">
          <div className="grid gap-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
            <FileField
              label="Spectra file"
              hint="Wavelength in nm in the first column, one spectrum per column with its [Q] in the header (e.g. 0 mM, 2 mM), all on one grid, including the spectrum without quencher."
              fileName={file?.name ?? null}
              onFile={setFile}
            />
            <BandWidthField value={bandWidth} onChange={setBandWidth} />
          </div>
          {keep.isError && <FormAlert>{describeError(keep.error)}</FormAlert>}
          <Button
            disabled={!file}
            pending={keep.isPending}
            onClick={() => file && keep.mutate({ file, bandWidth }, { onSuccess: () => setFile(null) })}
          >
            Keep and analyse the spectra
          </Button>
        </div>
      )}
      {matrices.isError && <FormAlert>{describeError(matrices.error)}</FormAlert>}
      {matrices.isSuccess && items.length === 0 && (
        <EmptyState title="No spectra yet">
          Emission spectra at each [Q] show whether K_SV is the same at every wavelength.
        </EmptyState>
      )}
      {discarded && <VerdictChangeNotice what={`Discarded ${discarded.title}`} change={discarded.change} />}
      {items.map((matrix) => (
        <MatrixView
          key={matrix.id}
          labId={labId}
          matrix={matrix}
          changes={
            editable && (
              <MatrixChanges
                labId={labId}
                studyId={studyId}
                matrix={matrix}
                onDiscarded={(change) => setDiscarded({ title: matrix.title, change })}
              />
            )
          }
        />
      ))}
    </div>
  );
}
