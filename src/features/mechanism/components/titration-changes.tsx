import { useState } from 'react';
import { ASSOCIATION_FITS, type AbsorptionTitration } from '@shared/schemas/absorption-titrations';
import type { MechanismVerdictChange } from '@shared/schemas/mechanism-evidence';
import { fromMicromolar, toMicromolar } from '@shared/units/units';
import { Button } from '@/components/button';
import { ChoiceField } from '@/components/choice-field';
import { ConfirmedAction } from '@/components/confirmed-action';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import { useDiscardAbsorptionTitration } from '../api/discard-absorption-titration';
import { useReanalyseAbsorptionTitration } from '../api/reanalyse-absorption-titration';
import { TitrationSettingsFields, type TitrationSettings } from './titration-settings-fields';
import { typedNumber } from './typed-number';
import { VerdictChangeNotice } from './verdict-change-notice';

const FIT_LABELS: Record<(typeof ASSOCIATION_FITS)[number], string> = {
  isotherm: '1:1 isotherm (nonlinear fit)',
  'benesi-hildebrand': 'Benesi–Hildebrand line',
};
const FIT_CHOICES = ASSOCIATION_FITS.map((value) => ({ value, label: FIT_LABELS[value] }));

/**
 * Analyse a kept titration again with new settings (band, path length, [E]0, the quencher's own
 * absorbance taken out or not, the K_a the verdict uses), or discard it after a second click; each
 * answer says what happened to the mechanism verdict.
 */
export function TitrationChanges({
  labId,
  studyId,
  titration,
  onDiscarded,
}: {
  labId: string;
  studyId: string;
  titration: AbsorptionTitration;
  onDiscarded: (change: MechanismVerdictChange) => void;
}) {
  const { options } = titration;
  const [settings, setSettings] = useState<TitrationSettings>({
    bandWidth: String(options.bandWidth),
    pathLength: String(options.pathLength),
    // To 8 significant figures, so 2e-5 M reads 20, not 20.000000000000004 (binary floating point).
    emitterMicromolar:
      options.emitterConcentration === undefined
        ? ''
        : String(Number(toMicromolar(options.emitterConcentration).toPrecision(8))),
  });
  const [subtract, setSubtract] = useState(options.subtractQuencher);
  const [fit, setFit] = useState(options.associationFit);
  const reanalyse = useReanalyseAbsorptionTitration(labId, studyId, titration.id);
  const discard = useDiscardAbsorptionTitration(labId, studyId);
  const send = () =>
    reanalyse.mutate({
      bandWidth: typedNumber(settings.bandWidth),
      pathLength: typedNumber(settings.pathLength),
      emitterConcentration:
        settings.emitterMicromolar.trim() === '' ? null : fromMicromolar(typedNumber(settings.emitterMicromolar)),
      subtractQuencher: subtract,
      associationFit: fit,
    });
  return (
    <fieldset className="space-y-2 border-t border-paper-200 pt-3">
      <legend className="text-body font-bold text-ink-900">Analyse again</legend>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <TitrationSettingsFields settings={settings} onChange={setSettings} again />
        <ChoiceField label="K_a the verdict uses" value={fit} choices={FIT_CHOICES} onChange={setFit} />
      </div>
      <label className="flex items-center gap-2 text-body text-ink-900">
        <input
          type="checkbox"
          checked={subtract}
          disabled={!titration.quencherFile}
          onChange={(event) => setSubtract(event.target.checked)}
        />
        {titration.quencherFile
          ? "Take the quencher's own absorbance out (its kept file)"
          : "Take the quencher's own absorbance out (kept without the quencher's file)"}
      </label>
      <div className="flex flex-wrap gap-3">
        <Button variant="quiet" pending={reanalyse.isPending} pendingLabel="Analysing…" onClick={send}>
          Analyse the titration again
        </Button>
        <ConfirmedAction
          ask="Discard this titration"
          confirm={`Discard ${titration.title} and its files`}
          pending={discard.isPending}
          pendingLabel="Discarding…"
          onConfirm={() => discard.mutate(titration.id, { onSuccess: (answer) => onDiscarded(answer.verdict) })}
        />
      </div>
      {reanalyse.isError && <FormAlert>{describeError(reanalyse.error)}</FormAlert>}
      {discard.isError && <FormAlert>{describeError(discard.error)}</FormAlert>}
      {reanalyse.data && <VerdictChangeNotice what="Analysed again" change={reanalyse.data.verdict} />}
    </fieldset>
  );
}
