import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { linearRegression } from 'simple-statistics';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { fitStudy } from '@shared/engine/study-fit/fit-study';
import type * as FitStudyModule from '@shared/engine/study-fit/fit-study';
import { correctPoint } from '@shared/engine/study-fit/corrections';
import type * as CorrectionsModule from '@shared/engine/study-fit/corrections';
import { ENGINE_VERSION } from '@shared/engine';
import { Study, StudyFit } from '../../server/models';
import { pino } from 'pino';
import { prepareSchema } from '../../server/boot/database';
import type { AppConfig } from '../../server/config/env';
import { refitOutdatedFits } from '../../server/services/studies/refit-outdated-fits';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { pointAt } from '@shared/schemas/study-points';
import { createStudy, exactPoints } from '../support/studies';
import { createTestApp } from '../support/test-app';

// The pipeline and its corrections, wrapped so the test can count what a request runs.
vi.mock('@shared/engine/study-fit/corrections', async (original) => {
  const actual = await original<typeof CorrectionsModule>();
  return { ...actual, correctPoint: vi.fn(actual.correctPoint) };
});
vi.mock('@shared/engine/study-fit/fit-study', async (original) => {
  const actual = await original<typeof FitStudyModule>();
  return { ...actual, fitStudy: vi.fn(actual.fitStudy) };
});

const fixture = (name: string) => fs.readFileSync(path.join(import.meta.dirname, '../fixtures/uploads', name));
const testApp = await createTestApp();
let client: Awaited<ReturnType<typeof apiClient>>;
let labId = '';
let csrf = '';

beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  labId = lab.id;
  client = await apiClient(testApp.app);
  csrf = (await client.signIn(users.researcher)).body.csrfToken;
});
afterAll(testApp.close);

const base = (studyId: string) => `/api/labs/${labId}/studies/${studyId}`;
const newStudy = () => createStudy(client, labId, crypto.randomBytes(3).toString('hex'));

describe('one study-fit pipeline (issue 13, findings 11 and 12)', () => {
  it('when an upload is applied, then the series is fitted once', async () => {
    const study = await newStudy();
    const preview = await client.agent
      .post(`${base(study.id)}/uploads`)
      .set('x-csrf-token', csrf)
      .attach('file', fixture('series-comma-mM.csv'), 'series-comma-mM.csv');
    expect(preview.status, JSON.stringify(preview.body)).toBe(201);
    vi.mocked(fitStudy).mockClear();
    const applied = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/apply`, {
      version: study.version,
      mapping: preview.body.mapping,
    });
    expect(applied.status, JSON.stringify(applied.body)).toBe(200);
    expect(applied.body.latestFit.kSv).toBeCloseTo(500, 1); // the line the fixture was built from
    expect(vi.mocked(fitStudy)).toHaveBeenCalledTimes(1);
  });

  it('when a left-out point is stored, then the answer carries it at its plotted place with the axis and its unit', async () => {
    const study = await newStudy();
    const points = exactPoints.map((p, i) => (i === 2 ? { ...p, excluded: true, exclusionReason: 'bubble' } : p));
    const detail = (await client.patch(`${base(study.id)}/points`, { version: 0, points }).expect(200)).body;
    // I0/I = 1 + 500 × 0.002 = 2 at [Q] = 2 mM (constructed line, hand-computed)
    expect(detail.latestFit.result.plot.xAxis).toEqual({ label: '[Q] (mM)', unit: 'mM', scale: 1000 });
    expect(detail.latestFit.result.plot.excluded).toEqual([{ position: 2, x: 2e-3, y: expect.closeTo(2, 9) }]);
  });

  it('when the latest stored fit is from an engine before 1.1.0, then a read writes nothing and the start-up refit fits it again once', async () => {
    const study = await newStudy();
    const points = exactPoints.map((p, i) => (i === 4 ? { ...p, excluded: true, exclusionReason: 'lamp drift' } : p));
    const first = (await client.patch(`${base(study.id)}/points`, { version: 0, points }).expect(200)).body.latestFit;
    const stored = (await StudyFit.findByPk(first.id))!;
    const { xAxis: _x, excluded: _e, ...oldPlot } = stored.result.plot;
    await stored.update({
      engineVersion: '1.0.0',
      result: { ...stored.result, plot: oldPlot as typeof stored.result.plot },
    });
    const before = (await Study.findByPk(study.id))!;
    const fitCount = () => StudyFit.count({ where: { studyId: study.id } });
    const countBefore = await fitCount();

    // a GET shows the old record as it was drawn ([Q] in mM, no left-out markers) and changes nothing
    const read = (await client.get(base(study.id)).expect(200)).body;
    expect(read.latestFit.id).toBe(first.id);
    expect(read.latestFit.result.plot.xAxis.label).toBe('[Q] (mM)');
    expect(read.latestFit.result.plot.excluded).toEqual([]);
    const after = (await Study.findByPk(study.id))!;
    expect(after.updatedAt.toISOString()).toBe(before.updatedAt.toISOString());
    expect(after.latestFitId).toBe(first.id);
    expect(await fitCount()).toBe(countBefore);

    // the start-up step, run as a start runs it (under the migration lock, nothing left to migrate)
    await prepareSchema(testApp.sequelize, { demoData: false } as AppConfig, pino({ level: 'silent' }));
    const refitted = (await client.get(base(study.id)).expect(200)).body.latestFit;
    expect(refitted.id).not.toBe(first.id);
    expect(refitted.engineVersion).toBe(ENGINE_VERSION);
    expect(refitted.kSv).toBeCloseTo(500, 9); // K_SV = 500 M^-1 by construction
    expect(refitted.result.plot.excluded).toEqual([{ position: 4, x: 4e-3, y: expect.closeTo(3, 9) }]);
    const fits = (await client.get(`${base(study.id)}/fits`).expect(200)).body.items;
    expect(fits.map((fit: { id: string }) => fit.id)).toEqual([refitted.id, first.id]);

    // a second start finds nothing of this study to fit again
    await refitOutdatedFits(testApp.sequelize);
    expect((await client.get(base(study.id)).expect(200)).body.latestFit.id).toBe(refitted.id);
  });

  it('when corrections are on, then a read shows the corrected values the fit stored and corrects nothing again', async () => {
    const study = await createStudy(client, labId, crypto.randomBytes(3).toString('hex'), {
      dilutionCorrection: true,
      initialVolume: 2e-3,
      stockConcentration: 0.1,
    });
    // invented: 0-100 µL of 0.1 M stock into 2 mL; the fourth point left out
    const points = [0, 20e-6, 40e-6, 60e-6, 80e-6, 100e-6].map((volume, i) => ({
      ...pointAt((0.1 * volume) / 2e-3),
      intensity: 1000 / (1 + 0.5 * i),
      volumeAdded: volume,
      ...(i === 3 ? { excluded: true, exclusionReason: 'bubble' } : {}),
    }));
    const saved = (await client.patch(`${base(study.id)}/points`, { version: 0, points }).expect(200)).body;
    vi.mocked(correctPoint).mockClear();
    const read = (await client.get(base(study.id)).expect(200)).body;
    expect(vi.mocked(correctPoint)).not.toHaveBeenCalled();
    const stored = saved.latestFit.result.corrections;
    expect(read.points.map((p: { corrected: unknown }) => p.corrected)).toEqual(
      stored.map(({ position: _p, ...values }: { position: number }) => values),
    );
    // by hand (mass balance): the left-out point at 60 µL, [Q] = 0.1 × 60/2060 M, I × 2060/2000
    expect(read.points[3].corrected.concentration).toBeCloseTo((0.1 * 60e-6) / 2.06e-3, 15);
    expect(read.points[3].corrected.intensity).toBeCloseTo((400 * 2.06e-3) / 2e-3, 9);

    // a fit stored before engine 1.5.0 holds none: nothing is shown until the start-up refit
    const fit = (await StudyFit.findByPk(saved.latestFit.id))!;
    const { corrections: _c, ...older } = fit.result;
    await fit.update({ engineVersion: '1.4.0', result: older as typeof fit.result });
    const before = (await client.get(base(study.id)).expect(200)).body;
    expect(before.points.every((p: { corrected: unknown }) => p.corrected === null)).toBe(true);
    await refitOutdatedFits(testApp.sequelize);
    const after = (await client.get(base(study.id)).expect(200)).body;
    expect(after.latestFit.id).not.toBe(saved.latestFit.id);
    expect(after.points.map((p: { corrected: unknown }) => p.corrected)).toEqual(
      read.points.map((p: { corrected: unknown }) => p.corrected),
    );
  });

  it('when a study holds two runs, then each keeps its run number and is divided by its own I0 (K_SV = 500 M^-1 by construction)', async () => {
    const study = await newStudy();
    // run 2: the same line with the lamp at 80 %, so one I0 for both runs would bend the pooled points
    const points = [...exactPoints, ...exactPoints.map((p) => ({ ...p, intensity: p.intensity! * 0.8, series: 2 }))];
    const detail = (await client.patch(`${base(study.id)}/points`, { version: 0, points }).expect(200)).body;
    expect(detail.points.map((p: { series: number }) => p.series)).toEqual([1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2]);
    expect(detail.latestFit.kSv).toBeCloseTo(500, 6);
    expect(detail.latestFit.result.replicates.runs.map((run: { value: number }) => run.value)).toEqual([1000, 800]);
    expect(detail.latestFit.result.replicates.summary).toHaveLength(6);
  });
});

describe('POST /api/labs/:labId/studies/:studyId/fits with a weighting', () => {
  // Invented ratios near 1 + 500 [Q]; σ = 1/√k gives whole-number weights k = 1, 2, 3, 4, 3, 2.
  const qs = [0, 1e-3, 2e-3, 3e-3, 4e-3, 5e-3];
  const ratios = qs.map((q, i) => 1 + 500 * q + [0, 0.03, -0.02, 0.025, -0.03, 0.02][i]!);
  const weights = [1, 2, 3, 4, 3, 2];
  const points = qs.map((q, i) => ({ ...pointAt(q), intensity: ratios[i]!, uncertainty: 1 / Math.sqrt(weights[i]!) }));
  // simple-statistics 7.x linearRegression: unweighted on the points, weighted = on each point taken k times
  const unweighted = linearRegression(qs.map((q, i) => [q, ratios[i]!])).m;
  const weighted = linearRegression(qs.flatMap((q, i) => Array.from({ length: weights[i]! }, () => [q, ratios[i]!]))).m;

  it('when weighted is chosen, then the reported K_SV is the weighted one, stored with the fit and kept for later fits', async () => {
    const study = await createStudy(client, labId, crypto.randomBytes(3).toString('hex'), { dataKind: 'ratio' });
    const first = (await client.patch(`${base(study.id)}/points`, { version: 0, points }).expect(200)).body;
    expect(first.fitWeighting).toBe('unweighted');
    expect(first.latestFit.weighting).toBe('unweighted');
    expect(first.latestFit.kSv).toBeCloseTo(unweighted, 9);

    const fit = await client.post(`${base(study.id)}/fits`, { model: 'linear-free', weighting: 'weighted' });
    expect(fit.status, JSON.stringify(fit.body)).toBe(201);
    expect(fit.body.weighting).toBe('weighted');
    expect(fit.body.kSv).toBeCloseTo(weighted, 9);
    expect(fit.body.result.weighting).toEqual({
      chosen: 'weighted',
      applied: 'point-uncertainties',
      pointsWeighted: 6,
      reason: null,
    });
    const detail = (await client.get(base(study.id)).expect(200)).body;
    expect(detail.fitWeighting).toBe('weighted');
    expect(detail.latestFit.kSv).toBeCloseTo(weighted, 9);

    // the next automatic fit (points saved again) keeps the weighting
    const again = (await client.patch(`${base(study.id)}/points`, { version: detail.version, points }).expect(200))
      .body;
    expect(again.latestFit.weighting).toBe('weighted');
    expect(again.latestFit.kSv).toBeCloseTo(weighted, 9);

    const csv = (await client.get(`${base(study.id)}/export.csv?part=fit`).expect(200)).text;
    expect(csv).toMatch(
      /^weighting,point-uncertainties,.*w = 1\/σ² from the readings’ own uncertainties \(6 points\)/m,
    );
  });

  it('when the weighting is not one of the two, then 400 names the field', async () => {
    const study = await newStudy();
    const response = await client.post(`${base(study.id)}/fits`, { model: 'linear-free', weighting: 'heavy' });
    expect(response.status).toBe(400);
    expect(JSON.stringify(response.body)).toMatch(/weighting/);
  });
});
