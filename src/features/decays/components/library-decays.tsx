import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { atmospheres } from '@shared/schemas/library-measurements';
import type { DecayPreview, DecaySet, DecaySetRefit } from '@shared/schemas/decays';
import { SOLVENTS } from '@shared/engine/kinetics/solvents';
import { formatEstimate, formatNumber } from '@shared/format';
import { toNanoseconds } from '@shared/units/units';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { describeError } from '@/lib/form-errors';
import { useCompoundDecaySets } from '../api/get-compound-decay-sets';
import { getDecayCurvesQueryOptions } from '../api/get-decay-curves';
import { useKeepLibraryDecay } from '../api/keep-library-decay';
import { usePreviewLibraryDecay } from '../api/preview-library-decay';
import { useDecayReadChoices } from './decay-read-choices';
import { DecayPreviewCard, DecayReadFields } from './decay-read-fields';
import { DecayFit } from './decay-fit';
import { RefitDecaySet } from './refit-decay-set';

const solventOptions = Object.values(SOLVENTS).map((solvent) => ({ value: solvent.id, label: solvent.name }));
const atmosphereOptions = atmospheres.map((value) => ({ value, label: value }));

/** tau of a decay in ns, to the decimal of its standard error. */
const lifetimeText = (lifetime: { value: number; standardError: number }) =>
  `${formatEstimate(toNanoseconds(lifetime.value), toNanoseconds(lifetime.standardError))} ns`;

/** A kept decay of the compound: its lifetime, its file (download and SHA-256), and its plot on demand. */
function KeptDecay({
  labId,
  set,
  compoundName,
  mayRefit,
  onRefitted,
}: {
  labId: string;
  set: DecaySet;
  compoundName: string;
  mayRefit: boolean;
  onRefitted: (answer: DecaySetRefit) => void;
}) {
  const [plotted, setPlotted] = useState(false);
  // Drawn only when asked: the server reads the kept file again to draw it.
  const curves = useQuery({ ...getDecayCurvesQueryOptions(labId, set.id, 0), enabled: plotted });
  const outcome = set.outcomes[0];
  return (
    <article aria-label={`Decay ${set.file.fileName}`} className="space-y-2 rounded-md border border-paper-300 p-3">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1 text-body">
          <dt className="text-ink-600">τ</dt>
          <dd aria-label={`Lifetime from ${set.file.fileName}`} className="font-bold tabular-nums">
            {outcome?.lifetime ? lifetimeText(outcome.lifetime) : '—'}
            {outcome?.lifetime?.basis === 'amplitude-weighted-mean' && ' (amplitude-weighted mean)'}
          </dd>
          <dt className="text-ink-600">Source file</dt>
          <dd>
            <a className="underline" href={`/api/labs/${labId}/decay-files/${set.file.id}`}>
              {set.file.fileName}
            </a>{' '}
            ({formatNumber(set.file.size / 1024, 3)} kB)
            {set.responseFile && (
              <>
                , response{' '}
                <a className="underline" href={`/api/labs/${labId}/decay-files/${set.responseFile.id}`}>
                  {set.responseFile.fileName}
                </a>
              </>
            )}
          </dd>
          <dt className="text-ink-600">SHA-256</dt>
          <dd aria-label={`SHA-256 of ${set.file.fileName}`} className="break-all font-mono text-caption">
            {set.file.sha256}
          </dd>
          <dt className="text-ink-600">Record</dt>
          <dd className="text-caption text-ink-600">
            {set.lifetimeId ? 'in the list of lifetimes above' : 'removed from the library'}
            {set.createdBy ? `; kept by ${set.createdBy}` : ''}
          </dd>
        </dl>
        <Button variant="quiet" aria-expanded={plotted} onClick={() => setPlotted(!plotted)}>
          {plotted ? 'Hide the fit' : 'Show the fit'}
        </Button>
      </div>
      {plotted && <DecayFit curves={curves.data} outcome={outcome} title={compoundName} error={curves.error} />}
      {mayRefit && set.compoundId && (
        <RefitDecaySet
          labId={labId}
          owner={{ compoundId: set.compoundId }}
          set={set}
          inUse={set.lifetimeId !== null}
          onRefitted={onRefitted}
        />
      )}
    </article>
  );
}

interface Conditions {
  solvent: string;
  atmosphere: (typeof atmospheres)[number];
  temperature: string;
  notes: string;
}

/**
 * One decay of the emitter becomes a lifetime record: choose the file (and a response file), look
 * at the fit with the model picker, give the conditions, keep. Nothing is kept before "Keep".
 */
function DecayToLifetime({
  labId,
  compoundId,
  compoundName,
  defaultSolvent,
  onKept,
}: {
  labId: string;
  compoundId: string;
  compoundName: string;
  defaultSolvent: string;
  onKept: () => void;
}) {
  const [conditions, setConditions] = useState<Conditions>({
    solvent: defaultSolvent,
    atmosphere: 'argon',
    temperature: '298.15',
    notes: '',
  });
  const [preview, setPreview] = useState<DecayPreview | null>(null);
  const [kept, setKept] = useState<DecaySet | null>(null);
  const read = usePreviewLibraryDecay(labId, compoundId);
  const keep = useKeepLibraryDecay(labId, compoundId, onKept);
  const choices = useDecayReadChoices((sent) => {
    setKept(null);
    read.mutate(sent, { onSuccess: setPreview });
  });
  const temperature = Number(conditions.temperature);
  const outcome = preview?.outcomes[0];
  const set = (field: keyof Conditions) => (value: string) => setConditions({ ...conditions, [field]: value });

  return (
    <div className="space-y-3">
      <DecayReadFields
        choices={choices}
        fileLabel="Decay file of the emitter"
        fileHint="Time in the first column with its unit, one counts column, the response as a column named IRF"
        reading={read}
      />
      {preview && (
        <DecayPreviewCard
          preview={preview}
          summary={
            outcome?.lifetime && (
              <>
                {' '}
                τ <strong className="tabular-nums">{lifetimeText(outcome.lifetime)}</strong>
              </>
            )
          }
          keeping={keep}
          keepLabel="Keep as a lifetime record"
          keepDisabled={!choices.file}
          onKeep={() => {
            const sent = choices.readOf();
            if (!sent) return;
            keep.mutate(
              {
                ...sent,
                options: {
                  ...sent.options,
                  solvent: conditions.solvent,
                  atmosphere: conditions.atmosphere,
                  // An empty or unreadable field is sent as it is, so the server names it.
                  temperature: conditions.temperature.trim() === '' ? Number.NaN : temperature,
                  notes: conditions.notes,
                },
              },
              {
                onSuccess: (answer) => {
                  setPreview(null);
                  setKept(answer);
                },
              },
            );
          }}
        >
          {preview.shown && <DecayFit curves={preview.shown} outcome={outcome} title={compoundName} />}
          <div className="grid gap-3 sm:grid-cols-3">
            <SelectField
              label="Solvent"
              value={conditions.solvent}
              options={solventOptions}
              onChange={(event) => set('solvent')(event.target.value)}
            />
            <SelectField
              label="Atmosphere"
              value={conditions.atmosphere}
              options={atmosphereOptions}
              onChange={(event) => set('atmosphere')(event.target.value)}
            />
            <TextField
              label="Temperature (K)"
              type="number"
              inputMode="decimal"
              step="any"
              value={conditions.temperature}
              onChange={(event) => set('temperature')(event.target.value)}
            />
          </div>
          <TextField
            label="Notes"
            hint="How the sample was prepared, e.g. degassed by freeze-pump-thaw."
            value={conditions.notes}
            onChange={(event) => set('notes')(event.target.value)}
          />
        </DecayPreviewCard>
      )}
      {kept?.outcomes[0]?.lifetime && (
        <FormAlert tone="good">
          Kept: a lifetime record of {lifetimeText(kept.outcomes[0].lifetime)} from decay {kept.file.fileName} is in the
          list above.
        </FormAlert>
      )}
    </div>
  );
}

/**
 * The compound's lifetimes fitted from decay files: each kept decay with its source file, and for
 * those who may add to the library the flow that turns one more decay into a lifetime record.
 */
export function LibraryDecays({
  labId,
  compoundId,
  compoundName,
  defaultSolvent,
  canAdd,
  mayEdit,
  onKept,
  onRefitted,
}: {
  labId: string;
  compoundId: string;
  compoundName: string;
  defaultSolvent: string;
  canAdd: boolean;
  /** who may refit a kept decay: as for its lifetime record, the person who kept it or a reviewer or admin */
  mayEdit: (set: { createdById: string | null }) => boolean;
  /** a lifetime record was added: the route module refreshes the compound */
  onKept: () => void;
  /** a kept decay was refitted: the route module refreshes the compound and the studies using its record */
  onRefitted: (answer: DecaySetRefit) => void;
}) {
  const sets = useCompoundDecaySets(labId, compoundId);
  return (
    <div className="space-y-3">
      {sets.isError && <FormAlert>{describeError(sets.error)}</FormAlert>}
      {sets.data?.items.length === 0 && !canAdd && (
        <p className="text-body text-ink-500">No lifetime of this compound was fitted from a decay file.</p>
      )}
      {sets.data?.items.map((set) => (
        <KeptDecay
          key={set.id}
          labId={labId}
          set={set}
          compoundName={compoundName}
          mayRefit={mayEdit(set)}
          onRefitted={onRefitted}
        />
      ))}
      {canAdd && (
        <DecayToLifetime
          labId={labId}
          compoundId={compoundId}
          compoundName={compoundName}
          defaultSolvent={defaultSolvent}
          onKept={onKept}
        />
      )}
    </div>
  );
}
