import { useState, type ReactNode } from 'react';
import type { AbsorptionTitration } from '@shared/schemas/absorption-titrations';
import type { MechanismVerdictChange } from '@shared/schemas/mechanism-evidence';
import { fromMicromolar } from '@shared/units/units';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { FileField } from '@/components/file-field';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import type { AbsorptionInput } from '../api/absorption-upload-form';
import { useAbsorptionTitrations } from '../api/get-absorption-titrations';
import { useKeepAbsorptionTitration } from '../api/keep-absorption-titration';
import { usePreviewAbsorptionTitration } from '../api/preview-absorption-titration';
import { TitrationChanges } from './titration-changes';
import { TitrationSettingsFields, type TitrationSettings } from './titration-settings-fields';
import { TitrationView } from './titration-view';
import { VerdictChangeNotice } from './verdict-change-notice';

/** A kept titration: what it says, its files, and (for who may change the study) its changes. */
function KeptTitration({
  labId,
  titration,
  changes,
}: {
  labId: string;
  titration: AbsorptionTitration;
  changes?: ReactNode;
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
      {changes}
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
  const [settings, setSettings] = useState<TitrationSettings>({
    bandWidth: '5',
    pathLength: '1',
    emitterMicromolar: '',
  });
  const titrations = useAbsorptionTitrations(labId, studyId);
  const preview = usePreviewAbsorptionTitration(labId, studyId);
  const keep = useKeepAbsorptionTitration(labId, studyId);
  const [discarded, setDiscarded] = useState<{ title: string; change: MechanismVerdictChange } | null>(null);
  const items = titrations.data?.items ?? [];
  const { bandWidth, pathLength, emitterMicromolar } = settings;
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
  // A new file of either kind makes the preview out of date.
  const fileSlots = [
    {
      label: 'UV-vis spectra file',
      hint: 'Wavelength in nm in the first column, one absorbance spectrum per column with its [Q] in the header (0 mM and at least 3 more), all on one grid.',
      chosen: file,
      choose: setFile,
    },
    {
      label: 'Quencher alone (optional)',
      hint: 'Same grid, one column headed with its [Q] ("quencher 10 mM") or with ε ("ε (M-1 cm-1)").',
      chosen: quencher,
      choose: setQuencher,
    },
  ];
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
            {fileSlots.map((slot) => (
              <FileField
                key={slot.label}
                label={slot.label}
                hint={slot.hint}
                fileName={slot.chosen?.name ?? null}
                onFile={(chosen) => {
                  preview.reset();
                  slot.choose(chosen);
                }}
              />
            ))}
          </div>
          <div className="grid gap-3 sm:grid-cols-3">
            <TitrationSettingsFields settings={settings} onChange={setSettings} />
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
          changes={
            editable && (
              <TitrationChanges
                labId={labId}
                studyId={studyId}
                titration={titration}
                onDiscarded={(change) => setDiscarded({ title: titration.title, change })}
              />
            )
          }
        />
      ))}
    </div>
  );
}
