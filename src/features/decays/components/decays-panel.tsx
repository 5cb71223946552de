import { useState } from 'react';
import type { DecayOutcome, DecayPreview, DecaySet } from '@shared/schemas/decays';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { formatEstimate, formatNumber } from '@shared/format';
import { toMillimolar, toNanoseconds } from '@shared/units/units';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { TableHead } from '@/components/table-head';
import { TableScroll } from '@/components/table-scroll';
import { describeError } from '@/lib/form-errors';
import { useApplyDecaySet } from '../api/apply-decay-set';
import { useDecayCurves } from '../api/get-decay-curves';
import { useStudyDecaySets } from '../api/get-study-decay-sets';
import { useKeepDecaySet } from '../api/keep-decay-set';
import { usePreviewDecays } from '../api/preview-decays';
import { useDecayReadChoices } from './decay-read-choices';
import { DecayPreviewCard, DecayReadFields } from './decay-read-fields';
import { DecayFit } from './decay-fit';
import { DecaySternVolmerPlot } from './decay-stern-volmer-plot';
import { RefitDecaySet } from './refit-decay-set';

const lifetimeText = (outcome: DecayOutcome) =>
  outcome.lifetime
    ? formatEstimate(toNanoseconds(outcome.lifetime.value), toNanoseconds(outcome.lifetime.standardError))
    : (outcome.problem ?? '—');

/** The decays of a set: [Q], lifetime, chi-squared, flags; a row button shows that decay. */
function OutcomesTable({
  outcomes,
  shown,
  onShow,
}: {
  outcomes: DecayOutcome[];
  shown: number;
  onShow: (i: number) => void;
}) {
  return (
    <TableScroll label="Fitted decays, scroll sideways">
      <table aria-label="Fitted decays" className="w-full text-left text-body">
        <TableHead
          look="ruled"
          columns={[
            'Decay',
            '[Q] (mM)',
            { label: 'τ (ns)', className: 'whitespace-nowrap' },
            { label: 'reduced χ²', className: 'whitespace-nowrap' },
            <span className="sr-only">Plot</span>,
          ]}
        />
        <tbody>
          {outcomes.map((outcome) => (
            <tr
              key={outcome.index}
              className={`border-b border-paper-200 ${outcome.index === shown ? 'bg-glow-50' : ''}`}
            >
              <td className="whitespace-nowrap py-1 pr-3">{outcome.label}</td>
              <td className="pr-3 tabular-nums">
                {outcome.concentration === null ? 'not given' : formatNumber(toMillimolar(outcome.concentration), 4)}
              </td>
              <td className="whitespace-nowrap pr-3 tabular-nums">{lifetimeText(outcome)}</td>
              <td className="pr-3 tabular-nums">
                {outcome.fit ? formatNumber(outcome.fit.reducedChiSquared, 3) : ''}
                {outcome.fit && outcome.fit.flags.length > 0 ? ` · ${outcome.fit.flags.length} to check` : ''}
              </td>
              <td>
                <button
                  type="button"
                  className="text-caption underline"
                  aria-label={`Plot ${outcome.label}`}
                  aria-pressed={outcome.index === shown}
                  onClick={() => onShow(outcome.index)}
                >
                  {outcome.index === shown ? 'Plotted' : 'Plot'}
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </TableScroll>
  );
}

/** A kept set: its decays, the one chosen drawn from the stored fit, the lifetime Stern–Volmer plot, and "use in the study". */
function KeptSet({
  labId,
  set,
  study,
  editable,
  onApplied,
  onRefitted,
}: {
  labId: string;
  set: DecaySet;
  study: StudyDetail;
  editable: boolean;
  onApplied: (study: StudyDetail) => void;
  onRefitted: () => void;
}) {
  const [shown, setShown] = useState(0);
  const curves = useDecayCurves(labId, set.id, shown);
  const apply = useApplyDecaySet(labId, study.id, onApplied);
  const inUse =
    study.tau0Source?.decaySetId === set.id || study.points.some((p) => p.lifetimeSource?.decaySetId === set.id);
  return (
    <article aria-label={`Decay set ${set.title}`} className="space-y-3 rounded-md border border-paper-300 p-3">
      <header className="flex flex-wrap items-baseline justify-between gap-3">
        <p className="text-body">
          <strong>{set.title}</strong>: {set.outcomes.length} decay{set.outcomes.length === 1 ? '' : 's'}, {set.format}
          {set.responseFile ? `, response ${set.responseFile.fileName}` : ''}.{' '}
          <a className="text-caption underline" href={`/api/labs/${labId}/decay-files/${set.file.id}`}>
            Raw file
          </a>
        </p>
        {editable && (
          <Button
            variant={inUse ? 'quiet' : 'primary'}
            pending={apply.isPending}
            onClick={() => apply.mutate({ setId: set.id, version: study.version })}
          >
            {inUse ? 'Use these lifetimes again' : 'Use these lifetimes in the study'}
          </Button>
        )}
      </header>
      {apply.isError && <FormAlert>{describeError(apply.error)}</FormAlert>}
      <OutcomesTable outcomes={set.outcomes} shown={shown} onShow={setShown} />
      <DecayFit curves={curves.data} outcome={set.outcomes[shown]} title={study.title} error={curves.error} />
      {set.sternVolmer ? (
        <DecaySternVolmerPlot sternVolmer={set.sternVolmer} title={study.title} />
      ) : (
        <p className="text-caption text-ink-500">No lifetime Stern–Volmer plot: {set.sternVolmerProblem}</p>
      )}
      {editable && (
        <RefitDecaySet labId={labId} owner={{ studyId: study.id }} set={set} inUse={inUse} onRefitted={onRefitted} />
      )}
    </article>
  );
}

/**
 * Decays of the study: choose the decay file (and a response file), look at the fits, keep the
 * set, and put its lifetimes and tau0 into the study. Nothing is kept before "Keep".
 */
export function DecaysPanel({
  labId,
  study,
  editable,
  onApplied,
  onRefitted,
}: {
  labId: string;
  study: StudyDetail;
  editable: boolean;
  onApplied: (study: StudyDetail) => void;
  /** a kept set was fitted again: the study may have new lifetimes, tau0, fit and history */
  onRefitted: () => void;
}) {
  const [preview, setPreview] = useState<DecayPreview | null>(null);
  const sets = useStudyDecaySets(labId, study.id);
  const read = usePreviewDecays(labId, study.id);
  const keep = useKeepDecaySet(labId, study.id);
  const choices = useDecayReadChoices((sent) => read.mutate(sent, { onSuccess: setPreview }));

  return (
    <div className="space-y-4">
      {editable && (
        <div className="space-y-3">
          <DecayReadFields
            choices={choices}
            fileLabel="Decay file"
            fileHint="Time in the first column, one counts column per decay"
            reading={read}
          />
          {preview && (
            <DecayPreviewCard
              preview={preview}
              keeping={keep}
              keepLabel="Keep this decay set"
              onKeep={() => {
                const sent = choices.readOf();
                if (sent) keep.mutate(sent, { onSuccess: () => setPreview(null) });
              }}
            >
              <OutcomesTable
                outcomes={preview.outcomes}
                shown={preview.shown?.index ?? 0}
                onShow={(index) => choices.lookAt({ show: index })}
              />
              {preview.shown && (
                <DecayFit curves={preview.shown} outcome={preview.outcomes[preview.shown.index]} title={study.title} />
              )}
            </DecayPreviewCard>
          )}
        </div>
      )}
      {sets.isError && <FormAlert>{describeError(sets.error)}</FormAlert>}
      {sets.data?.items.length === 0 && !editable && (
        <p className="text-body text-ink-500">No decays kept for this study.</p>
      )}
      {sets.data?.items.map((set) => (
        <KeptSet
          key={set.id}
          labId={labId}
          set={set}
          study={study}
          editable={editable}
          onApplied={onApplied}
          onRefitted={onRefitted}
        />
      ))}
    </div>
  );
}
