import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInResearcher, type ApiClient } from '../support/accounts';
import { createStudy } from '../support/studies';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
let client: ApiClient, csrf: string, labId: string;
beforeAll(async () => {
  ({ client, csrf, labId } = await signedInResearcher(testApp));
});
afterAll(testApp.close);

describe('GET /api/labs/:labId/studies/:studyId/uploads/:uploadId/file', () => {
  it('when a file named "données μM.csv" is uploaded, then its name is kept and the download is named the same (RFC 5987)', async () => {
    const name = 'données μM.csv';
    const study = await createStudy(client, labId, crypto.randomBytes(3).toString('hex'));
    const base = `/api/labs/${labId}/studies/${study.id}`;
    const bytes = Buffer.from('[Q] (mM),intensity\n0,1000\n1,800\n2,600\n');
    const received = await client.agent.post(`${base}/uploads`).set('x-csrf-token', csrf).attach('file', bytes, name);
    expect(received.status, JSON.stringify(received.body)).toBe(201);
    expect(received.body.upload.fileName).toBe(name);
    expect((await client.get(base)).body.uploads[0].fileName).toBe(name);
    const download = await client.get(`${base}/uploads/${received.body.upload.id}/file`);
    expect(download.status).toBe(200);
    const disposition = download.headers['content-disposition'] as string;
    // RFC 5987 / RFC 6266: the UTF-8 name percent-encoded in filename*, a plain fallback in filename
    expect(disposition).toContain(`filename*=UTF-8''${encodeURIComponent(name)}`);
    expect(disposition).toMatch(/^attachment; filename="[\x20-\x7e]+"; filename\*=/);
  });
});

describe('CSV downloads are named through the same helper', () => {
  it('when the points and the library are exported, then each answer is an attachment with its name', async () => {
    const study = await createStudy(client, labId, crypto.randomBytes(3).toString('hex'));
    const points = await client.get(`/api/labs/${labId}/studies/${study.id}/export.csv?part=points`);
    expect(points.status).toBe(200);
    expect(points.headers['content-disposition']).toMatch(/^attachment; filename="?[^";]+\.csv"?$/);
    const library = await client.get(`/api/labs/${labId}/compounds/export.csv`);
    expect(library.headers['content-disposition']).toMatch(/^attachment; filename="?halflight-library\.csv"?$/);
  });
});
