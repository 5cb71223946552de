import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QUALITY_FLAG_CODES, type QualityFlagCode } from '@shared/engine';
import {
  AuditEvent,
  Compound,
  DecaySet,
  ExcitedStateLifetime,
  Lab,
  SpectrumMatrix,
  Study,
  StudyFit,
  StudyPoint,
} from '../../server/models';
import { demoLabs, demoPassword, demoPeople, seedDemoData } from '../../server/seed/demo';
import { demoCompoundFamilies } from '../../server/seed/demo-library';
import { demoAbsorptionFileName } from '../../server/seed/demo-absorption';
import { demoDecayFileName, demoLibraryDecayFileName, demoLibraryDecayLifetime } from '../../server/seed/demo-decays';
import { demoExciplexFileName } from '../../server/seed/demo-exciplex';
import { demoStudies } from '../../server/seed/demo-studies';
import { analyseSeries, listTemperatureSeries } from '../../server/services/mechanism/temperature-series.service';
import { apiClient } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

let studies: Study[] = [];
let names = new Map<string, string>();
beforeAll(async () => {
  await seedDemoData(testApp.sequelize);
  const lab = await Lab.findOne({ where: { slug: demoLabs[0].slug } });
  // Other test files in the same run add their own studies to the demo lab: read the seeded ones only.
  const seededTitles = new Set(demoStudies.map((study) => study.title));
  studies = (await Study.findAll({ where: { labId: lab!.id } })).filter((study) => seededTitles.has(study.title));
  names = new Map((await Compound.findAll({ where: { labId: lab!.id } })).map((c) => [c.id, c.name]));
});

// Compound codes as the demo writes them: HL-Ir-7, Q-aryl-Br-1, Q-viol-5 ...
const CODE = /\b(?:HL|Q)-[A-Za-z]+(?:-[A-Za-z]+)?-\d+\b/g;

describe('seedDemoStudies', () => {
  it('when the demo is loaded, then every study title names exactly its own emitter and quencher, and its words fit them', () => {
    expect(studies.length).toBeGreaterThanOrEqual(10);
    for (const study of studies) {
      const emitter = names.get(study.emitterId)!;
      const quencher = names.get(study.quencherId)!;
      expect(new Set(study.title.match(CODE)), study.title).toEqual(new Set([emitter, quencher]));
      // A family word in the title ("iridium", "bipyridinium salt", "alkene") must describe one of the two.
      for (const { name, family } of demoCompoundFamilies) {
        if (new RegExp(`\\b${family}\\b`, 'i').test(study.title))
          expect([emitter, quencher], `${study.title} says ${family}`).toContain(name);
      }
    }
  });

  it('when the demo is loaded, then it shows every status, every fit model and every flag the engine raises', async () => {
    expect(new Set(studies.map((study) => study.status))).toEqual(
      new Set(['draft', 'submitted', 'approved', 'returned']),
    );
    const fits = await StudyFit.findAll({
      where: { id: studies.map((s) => s.latestFitId).filter((id) => id !== null) },
    });
    expect(new Set(fits.map((fit) => fit.model))).toEqual(
      new Set(['linear-free', 'linear-fixed', 'static-dynamic', 'modified']),
    );
    const codes = new Set(fits.flatMap((fit) => fit.result.flags.map((flag) => flag.code)));
    // Not asked of the demo: the flags that stop a fit (checked below as fit problems), and those no demo study is built to raise.
    const stopsFit: QualityFlagCode[] = ['NON_POSITIVE_INTENSITY', 'NO_I0'];
    const notBuilt: QualityFlagCode[] = [
      'LOW_R_SQUARED',
      'KSV_UNCERTAIN',
      'RATIO_BELOW_ONE',
      'QUENCHER_ABSORBS_UNCORRECTED',
    ];
    for (const code of QUALITY_FLAG_CODES.filter((code) => ![...stopsFit, ...notBuilt].includes(code)))
      expect(codes, code).toContain(code);
    // The two problems that stop a fit (a reading of zero, no blank and no I0) show as the study's fit problem.
    const unfitted = studies.filter((study) => study.latestFitId === null);
    expect(unfitted.map((study) => study.fitProblem)).toEqual([expect.any(String), expect.any(String)]);
    expect(fits.some((fit) => fit.result.lifetime !== null)).toBe(true);
  });

  it('when each demo person opens the overview, then every card they see has content and the activity runs newest first', async () => {
    const lab = await Lab.findOne({ where: { slug: demoLabs[0].slug } });
    for (const person of demoPeople.filter((p) => p.roles.marram && p.roles.marram !== 'viewer')) {
      const client = await apiClient(testApp.app);
      await client.signIn({ email: person.email, password: demoPassword });
      const dashboard = (await client.get(`/api/labs/${lab!.id}/dashboard`).expect(200)).body;
      if (person.roles.marram !== 'researcher')
        expect(dashboard.waitingForMyReview.length, person.key).toBeGreaterThan(0);
      expect(dashboard.myReturned.length, person.key).toBeGreaterThan(0);
      expect(dashboard.recentlyFlagged.length, person.key).toBeGreaterThan(0);
      const activity: Array<{ at: string; action: string }> = dashboard.recentActivity;
      expect(activity.length).toBeGreaterThanOrEqual(10);
      const times = activity.map((event) => Date.parse(event.at));
      expect(times).toEqual([...times].sort((a, b) => b - a));
      // The story took place over days, not in the second the demo was loaded.
      expect(times[0]! - times.at(-1)!).toBeGreaterThan(24 * 3600 * 1000);
      expect(new Set(activity.map((event) => event.action)).size).toBeGreaterThanOrEqual(3);
    }
  });

  it('when the demo comparison of HL-Ir-7 is opened, then its scattered acetonitrile kq give no λ and say why, instead of λ = 0 ± 70 eV', async () => {
    const lab = await Lab.findOne({ where: { slug: demoLabs[0].slug } });
    const emitter = await Compound.findOne({ where: { labId: lab!.id, name: 'HL-Ir-7' } });
    const person = demoPeople.find((p) => p.roles.marram)!;
    const client = await apiClient(testApp.app);
    await client.signIn({ email: person.email, password: demoPassword });
    const comparison = (await client.get(`/api/labs/${lab!.id}/comparisons/emitter/${emitter!.id}`).expect(200)).body;
    // the 25 °C trend: the demo's temperature series of the same emitter is fitted apart, one trend per temperature
    const acetonitrile = comparison.trends.find(
      (trend: { solvent: string; temperature: number }) =>
        trend.solvent === 'acetonitrile' && trend.temperature === 298.15,
    );
    expect(acetonitrile.points.length).toBeGreaterThanOrEqual(3);
    expect(acetonitrile.fit).toBeNull();
    // the engine's reason (fitRehmWeller, NOT_DETERMINED) as a person reads it, without its field name
    expect(acetonitrile.note).toMatch(/^λ is not determined by these rate constants: /);
  });

  it('when the demo is loaded, then one study carries a decay set whose lifetimes and tau0 fill its points, and its curves can be drawn', async () => {
    const study = studies.find((candidate) => candidate.title.endsWith('lifetimes from decays'))!;
    const sets = await DecaySet.findAll({ where: { studyId: study.id } });
    expect(sets.map((set) => set.title)).toEqual([demoDecayFileName]);
    const set = sets[0]!;
    expect(set.reading.responseSource).toBe('column');
    expect(set.options.model.method).toBe('reconvolution');
    expect(set.outcomes.map((outcome) => outcome.concentration)).toEqual([0, 0.5e-3, 1e-3, 2e-3, 3e-3, 4e-3]);
    expect(set.outcomes.every((outcome) => outcome.problem === null && outcome.lifetime !== null)).toBe(true);
    expect(study.tau0DecaySetId).toBe(set.id);
    // Demo data, not a check of the engine: the file is made with tau0 = 1.9 us (demo-decays.ts,
    // invented); the fit of its blank must land near it, else the demo would show something odd.
    expect(Math.abs(study.tau0! / 1.9e-6 - 1)).toBeLessThan(0.02);
    const points = await StudyPoint.findAll({ where: { studyId: study.id } });
    expect(points).toHaveLength(6);
    expect(points.every((point) => point.lifetimeDecaySetId === set.id && point.lifetime !== null)).toBe(true);
    const fit = await StudyFit.findByPk(study.latestFitId!);
    expect(fit!.result.lifetime).not.toBeNull();
    expect(await AuditEvent.count({ where: { targetId: study.id, action: 'study_lifetimes_from_decays' } })).toBe(1);

    const priya = demoPeople.find((person) => person.key === 'priya')!;
    const client = await apiClient(testApp.app);
    await client.signIn({ email: priya.email, password: demoPassword });
    const listed = (await client.get(`/api/labs/${study.labId}/studies/${study.id}/decay-sets`).expect(200)).body;
    expect(listed.items).toHaveLength(1);
    const curves = (await client.get(`/api/labs/${study.labId}/decay-sets/${set.id}/decays/2/curves`).expect(200)).body;
    expect(curves.counts).toHaveLength(1024);
    expect(curves.model).toHaveLength(1024);
  });

  it('when the demo is loaded, then the compound HL-Ru-4 has a lifetime record kept from one invented decay file, listed on its page', async () => {
    const lab = await Lab.findOne({ where: { slug: demoLabs[0].slug } });
    const compound = await Compound.findOne({ where: { labId: lab!.id, name: 'HL-Ru-4' } });
    const sets = await DecaySet.findAll({ where: { compoundId: compound!.id } });
    expect(sets.map((set) => set.title)).toEqual([demoLibraryDecayFileName]);
    const set = sets[0]!;
    expect(set.studyId).toBeNull();
    expect(set.reading.responseSource).toBe('column');
    expect(set.outcomes).toHaveLength(1);
    const record = await ExcitedStateLifetime.findByPk(set.lifetimeId!);
    expect(record!.compoundId).toBe(compound!.id);
    expect(record!.source).toBe(`from decay ${demoLibraryDecayFileName}`);
    expect(record!.notes).toMatch(/^Demo record: an invented decay file/);
    // Demo data, not a check of the engine: the file is made with tau = 0.93 us (demo-decays.ts,
    // invented); its fit must land near it, else the compound page would show something odd.
    expect(Math.abs(record!.value / demoLibraryDecayLifetime - 1)).toBeLessThan(0.02);
    expect(await AuditEvent.count({ where: { targetId: record!.id, action: 'lifetime_added' } })).toBe(1);

    const priya = demoPeople.find((person) => person.key === 'priya')!;
    const client = await apiClient(testApp.app);
    await client.signIn({ email: priya.email, password: demoPassword });
    const listed = (await client.get(`/api/labs/${lab!.id}/compounds/${compound!.id}/decay-sets`).expect(200)).body;
    expect(listed.items.map((item: { id: string }) => item.id)).toEqual([set.id]);
    const detail = (await client.get(`/api/labs/${lab!.id}/compounds/${compound!.id}`).expect(200)).body;
    expect(detail.lifetimes.map((lifetime: { id: string }) => lifetime.id)).toContain(record!.id);
  });

  it('when the demo is loaded, then it holds one dynamic and one static temperature series', async () => {
    const lab = await Lab.findOne({ where: { slug: demoLabs[0].slug } });
    const context = { id: lab!.id, name: lab!.name, isDemo: true, role: 'viewer' as const, membershipId: '' };
    const ready = (await listTemperatureSeries(context)).items.filter((group) => group.ready);
    const verdicts = await Promise.all(
      ready.map(async (group) => (await analyseSeries(context, group.studyIds)).verdict),
    );
    expect(verdicts.sort()).toEqual(['dynamic', 'static']);
  });

  it('when the demo is loaded, then the static and dynamic carbazole study holds an absorption titration whose K_a agrees with its K_S', async () => {
    const study = studies.find(
      (candidate) => candidate.title.includes('HL-Cz-2') && candidate.fitModel === 'static-dynamic',
    )!;
    const priya = demoPeople.find((person) => person.key === 'priya')!;
    const client = await apiClient(testApp.app);
    await client.signIn({ email: priya.email, password: demoPassword });
    const { items } = (
      await client.get(`/api/labs/${study.labId}/studies/${study.id}/absorption-titrations`).expect(200)
    ).body;
    expect(items.map((item: { title: string }) => item.title)).toEqual([demoAbsorptionFileName]);
    const [titration] = items;
    expect(titration.analysis.flags.map((flag: { code: string }) => flag.code)).toEqual(['ABSORPTION_CHANGES']);
    expect(titration.quencher.kind).toBe('absorptivity');
    // Demo data, not a check of the engine: the files are made with K_a = 150 M^-1 and the study's
    // series with K_S = 150 M^-1 (demo-absorption.ts, demo-studies.ts, invented); the demo story needs them to agree.
    expect(titration.comparison.kS).not.toBeNull();
    expect(titration.comparison.isotherm.agree).toBe(true);
  });

  it('when the demo is loaded, then the iridium/amine dilution study holds an emission matrix with a growing exciplex band', async () => {
    const study = studies.find((candidate) =>
      candidate.title.startsWith('Demo: HL-Ir-7 (iridium) with the amine Q-amine-3, stock without emitter'),
    )!;
    const matrices = await SpectrumMatrix.findAll({ where: { studyId: study.id } });
    expect(matrices.map((matrix) => matrix.title)).toEqual([demoExciplexFileName]);
    expect(matrices[0]!.analysis.flags.map((flag) => flag.code)).toContain('NEW_COMPONENT_GROWS');
  });
});
