import crypto from 'node:crypto';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import type { Role } from '../../shared/schemas/roles';
import { hashPassword } from '../../server/auth/passwords';
import { Lab, Membership, User } from '../../server/models';

export interface TestUser {
  id: string;
  email: string;
  password: string;
  name: string;
}

const testPassword = 'correct-horse-battery-9';
let passwordHash: Promise<string> | undefined;

/** A lab with one new person per requested role (all with the same test password). */
export async function createLabWithMembers(_sequelize: Sequelize, options: { roles: Role[]; labName?: string }) {
  passwordHash ??= hashPassword(testPassword);
  const tag = crypto.randomBytes(4).toString('hex');
  const lab = await Lab.create({ name: options.labName ?? `Test lab ${tag}`, slug: `test-${tag}` });
  const users: Partial<Record<Role, TestUser>> = {};
  const memberships: Partial<Record<Role, string>> = {};
  for (const role of options.roles) {
    const email = `${role}-${tag}@tests.halflight.example`;
    const user = await User.create({ email, name: `${role} ${tag}`, passwordHash: await passwordHash });
    const membership = await Membership.create({ labId: lab.id, userId: user.id, role });
    users[role] = { id: user.id, email, password: testPassword, name: user.name };
    memberships[role] = membership.id;
  }
  return { lab, users: users as Record<Role, TestUser>, memberships: memberships as Record<Role, string> };
}

/** A cookie-keeping client that fetches and sends the CSRF token like the browser app does. */
export async function apiClient(app: Parameters<typeof request.agent>[0]) {
  const agent = request.agent(app);
  let csrfToken = (await agent.get('/api/csrf-token').expect(200)).body.csrfToken as string;
  const withToken = <T extends { set(name: string, value: string): T }>(test: T) => test.set('x-csrf-token', csrfToken);
  return {
    agent,
    get: (url: string) => agent.get(url),
    post: (url: string, body?: object) => withToken(agent.post(url)).send(body ?? {}),
    patch: (url: string, body?: object) => withToken(agent.patch(url)).send(body ?? {}),
    put: (url: string, body?: object) => withToken(agent.put(url)).send(body ?? {}),
    delete: (url: string) => withToken(agent.delete(url)),
    async signIn(user: { email: string; password: string }) {
      const response = await withToken(agent.post('/api/session')).send({ email: user.email, password: user.password });
      if (response.status !== 200)
        throw new Error(`sign-in failed: ${response.status} ${JSON.stringify(response.body)}`);
      csrfToken = response.body.csrfToken;
      return response;
    },
    setCsrfToken(token: string) {
      csrfToken = token;
    },
  };
}

export type ApiClient = Awaited<ReturnType<typeof apiClient>>;

/** A new lab with one researcher, signed in through a fresh client: the set-up of the upload tests. */
export async function signedInResearcher(testApp: {
  app: Parameters<typeof request.agent>[0];
  sequelize: Sequelize;
}): Promise<{ labId: string; client: ApiClient; csrf: string }> {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  const client = await apiClient(testApp.app);
  const csrf = (await client.signIn(users.researcher)).body.csrfToken as string;
  return { labId: lab.id, client, csrf };
}

/** A new lab with a researcher and a viewer, each signed in through a fresh client: the set-up of the list tests. */
export async function signedInResearcherAndViewer(testApp: {
  app: Parameters<typeof request.agent>[0];
  sequelize: Sequelize;
}): Promise<{ labId: string; researcher: ApiClient; viewer: ApiClient }> {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher', 'viewer'] });
  const researcher = await apiClient(testApp.app);
  await researcher.signIn(users.researcher);
  const viewer = await apiClient(testApp.app);
  await viewer.signIn(users.viewer);
  return { labId: lab.id, researcher, viewer };
}

/**
 * When this test file loaded this module (vitest loads it afresh per file): the mail jobs a file
 * waits for are its own. The api files share one database, and a job another file left behind
 * (its app closed before the send, or its server process killed mid-send, so the job stays active
 * until it expires) would otherwise hold every later file's wait to its bound.
 */
const fileStartedAt = new Date();

/**
 * Waits until the mail jobs this test file asked for are done (sent, or given up), so a test reads
 * what the worker sent. A retry that is waiting for a relay that is down counts as not done. The
 * bound is generous: on a busy machine a first send can time out and wait for its retry.
 */
export async function settleMailQueue(timeoutMs = 60_000) {
  const { CaughtMail } = await import('../../server/models');
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const [rows] = await CaughtMail.sequelize!.query(
      `SELECT count(*)::int AS count FROM pgboss.job
        WHERE (name LIKE 'mail-%' OR name LIKE 'password-reset-%') AND state < 'completed' AND created_on >= :since`,
      { replacements: { since: fileStartedAt } },
    );
    if ((rows as Array<{ count: number }>)[0]!.count === 0) return;
    if (Date.now() > deadline) throw new Error(`the mail queue did not settle within ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/** The newest message the local catcher took for an address (once the queue settled), and the first link in it. */
export async function latestMailTo(email: string) {
  const { CaughtMail } = await import('../../server/models');
  const { Op } = await import('sequelize');
  await settleMailQueue();
  const mail = await CaughtMail.findOne({
    where: { toAddresses: { [Op.contains]: [email] } },
    order: [['receivedAt', 'DESC']],
  });
  const link = mail?.textBody.match(/https?:\/\/\S+/)?.[0] ?? null;
  return { mail, link };
}
