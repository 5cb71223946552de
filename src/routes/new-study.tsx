import { useNavigate, useSearchParams } from 'react-router-dom';
import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { useCreateStudy } from '@/features/studies/api/create-study';
import { useStudyFormOptions } from '@/features/studies/api/get-study-form-options';
import { StudyForm } from '@/features/studies/components/study-form';
import type { StudyFormValues } from '@/features/studies/components/study-form-values';
import { paths } from '@/lib/paths';
import { can } from '@/lib/policy';
import { useLab } from '@/routes/lab-context';

/** Set up a new quenching study; points come next, on the study's screen. */
export function NewStudyRoute() {
  const lab = useLab();
  const labId = lab.labId;
  const options = useStudyFormOptions(labId);
  const create = useCreateStudy(labId);
  const navigate = useNavigate();
  const [params] = useSearchParams();
  // Links from a scenario (the pair that lacks a kq) and from the planner (volumes and stock) pre-fill the form.
  const preset: Partial<StudyFormValues> = Object.fromEntries(
    (['emitterId', 'quencherId', 'title', 'initialVolumeMilli', 'stockMilli'] as const)
      .filter((key) => params.get(key))
      .map((key) => [key, params.get(key)!]),
  );
  if (params.get('dilutionCorrection') === 'true') preset.dilutionCorrection = true;
  if (params.get('stockContainsEmitter') === 'true') preset.stockContainsEmitter = true;
  if (!can(lab.role, 'studies:write'))
    return (
      <ErrorNotice
        error={new Error('Your role in this lab reads studies but cannot start them.')}
        what="the study form"
      />
    );
  return (
    <div className="max-w-5xl space-y-6">
      <header>
        <p className="text-caption uppercase text-ink-500">{lab.labName}</p>
        <h1 className="text-display font-black text-ink-950">New quenching study</h1>
        <p className="mt-1 text-lead text-ink-700">
          One emitter against one quencher, in one solvent at one temperature.
        </p>
      </header>
      {options.isError && <ErrorNotice error={options.error} what="the lab's compounds" />}
      <Panel title="Set-up">
        {!options.data && !options.isError && (
          <p className="text-body text-ink-500">Loading the lab&apos;s compounds…</p>
        )}
        {options.data && (
          <StudyForm
            options={options.data}
            preset={preset}
            submitLabel="Create study"
            onSubmit={async (body) => {
              const study = await create.mutateAsync(body);
              await navigate(paths.study(labId, study.id));
            }}
          />
        )}
      </Panel>
    </div>
  );
}
