import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { DecayFile, DecaySet, MechanismFile, StudyUpload } from '../../server/models';
import { demoDecayFile } from '../../server/seed/demo-decays';
import { moveFilesToS3 } from '../../server/services/studies/files/move-files-to-s3';
import { createRawFileStore } from '../../server/services/studies/files/raw-file-store';
import { createS3Objects } from '../../server/services/studies/files/s3-objects';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { startFakeS3 } from '../support/fake-s3';
import { freePort } from '../support/free-port';
import { createStudy } from '../support/studies';
import { createTestApp } from '../support/test-app';

// Raw files in S3-compatible object storage, against s3rver on loopback (tests/support/fake-s3.ts).
const fakeS3 = await startFakeS3();
const s3 = createS3Objects(fakeS3.settings);
// Writes to the database, and reads from the bucket what was moved there.
const inDatabase = await createTestApp({ files: createRawFileStore({ writeTo: 'database', s3 }) });
const inS3 = await createTestApp({
  sequelize: inDatabase.sequelize,
  files: createRawFileStore({ writeTo: 's3', s3 }),
});
// An object store nobody listens on: every request is refused.
const downS3 = createS3Objects({ ...fakeS3.settings, endpoint: `http://127.0.0.1:${await freePort()}` });
const storeDown = await createTestApp({
  sequelize: inDatabase.sequelize,
  files: createRawFileStore({ writeTo: 's3', s3: downS3 }),
});
afterAll(async () => {
  for (const app of [storeDown, inS3, inDatabase]) await app.close();
  s3.close();
  downS3.close();
  await fakeS3.stop();
});

const fixture = (name: string) => fs.readFileSync(path.join(import.meta.dirname, '../fixtures/uploads', name));
const sha256 = (bytes: Buffer) => crypto.createHash('sha256').update(bytes).digest('hex');
let labId = '';
let researcher: { email: string; password: string };
beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(inDatabase.sequelize, { roles: ['researcher'] });
  labId = lab.id;
  researcher = users.researcher;
});

/** A signed-in client of one app with its CSRF token, and a new study. */
async function signedIn(app: Awaited<ReturnType<typeof createTestApp>>) {
  const client = await apiClient(app.app);
  const csrf = (await client.signIn(researcher)).body.csrfToken as string;
  const study = await createStudy(client, labId, crypto.randomBytes(3).toString('hex'));
  const base = `/api/labs/${labId}/studies/${study.id}`;
  const send = (name: string, bytes: Buffer) =>
    client.agent.post(`${base}/uploads`).set('x-csrf-token', csrf).attach('file', bytes, name);
  const download = (uploadId: string) =>
    client.agent
      .get(`${base}/uploads/${uploadId}/file`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
  return { client, csrf, study, base, send, download };
}

describe('POST /api/labs/:labId/studies/:studyId/uploads with object storage', () => {
  it('when a file is uploaded, then its bytes live in the bucket (not the row), download byte for byte, and it can be applied', async () => {
    const { client, study, base, send, download } = await signedIn(inS3);
    const bytes = fixture('spectrum-matrix.csv');
    const received = await send('spectrum-matrix.csv', bytes);
    expect(received.status, JSON.stringify(received.body)).toBe(201);
    expect(received.body.upload.sha256).toBe(sha256(bytes));
    const row = await StudyUpload.findByPk(received.body.upload.id);
    expect(row).toMatchObject({ storage: 's3', storageKey: `labs/${labId}/uploads/${row!.id}`, content: null });
    expect(Buffer.compare(await s3.get(row!.storageKey!), bytes)).toBe(0);
    const downloaded = await download(row!.id);
    expect(downloaded.status).toBe(200);
    expect(Buffer.compare(downloaded.body as Buffer, bytes)).toBe(0);
    const applied = await client.post(`${base}/uploads/${row!.id}/apply`, {
      version: study.version,
      mapping: received.body.mapping,
    });
    expect(applied.status, JSON.stringify(applied.body)).toBe(200);
    expect(applied.body.latestFit.kSv).toBeCloseTo(500, 1); // tests/fixtures/uploads/README.md: built on K_SV = 500 M^-1
  });

  it('when the same bytes are sent again, then 409 names the earlier file and nothing more is kept', async () => {
    const { send, study } = await signedIn(inS3);
    const bytes = fixture('series-comma-mM.csv');
    const first = await send('series-comma-mM.csv', bytes);
    expect(first.status).toBe(201);
    const again = await send('copy.csv', bytes);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toContain('"series-comma-mM.csv"');
    expect(await StudyUpload.count({ where: { sha256: sha256(bytes), studyId: study.id } })).toBe(1);
  });

  it('when the object store does not answer, then 503 with Retry-After, no upload row is kept, and a later send is accepted', async () => {
    const down = await signedIn(storeDown);
    const bytes = Buffer.from(`[Q] (mM),intensity\n0,1000\n1,${crypto.randomInt(500, 900)}\n2,600\n`);
    const refused = await down.send('series.csv', bytes);
    expect(refused.status, JSON.stringify(refused.body)).toBe(503);
    // Like a database outage: the one error shape, and when to try again.
    expect(refused.body).toEqual({ error: { code: 'file_store_unavailable', message: expect.any(String) } });
    expect(refused.headers['retry-after']).toMatch(/^[1-9]\d*$/);
    expect(await StudyUpload.count({ where: { sha256: sha256(bytes) } })).toBe(0);
    expect((await down.client.get(down.base)).body.uploads).toEqual([]);
    // The same user sends the same bytes once the store is back (here: the app with a working bucket).
    const inBucket = await signedIn(inS3);
    const retry = await inBucket.send('series.csv', bytes);
    expect(retry.status, JSON.stringify(retry.body)).toBe(201);
    // Reading a kept file while the store is down: the same 503.
    const unread = await down.client.agent.get(`${inBucket.base}/uploads/${retry.body.upload.id}/file`);
    expect(unread.status).toBe(503);
    expect(unread.body.error.code).toBe('file_store_unavailable');
    expect(unread.headers['retry-after']).toMatch(/^[1-9]\d*$/);
  });
});

describe('POST /api/labs/:labId/studies/:studyId/decay-sets with object storage', () => {
  it('when reading the kept set back fails after its rows committed, then its files stay in the bucket', async () => {
    const { client, csrf, base } = await signedIn(inS3);
    const bytes = demoDecayFile();
    // The one DecaySet.findOne of the request is the read after the commit.
    const readBack = vi.spyOn(DecaySet, 'findOne').mockRejectedValueOnce(new Error('read after commit failed'));
    try {
      const kept = await client.agent
        .post(`${base}/decay-sets`)
        .set('x-csrf-token', csrf)
        .attach('file', bytes, 'after-commit.csv');
      expect(kept.status).toBe(500);
    } finally {
      readBack.mockRestore();
    }
    const row = await DecayFile.findOne({ where: { labId, fileName: 'after-commit.csv' } });
    expect(row).toMatchObject({ storage: 's3', content: null });
    // common practice: bytes a committed row points to are never removed by the request that wrote it
    expect(sha256(await s3.get(row!.storageKey!))).toBe(sha256(bytes));
  });
});

describe('npm run files:move-to-s3 (moveFilesToS3)', () => {
  it('when files kept in the database are moved, then each lives in the bucket with the same SHA-256 and downloads unchanged', async () => {
    const { send, download } = await signedIn(inDatabase);
    const bytes = fixture('series-tab-ratio.tsv');
    const received = await send('series-tab-ratio.tsv', bytes);
    expect(received.status).toBe(201);
    const lines: string[] = [];
    const result = await moveFilesToS3(s3, (line) => lines.push(line), { labId });
    expect(result.refused).toBe(0);
    expect(result.moved).toBeGreaterThanOrEqual(1);
    expect(await StudyUpload.count({ where: { storage: 'database', labId } })).toBe(0);
    const row = await StudyUpload.findByPk(received.body.upload.id);
    expect(row).toMatchObject({ storage: 's3', content: null });
    expect(sha256(await s3.get(row!.storageKey!))).toBe(row!.sha256);
    expect(lines.some((line) => line.includes(row!.id) && line.includes('SHA-256 checked'))).toBe(true);
    // The app that writes to the database still reads the moved file from the bucket.
    const again = await download(row!.id);
    expect(Buffer.compare(again.body as Buffer, bytes)).toBe(0);
  });

  it('when decay files kept in the database are moved, then each lives in the bucket with the same SHA-256 and the set is drawn from there', async () => {
    const { client, csrf, base } = await signedIn(inDatabase);
    // The demo's invented titration (a response column and six decays) as a kept decay set.
    const bytes = demoDecayFile();
    const kept = await client.agent
      .post(`${base}/decay-sets`)
      .set('x-csrf-token', csrf)
      .attach('file', bytes, 'titration.csv');
    expect(kept.status, JSON.stringify(kept.body)).toBe(201);
    expect(await DecayFile.findByPk(kept.body.file.id)).toMatchObject({ storage: 'database' });
    const lines: string[] = [];
    const result = await moveFilesToS3(s3, (line) => lines.push(line), { labId });
    expect(result.refused).toBe(0);
    expect(await DecayFile.count({ where: { storage: 'database', labId } })).toBe(0);
    const row = await DecayFile.findByPk(kept.body.file.id);
    expect(row).toMatchObject({ storage: 's3', content: null });
    expect(sha256(await s3.get(row!.storageKey!))).toBe(row!.sha256);
    expect(lines.some((line) => line.includes(`decay file ${row!.id}`) && line.includes('SHA-256 checked'))).toBe(true);
    // The app that writes to the database draws the set's curves from the bucket.
    const curves = await client.get(`/api/labs/${labId}/decay-sets/${kept.body.id}/decays/0/curves`);
    expect(curves.status, JSON.stringify(curves.body)).toBe(200);
    expect(curves.body.counts).toHaveLength(1024);
  });

  it('when spectrum-matrix files kept in the database are moved, then each lives in the bucket with the same SHA-256', async () => {
    const { client, csrf, base } = await signedIn(inDatabase);
    const kept = await client.agent
      .post(`${base}/spectrum-matrices`)
      .set('x-csrf-token', csrf)
      .attach('file', fixture('spectrum-matrix.csv'), 'spectra.csv');
    expect(kept.status, JSON.stringify(kept.body).slice(0, 300)).toBe(201);
    expect(await MechanismFile.findByPk(kept.body.file.id)).toMatchObject({ storage: 'database' });
    const lines: string[] = [];
    expect((await moveFilesToS3(s3, (line) => lines.push(line), { labId })).refused).toBe(0);
    const row = await MechanismFile.findByPk(kept.body.file.id);
    expect(row).toMatchObject({ storage: 's3', content: null });
    expect(sha256(await s3.get(row!.storageKey!))).toBe(sha256(fixture('spectrum-matrix.csv')));
    expect(lines.some((line) => line.includes(`mechanism file ${row!.id}`))).toBe(true);
  });
});
