import { afterAll, describe, expect, it, vi } from 'vitest';
import { defineRoute } from '../../server/http/define-route';
import { apiRoutes } from '../../server/routes';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { keptLogLines, linesWhen } from '../support/log-lines';
import { createTestApp } from '../support/test-app';

// Every line the app writes at info level, parsed.
type Line = {
  level: number;
  msg: string;
  req?: {
    id: number;
    method: string;
    url: string;
    query: Record<string, unknown>;
    params: Record<string, unknown>;
    headers: Record<string, unknown>;
    remoteAddress: string;
    remotePort: number;
  };
  res?: { statusCode: number; headers: Record<string, unknown> };
  err?: { message: string };
  responseTime?: number;
};
const { lines, logger } = keptLogLines<Line>('info');
const failing = defineRoute({
  method: 'get',
  path: '/api/log-test/failure',
  summary: 'Fails on purpose (request log test)',
  tags: ['system'],
  access: 'public',
  responses: { 500: { description: 'always' } },
  handler: () => {
    throw new Error('failed on purpose');
  },
});
const testApp = await createTestApp({ logger, routes: [...apiRoutes, failing] });
afterAll(testApp.close);

/**
 * Request lines only, without the client's set-up read: that line, and the app's own start-up lines
 * (the job queue's, for one), can arrive after `lines` was emptied.
 */
const notTheClientsSetUp = (line: Line) => line.req !== undefined && line.req.url !== '/api/csrf-token';

describe('the request log at info level', () => {
  it('when a signed-in person reads, then each request has one line with the request, the answer and the time, secrets replaced', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    lines.length = 0;
    await client.signIn(users.researcher);
    const url = `/api/labs/${lab.id}/studies?page=1&token=a-link-token-to-hide`;
    expect((await client.get(url)).status).toBe(200);
    expect((await client.get('/api/health')).status).toBe(200);
    expect((await client.get('/api/session')).status).toBe(200);

    // Each line is written when its connection closes, so they can come in another order than the requests.
    const kept = await linesWhen(lines, notTheClientsSetUp, 3);
    const lineOf = (method: string, url: RegExp) =>
      kept.find((line) => line.req?.method === method && url.test(line.req.url));
    const signIn = lineOf('POST', /^\/api\/session$/);
    const read = lineOf('GET', /^\/api\/labs\//);
    const session = lineOf('GET', /^\/api\/session$/);
    const rest = kept.filter((line) => line !== signIn && line !== read && line !== session);
    // The health check, asked every few seconds by monitors, is left out (as pino-http's ignore did).
    expect(rest).toEqual([]);
    expect(read).toMatchObject({
      level: 30,
      msg: 'request completed',
      req: {
        method: 'GET',
        url: `/api/labs/${lab.id}/studies?page=1&token=[Redacted]`,
        query: { page: '1', token: '[Redacted]' },
        params: {},
        headers: { cookie: '[Redacted]' },
        remoteAddress: '127.0.0.1',
      },
      res: { statusCode: 200, headers: { 'cache-control': 'private, no-cache', 'x-content-type-options': 'nosniff' } },
    });
    expect(read!.req!.remotePort).toBeGreaterThan(0);
    expect(read!.responseTime).toBeGreaterThanOrEqual(0);
    // Numbered in arrival order per process; the health check took the number between them.
    expect(session!.req!.id).toBe(read!.req!.id + 2);
    expect(signIn).toMatchObject({
      req: { method: 'POST', url: '/api/session', headers: { 'x-csrf-token': '[Redacted]' } },
      res: { statusCode: 200, headers: { 'set-cookie': '[Redacted]' } },
    });
    expect(JSON.stringify(signIn)).not.toContain(users.researcher.password);
    expect(JSON.stringify(lines)).not.toContain('a-link-token-to-hide');
  });

  it('when reads are answered, then no child logger is made for them (only a request that logs something gets one)', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.researcher);
    // Every pino logger (children too) inherits child() from the same prototype.
    const child = vi.spyOn(Object.getPrototypeOf(logger) as { child: typeof logger.child }, 'child');
    try {
      for (let i = 0; i < 5; i++) {
        expect((await client.get(`/api/labs/${lab.id}/studies`)).status).toBe(200);
        expect((await client.get('/api/health')).status).toBe(200);
      }
      expect(child).not.toHaveBeenCalled();
    } finally {
      child.mockRestore();
    }
  });

  it('when a request fails, then its error names the request and its line says it errored', async () => {
    const client = await apiClient(testApp.app);
    lines.length = 0;
    expect((await client.get('/api/log-test/failure?code=123456')).status).toBe(500);
    const [error, line] = await linesWhen(lines, (line) => line.req?.url.startsWith('/api/log-test/') === true, 2);
    expect(error).toMatchObject({
      level: 50,
      msg: 'unhandled error',
      err: { message: 'failed on purpose' },
      req: { method: 'GET', url: '/api/log-test/failure?code=[Redacted]' },
    });
    expect(line).toMatchObject({
      level: 30,
      msg: 'request errored',
      err: { message: 'failed with status code 500' },
      req: { method: 'GET', query: { code: '[Redacted]' } },
      res: { statusCode: 500 },
    });
    expect(error!.req!.id).toBe(line!.req!.id);
    expect(JSON.stringify(lines)).not.toContain('123456');
  });
});
