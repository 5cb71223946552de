import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rehmWellerRateConstant, solventDiffusionLimit } from '../../shared/engine';
import { ExcitedStateEnergy, RedoxPotential, Study, StudyFit } from '../../server/models';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createCompound, createStudyRecord } from '../support/study-records';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

let labId = '';
let viewer: Awaited<ReturnType<typeof apiClient>>;
let emitterId = '';
const quencherIds: string[] = [];
// Test inputs: acceptor reduction potentials (V vs SCE) of four invented quenchers.
const acceptorPotentials = [-1.3, -1.6, -1.9, -2.1];

async function potential(compoundId: string, couple: 'oxidation' | 'reduction', value: number) {
  await RedoxPotential.create({
    labId,
    compoundId,
    couple,
    value,
    reference: 'SCE',
    solvent: 'acetonitrile',
    kind: 'half-wave',
    createdById: null,
  });
}

beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
  labId = lab.id;
  // The catalyst row "Ptppy" of Chem. Sci. 2015, 6, 1454 (PMC5811153) Table 1:
  // E(M+/M) = +0.57 V, E(M/M-) = -2.38 V vs SCE in MeCN, E_T = 2.64 eV.
  const emitter = await createCompound(labId, 'Pt-row', 'photocatalyst');
  emitterId = emitter.id;
  await potential(emitterId, 'oxidation', 0.57);
  await potential(emitterId, 'reduction', -2.38);
  await ExcitedStateEnergy.create({
    labId,
    compoundId: emitterId,
    value: 2.64,
    method: 'phosphorescence',
    createdById: null,
  });
  const diffusionLimit = solventDiffusionLimit('acetonitrile');
  for (const [index, reduction] of acceptorPotentials.entries()) {
    const quencher = await createCompound(labId, `acceptor-${index}`, 'quencher');
    quencherIds.push(quencher.id);
    await potential(quencher.id, 'reduction', reduction);
    // Synthetic kq from the Rehm–Weller form with a known lambda = 0.80 eV (shared/engine/README.md, section 7).
    const drivingForce = 0.57 - reduction - 2.64;
    const kq = rehmWellerRateConstant({ drivingForce, reorganisationEnergy: 0.8, diffusionLimit });
    await createStudyRecord({
      labId,
      emitterId,
      quencherId: quencher.id,
      kq,
      status: index % 2 === 0 ? 'approved' : 'draft',
      title: `Pt vs acceptor-${index}`,
    });
  }
  // A study in another solvent: listed, but never mixed into the acetonitrile trend.
  await createStudyRecord({
    labId,
    emitterId,
    quencherId: quencherIds[0]!,
    kq: 1e9,
    solventId: 'dmf',
    title: 'in DMF',
  });
  viewer = await apiClient(testApp.app);
  await viewer.signIn(users.viewer);
});

describe('GET /api/labs/:labId/comparisons/:side/:compoundId', () => {
  it('when an emitter is compared, then each quencher shows kq and the Rehm–Weller driving force', async () => {
    const response = await viewer.get(`/api/labs/${labId}/comparisons/emitter/${emitterId}?sort=drivingForce`);
    expect(response.status).toBe(200);
    const acetonitrileRows = response.body.rows.filter((row: { solvent: string }) => row.solvent === 'acetonitrile');
    // dG_ET = e[E(D+/D) - E(A/A-)] - E00 (Rehm & Weller 1970; shared/engine/README.md, section 6): 0.57 + 1.30 - 2.64 = -0.77 eV.
    expect(acetonitrileRows[0].drivingForce.pathway).toBe('oxidative');
    expect(acetonitrileRows[0].drivingForce.electronvolts).toBeCloseTo(-0.77, 10);
    expect(acetonitrileRows.map((row: { partner: { name: string } }) => row.partner.name)).toEqual([
      'acceptor-0',
      'acceptor-1',
      'acceptor-2',
      'acceptor-3',
    ]);
    expect(response.body.rows.find((row: { solvent: string }) => row.solvent === 'dmf').status).toBe('draft');
  });

  it('when the trend is fitted, then lambda comes back with its error and solvents stay apart', async () => {
    const response = await viewer.get(`/api/labs/${labId}/comparisons/emitter/${emitterId}`);
    const trends = response.body.trends;
    expect(trends.map((trend: { solvent: string }) => trend.solvent)).toEqual(['acetonitrile', 'dmf']);
    const [acetonitrile, dmf] = trends;
    expect(acetonitrile.points).toHaveLength(4);
    // Synthetic data made with lambda = 0.80 eV must give it back.
    expect(acetonitrile.fit.reorganisationEnergy).toBeCloseTo(0.8, 6);
    expect(acetonitrile.fit.reorganisationEnergyStandardError).toBeGreaterThanOrEqual(0);
    expect(acetonitrile.diffusionLimit).toBeCloseTo(solventDiffusionLimit('acetonitrile'), 0);
    expect(dmf.fit).toBeNull();
    expect(dmf.note).toMatch(/at least 3 studies/);
  });

  it('when only approved results are asked for, then drafts leave the fit but stay in the table', async () => {
    const response = await viewer.get(`/api/labs/${labId}/comparisons/emitter/${emitterId}?approvedOnly=true`);
    expect(response.body.rows).toHaveLength(5);
    expect(response.body.trends[0].points).toHaveLength(2);
    expect(response.body.trends[0].fit).toBeNull();
  });

  it('when a quencher is compared, then its emitters are listed', async () => {
    const response = await viewer.get(`/api/labs/${labId}/comparisons/quencher/${quencherIds[0]}`);
    expect(response.body.rows.map((row: { partner: { name: string } }) => row.partner.name)).toEqual([
      'Pt-row',
      'Pt-row',
    ]);
  });

  it('when a study has a fit, then its row carries the standard errors and the flags of that fit only', async () => {
    const study = await Study.findOne({ where: { labId, title: 'in DMF' } });
    // Test inputs, not measurements: a stored fit result reduced to the parts a comparison reads.
    const fit = await StudyFit.create({
      studyId: study!.id,
      model: 'linear-free',
      trigger: 'manual',
      kSv: 1e3,
      kq: 1e9,
      result: {
        parameters: { kq: { value: 1e9, standardError: 4e7 }, kSv: { value: 1e3, standardError: 40 } },
        flags: [
          { code: 'few_points', title: 'Few points', severity: 'warning', whatToDo: 'Measure more.' },
          { code: 'curvature', title: 'Curved', severity: 'info', whatToDo: 'Look at the residuals.' },
        ],
      } as never,
      pointsUsed: [],
      engineVersion: 'test',
    });
    await study!.update({ latestFitId: fit.id });
    const response = await viewer.get(`/api/labs/${labId}/comparisons/emitter/${emitterId}`);
    const row = response.body.rows.find((item: { title: string }) => item.title === 'in DMF');
    expect(row.kq).toEqual({ value: 1e9, standardError: 4e7 });
    expect(row.kSv).toEqual({ value: 1000, standardError: 40 }); // the study's own K_SV (createStudyRecord: kq x tau0)
    expect(row.flags).toEqual([
      { code: 'few_points', title: 'Few points' },
      { code: 'curvature', title: 'Curved' },
    ]);
    const others = response.body.rows.filter((item: { title: string }) => item.title !== 'in DMF');
    expect(others.every((item: { flags: unknown[]; kq: { standardError: null } }) => !item.flags.length)).toBe(true);
  });

  it('when exported, then the CSV carries the same rows with an approved column', async () => {
    const response = await viewer.get(`/api/labs/${labId}/comparisons/emitter/${emitterId}/export.csv`);
    expect(response.headers['content-type']).toMatch(/text\/csv/);
    const lines = response.text.trim().split('\n');
    expect(lines[2]).toMatch(/^quencher,study,solvent,status,approved,kq \(M⁻¹ s⁻¹\),kq SE \(M⁻¹ s⁻¹\),K_SV \(M⁻¹\)/);
    expect(lines).toHaveLength(3 + 5);
  });
});

describe('GET /api/labs/:labId/comparisons/:side/:compoundId at another temperature', () => {
  it('when studies were run at 50 °C, then their trend is fitted apart with k_diff = 8RT/3η(T) at 323.15 K', async () => {
    // The same catalyst row as above (Chem. Sci. 2015, 6, 1454, Table 1), its studies run at 323.15 K.
    const emitter = await createCompound(labId, 'Pt-row-warm', 'photocatalyst');
    await potential(emitter.id, 'oxidation', 0.57);
    await potential(emitter.id, 'reduction', -2.38);
    await ExcitedStateEnergy.create({
      labId,
      compoundId: emitter.id,
      value: 2.64,
      method: 'phosphorescence',
      createdById: null,
    });
    const temperature = 323.15;
    for (const [index, reduction] of [...acceptorPotentials, -1.45].entries()) {
      const quencher = await createCompound(labId, `warm-acceptor-${index}`, 'quencher');
      await potential(quencher.id, 'reduction', reduction);
      // Synthetic kq from the Rehm–Weller form at 323.15 K with lambda = 0.80 eV and the engine's k_d there.
      const kq = rehmWellerRateConstant({
        drivingForce: 0.57 - reduction - 2.64,
        reorganisationEnergy: 0.8,
        diffusionLimit: solventDiffusionLimit('acetonitrile', temperature),
        temperature,
      });
      await createStudyRecord({ labId, emitterId: emitter.id, quencherId: quencher.id, kq, temperature });
    }
    // One study at 25 °C beside them: it must not join the 50 °C fit.
    await createStudyRecord({ labId, emitterId: emitter.id, quencherId: quencherIds[1]!, kq: 2e9 });

    const response = await viewer.get(`/api/labs/${labId}/comparisons/emitter/${emitter.id}`);
    expect(response.status).toBe(200);
    const trends = response.body.trends as {
      solvent: string;
      temperature: number;
      label: string;
      diffusionLimit: number;
      points: unknown[];
      fit: { reorganisationEnergy: number } | null;
    }[];
    expect(trends.map((trend) => [trend.solvent, trend.temperature, trend.points.length])).toEqual([
      ['acetonitrile', 298.15, 1],
      ['acetonitrile', 323.15, 5],
    ]);
    const warm = trends[1]!;
    expect(warm.label).toBe('acetonitrile at 323.15 K');
    // Hand calculation: k_diff = 8RT/(3η) × 1000 (Smoluchowski–Stokes–Einstein) with η(323.15 K) of
    // acetonitrile = 0.2801 mPa s, the VDI Heat Atlas 2nd ed. PPDS correlation (coefficient file in
    // CalebBell/chemicals, commit 82faef9, as in tests/unit/engine/viscosity.test.ts):
    // 8 × 8.314462618 × 323.15 / (3 × 0.2801e-3) × 1000 = 2.558e10 M⁻¹ s⁻¹. The engine's eta(T) is
    // Perry's correlation, a second handbook: within 3 %, as handbook viscosities of one liquid
    // commonly differ by 1–3 % (common practice).
    // R = 8.314462618 J mol⁻¹ K⁻¹ (CODATA 2018).
    const handCalculation = ((8 * 8.314462618 * 323.15) / (3 * 0.2801e-3)) * 1000;
    expect(Math.abs(warm.diffusionLimit / handCalculation - 1)).toBeLessThan(0.03);
    // ... and well above the 25 °C ceiling (about 1.93e10; shared/engine README, section 3).
    expect(warm.diffusionLimit / trends[0]!.diffusionLimit).toBeGreaterThan(1.3);
    // Made with lambda = 0.80 eV at 323.15 K: the fit at the studies' own temperature gives it back.
    expect(warm.fit!.reorganisationEnergy).toBeCloseTo(0.8, 6);
    const warmRows = response.body.rows.filter((row: { temperature: number }) => row.temperature === 323.15);
    expect(warmRows).toHaveLength(5);
    for (const row of warmRows) expect(row.diffusionLimit.value).toBe(warm.diffusionLimit);
    expect(warmRows[0].diffusionLimit.basis).toMatch(/323\.15 K/);
  });

  it('when an emitter has more than 500 current studies, then its rows are the newest 500 by change, then id', async () => {
    const emitter = await createCompound(labId, 'Pt-many', 'photocatalyst');
    const template = await createStudyRecord({ labId, emitterId: emitter.id, quencherId: quencherIds[0]!, kq: 1e9 });
    // 504 copies in SQL whose change times come in pairs; the 500th row falls inside a pair, where id decides.
    await testApp.sequelize.query(
      `INSERT INTO studies (id, lab_id, emitter_id, quencher_id, title, solvent_id, temperature, excitation_wavelength,
         emission_wavelength, atmosphere, degassing_method, tau0, data_kind, fit_model, notes, status, revision,
         is_current, k_sv, kq, flagged, version, created_at, updated_at)
       SELECT gen_random_uuid(), lab_id, emitter_id, quencher_id, 'many ' || g, solvent_id, temperature,
         excitation_wavelength, emission_wavelength, atmosphere, degassing_method, tau0, data_kind, fit_model, notes,
         status, revision, true, k_sv, kq, flagged, 0, created_at,
         timestamptz '2026-11-01 10:00:00+00' - (g / 2) * interval '1 minute'
       FROM studies, generate_series(0, 503) AS g WHERE id = $1`,
      { bind: [template.id] },
    );
    const newest = await testApp.sequelize.query<{ id: string }>(
      `SELECT id FROM studies WHERE lab_id = $1 AND emitter_id = $2 AND is_current
       ORDER BY updated_at DESC, id LIMIT 500`,
      { bind: [labId, emitter.id], type: QueryTypes.SELECT },
    );
    const response = await viewer.get(`/api/labs/${labId}/comparisons/emitter/${emitter.id}`);
    expect(response.status).toBe(200);
    const shown = response.body.rows.map((row: { studyId: string }) => row.studyId);
    expect(shown).toHaveLength(500);
    // Rows come sorted by kq (all equal here); the set is what the 500 newest are.
    expect([...shown].sort()).toEqual(newest.map((row) => row.id).sort());
    expect(shown).toContain(template.id); // made now: newer than every copy
  });
});
