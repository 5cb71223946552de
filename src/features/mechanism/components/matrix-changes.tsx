import { useState } from 'react';
import { formatNumber } from '@shared/format';
import type { MechanismVerdictChange } from '@shared/schemas/mechanism-evidence';
import type { SpectrumMatrix } from '@shared/schemas/spectrum-matrices';
import { Button } from '@/components/button';
import { ConfirmedAction } from '@/components/confirmed-action';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import { useDiscardSpectrumMatrix } from '../api/discard-spectrum-matrix';
import { useReanalyseSpectrumMatrix } from '../api/reanalyse-spectrum-matrix';
import { DecimalField } from './decimal-field';
import { typedNumber } from './typed-number';
import { VerdictChangeNotice } from './verdict-change-notice';

/**
 * Analyse a kept matrix again at another band width, or discard it after a second click; each
 * answer says what happened to the mechanism verdict.
 */
export function MatrixChanges({
  labId,
  studyId,
  matrix,
  onDiscarded,
}: {
  labId: string;
  studyId: string;
  matrix: SpectrumMatrix;
  onDiscarded: (change: MechanismVerdictChange) => void;
}) {
  const [bandWidth, setBandWidth] = useState(String(matrix.analysis.bandWidth));
  const reanalyse = useReanalyseSpectrumMatrix(labId, studyId, matrix.id);
  const discard = useDiscardSpectrumMatrix(labId, studyId);
  const done = reanalyse.data?.matrix.analysis.bandWidth;
  return (
    <div className="space-y-2 border-t border-paper-200 pt-3">
      <div className="flex flex-wrap items-end gap-3">
        <DecimalField
          label="New band width (nm)"
          hint="Analyse the kept file again; 0 gives one band per wavelength"
          value={bandWidth}
          onChange={setBandWidth}
        />
        <Button
          variant="quiet"
          pending={reanalyse.isPending}
          pendingLabel="Analysing…"
          onClick={() => reanalyse.mutate({ bandWidth: typedNumber(bandWidth) })}
        >
          Analyse again
        </Button>
        <ConfirmedAction
          ask="Discard these spectra"
          confirm={`Discard ${matrix.title} and its file`}
          keep="Keep them"
          pending={discard.isPending}
          pendingLabel="Discarding…"
          onConfirm={() => discard.mutate(matrix.id, { onSuccess: (answer) => onDiscarded(answer.verdict) })}
        />
      </div>
      {reanalyse.isError && <FormAlert>{describeError(reanalyse.error)}</FormAlert>}
      {discard.isError && <FormAlert>{describeError(discard.error)}</FormAlert>}
      {reanalyse.data && done !== undefined && (
        <VerdictChangeNotice
          what={`Analysed again in ${done === 0 ? 'one band per wavelength' : `${formatNumber(done)} nm bands`}`}
          change={reanalyse.data.verdict}
        />
      )}
    </div>
  );
}
