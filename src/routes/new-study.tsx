import { useQueryClient } from '@tanstack/react-query';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { useSession } from '@/features/auth/api/get-session';
import { applyUpload } from '@/features/studies/api/apply-upload';
import { createStudy } from '@/features/studies/api/create-study';
import { useStudyFormOptions } from '@/features/studies/api/get-study-form-options';
import { studiesKeys } from '@/features/studies/api/studies-keys';
import { uploadFile } from '@/features/studies/api/upload-file';
import { NewStudyForm } from '@/features/studies/components/new-study-form';
import type { StudyFormValues } from '@/features/studies/components/study-form-values';
import { notify } from '@/lib/notify';
import { paths } from '@/lib/paths';
import { can } from '@/lib/policy';
import { useLab } from '@/routes/lab-context';

/** What the study screen is told on arrival: bring the fit into view and say so. */
export interface StudyArrival {
  arrived: 'fitted' | 'created';
}

/** A new quenching study: the pair and solvent, the export dropped right here, one confirmation to a fit. */
export function NewStudyRoute() {
  const lab = useLab();
  const labId = lab.labId;
  const { user } = useSession();
  const options = useStudyFormOptions(labId);
  const queryClient = useQueryClient();
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
        <p className="text-caption tracking-wide text-ink-500">{lab.labName}</p>
        <h1 className="text-display font-black text-ink-950">New quenching study</h1>
        <p className="mt-1 text-lead text-ink-700">
          One emitter against one quencher in one solvent: pick them, drop the instrument export, check the preview, and
          confirm.
        </p>
      </header>
      {options.isError && <ErrorNotice error={options.error} what="the lab's compounds" />}
      <Panel title="Set-up and data">
        {!options.data && !options.isError && (
          <p className="text-body text-ink-500">Loading the lab&apos;s compounds…</p>
        )}
        {options.data && (
          <NewStudyForm
            options={options.data}
            memory={{ userId: user.id, labId }}
            preset={preset}
            onSubmit={async ({ body, file, mapping, acknowledged }, onProgress) => {
              const study = await createStudy(labId, body);
              await queryClient.invalidateQueries({ queryKey: studiesKeys.all });
              let arrival: StudyArrival = { arrived: 'created' };
              if (file && mapping) {
                try {
                  const upload = await uploadFile(labId, study.id, file, onProgress);
                  await applyUpload(labId, study.id, upload.upload.id, {
                    version: study.version,
                    mapping,
                    mode: 'replace',
                    acknowledged,
                  });
                  arrival = { arrived: 'fitted' };
                } catch (error) {
                  // The study exists: open it and say what to do with the file there.
                  notify.failed('The study was created, but its file was not taken', error);
                }
              } else notify.done('Study created: add its points');
              await navigate(paths.study(labId, study.id), { state: arrival });
            }}
          />
        )}
      </Panel>
    </div>
  );
}
