import { useQueryClient } from '@tanstack/react-query';
import { lazy, Suspense, type ReactNode } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { ErrorNotice } from '@/components/error-notice';
import { FormAlert } from '@/components/form-alert';
import { Panel } from '@/components/panel';
import { Signal } from '@/components/signal';
import { useSession } from '@/features/auth/api/get-session';
import { useCompound } from '@/features/library/api/get-compound';
import { useDeleteMeasurement, type MeasurementSegment } from '@/features/library/api/delete-measurement';
import { useLabSettings } from '@/features/library/api/get-lab-settings';
import { libraryKeys } from '@/features/library/api/library-keys';
import { CompoundHeader } from '@/features/library/components/compound-header';
import { EnergiesTable } from '@/features/library/components/energies-table';
import { EnergyForm } from '@/features/library/components/energy-form';
import { ExcitedStatePanel } from '@/features/library/components/excited-state-panel';
import { LifetimeForm } from '@/features/library/components/lifetime-form';
import { LifetimesTable } from '@/features/library/components/lifetimes-table';
import { PairDrivingForce } from '@/features/library/components/pair-driving-force';
import { PotentialForm } from '@/features/library/components/potential-form';
import { PotentialsTable } from '@/features/library/components/potentials-table';
import { studiesKeys } from '@/features/studies/api/studies-keys';
import { describeError } from '@/lib/form-errors';
import { paths } from '@/lib/paths';
import { can } from '@/lib/policy';
import { useLab } from '@/routes/lab-context';
import { Tag } from '@/components/tag';

// The decay flow brings its plots and model picker: its code loads only when a compound is opened.
const LibraryDecays = lazy(() =>
  import('@/features/decays/components/library-decays').then((m) => ({ default: m.LibraryDecays })),
);

/** One compound: potentials in the lab's reference with the originals, excited-state potentials, lifetimes, E00, driving force. */
export function CompoundDetailRoute() {
  const { compoundId = '' } = useParams();
  const lab = useLab();
  const labId = lab.labId;
  const { user } = useSession();
  const compound = useCompound(labId, compoundId);
  const settings = useLabSettings(labId);
  const remove = useDeleteMeasurement(labId, compoundId);
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  if (compound.isPending) return <Signal tone="waiting">Loading the compound</Signal>;
  if (compound.isError) return <ErrorNotice error={compound.error} what="the compound" />;
  const data = compound.data;
  const canAdd = can(lab.role, 'library:add');
  const canCurate = can(lab.role, 'library:curate');
  const mayEdit = (record: { createdById: string | null }) => canCurate || (canAdd && record.createdById === user.id);
  const solvent = settings.data?.displaySolvent ?? 'acetonitrile';
  const isEmitter = data.roleHint !== 'quencher';
  // What every measurement table of this compound is given; each adds its own records.
  const table = { labId, compoundId: data.id, mayEdit, canCurate };
  const deleteFrom = (segment: MeasurementSegment) => (record: { id: string; version: number }) =>
    remove.mutate({ segment, id: record.id, version: record.version });
  return (
    <div className="max-w-6xl space-y-6">
      <CompoundHeader
        labId={labId}
        labName={lab.labName}
        isDemo={lab.isDemo}
        compound={data}
        mayEdit={mayEdit(data)}
        canCurate={canCurate}
        onDeleted={() => void navigate(paths.library(labId))}
      />
      {data.roleHint !== 'photocatalyst' && (
        <FormAlert tone="note">
          Handle quenchers as their safety data sheets say: many amines are toxic or corrosive, some bipyridinium salts
          are highly toxic, and the usual solvents are flammable. Follow your institution&apos;s rules; Halflight gives
          no safety approval.
        </FormAlert>
      )}
      {remove.isError && <FormAlert>{describeError(remove.error)}</FormAlert>}
      <Panel title="Redox potentials" aside={<Tag tone="neutral">{`shown vs ${data.displayReference}`}</Tag>}>
        <PotentialsTable
          {...table}
          defaultSolvent={solvent}
          potentials={data.potentials}
          displayReference={data.displayReference}
          onDelete={deleteFrom('potentials')}
        />
        {canAdd && (
          <AddSection id="add-potential" title="Add a potential">
            <PotentialForm labId={labId} compoundId={data.id} defaultSolvent={solvent} />
          </AddSection>
        )}
      </Panel>
      {isEmitter && <ExcitedStatePanel state={data.excitedState} />}
      {isEmitter && (
        <Panel title="E00 (excited-state energy)">
          <EnergiesTable {...table} energies={data.energies} onDelete={deleteFrom('energies')} />
          {canAdd && (
            <AddSection id="add-e00" title="Add an E00 value">
              <EnergyForm labId={labId} compoundId={data.id} />
            </AddSection>
          )}
        </Panel>
      )}
      {isEmitter && (
        <Panel title="Excited-state lifetimes">
          <LifetimesTable
            {...table}
            userId={user.id}
            defaultSolvent={solvent}
            lifetimes={data.lifetimes}
            onDelete={deleteFrom('lifetimes')}
            // A refit changes the study's fit and version, which the studies screens keep in their own cache.
            onStudyRefitted={() => void queryClient.invalidateQueries({ queryKey: studiesKeys.all })}
          />
          {canAdd && (
            <AddSection title="Add a lifetime">
              <LifetimeForm labId={labId} compoundId={data.id} defaultSolvent={solvent} />
            </AddSection>
          )}
          <AddSection id="lifetime-from-decay" title="Lifetimes from decay files">
            <Suspense fallback={<p className="text-body">Loading…</p>}>
              <LibraryDecays
                labId={labId}
                compoundId={data.id}
                compoundName={data.name}
                defaultSolvent={solvent}
                canAdd={canAdd}
                mayEdit={mayEdit}
                onKept={() => void queryClient.invalidateQueries({ queryKey: libraryKeys.detail(labId, data.id) })}
                onRefitted={(answer) => {
                  // The record took the new value; the list of studies using it says which still hold the older one.
                  void queryClient.invalidateQueries({ queryKey: libraryKeys.detail(labId, data.id) });
                  if (answer.lifetime)
                    void queryClient.invalidateQueries({
                      queryKey: libraryKeys.dependents(labId, answer.lifetime.lifetimeId),
                    });
                }}
              />
            </Suspense>
          </AddSection>
        </Panel>
      )}
      <Panel title="Driving force with a partner">
        <PairDrivingForce labId={labId} compound={data} defaultSolvent={solvent} />
      </Panel>
    </div>
  );
}

/** Below a measurement table: the form that adds one more, under its own heading. */
function AddSection({ id, title, children }: { id?: string; title: string; children: ReactNode }) {
  return (
    <div id={id} className="mt-4 border-t border-paper-200 pt-4">
      <h3 className="mb-2 text-body font-bold text-ink-900">{title}</h3>
      {children}
    </div>
  );
}
