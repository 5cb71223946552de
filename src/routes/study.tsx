import { lazy, Suspense, useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Link, useLocation, useNavigate, useParams } from 'react-router-dom';
import { formatEstimate, UNITS } from '@shared/format';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { toNanoseconds } from '@shared/units/units';
import { ErrorNotice } from '@/components/error-notice';
import { FormAlert } from '@/components/form-alert';
import { Panel } from '@/components/panel';
import { Signal } from '@/components/signal';
import { Tag } from '@/components/tag';
import { useSession } from '@/features/auth/api/get-session';
import { DrivingForcePanel } from '@/features/library/components/driving-force-panel';
import { MechanismPanel, type EvidenceAnchors } from '@/features/mechanism/components/mechanism-panel';
import { useStudy } from '@/features/studies/api/get-study';
import { useStudyFormOptions } from '@/features/studies/api/get-study-form-options';
import { studiesKeys } from '@/features/studies/api/studies-keys';
import { useUpdateStudy } from '@/features/studies/api/update-study';
import { FilesList } from '@/features/studies/components/files-list';
import { FitControls } from '@/features/studies/components/fit-controls';
import { CautionsOnce } from '@/features/studies/components/cautions-once';
import { HistoryPanel } from '@/features/studies/components/history-panel';
import { LifetimePlot } from '@/features/studies/components/lifetime-plot';
import { PointsGrid } from '@/features/studies/components/points-grid';
import { ResultsPanel } from '@/features/studies/components/results-panel';
import { ResultSummary } from '@/features/studies/components/result-summary';
import { ReviewBar } from '@/features/studies/components/review-bar';
import { ReviewPanel } from '@/features/studies/components/review-panel';
import { SafetyNotes } from '@/features/studies/components/safety-notes';
import { StatusSignal } from '@/features/studies/components/status-signal';
import { SternVolmerPlot } from '@/features/studies/components/stern-volmer-plot';
import { StudyForm } from '@/features/studies/components/study-form';
import { UploadPanel } from '@/features/studies/components/upload-panel';
import { useAfterPaint } from '@/lib/after-paint';
import { describeError } from '@/lib/form-errors';
import { notify } from '@/lib/notify';
import { paths } from '@/lib/paths';
import { can } from '@/lib/policy';
import { useLab } from '@/routes/lab-context';

// The two spectra panels sit far below the fold and bring their own plots and readers: their code
// loads after the study is on screen, keeping the study screen's first load within its budget.
const SpectrumMatrixPanel = lazy(() =>
  import('@/features/mechanism/components/spectrum-matrix-panel').then((m) => ({ default: m.SpectrumMatrixPanel })),
);
const AbsorptionPanel = lazy(() =>
  import('@/features/mechanism/components/absorption-panel').then((m) => ({ default: m.AbsorptionPanel })),
);
// The decays panel sits below the points and shares its plots with the library's decay flow: it
// loads after the study too.
const DecaysPanel = lazy(() =>
  import('@/features/decays/components/decays-panel').then((m) => ({ default: m.DecaysPanel })),
);
const panelLoading = <p className="text-body">Loading…</p>;
import type { StudyArrival } from '@/routes/new-study';

/** Where the mechanism panel sends a person to add each missing piece of evidence. */
const EVIDENCE_ANCHORS: EvidenceAnchors = {
  lifetime: { href: '#lifetimes-from-decays', label: 'Lifetimes from decays' },
  wavelength: { href: '#emission-by-wavelength', label: 'Emission by wavelength' },
  absorption: { href: '#absorption', label: 'Absorption' },
  diffusion: { href: '#set-up', label: 'Set-up' },
};

/** One study: the plot and results up top, then the points, files, set-up, review and history. */
export function StudyRoute() {
  const { studyId = '' } = useParams();
  const lab = useLab();
  const labId = lab.labId;
  const { user } = useSession();
  const study = useStudy(labId, studyId);
  if (study.isError) return <ErrorNotice error={study.error} what="the study" />;
  if (!study.data) return <Signal tone="waiting">Loading the study</Signal>;
  const isOwner = study.data.ownerId === user.id;
  return (
    <StudyScreen
      // Keyed by the study, not its version: a save re-renders in place, so the callbacks of what
      // was just done (notices, undo) still run; parts that hold a copy are keyed themselves.
      key={study.data.id}
      labId={labId}
      labName={lab.labName}
      isDemo={lab.isDemo}
      study={study.data}
      isOwner={isOwner}
      userId={user.id}
      canWrite={can(lab.role, 'studies:write')}
      canReview={can(lab.role, 'studies:review')}
    />
  );
}

interface ScreenProps {
  labId: string;
  labName: string;
  isDemo: boolean;
  study: StudyDetail;
  isOwner: boolean;
  userId: string;
  canWrite: boolean;
  canReview: boolean;
}

/** After a fit arrives (from the new-study form or an upload): bring the result into view, focus it and say it. */
function useArrival(study: StudyDetail) {
  const summary = useRef<HTMLElement>(null);
  const location = useLocation();
  const navigate = useNavigate();
  const arrival = (location.state as StudyArrival | null)?.arrived;
  useEffect(() => {
    if (!arrival) return;
    summary.current?.scrollIntoView({ block: 'start' });
    summary.current?.focus({ preventScroll: true });
    const kSv = study.latestFit?.result.parameters.kSv;
    const kq = study.latestFit?.result.parameters.kq;
    if (arrival === 'fitted' && kSv)
      notify.done(
        `Fitted: K_SV = ${formatEstimate(kSv.value, kSv.standardError, UNITS.perMolar)}${kq ? `, kq = ${formatEstimate(kq.value, kq.standardError, UNITS.perMolarPerSecond)}` : ''}`,
      );
    else if (arrival === 'fitted') notify.note(study.fitProblem ?? 'The points were taken; no fit yet.');
    void navigate('.', { replace: true, state: null });
  }, [arrival, study, navigate]);
  return summary;
}

function StudyScreen({ labId, labName, isDemo, study, isOwner, userId, canWrite, canReview }: ScreenProps) {
  const summary = useArrival(study);
  const navigate = useNavigate();
  const [editing, setEditing] = useState(false);
  const options = useStudyFormOptions(labId);
  const update = useUpdateStudy(labId, study.id);
  const queryClient = useQueryClient();
  const editable =
    isOwner && canWrite && (study.status === 'draft' || study.status === 'returned') && study.nextRevisionId === null;
  const fit = study.latestFit;
  const pinned = study.pinnedMechanism === 'energy-transfer' ? null : study.pinnedMechanism;
  // The grid (a page of 50 rows of inputs) follows the plots after the first paint: rendered with
  // the rest of the screen it made the opening of a 400-point study one long task.
  const pointsShown = useAfterPaint();

  return (
    <div className="max-w-6xl space-y-6">
      <header className="space-y-1">
        <p className="flex items-center gap-2 text-caption tracking-wide text-ink-500">
          <Link to={paths.studies(labId)} className="underline">
            {labName} · Studies
          </Link>{' '}
          {isDemo && <Tag tone="demo">Demo</Tag>}
        </p>
        <h1 className="text-display font-black text-ink-950">{study.title}</h1>
        <p className="flex flex-wrap items-center gap-3 text-lead text-ink-700">
          {study.emitter.name} with {study.quencher.name} · {study.solventLabel}, {study.temperature} K,{' '}
          {study.atmosphere} <StatusSignal status={study.status} />
          <span className="text-caption">
            revision {study.revision} · {study.ownerName}
          </span>
          <a
            className="rounded-md border border-paper-300 bg-paper-50 px-3 py-1 text-body font-bold text-ink-800 hover:border-ink-300"
            href={`/api/labs/${labId}/studies/${study.id}/report.pdf`}
          >
            PDF report
          </a>
        </p>
        {study.previousRevisionId && (
          <p className="text-caption">
            <Link className="underline" to={paths.study(labId, study.previousRevisionId)}>
              Earlier revision
            </Link>
          </p>
        )}
        {study.nextRevisionId && (
          <FormAlert tone="note">
            A newer revision exists:{' '}
            <Link className="underline" to={paths.study(labId, study.nextRevisionId)}>
              open it
            </Link>
            . This one stays as it was.
          </FormAlert>
        )}
        {study.status === 'approved' && !study.nextRevisionId && (
          <FormAlert tone="good">Approved and locked. A change starts a new revision; this one is kept.</FormAlert>
        )}
      </header>
      <ResultSummary ref={summary} study={study} />
      <CautionsOnce userId={userId} labId={labId}>
        <SafetyNotes study={study} />
      </CautionsOnce>
      {/* minmax(0, …): a chart or wide table shrinks to its column instead of widening the column past the window */}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <Panel
          title="Stern–Volmer plot"
          aside={
            <a
              className="text-caption underline"
              href={`/api/labs/${labId}/studies/${study.id}/export.csv?part=points`}
            >
              Points as CSV
            </a>
          }
        >
          {fit ? (
            <SternVolmerPlot plot={fit.result.plot} studyTitle={study.title} />
          ) : (
            <p className="text-body text-ink-500">
              {study.fitProblem ?? 'Add points (type, paste or upload) and the fit appears here.'}
            </p>
          )}
          {fit?.result.lifetime && (
            <div className="mt-4">
              <h3 className="text-body font-bold">Lifetimes</h3>
              <LifetimePlot lifetime={fit.result.lifetime} studyTitle={study.title} />
            </div>
          )}
        </Panel>
        <Panel
          title="Results"
          aside={
            fit && (
              <a className="text-caption underline" href={`/api/labs/${labId}/studies/${study.id}/export.csv?part=fit`}>
                Fit as CSV
              </a>
            )
          }
        >
          {study.fitProblem && <FormAlert>{study.fitProblem}</FormAlert>}
          {fit ? <ResultsPanel fit={fit} /> : <p className="text-body text-ink-500">No fit yet.</p>}
          {editable && fit && (
            <div className="mt-3">
              <FitControls
                key={`${study.fitModel} ${study.fitWeighting}`}
                labId={labId}
                studyId={study.id}
                model={study.fitModel}
                weighting={study.fitWeighting}
              />
            </div>
          )}
        </Panel>
      </div>
      <Panel title="Mechanism">
        <MechanismPanel labId={labId} studyId={study.id} fitId={fit?.id ?? null} anchors={EVIDENCE_ANCHORS} />
      </Panel>
      <Panel title="Points">
        {/* keyed by the saved points: a file taken or an undo shows in the grid instead of stale rows */}
        {pointsShown ? (
          <PointsGrid
            key={study.points.map((point) => point.id).join()}
            labId={labId}
            study={study}
            editable={editable}
          />
        ) : (
          <p className="text-body text-ink-500">Laying out the points…</p>
        )}
      </Panel>
      <Panel title="Lifetimes from decays" id="lifetimes-from-decays">
        <Suspense fallback={panelLoading}>
          <DecaysPanel
            labId={labId}
            study={study}
            editable={editable}
            onApplied={(next) => {
              queryClient.setQueryData(studiesKeys.detail(labId, study.id), next);
              void queryClient.invalidateQueries({ queryKey: studiesKeys.history(labId, study.id) });
              void queryClient.invalidateQueries({ queryKey: studiesKeys.lists(labId) });
            }}
            onRefitted={() => {
              void queryClient.invalidateQueries({ queryKey: studiesKeys.detail(labId, study.id) });
              void queryClient.invalidateQueries({ queryKey: studiesKeys.history(labId, study.id) });
              void queryClient.invalidateQueries({ queryKey: studiesKeys.lists(labId) });
            }}
          />
        </Suspense>
      </Panel>
      <Panel title="Emission by wavelength" id="emission-by-wavelength">
        <Suspense fallback={panelLoading}>
          <SpectrumMatrixPanel labId={labId} studyId={study.id} editable={editable} />
        </Suspense>
      </Panel>
      <Panel title="Absorption" id="absorption">
        <Suspense fallback={panelLoading}>
          <AbsorptionPanel labId={labId} studyId={study.id} editable={editable} />
        </Suspense>
      </Panel>
      {editable && (
        <Panel title="Upload an instrument file">
          <UploadPanel
            labId={labId}
            study={study}
            onFitted={() => void navigate('.', { replace: true, state: { arrived: 'fitted' } satisfies StudyArrival })}
          />
        </Panel>
      )}
      <DrivingForcePanel
        labId={labId}
        emitterId={study.emitter.id}
        quencherId={study.quencher.id}
        solvent={study.solventId}
        pinned={pinned}
        onPin={editable ? (pathway) => update.mutate({ version: study.version, pinnedMechanism: pathway }) : undefined}
      />
      <Panel
        title="Set-up"
        id="set-up"
        aside={
          editable && (
            <button type="button" className="text-caption underline" onClick={() => setEditing(!editing)}>
              {editing ? 'Close' : 'Change'}
            </button>
          )
        }
      >
        {update.isError && <FormAlert>{describeError(update.error)}</FormAlert>}
        {editing ? (
          <StudyForm
            options={options.data}
            study={study}
            submitLabel="Save set-up"
            onSubmit={async (body) => {
              await update.mutateAsync({ ...body, version: study.version });
              setEditing(false);
              notify.done('Set-up saved');
            }}
          />
        ) : (
          <SetupSummary study={study} />
        )}
      </Panel>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <Panel title="Review">
          <ReviewPanel labId={labId} study={study} isOwner={isOwner} canReview={canReview} canWrite={canWrite} />
        </Panel>
        <Panel title="Files">
          <FilesList labId={labId} studyId={study.id} uploads={study.uploads} editable={editable} />
        </Panel>
      </div>
      <Panel title="History">
        <HistoryPanel labId={labId} studyId={study.id} />
      </Panel>
      {canReview && !isOwner && study.status === 'submitted' && study.nextRevisionId === null && (
        <ReviewBar labId={labId} study={study} />
      )}
    </div>
  );
}

function SetupSummary({ study }: { study: StudyDetail }) {
  const facts: Array<[string, string]> = [
    ['Excitation', study.excitationWavelength ? `${study.excitationWavelength} nm` : '—'],
    [
      'Emission',
      study.windowStart !== null && study.windowEnd !== null
        ? `${study.windowStart}–${study.windowEnd} nm (integrated)`
        : study.emissionWavelength
          ? `${study.emissionWavelength} nm`
          : '—',
    ],
    ['Degassing', study.degassingMethod],
    [
      'τ0',
      study.tau0 !== null
        ? `${toNanoseconds(study.tau0).toPrecision(4)} ns${
            study.tau0LifetimeId
              ? ' (lifetime record)'
              : study.tau0Source
                ? ` (from decay ${study.tau0Source.fileName})`
                : ''
          }`
        : 'not given',
    ],
    [
      'Corrections',
      [study.dilutionCorrection && 'dilution', study.innerFilterCorrection && 'inner filter']
        .filter(Boolean)
        .join(', ') || 'none',
    ],
    ['Series', study.dataKind === 'ratio' ? 'I0/I ratios' : 'intensities'],
  ];
  return (
    <dl className="grid grid-cols-2 gap-2 text-body md:grid-cols-3">
      {facts.map(([label, value]) => (
        <div key={label}>
          <dt className="text-caption tracking-wide text-ink-500">{label}</dt>
          <dd className="font-bold">{value}</dd>
        </div>
      ))}
      {study.notes && (
        <div className="col-span-full">
          <dt className="text-caption tracking-wide text-ink-500">Notes</dt>
          <dd className="whitespace-pre-wrap">{study.notes}</dd>
        </div>
      )}
    </dl>
  );
}
