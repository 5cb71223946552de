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
  'GET /api/account/sessions': { path: () => '/api/account/sessions', expected: signedIn(200) },
  'DELETE /api/account/sessions/:sessionId': {
    path: () => `/api/account/sessions/${'0'.repeat(32)}`,
    expected: signedIn(404),
  },
  'POST /api/session/second-step': { path: () => '/api/session/second-step', body: {}, expected: same(400) },
  'POST /api/account/two-factor/setup': { path: () => '/api/account/two-factor/setup', expected: signedIn(200) },
  'POST /api/account/two-factor': { path: () => '/api/account/two-factor', body: {}, expected: signedIn(400) },
  'POST /api/account/two-factor/disable': {
    path: () => '/api/account/two-factor/disable',
    body: {},
    expected: signedIn(400),
  },
  'POST /api/account/two-factor/recovery-codes': {
    path: () => '/api/account/two-factor/recovery-codes',
    body: {},
    expected: signedIn(400),
  },
  'PUT /api/labs/:labId/sign-in-rules': {
    path: ({ labId }) => `/api/labs/${labId}/sign-in-rules`,
    body: {},
    expected: labRoute('admin', 400),
  },
  'GET /api/caught-mail': { path: () => '/api/caught-mail', expected: signedIn(200) },
  'POST /api/password-resets': { path: () => '/api/password-resets', body: {}, expected: same(400) },
  'POST /api/password-resets/complete': { path: () => '/api/password-resets/complete', body: {}, expected: same(400) },
  'GET /api/invitations/:token': { path: () => `/api/invitations/${unknownToken}`, expected: same(404) },
  'POST /api/invitations/:token/accept': {
    path: () => `/api/invitations/${unknownToken}/accept`,
    body: { password: 'whatever-password' },
    expected: same(404),
  },
  'GET /api/labs/:labId/members': {
    path: ({ labId }) => `/api/labs/${labId}/members`,
    expected: labRoute('viewer', 200),
  },
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
  'POST /api/labs/:labId/titration-plans': {
    path: ({ labId }) => `/api/labs/${labId}/titration-plans`,
    body: { initialVolume: 0.002 },
    expected: labRoute('viewer', 400),
  },
  'POST /api/labs/:labId/titration-plans/csv': {
    path: ({ labId }) => `/api/labs/${labId}/titration-plans/csv`,
    body: { initialVolume: 0.002 },
    expected: labRoute('viewer', 400),
  },
  // Compound library (issue 6). Unknown compound and record ids, incomplete bodies.
  'GET /api/labs/:labId/compounds': {
    path: ({ labId }) => `/api/labs/${labId}/compounds`,
    expected: labRoute('viewer', 200),
  },
  'POST /api/labs/:labId/compounds': {
    path: ({ labId }) => `/api/labs/${labId}/compounds`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'GET /api/labs/:labId/compounds/export.csv': {
    path: ({ labId }) => `/api/labs/${labId}/compounds/export.csv`,
    expected: labRoute('viewer', 200),
  },
  'POST /api/labs/:labId/compounds/import': {
    path: ({ labId }) => `/api/labs/${labId}/compounds/import`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'GET /api/labs/:labId/compounds/:compoundId': {
    path: ({ labId }) => `/api/labs/${labId}/compounds/${unknownId}`,
    expected: labRoute('viewer', 404),
  },
  'PATCH /api/labs/:labId/compounds/:compoundId': {
    path: ({ labId }) => `/api/labs/${labId}/compounds/${unknownId}`,
    body: { version: 0 },
    expected: labRoute('researcher', 404),
  },
  'DELETE /api/labs/:labId/compounds/:compoundId': {
    path: ({ labId }) => `/api/labs/${labId}/compounds/${unknownId}`,
    expected: labRoute('reviewer', 404),
  },
  ...Object.fromEntries(
    (['potentials:potentialId', 'lifetimes:lifetimeId', 'energies:energyId'] as const).flatMap((entry) => {
      const [segment, idName] = entry.split(':') as [string, string];
      const base = (labId: string) => `/api/labs/${labId}/compounds/${unknownId}/${segment}`;
      return [
        [
          `POST /api/labs/:labId/compounds/:compoundId/${segment}`,
          { path: ({ labId }: { labId: string }) => base(labId), body: {}, expected: labRoute('researcher', 400) },
        ],
        [
          `PATCH /api/labs/:labId/compounds/:compoundId/${segment}/:${idName}`,
          {
            path: ({ labId }: { labId: string }) => `${base(labId)}/${unknownId}`,
            body: { version: 0 },
            expected: labRoute('researcher', 404),
          },
        ],
        [
          `DELETE /api/labs/:labId/compounds/:compoundId/${segment}/:${idName}`,
          {
            path: ({ labId }: { labId: string }) => `${base(labId)}/${unknownId}`,
            expected: labRoute('reviewer', 404),
          },
        ],
      ];
    }),
  ),
  'GET /api/labs/:labId/settings': {
    path: ({ labId }) => `/api/labs/${labId}/settings`,
    expected: labRoute('viewer', 200),
  },
  'PATCH /api/labs/:labId/settings': {
    path: ({ labId }) => `/api/labs/${labId}/settings`,
    body: {},
    expected: labRoute('admin', 400),
  },
  'GET /api/labs/:labId/driving-force': {
    path: ({ labId }) => `/api/labs/${labId}/driving-force`,
    expected: labRoute('viewer', 400),
  },
  'GET /api/labs/:labId/compounds/:compoundId/lifetimes/:lifetimeId/dependents': {
    path: ({ labId }) => `/api/labs/${labId}/compounds/${unknownId}/lifetimes/${unknownId}/dependents`,
    expected: labRoute('viewer', 404),
  },
  'GET /api/labs/:labId/scenarios': {
    path: ({ labId }) => `/api/labs/${labId}/scenarios`,
    expected: labRoute('viewer', 200),
  },
  'POST /api/labs/:labId/scenarios': {
    path: ({ labId }) => `/api/labs/${labId}/scenarios`,
    body: { name: 'x' },
    expected: labRoute('researcher', 400),
  },
  'GET /api/labs/:labId/scenarios/:scenarioId': {
    path: ({ labId }) => `/api/labs/${labId}/scenarios/${unknownId}`,
    expected: labRoute('viewer', 404),
  },
  'PUT /api/labs/:labId/scenarios/:scenarioId': {
    path: ({ labId }) => `/api/labs/${labId}/scenarios/${unknownId}`,
    body: { name: 'x' },
    expected: labRoute('researcher', 400),
  },
  'DELETE /api/labs/:labId/scenarios/:scenarioId': {
    path: ({ labId }) => `/api/labs/${labId}/scenarios/${unknownId}`,
    expected: labRoute('researcher', 404),
  },
  'GET /api/labs/:labId/temperature-series': {
    path: ({ labId }) => `/api/labs/${labId}/temperature-series`,
    expected: labRoute('viewer', 200),
  },
  'GET /api/labs/:labId/temperature-series/analysis': {
    path: ({ labId }) => `/api/labs/${labId}/temperature-series/analysis?studies=${unknownId}`,
    expected: labRoute('viewer', 404),
  },
  'GET /api/labs/:labId/studies/:studyId/mechanism': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/mechanism`,
    expected: labRoute('viewer', 404),
  },
  // Studies (issue 5): unknown study ids end in 404, incomplete bodies in 400.
  'GET /api/labs/:labId/studies': {
    path: ({ labId }) => `/api/labs/${labId}/studies`,
    expected: labRoute('viewer', 200),
  },
  'POST /api/labs/:labId/studies': {
    path: ({ labId }) => `/api/labs/${labId}/studies`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'GET /api/labs/:labId/study-form-options': {
    path: ({ labId }) => `/api/labs/${labId}/study-form-options`,
    expected: labRoute('viewer', 200),
  },
  'GET /api/labs/:labId/studies/:studyId': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}`,
    expected: labRoute('viewer', 404),
  },
  'PATCH /api/labs/:labId/studies/:studyId': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}`,
    body: { version: 0 },
    expected: labRoute('researcher', 404),
  },
  'PATCH /api/labs/:labId/studies/:studyId/points': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/points`,
    body: { version: 0, points: [] },
    expected: labRoute('researcher', 404),
  },
  'GET /api/labs/:labId/studies/:studyId/fits': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/fits`,
    expected: labRoute('viewer', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/fits': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/fits`,
    body: { model: 'linear-free' },
    expected: labRoute('researcher', 404),
  },
  'GET /api/labs/:labId/studies/:studyId/history': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/history`,
    expected: labRoute('viewer', 404),
  },
  'GET /api/labs/:labId/studies/:studyId/export.csv': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/export.csv`,
    expected: labRoute('viewer', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/uploads': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/uploads`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'POST /api/labs/:labId/file-readings': {
    path: ({ labId }) => `/api/labs/${labId}/file-readings`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'POST /api/labs/:labId/studies/:studyId/uploads/:uploadId/preview': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/uploads/${unknownId}/preview`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'POST /api/labs/:labId/studies/:studyId/uploads/:uploadId/apply': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/uploads/${unknownId}/apply`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'GET /api/labs/:labId/studies/:studyId/uploads/:uploadId/file': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/uploads/${unknownId}/file`,
    expected: labRoute('viewer', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/spectrum-matrices': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/spectrum-matrices`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'GET /api/labs/:labId/studies/:studyId/spectrum-matrices': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/spectrum-matrices`,
    expected: labRoute('viewer', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/spectrum-matrices/:matrixId/reanalyse': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/spectrum-matrices/${unknownId}/reanalyse`,
    body: { bandWidth: 5 },
    expected: labRoute('researcher', 404),
  },
  'DELETE /api/labs/:labId/studies/:studyId/spectrum-matrices/:matrixId': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/spectrum-matrices/${unknownId}`,
    expected: labRoute('researcher', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/absorption-titrations/:titrationId/reanalyse': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/absorption-titrations/${unknownId}/reanalyse`,
    body: {
      bandWidth: 5,
      pathLength: 1,
      emitterConcentration: null,
      subtractQuencher: true,
      associationFit: 'isotherm',
    },
    expected: labRoute('researcher', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/absorption-titrations/preview': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/absorption-titrations/preview`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'POST /api/labs/:labId/studies/:studyId/absorption-titrations': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/absorption-titrations`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'GET /api/labs/:labId/studies/:studyId/absorption-titrations': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/absorption-titrations`,
    expected: labRoute('viewer', 404),
  },
  'DELETE /api/labs/:labId/studies/:studyId/absorption-titrations/:titrationId': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/absorption-titrations/${unknownId}`,
    expected: labRoute('researcher', 404),
  },
  'GET /api/labs/:labId/mechanism-files/:fileId': {
    path: ({ labId }) => `/api/labs/${labId}/mechanism-files/${unknownId}`,
    expected: labRoute('viewer', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/decay-sets/preview': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/decay-sets/preview`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'POST /api/labs/:labId/studies/:studyId/decay-sets': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/decay-sets`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'GET /api/labs/:labId/studies/:studyId/decay-sets': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/decay-sets`,
    expected: labRoute('viewer', 404),
  },
  'GET /api/labs/:labId/decay-sets/:setId/decays/:index/curves': {
    path: ({ labId }) => `/api/labs/${labId}/decay-sets/${unknownId}/decays/0/curves`,
    expected: labRoute('viewer', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/decay-sets/:setId/apply': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/decay-sets/${unknownId}/apply`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'POST /api/labs/:labId/decay-sets/:setId/refit': {
    path: ({ labId }) => `/api/labs/${labId}/decay-sets/${unknownId}/refit`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'POST /api/labs/:labId/compounds/:compoundId/decay-lifetimes/preview': {
    path: ({ labId }) => `/api/labs/${labId}/compounds/${unknownId}/decay-lifetimes/preview`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'GET /api/labs/:labId/compounds/:compoundId/decay-sets': {
    path: ({ labId }) => `/api/labs/${labId}/compounds/${unknownId}/decay-sets`,
    expected: labRoute('viewer', 404),
  },
  'POST /api/labs/:labId/compounds/:compoundId/decay-lifetimes': {
    path: ({ labId }) => `/api/labs/${labId}/compounds/${unknownId}/decay-lifetimes`,
    body: {},
    expected: labRoute('researcher', 400),
  },
  'GET /api/labs/:labId/decay-files/:fileId': {
    path: ({ labId }) => `/api/labs/${labId}/decay-files/${unknownId}`,
    expected: labRoute('viewer', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/submit': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/submit`,
    body: {},
    expected: labRoute('researcher', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/approve': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/approve`,
    body: {},
    expected: labRoute('reviewer', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/return': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/return`,
    body: {},
    expected: labRoute('reviewer', 400),
  },
  'POST /api/labs/:labId/studies/:studyId/comments': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/comments`,
    body: { comment: 'x' },
    expected: labRoute('researcher', 404),
  },
  'POST /api/labs/:labId/studies/:studyId/revisions': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/revisions`,
    expected: labRoute('researcher', 404),
  },
  'GET /api/labs/:labId/comparisons/:side/:compoundId': {
    path: ({ labId }) => `/api/labs/${labId}/comparisons/emitter/${unknownId}`,
    expected: labRoute('viewer', 404),
  },
  'GET /api/labs/:labId/comparisons/:side/:compoundId/export.csv': {
    path: ({ labId }) => `/api/labs/${labId}/comparisons/quencher/${unknownId}/export.csv`,
    expected: labRoute('viewer', 404),
  },
  'GET /api/labs/:labId/dashboard': {
    path: ({ labId }) => `/api/labs/${labId}/dashboard`,
    expected: labRoute('viewer', 200),
  },
  'GET /api/labs/:labId/studies/:studyId/report.pdf': {
    path: ({ labId }) => `/api/labs/${labId}/studies/${unknownId}/report.pdf`,
    expected: labRoute('viewer', 404),
  },
  'GET /api/labs/:labId/scenarios/:scenarioId/report.pdf': {
    path: ({ labId }) => `/api/labs/${labId}/scenarios/${unknownId}/report.pdf`,
    expected: labRoute('viewer', 404),
  },
  'GET /api/labs/:labId/comparisons/:side/:compoundId/report.pdf': {
    path: ({ labId }) => `/api/labs/${labId}/comparisons/emitter/${unknownId}/report.pdf`,
    expected: labRoute('viewer', 404),
  },
  'DELETE /api/account/sessions': { path: () => '/api/account/sessions', expected: signedIn(204) },
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
  const stack = (
    testApp.app as unknown as {
      router: { stack: Array<{ route?: { path: string; methods: Record<string, boolean> } }> };
    }
  ).router.stack;
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
      const method = key.split(' ')[0]!.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
      for (const who of everyone) {
        const client = clients[who];
        const url = row.path({ labId });
        const response =
          method === 'get'
            ? await client.get(url)
            : method === 'delete'
              ? await client.delete(url)
              : await client[method](url, row.body);
        expect(response.status, `${who} → ${key}: ${JSON.stringify(response.body)}`).toBe(row.expected[who]);
      }
    });
  }
});
