import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { startServerProcess } from '../support/server-process';
import { createStudy } from '../support/studies';
import { createTestApp } from '../support/test-app';

// Two instances of Halflight on one database: this process's test app and a second process.
const sessionSecret = crypto.randomBytes(32).toString('hex');
const testApp = await createTestApp({ sessionSecret });
let second: Awaited<ReturnType<typeof startServerProcess>>;

beforeAll(async () => {
  // The compiled server (npm test builds it first), as `npm start` runs it.
  second = await startServerProcess({
    DATABASE_URL: inject('databaseUrl'),
    SESSION_SECRET: sessionSecret,
    HALFLIGHT_JOB_WORKER: 'false',
    HALFLIGHT_DEMO_DATA: 'false',
    LOG_LEVEL: 'warn',
  });
  await second.waitForHealthy();
}, 120_000);
afterAll(async () => {
  second?.kill('SIGTERM');
  await second?.waitForExit();
  await testApp.close();
}, 120_000);

const fixture = (name: string) => fs.readFileSync(path.join(import.meta.dirname, '../fixtures/uploads', name));

describe('uploads across two instances', () => {
  it('when a file is received by one instance, then the other previews it again and applies it (no state kept per process)', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const first = await apiClient(testApp.app);
    const signedIn = await first.signIn(users.researcher);
    const csrf = signedIn.body.csrfToken as string;
    const cookie = signedIn.headers['set-cookie'] as unknown as string[];
    const study = await createStudy(first, lab.id, crypto.randomBytes(3).toString('hex'));
    const base = `/api/labs/${lab.id}/studies/${study.id}`;
    const received = await first.agent
      .post(`${base}/uploads`)
      .set('x-csrf-token', csrf)
      .attach('file', fixture('spectrum-matrix.csv'), 'spectrum-matrix.csv');
    expect(received.status, JSON.stringify(received.body)).toBe(201);

    // The same session, sent to the other process.
    const other = (method: 'post' | 'get', url: string) =>
      request(second.baseUrl)[method](url).set('Cookie', cookie).set('x-csrf-token', csrf);
    const reading = { ...received.body.mapping, reduction: { kind: 'wavelength', at: 505 } };
    const previewed = await other('post', `${base}/uploads/${received.body.upload.id}/preview`).send({
      mapping: reading,
    });
    expect(previewed.status, JSON.stringify(previewed.body)).toBe(200);
    // tests/fixtures/uploads/README.md: the blank's spectrum is (lambda - 400), so 105 at 505 nm
    expect(previewed.body.points[0].intensity).toBeCloseTo(105, 9);
    const applied = await other('post', `${base}/uploads/${received.body.upload.id}/apply`).send({
      version: study.version,
      mapping: received.body.mapping,
    });
    expect(applied.status, JSON.stringify(applied.body)).toBe(200);
    expect(applied.body.latestFit.kSv).toBeCloseTo(500, 1); // the fixture's spectra are built on K_SV = 500 M^-1

    const seenHere = (await first.get(base)).body;
    expect(seenHere.version).toBe(study.version + 1);
    expect(seenHere.uploads).toEqual([expect.objectContaining({ parseStatus: 'applied' })]);
  });
});
