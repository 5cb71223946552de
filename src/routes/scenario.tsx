import { Link, useNavigate, useParams } from 'react-router-dom';
import { SOLVENTS } from '@shared/engine/kinetics/solvents';
import { Button } from '@/components/button';
import { ConfirmedAction } from '@/components/confirmed-action';
import { ErrorNotice } from '@/components/error-notice';
import { FormAlert } from '@/components/form-alert';
import { Panel } from '@/components/panel';
import { useCompounds } from '@/features/library/api/get-compounds';
import { useDeleteScenario } from '@/features/scenarios/api/delete-scenario';
import { useDownloadScenarioReport } from '@/features/scenarios/api/download-scenario-report';
import { useScenario } from '@/features/scenarios/api/get-scenario';
import { useSaveScenario } from '@/features/scenarios/api/save-scenario';
import { ScenarioForm } from '@/features/scenarios/components/scenario-form';
import { toScenarioInput } from '@/features/scenarios/components/scenario-form-schema';
import { ShareChart } from '@/features/scenarios/components/share-chart';
import { ShareTable } from '@/features/scenarios/components/share-table';
import { describeError } from '@/lib/form-errors';
import { paths } from '@/lib/paths';
import { useLab } from '@/routes/lab-context';

const solventOptions = Object.values(SOLVENTS).map((solvent) => ({ value: solvent.id, label: solvent.name }));

/** One reaction scenario: edit its components, read who intercepts the excited emitter. */
export function ScenarioRoute() {
  const { labId } = useLab();
  const { scenarioId } = useParams();
  const isNew = scenarioId === undefined || scenarioId === 'new';
  const navigate = useNavigate();
  const scenario = useScenario(labId, isNew ? undefined : scenarioId);
  const save = useSaveScenario(labId, isNew ? undefined : scenarioId);
  const remove = useDeleteScenario(labId);
  const report = useDownloadScenarioReport(labId);
  const emitters = useCompounds(labId, { roleHint: 'photocatalyst', pageSize: 100 });
  const quenchers = useCompounds(labId, { roleHint: 'quencher', pageSize: 100 });
  const options = (list: typeof emitters) =>
    (list.data?.items ?? []).map((item) => ({ value: item.id, label: item.name }));
  const data = scenario.data;

  if (!isNew && scenario.isError) return <ErrorNotice error={scenario.error} what="this scenario" />;
  if ((!isNew && !data) || emitters.isPending || quenchers.isPending)
    return <p className="text-body text-ink-500">Loading…</p>;

  return (
    <div className="max-w-6xl space-y-6">
      <header>
        <Link to={paths.scenarios(labId)} className="text-caption text-ink-500 underline">
          All scenarios
        </Link>
        <h1 className="text-display font-black text-ink-950">{data?.name ?? 'New reaction scenario'}</h1>
      </header>
      {data && (
        <Panel
          title="Who intercepts the excited emitter"
          aside={
            <Button
              variant="quiet"
              pending={report.isPending}
              pendingLabel="Writing…"
              onClick={() => report.mutate(data.id)}
            >
              PDF summary
            </Button>
          }
        >
          <div className="grid gap-6 lg:grid-cols-2">
            <ShareTable scenario={data} labId={labId} />
            <ShareChart scenario={data} />
          </div>
          {data.missing.map((item) => (
            <p key={item.componentId} className="mt-3 text-body text-brick-700">
              No kq for <strong>{item.label}</strong> with {data.emitter.name} yet, so it is left out of the shares.{' '}
              {item.compoundId && (
                <Link
                  className="font-bold underline"
                  to={paths.newStudy(labId, { emitterId: data.emitter.id, quencherId: item.compoundId })}
                >
                  Start the study that would supply it
                </Link>
              )}
            </p>
          ))}
          <p className="mt-4 rounded-md bg-paper-200 px-3 py-2 text-body text-ink-800">{data.caution}</p>
        </Panel>
      )}
      <Panel title={isNew ? 'The reaction' : 'Change the reaction'}>
        <ScenarioForm
          key={data ? `${data.id}-${data.version}` : 'new'}
          scenario={data}
          emitterOptions={options(emitters)}
          quencherOptions={options(quenchers)}
          solventOptions={solventOptions}
          pending={save.isPending}
          serverError={save.isError ? describeError(save.error) : undefined}
          onSave={(values) =>
            save.mutate(toScenarioInput(values, data?.version), {
              onSuccess: (saved) => isNew && navigate(paths.scenario(labId, saved.id), { replace: true }),
            })
          }
        />
      </Panel>
      {data && (
        <div className="flex items-center gap-3">
          <ConfirmedAction
            ask="Delete this scenario…"
            confirm="Yes, delete it"
            pending={remove.isPending}
            onConfirm={() => remove.mutate(data.id, { onSuccess: () => navigate(paths.scenarios(labId)) })}
          />
          {remove.isError && <FormAlert>{describeError(remove.error)}</FormAlert>}
        </div>
      )}
    </div>
  );
}
