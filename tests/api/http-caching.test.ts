import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { projectRoot } from '../../server/config/env';
import { defineRoute } from '../../server/http/define-route';
import { apiRoutes } from '../../server/routes';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createStudy } from '../support/studies';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

// A route that says whether the compression middleware took its answer over (it adds res.flush).
const compressionProbe = defineRoute({
  method: 'get',
  path: '/api/compression-test/probe',
  summary: 'Says whether the compression middleware wraps this answer (compression test)',
  tags: ['system'],
  access: 'public',
  responses: { 200: { description: 'always' } },
  handler: ({ res }) => {
    res.json({ wrapped: typeof (res as { flush?: unknown }).flush === 'function', padding: 'x'.repeat(2000) });
  },
});
const probeApp = await createTestApp({ sequelize: testApp.sequelize, routes: [...apiRoutes, compressionProbe] });
afterAll(probeApp.close);

/** The hashed script the built index.html loads (npm test builds the client before the tests). */
function builtScript(): string {
  const html = fs.readFileSync(path.join(projectRoot, 'dist', 'client', 'index.html'), 'utf8');
  const match = /src="(\/assets\/[^"]+\.js)"/.exec(html);
  if (!match) throw new Error('dist/client/index.html loads no /assets/*.js: run "npm run build".');
  return match[1]!;
}

describe('GET /assets/*', () => {
  it('when the browser accepts brotli or gzip, then the hashed script comes precompressed and cached for a year', async () => {
    const script = builtScript();
    const plain = fs.readFileSync(path.join(projectRoot, 'dist', 'client', script));
    const brotli = await request(testApp.app)
      .get(script)
      .set('Accept-Encoding', 'gzip, deflate, br')
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(brotli.status).toBe(200);
    expect(brotli.headers['content-encoding']).toBe('br');
    expect(brotli.headers['content-type']).toMatch(/javascript/);
    expect(brotli.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(brotli.headers.vary).toMatch(/Accept-Encoding/i);
    // supertest decodes the body as a browser would: it must be the built file byte for byte.
    expect((brotli.body as Buffer).equals(plain)).toBe(true);

    const gzip = await request(testApp.app).get(script).set('Accept-Encoding', 'gzip');
    expect(gzip.headers['content-encoding']).toBe('gzip');
    expect(gzip.headers['cache-control']).toBe('public, max-age=31536000, immutable');

    const identity = await request(testApp.app).get(script).set('Accept-Encoding', 'identity');
    expect(identity.headers['content-encoding']).toBeUndefined();
    expect(Number(identity.headers['content-length'])).toBe(plain.length);
  });

  it('when the app shell is asked for, then index.html is revalidated every time', async () => {
    const shell = await request(testApp.app).get('/labs/anything');
    expect(shell.status).toBe(200);
    expect(shell.headers['cache-control']).toBe('no-cache');
    expect(shell.text).toContain(builtScript());
  });
});

describe('GET /api/...', () => {
  it('when a list is asked for with gzip, then it comes compressed, private, and 304 when unchanged', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.researcher);
    for (const tag of ['c1', 'c2', 'c3', 'c4', 'c5', 'c6']) await createStudy(client, lab.id, `cache-${tag}`);
    const url = `/api/labs/${lab.id}/studies`;
    const first = await client.get(url).set('Accept-Encoding', 'gzip');
    expect(first.status).toBe(200);
    expect(first.headers['content-encoding']).toBe('gzip');
    expect(first.headers['cache-control']).toBe('private, no-cache');
    expect(first.body.total).toBe(6);
    const etag = first.headers.etag as string;
    expect(etag).toBeTruthy();

    const again = await client.get(url).set('If-None-Match', etag);
    expect(again.status).toBe(304);
    await createStudy(client, lab.id, 'cache-c7');
    const changed = await client.get(url).set('If-None-Match', etag);
    expect(changed.status).toBe(200);
    expect(changed.body.total).toBe(7);
  });

  it('when one study and the dashboard are asked for again unchanged, then 304; after a change, the new answer', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.researcher);
    const study = await createStudy(client, lab.id, 'cache-detail');
    const studyUrl = `/api/labs/${lab.id}/studies/${study.id}`;
    const dashboardUrl = `/api/labs/${lab.id}/dashboard`;
    const tags: Record<string, string> = {};
    for (const url of [studyUrl, dashboardUrl]) {
      const first = await client.get(url);
      expect(first.status).toBe(200);
      tags[url] = first.headers.etag as string;
      expect(tags[url], url).toBeTruthy();
      expect((await client.get(url).set('If-None-Match', tags[url])).status, url).toBe(304);
    }
    const renamed = await client.patch(studyUrl, { version: study.version, title: 'cache-detail renamed' });
    expect(renamed.status).toBe(200);
    const changed = await client.get(studyUrl).set('If-None-Match', tags[studyUrl]!);
    expect(changed.status).toBe(200);
    expect(changed.body.title).toBe('cache-detail renamed');
    const dashboard = await client.get(dashboardUrl).set('If-None-Match', tags[dashboardUrl]!);
    expect(dashboard.status).toBe(200);
    expect(dashboard.body.myDrafts[0].title).toBe('cache-detail renamed');
  });
});

describe('compression of API answers', () => {
  it('when the client names no Accept-Encoding, then the answer is plain, says it varies by encoding, and no compressor wraps it', async () => {
    const plain = await request(probeApp.app).get('/api/compression-test/probe').unset('Accept-Encoding');
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.headers.vary).toMatch(/Accept-Encoding/i);
    expect(plain.body.wrapped).toBe(false);

    const openApi = await request(testApp.app).get('/api/openapi.json').unset('Accept-Encoding');
    expect(openApi.headers['content-encoding']).toBeUndefined();
    expect(openApi.headers.vary).toMatch(/Accept-Encoding/i);
    expect(openApi.body.openapi).toMatch(/^3\./);
  });

  it('when the client accepts gzip or brotli, then an answer above 1 KB comes encoded', async () => {
    const gzip = await request(probeApp.app).get('/api/compression-test/probe').set('Accept-Encoding', 'gzip');
    expect(gzip.headers['content-encoding']).toBe('gzip');
    expect(gzip.headers.vary).toMatch(/Accept-Encoding/i);
    expect(gzip.body.wrapped).toBe(true);
    const brotli = await request(testApp.app).get('/api/openapi.json').set('Accept-Encoding', 'br');
    expect(brotli.headers['content-encoding']).toBe('br');
  });
});
