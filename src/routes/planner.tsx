import { useState } from 'react';
import type { TitrationPlanInput, TitrationPlanResult } from '@shared/schemas/planner';
import { toMicromolar, toMillilitres, toMillimolar } from '@shared/units/units';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { Panel } from '@/components/panel';
import { SafetyNotice } from '@/components/safety-notice';
import { useCreateTitrationPlan } from '@/features/planner/api/create-titration-plan';
import { useDownloadTitrationPlan } from '@/features/planner/api/download-titration-plan';
import { PlanTable } from '@/features/planner/components/plan-table';
import { PlannerForm } from '@/features/planner/components/planner-form';
import { toPlanInput } from '@/features/planner/components/planner-form-schema';
import { describeError } from '@/lib/form-errors';
import { paths } from '@/lib/paths';
import { can } from '@/lib/policy';
import { useLab } from '@/routes/lab-context';
import { ScreenHeader } from '@/components/screen-header';
import { LinkButton } from '@/components/link-button';

/** The new-study form, pre-filled with the plan's volumes and stock and the dilution correction switched on. */
function studyFromPlan(labId: string, input: TitrationPlanInput): string {
  return paths.newStudy(labId, {
    initialVolumeMilli: String(toMillilitres(input.initialVolume)),
    stockMilli: String(toMillimolar(input.stockConcentration)),
    dilutionCorrection: 'true',
    stockContainsEmitter: String(Boolean(input.stockContainsEmitter)),
    title: input.quencherName ? `Titration with ${input.quencherName}` : undefined,
  });
}

/** Titration planner: the additions that reach each quencher concentration, before any stock is made. */
export function PlannerRoute() {
  const lab = useLab();
  const labId = lab.labId;
  const createPlan = useCreateTitrationPlan(labId);
  const download = useDownloadTitrationPlan(labId);
  const [planned, setPlanned] = useState<{ input: TitrationPlanInput; plan: TitrationPlanResult } | null>(null);

  return (
    <div className="max-w-5xl space-y-6">
      <ScreenHeader title="Titration planner" className="print:hidden">
        <p className="mt-1 max-w-3xl text-lead text-ink-700">
          Work out each addition of quencher stock, how far the sample is diluted, and the concentration you really
          reach, before you start the titration.
        </p>
      </ScreenHeader>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem] print:block">
        <Panel title="Starting point">
          <div className="print:hidden">
            <PlannerForm
              pending={createPlan.isPending}
              serverError={createPlan.isError ? describeError(createPlan.error) : undefined}
              onPlan={(values) => {
                const input = toPlanInput(values);
                createPlan.mutate(input, { onSuccess: (plan) => setPlanned({ input, plan }) });
              }}
            />
          </div>
        </Panel>
        <div className="print:hidden">
          <SafetyNotice hazards={['toxic-quencher', 'flammable-solvent', 'light', 'pressurised-gas']} />
        </div>
      </div>
      {planned && (
        <Panel
          title="Additions"
          aside={
            <div className="flex gap-2 print:hidden">
              <Button
                variant="quiet"
                onClick={() => download.mutate(planned.input)}
                pending={download.isPending}
                pendingLabel="Preparing…"
              >
                Download CSV
              </Button>
              <Button variant="quiet" onClick={() => window.print()}>
                Print
              </Button>
              {can(lab.role, 'studies:write') && (
                <LinkButton to={studyFromPlan(labId, planned.input)}>Start a study from this plan</LinkButton>
              )}
            </div>
          }
        >
          <p className="mb-3 text-body text-ink-700">
            Start with {toMillilitres(planned.input.initialVolume)} mL of{' '}
            {toMicromolar(planned.input.emitterConcentration)} µM emitter and a{' '}
            {toMillimolar(planned.input.stockConcentration)} mM quencher stock
            {planned.input.quencherName ? ` (${planned.input.quencherName})` : ''}. In total the sample grows by{' '}
            <strong>{(planned.plan.totalDilution * 100).toFixed(1)} %</strong>.
          </p>
          {planned.plan.flags.map((flag) => (
            <div key={flag.code} className="mb-3">
              <FormAlert tone="note">
                <strong>{flag.title}.</strong> {flag.explanation} {flag.detail ? `(${flag.detail})` : ''}
                <ul className="mt-1 list-disc pl-5">
                  {flag.whatToCheck.map((item) => (
                    <li key={item}>{item}</li>
                  ))}
                </ul>
              </FormAlert>
            </div>
          ))}
          <PlanTable plan={planned.plan} />
          {download.isError && <FormAlert>{describeError(download.error)}</FormAlert>}
        </Panel>
      )}
    </div>
  );
}
