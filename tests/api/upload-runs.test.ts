import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createStudy } from '../support/studies';
import { createTestApp } from '../support/test-app';

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
const send = (studyId: string, name: string, text: string) =>
  client.agent
    .post(`${base(studyId)}/uploads`)
    .set('x-csrf-token', csrf)
    .attach('file', Buffer.from(text), name);

// Invented titration on the exact line I0/I = 1 + 500 [Q] (K_SV = 500 M⁻¹ by construction); the
// second run read with the lamp at 80 %, so pooling with one I0 would bend the line.
const qs = [0, 1, 2, 3, 4, 5]; // mM
const run1 = qs.map((q) => 1000 / (1 + 0.5 * q));
const run2 = run1.map((value) => 0.8 * value);

describe('uploads with several runs (issue 13, item 1)', () => {
  it('when the table has a run column, then the preview and the apply give each row its run, and the fit pools the runs', async () => {
    const study = await createStudy(client, labId, crypto.randomBytes(3).toString('hex'));
    const rows = [
      ...qs.map((q, i) => `${q},${run1[i]},A`),
      ...qs.map((q, i) => `${q},${run2[i]},B`), // labels, numbered in the order they first appear
    ];
    const preview = await send(study.id, 'runs.csv', ['[Q] (mM),intensity,run', ...rows].join('\n'));
    expect(preview.status, JSON.stringify(preview.body)).toBe(201);
    expect(preview.body.mapping).toMatchObject({ layout: 'series', run: 2, moreIntensities: [] });
    expect(preview.body.points.map((p: { series: number }) => p.series)).toEqual([1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2]);
    const applied = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/apply`, {
      version: study.version,
      mapping: preview.body.mapping,
    });
    expect(applied.status, JSON.stringify(applied.body)).toBe(200);
    expect(applied.body.points.map((p: { series: number }) => p.series)).toEqual([1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2]);
    expect(applied.body.latestFit.kSv).toBeCloseTo(500, 6);
    expect(applied.body.latestFit.result.replicates.runs.map((run: { value: number }) => run.value)).toEqual([
      1000, 800,
    ]);
  });

  it('when the table has one intensity column per run, then the chemist names them and each becomes a run', async () => {
    const study = await createStudy(client, labId, crypto.randomBytes(3).toString('hex'));
    const text = ['[Q] (mM),first,second', ...qs.map((q, i) => `${q},${run1[i]},${run2[i]}`)].join('\n');
    const preview = await send(study.id, 'two-runs.csv', text);
    expect(preview.status, JSON.stringify(preview.body)).toBe(201);
    const mapping = { ...preview.body.mapping, intensity: 1, moreIntensities: [2] };
    const again = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/preview`, { mapping });
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect(again.body.points).toHaveLength(12);
    expect(
      again.body.points
        .filter((p: { series: number }) => p.series === 2)
        .map((p: { intensity: number }) => p.intensity),
    ).toEqual(run2.map((value) => expect.closeTo(value, 9)));
    const applied = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/apply`, {
      version: study.version,
      mapping,
    });
    expect(applied.status, JSON.stringify(applied.body)).toBe(200);
    expect(applied.body.latestFit.kSv).toBeCloseTo(500, 6);
    expect(new Set(applied.body.points.map((p: { series: number }) => p.series))).toEqual(new Set([1, 2]));
  });

  it('when both a run column and per-run columns are mapped, then 4xx names the conflict and nothing is saved', async () => {
    const study = await createStudy(client, labId, crypto.randomBytes(3).toString('hex'));
    const text = ['[Q] (mM),first,second,run', ...qs.map((q, i) => `${q},${run1[i]},${run2[i]},1`)].join('\n');
    const preview = await send(study.id, 'both.csv', text);
    const mapping = { ...preview.body.mapping, intensity: 1, moreIntensities: [2], run: 3 };
    const refused = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/apply`, {
      version: study.version,
      mapping,
    });
    expect(refused.status).toBeGreaterThanOrEqual(400);
    expect(refused.status).toBeLessThan(500);
    expect(JSON.stringify(refused.body)).toMatch(/run column or one intensity column per run/);
    expect((await client.get(base(study.id))).body.points).toHaveLength(0);
  });
});
