import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { apiRoutes } from '../../server/routes';
import { createTestApp } from '../support/test-app';

const { app, sequelize, close } = await createTestApp();
afterAll(close);

describe('GET /api/health', () => {
  it('when the database is up, then it reports a real round trip and the applied migrations', async () => {
    const response = await request(app).get('/api/health').expect(200);
    expect(response.body.status).toBe('ok');
    expect(response.body.database.status).toBe('up');
    expect(response.body.database.serverVersion).toMatch(/^\d+\.\d+/);
    expect(response.body.database.latencyMs).toBeGreaterThanOrEqual(0);
    const [rows] = await sequelize.query('SELECT count(*)::int AS n FROM schema_migrations');
    expect(response.body.database.migrationsApplied).toBe((rows as Array<{ n: number }>)[0]!.n);
    expect(response.body.database.migrationsApplied).toBeGreaterThan(0);
  });
});

describe('unknown API routes', () => {
  it('when a path under /api matches nothing, then it answers 404 in the one error shape', async () => {
    const response = await request(app).get('/api/no-such-thing').expect(404);
    expect(response.body).toEqual({
      error: { code: 'not_found', message: 'No API route matches GET /api/no-such-thing.' },
    });
  });

  it('when a change arrives without a CSRF token, then it is refused with 403 csrf_invalid', async () => {
    const response = await request(app).post('/api/no-such-thing').send({}).expect(403);
    expect(response.body.error.code).toBe('csrf_invalid');
  });

  it('when the JSON body is malformed, then it answers 400 invalid_json', async () => {
    const response = await request(app)
      .post('/api/no-such-thing')
      .set('content-type', 'application/json')
      .send('{"broken":');
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('invalid_json');
  });
});

describe('GET /api/openapi.json', () => {
  it('when asked, then it is an OpenAPI 3.1 document listing every registered route', async () => {
    const response = await request(app).get('/api/openapi.json').expect(200);
    expect(response.body.openapi).toBe('3.1.0');
    for (const route of apiRoutes) {
      const documented = response.body.paths[route.path.replace(/:(\w+)/g, '{$1}')];
      expect(documented?.[route.method], `${route.method.toUpperCase()} ${route.path}`).toBeDefined();
    }
    expect(response.body.components.schemas.Health).toBeDefined();
  });
});

describe('client routes', () => {
  it('when a client path is requested, then the built index.html is served, not JSON', async () => {
    const clientDir = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-client-'));
    fs.writeFileSync(path.join(clientDir, 'index.html'), '<!doctype html><div id="root"></div>');
    const withClient = await createTestApp({ clientDir, sequelize });
    const response = await request(withClient.app).get('/studies/some-screen').expect(200);
    await withClient.close();
    expect(response.headers['content-type']).toMatch(/text\/html/);
    expect(response.text).toContain('<div id="root">');
    fs.rmSync(clientDir, { recursive: true, force: true });
  });
});
