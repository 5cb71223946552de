import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

type Who = 'anonymous' | 'viewer' | 'researcher' | 'reviewer' | 'admin' | 'outsider';
const everyone: Who[] = ['anonymous', 'viewer', 'researcher', 'reviewer', 'admin', 'outsider'];

interface Row {
  path: (ids: { labId: string }) => string;
  body?: object;
  expected: Record<Who, number>;
}

const same = (status: number): Record<Who, number> =>
  Object.fromEntries(everyone.map((who) => [who, status])) as Record<Who, number>;
const signedIn = (status: number) => ({ ...same(status), anonymous: 401 });
/** Lab routes: 401 signed out, 404 for a lab the person is not in, 403 below the needed role. */
function labRoute(needed: 'viewer' | 'researcher' | 'reviewer' | 'admin', allowed: number) {
  const rank = { viewer: 0, researcher: 1, reviewer: 2, admin: 3 };
  const row = { anonymous: 401, outsider: 404 } as Record<Who, number>;
  for (const role of ['viewer', 'researcher', 'reviewer', 'admin'] as const) {
    row[role] = rank[role] >= rank[needed] ? allowed : 403;
  }
  return row;
}

const unknownId = crypto.randomUUID();
const unknownToken = 'x'.repeat(43);

// One row per route the server registers. Bodies are deliberately incomplete and ids unknown,
// so a permitted request ends in 400/404 without changing anything, while a refused one
// shows which check stopped it.
const matrix: Record<string, Row> = {
  'GET /api/health': { path: () => '/api/health', expected: same(200) },
  'GET /api/openapi.json': { path: () => '/api/openapi.json', expected: same(200) },
  'GET /api/csrf-token': { path: () => '/api/csrf-token', expected: same(200) },
  'POST /api/session': { path: () => '/api/session', body: {}, expected: same(400) },
  'GET /api/session': { path: () => '/api/session', expected: signedIn(200) },
  'PATCH /api/account': { path: () => '/api/account', body: {}, expected: signedIn(400) },
  'POST /api/account/password': { path: () => '/api/account/password', body: {}, expected: signedIn(400) },
  'POST /api/password-resets': { path: () => '/api/password-resets', body: {}, expected: same(400) },
  'POST /api/password-resets/complete': { path: () => '/api/password-resets/complete', body: {}, expected: same(400) },
  'GET /api/invitations/:token': { path: () => `/api/invitations/${unknownToken}`, expected: same(404) },
  'POST /api/invitations/:token/accept': {
    path: () => `/api/invitations/${unknownToken}/accept`,
    body: { password: 'whatever-password' },
    expected: same(404),
  },
  'GET /api/labs/:labId/members': { path: ({ labId }) => `/api/labs/${labId}/members`, expected: labRoute('viewer', 200) },
  'POST /api/labs/:labId/invitations': {
    path: ({ labId }) => `/api/labs/${labId}/invitations`,
    body: { email: 'not-an-address', role: 'viewer' },
    expected: labRoute('admin', 400),
  },
  'DELETE /api/labs/:labId/invitations/:invitationId': {
    path: ({ labId }) => `/api/labs/${labId}/invitations/${unknownId}`,
    expected: labRoute('admin', 404),
  },
  'PATCH /api/labs/:labId/members/:memberId': {
    path: ({ labId }) => `/api/labs/${labId}/members/${unknownId}`,
    body: { role: 'viewer' },
    expected: labRoute('admin', 404),
  },
  'DELETE /api/labs/:labId/members/:memberId': {
    path: ({ labId }) => `/api/labs/${labId}/members/${unknownId}`,
    expected: labRoute('admin', 404),
  },
  'GET /api/labs/:labId/caught-mail': {
    path: ({ labId }) => `/api/labs/${labId}/caught-mail`,
    expected: labRoute('admin', 200),
  },
  // Last, because it signs each person out.
  'DELETE /api/session': { path: () => '/api/session', expected: signedIn(204) },
};

const testApp = await createTestApp();
type Client = Awaited<ReturnType<typeof apiClient>>;
const clients = {} as Record<Who, Client>;
let labId = '';

beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, {
    roles: ['viewer', 'researcher', 'reviewer', 'admin'],
  });
  const other = await createLabWithMembers(testApp.sequelize, { roles: ['admin'] });
  labId = lab.id;
  clients.anonymous = await apiClient(testApp.app);
  for (const role of ['viewer', 'researcher', 'reviewer', 'admin'] as const) {
    clients[role] = await apiClient(testApp.app);
    await clients[role].signIn(users[role]);
  }
  clients.outsider = await apiClient(testApp.app);
  await clients.outsider.signIn(other.users.admin);
});
afterAll(testApp.close);

/** Routes as Express registered them, read from the router itself. */
function registeredRoutes(): string[] {
  const stack = (testApp.app as unknown as { router: { stack: Array<{ route?: { path: string; methods: Record<string, boolean> } }> } })
    .router.stack;
  return stack
    .filter((layer) => typeof layer.route?.path === 'string' && layer.route.path.startsWith('/api'))
    .flatMap((layer) =>
      Object.keys(layer.route!.methods)
        .filter((method) => method !== '_all')
        .map((method) => `${method.toUpperCase()} ${layer.route!.path}`),
    );
}

describe('the permission matrix', () => {
  it('when the server registers a route, then the matrix has a row for it (and no stale rows)', () => {
    expect(new Set(registeredRoutes())).toEqual(new Set(Object.keys(matrix)));
  });

  for (const [key, row] of Object.entries(matrix)) {
    it(`${key}: ${everyone.map((who) => `${who} ${row.expected[who]}`).join(', ')}`, async () => {
      const method = key.split(' ')[0]!.toLowerCase() as 'get' | 'post' | 'patch' | 'delete';
      for (const who of everyone) {
        const client = clients[who];
        const url = row.path({ labId });
        const response =
          method === 'get' ? await client.get(url) : method === 'delete' ? await client.delete(url) : await client[method](url, row.body);
        expect(response.status, `${who} → ${key}: ${JSON.stringify(response.body)}`).toBe(row.expected[who]);
      }
    });
  }
});
