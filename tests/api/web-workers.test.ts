import net from 'node:net';
import { setTimeout as sleep } from 'node:timers/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiClient } from '../support/accounts';
import { childrenOf, tcpConnectionsOf } from '../support/process-sockets';
import { startServerProcess } from '../support/server-process';
import { startThrowawayCluster } from '../support/throwaway-cluster';

const researcher = { email: 'priya.halvorsen@demo.halflight.example', password: 'halflight-demo' };

/** Asks GET /api/health on an open raw connection (kept alive) and checks the 200. */
async function healthOnOwnConnection(socket: net.Socket): Promise<void> {
  const answer = new Promise<string>((resolve, reject) => {
    let text = '';
    socket.on('data', (chunk: Buffer) => {
      text += chunk.toString();
      if (text.includes('\r\n\r\n')) resolve(text);
    });
    socket.once('error', reject);
  });
  socket.write('GET /api/health HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: keep-alive\r\n\r\n');
  expect((await answer).split('\r\n')[0]).toBe('HTTP/1.1 200 OK');
}

let cluster: Awaited<ReturnType<typeof startThrowawayCluster>>;
let workers: Awaited<ReturnType<typeof startServerProcess>>;
let single: Awaited<ReturnType<typeof startServerProcess>>;

// Two production servers (compiled, plain node) on one throwaway database: one with two web workers, one alone.
beforeAll(async () => {
  cluster = await startThrowawayCluster();
  const common = { DATABASE_URL: cluster.url, HALFLIGHT_DEMO_DATA: 'true', LOG_LEVEL: 'info' };
  workers = await startServerProcess({ ...common, HALFLIGHT_WORKERS: '2' });
  await workers.waitForHealthy();
  single = await startServerProcess({ ...common, HALFLIGHT_WORKERS: '1' });
  await single.waitForHealthy();
}, 240_000);

afterAll(async () => {
  for (const server of [workers, single]) {
    server?.kill('SIGTERM');
    await server?.waitForExit().catch(() => {});
  }
  await cluster?.stop();
}, 120_000);

describe('several web processes on one database', { timeout: 240_000 }, () => {
  it('when a person signs in on one instance, then the other knows the session, and signing out there ends it on both', async () => {
    const client = await apiClient(single.baseUrl);
    const signedIn = await client.signIn(researcher);
    const cookie = signedIn.headers['set-cookie'] as unknown as string[];
    const onOther = await fetch(`${workers.baseUrl}/api/session`, {
      headers: { cookie: cookie.map((line) => line.split(';')[0]).join('; ') },
    });
    expect(onOther.status).toBe(200);
    expect(((await onOther.json()) as { user: { email: string } }).user.email).toBe(researcher.email);

    const other = await apiClient(workers.baseUrl);
    await other.signIn(researcher);
    await other.delete('/api/session').expect(204);
    expect((await other.get('/api/session')).status).toBe(401);
    // The first sign-in is a separate session and goes on.
    expect((await client.get('/api/session')).status).toBe(200);
  });

  it('when one web worker is stalled while clients connect, then each worker still gets its equal share of the connections', async () => {
    const [first, second] = childrenOf(workers.child.pid!);
    const port = Number(new URL(workers.baseUrl).port);
    const sockets: net.Socket[] = [];
    // A worker that is busy when connections arrive (a long answer, a garbage collection) must not
    // end up with fewer of them for as long as the clients keep them open; SIGSTOP makes it busy at will.
    process.kill(second!, 'SIGSTOP');
    try {
      for (let i = 0; i < 40; i++) {
        const socket = net.connect(port, '127.0.0.1');
        sockets.push(socket);
        await new Promise<void>((resolve, reject) => socket.once('connect', resolve).once('error', reject));
      }
      // Time for the primary to hand them all out (node:cluster waits for each worker's ack).
      await sleep(1_000);
    } finally {
      process.kill(second!, 'SIGCONT');
    }
    try {
      await Promise.all(sockets.map(healthOnOwnConnection));
      const clientPorts = new Set(sockets.map((socket) => socket.localPort!));
      const served = (pid: number) => tcpConnectionsOf(pid, (_local, remote) => clientPorts.has(remote));
      expect([served(first!), served(second!)]).toEqual([20, 20]);
    } finally {
      for (const socket of sockets) socket.destroy();
    }
  });

  it('when a web worker is killed under a stream of writes, then every write that was answered is kept and a new worker takes its place', async () => {
    const before = childrenOf(workers.child.pid!);
    expect(before).toHaveLength(2);
    const client = await apiClient(workers.baseUrl);
    const signedIn = await client.signIn(researcher);
    const labId = signedIn.body.user.labs[0].labId as string;
    const compounds = (await client.get(`/api/labs/${labId}/study-form-options`)).body as {
      compounds: Array<{ id: string; roleHint: string }>;
    };
    const emitter = compounds.compounds.find((compound) => compound.roleHint === 'photocatalyst')!;
    const quencher = compounds.compounds.find((compound) => compound.roleHint === 'quencher')!;

    const accepted: string[] = [];
    const refusals: string[] = [];
    let writing = true;
    const writer = async (lane: number) => {
      for (let i = 0; writing; i++) {
        try {
          // A bound on each write: a connection handed to the worker as it died must not hang the test.
          const response = await client
            .post(`/api/labs/${labId}/studies`, {
              title: `Worker kill ${lane}-${i}`,
              emitterId: emitter.id,
              quencherId: quencher.id,
              solventId: 'acetonitrile',
              atmosphere: 'argon',
              degassingMethod: 'sparging',
              tau0: 1e-6,
            })
            .timeout(15_000);
          if (response.status === 201) accepted.push(response.body.id as string);
          else refusals.push(`${response.status} ${JSON.stringify(response.body)}`);
        } catch (error) {
          // The connection went down with the worker: not answered, so not promised.
          refusals.push(String(error));
        }
      }
    };
    /** Waits until `count` writes were accepted; stops the writers and fails if writes keep being refused. */
    const acceptedReaches = async (count: number) => {
      const deadline = Date.now() + 60_000;
      while (accepted.length < count) {
        if (refusals.length > 20 || Date.now() > deadline) {
          writing = false;
          throw new Error(
            `${accepted.length} of ${count} writes accepted; refused:\n${refusals.slice(0, 5).join('\n')}\n${workers.output().slice(-3000)}`,
          );
        }
        await sleep(50);
      }
    };
    const lanes = [0, 1, 2, 3].map(writer);
    await acceptedReaches(8);
    process.kill(before[1]!, 'SIGKILL');
    const killedAt = accepted.length;
    await workers.waitForOutput('is serving again');
    await acceptedReaches(killedAt + 8);
    writing = false;
    await Promise.all(lanes);

    const after = childrenOf(workers.child.pid!);
    expect(after).toHaveLength(2);
    expect(after).not.toContain(before[1]);
    expect(workers.output()).toContain(`Web worker 1 (pid ${before[1]}) was killed (SIGKILL)`);
    // Every answered write is in the database, read back through the other instance.
    const reader = await apiClient(single.baseUrl);
    await reader.signIn(researcher);
    for (const id of accepted) expect((await reader.get(`/api/labs/${labId}/studies/${id}`)).status).toBe(200);
    const listed = await reader.get(`/api/labs/${labId}/studies?q=${encodeURIComponent('Worker kill')}&pageSize=100`);
    // A write the dying worker committed but could not answer may be there too (never more than were sent).
    expect(listed.body.total).toBeGreaterThanOrEqual(accepted.length);
    expect(listed.body.total).toBeLessThanOrEqual(accepted.length + refusals.length);
    expect(refusals.length).toBeLessThan(accepted.length);
  });
});
