import { describe, expect, it } from 'vitest';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { toPlanInput } from '@/features/planner/components/planner-form-schema';
import { toScenarioForm, toScenarioInput } from '@/features/scenarios/components/scenario-form-schema';
import { initialValues, toBody } from '@/features/studies/components/study-form-values';

// The forms take the units chemists type and send SI: 1 ns = 1e-9 s, 1 mL = 1e-3 L, 1 mM = 1e-3 mol/L,
// 1 µM = 1e-6 mol/L, 1 µL = 1e-6 L, 1 mPa s = 1e-3 Pa s (SI brochure, 9th ed., 2019, table 7; common practice).
describe('form values in typed units and SI', () => {
  it('when a study is opened in the form and sent back, then ns, mPa s, mL and mM become s, Pa s, L and mol/L', () => {
    const study = {
      emitter: { id: 'e', name: 'E' },
      quencher: { id: 'q', name: 'Q' },
      solventId: null,
      customSolventName: 'glycerol mix',
      customViscosity: 0.0123,
      tau0: 1.1e-6,
      tau0Uncertainty: 4e-8,
      tau0LifetimeId: null,
      initialVolume: 0.002,
      stockConcentration: 0.05,
    } as unknown as StudyDetail;
    const values = initialValues(study);
    expect(values.tau0Nano).toBe('1100');
    expect(values.tau0UncertaintyNano).toBe('40');
    expect(values.customViscosityMilli).toBe('12.3');
    expect(values.initialVolumeMilli).toBe('2');
    expect(values.stockMilli).toBe('50');
    const body = toBody({ ...values, tau0Nano: '850', stockMilli: '2,5' }, undefined);
    expect(body.tau0).toBeCloseTo(8.5e-7, 18);
    expect(body.tau0Uncertainty).toBeCloseTo(4e-8, 18);
    expect(body.customViscosity).toBeCloseTo(0.0123, 15);
    expect(body.initialVolume).toBeCloseTo(0.002, 15);
    expect(body.stockConcentration).toBeCloseTo(0.0025, 15);
    expect(toBody({ ...values, tau0Nano: '' }, undefined).tau0).toBeNull();
  });

  it('when a titration plan is asked in mL, µM, mM and µL, then the plan input is in L and mol/L', () => {
    const input = toPlanInput({
      initialVolumeMl: 3,
      emitterMicromolar: 20,
      stockMillimolar: 100,
      mode: 'targets',
      targetsMillimolar: '1, 2',
      pipetteStepMicrolitres: '0.5',
    } as Parameters<typeof toPlanInput>[0]);
    expect(input.initialVolume).toBeCloseTo(3e-3, 15);
    expect(input.emitterConcentration).toBeCloseTo(2e-5, 18);
    expect(input.stockConcentration).toBeCloseTo(0.1, 15);
    expect('targets' in input && input.targets).toEqual([expect.closeTo(1e-3, 15), expect.closeTo(2e-3, 15)]);
    expect(input.volumeStep).toBeCloseTo(5e-7, 18);
  });

  it('when a scenario is opened and sent back, then τ0 in ns and [Q] in mM round-trip to s and mol/L', () => {
    const form = toScenarioForm({
      name: 'n',
      emitter: { id: 'e' },
      solvent: 'acetonitrile',
      tau0: 1.1e-6,
      tau0Source: '',
      notes: '',
      shares: [{ kind: 'compound', compoundId: 'c', concentration: 0.0025, kqSource: null, kq: null }],
    } as unknown as Parameters<typeof toScenarioForm>[0]);
    expect(form.tau0Nanoseconds).toBe('1100');
    expect(form.components[0]!.concentrationMillimolar).toBe('2.5');
    const input = toScenarioInput(form);
    expect(input.tau0).toBeCloseTo(1.1e-6, 18);
    expect(input.components[0]!.concentration).toBeCloseTo(0.0025, 15);
  });
});
