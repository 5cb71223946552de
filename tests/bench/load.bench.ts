/**
 * Load benchmark: `npm run bench:load` (build first: `npm run build`). Starts the production
 * server (dist/server/index.js under plain node, HALFLIGHT_WORKERS as set in the environment) on
 * its own built-in PostgreSQL in a temporary folder with the demo data, adds generated studies to
 * the demo lab (tests/bench/load-data.ts), signs in as the demo researcher, then drives it with
 * autocannon on 127.0.0.1 in three timed phases of one run:
 *   1. GET /api/health, the bare baseline (one database round trip, no session);
 *   2. the read mix (studies list with filters, one study, compounds, dashboard);
 *   3. the read mix again while a write mix (create a study, replace its points, upload a small
 *      file) is asked at a fixed rate.
 * Prints req/s, p50/p99, non-2xx and errors of each, the load average beside each, and
 * `ratio read mix / bare route`. Then each write timed once, by kind and by when in the phase it
 * was sent (tests/bench/write-latencies.ts): autocannon's own write percentiles weigh each write
 * by its own time. The write connections ask one write a second each, and each connection's
 * second starts when it is made, so the writes come in bursts: all creates, then all point
 * replacements, then all uploads, each burst at about the same moment. With several web workers it also prints how the connections of
 * each read phase were spread over them, counted half-way through the phase from /proc: clients
 * keep their connections, so a worker holding more of them makes its clients wait longer.
 * Figures only; nothing is asserted.
 *
 * Settings (environment): BENCH_LOAD_SECONDS (each phase, default 30), BENCH_LOAD_CONNECTIONS
 * (read and baseline connections, default 200), BENCH_LOAD_WRITE_RATE (writes/s, default 20),
 * BENCH_LOAD_STUDIES (generated studies, default 5000), BENCH_LOAD_ROUTES=1 (also each read route
 * alone at 50 connections; =only for those alone, to compare two builds route by route), BENCH_LOAD_CPU_PROF=<folder> (the server runs with --cpu-prof and
 * writes one .cpuprofile per process there), BENCH_LOAD_PROJECT=<folder> (serve another checkout's
 * build, e.g. a worktree of an older commit, with this benchmark). HALFLIGHT_WORKERS and LOG_LEVEL
 * reach the server; BENCH_LOAD_SERVER_LOG=<file> keeps
 * the server's output (with LOG_LEVEL=debug each request's line has its database time); BENCH_LOAD_DEBUG=1 prints the status codes of each phase and the server's output;
 * BENCH_LOAD_WAITS=1 samples pg_stat_activity through the writes phase (tests/bench/load-waits.ts)
 * and prints what the app's backends were waiting on, statement by statement.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import autocannon from 'autocannon';
import { projectRoot } from '../../server/config/env';
import { freePort } from '../support/free-port';
import { childrenOf, tcpConnectionsOf } from '../support/process-sockets';
import { generatedStudiesSql } from './load-data';
import { demoLabPicks, signIn, startProductionServer } from './load-server';
import { sampleWaits as waitSampler } from './load-waits';
import { serverCpuMs } from './process-cpu';
import { writeLatencies } from './write-latencies';

const seconds = Number(process.env.BENCH_LOAD_SECONDS ?? 30);
const connections = Number(process.env.BENCH_LOAD_CONNECTIONS ?? 200);
const writeRate = Number(process.env.BENCH_LOAD_WRITE_RATE ?? 20);
const generated = Number(process.env.BENCH_LOAD_STUDIES ?? 5000);
const cpuProfileDir = process.env.BENCH_LOAD_CPU_PROF;
const servedProject = path.resolve(process.env.BENCH_LOAD_PROJECT ?? projectRoot);
const debug = process.env.BENCH_LOAD_DEBUG === '1';
const sampleWaits = process.env.BENCH_LOAD_WAITS === '1' ? waitSampler : undefined;
const researcher = { email: 'priya.halvorsen@demo.halflight.example', password: 'halflight-demo' };

const loadAverage = () =>
  os
    .loadavg()
    .map((value) => value.toFixed(2))
    .join(' / ');

/** CPU ms per request of the server's node processes and of PostgreSQL during a phase. */
type Cpu = { node: number; postgres: number };
type Phase = {
  name: string;
  connections: number;
  result: autocannon.Result;
  load: string;
  cpu?: Cpu;
  /** Client connections each web worker held half-way through the phase. */
  spread?: number[];
};

function run(options: autocannon.Options): Promise<autocannon.Result> {
  return new Promise((resolve, reject) => {
    autocannon(options, (error, result) => (error ? reject(error) : resolve(result)));
  });
}

/** A small two-column series as an instrument export would have it (invented numbers). */
function smallCsv(seed: number): Buffer {
  const lines = ['quencher (mM),intensity'];
  for (let i = 0; i <= 8; i++) {
    const mM = i * 0.5;
    lines.push(`${mM.toFixed(2)},${((52_000 + seed) / (1 + 0.31 * mM)).toFixed(1)}`);
  }
  return Buffer.from(`${lines.join('\n')}\n`);
}

function multipart(fileName: string, content: Buffer): { body: Buffer; contentType: string } {
  const boundary = `----halflight-bench-${Math.random().toString(16).slice(2)}`;
  const body = Buffer.concat([
    Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${fileName}"\r\n` +
        'Content-Type: text/csv\r\n\r\n',
    ),
    content,
    Buffer.from(`\r\n--${boundary}--\r\n`),
  ]);
  return { body, contentType: `multipart/form-data; boundary=${boundary}` };
}

const points = (seed: number) =>
  Array.from({ length: 8 }, (_, i) => ({
    concentration: i * 5e-4,
    intensity: (48_000 + seed) / (1 + 420 * i * 5e-4),
    lifetime: null,
    absorbanceExcitation: null,
    absorbanceEmission: null,
    volumeAdded: null,
    uncertainty: null,
  }));

async function main() {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-load-'));
  console.log(`bench:load — Node ${process.version}, ${os.cpus().length} cores, serving ${servedProject}`);
  console.log(`load average before start (1 / 5 / 15 min): ${loadAverage()}`);
  const server = await startProductionServer({
    projectRoot: servedProject,
    dataDir,
    port: await freePort(),
    pgPort: await freePort(),
    logFile: process.env.BENCH_LOAD_SERVER_LOG,
    nodeArgs: cpuProfileDir ? ['--cpu-prof', `--cpu-prof-dir=${path.resolve(cpuProfileDir)}`] : [],
  });
  try {
    const { labId, emitterId, quencherId } = await demoLabPicks(server);
    const t0 = performance.now();
    await server.query(generatedStudiesSql(), [labId, generated]);
    await server.query('ANALYZE');
    const [{ count }] = (await server.query<{ count: number }>(
      'SELECT count(*)::int AS count FROM studies WHERE lab_id = $1 AND is_current',
      [labId],
    )) as [{ count: number }];
    console.log(
      `demo lab holds ${count} current studies (${generated} generated in ${((performance.now() - t0) / 1000).toFixed(1)} s)`,
    );
    const demoStudies = await server.query<{ id: string }>(
      'SELECT id FROM studies WHERE lab_id = $1 AND latest_fit_id IS NOT NULL ORDER BY title LIMIT 2',
      [labId],
    );
    const signedIn = await signIn(server.baseUrl, researcher);
    const lab_ = `/api/labs/${labId}`;
    const readMix: autocannon.Request[] = [
      { path: `${lab_}/studies` },
      { path: `${lab_}/studies?status=approved&sort=kq&pageSize=25` },
      { path: `${lab_}/studies/${demoStudies[0]!.id}` },
      { path: `${lab_}/studies?emitterId=${emitterId}&solventId=acetonitrile` },
      { path: `${lab_}/compounds` },
      { path: `${lab_}/studies/${demoStudies[1]!.id}` },
      { path: `${lab_}/dashboard` },
    ];
    const readOptions = (conns: number, requests: autocannon.Request[]): autocannon.Options => ({
      url: server.baseUrl,
      connections: conns,
      duration: seconds,
      headers: { cookie: signedIn.cookie },
      requests,
      timeout: 20,
    });

    // Writes: each connection creates a study, replaces its points, then uploads a small file to it.
    type WriteContext = { studyId?: string; version?: number; seed?: number; sentAt?: number };
    const timedWrites = writeLatencies();
    const writesByKind = { create: 0, points: 0, upload: 0, failed: new Map<string, number>() };
    const countWrite = (kind: 'create' | 'points' | 'upload', status: number) => {
      if (status >= 200 && status < 300) writesByKind[kind] += 1;
      else writesByKind.failed.set(`${kind} ${status}`, (writesByKind.failed.get(`${kind} ${status}`) ?? 0) + 1);
    };
    const writeHeaders = { cookie: signedIn.cookie, 'x-csrf-token': signedIn['x-csrf-token'] };
    let seedCounter = 0;
    const writeMix: autocannon.Request[] = [
      {
        method: 'POST',
        path: `${lab_}/studies`,
        setupRequest: (request, context: WriteContext) => {
          context.seed = seedCounter++;
          context.sentAt = timedWrites.sent();
          return {
            ...request,
            headers: { ...writeHeaders, 'content-type': 'application/json' },
            body: JSON.stringify({
              title: `Load bench study ${context.seed} (invented)`,
              emitterId,
              quencherId,
              solventId: 'acetonitrile',
              atmosphere: 'argon',
              degassingMethod: 'sparging',
              tau0: 1.1e-6,
            }),
          };
        },
        onResponse: (status, body, context: WriteContext) => {
          countWrite('create', status);
          timedWrites.answered('create', status, context.sentAt!);
          const created = status === 201 ? (JSON.parse(body) as { id: string; version: number }) : undefined;
          context.studyId = created?.id;
          context.version = created?.version;
        },
      },
      {
        method: 'PATCH',
        setupRequest: (request, context: WriteContext) => {
          if (context.studyId === undefined) return undefined as unknown as autocannon.Request; // start over with a new study
          context.sentAt = timedWrites.sent();
          return {
            ...request,
            path: `${lab_}/studies/${context.studyId}/points`,
            headers: { ...writeHeaders, 'content-type': 'application/json' },
            body: JSON.stringify({ version: context.version, points: points(context.seed ?? 0) }),
          };
        },
        onResponse: (status, _body, context: WriteContext) => {
          countWrite('points', status);
          timedWrites.answered('points', status, context.sentAt!);
        },
      },
      {
        method: 'POST',
        setupRequest: (request, context: WriteContext) => {
          const form = multipart(`series-${context.seed}.csv`, smallCsv(context.seed ?? 0));
          context.sentAt = timedWrites.sent();
          return {
            ...request,
            path: `${lab_}/studies/${context.studyId}/uploads`,
            headers: { ...writeHeaders, 'content-type': form.contentType },
            body: form.body,
          };
        },
        onResponse: (status, _body, context: WriteContext) => {
          countWrite('upload', status);
          timedWrites.answered('upload', status, context.sentAt!);
        },
      },
    ];

    // Warm-up: JIT, connection pools, PostgreSQL's caches.
    await run({ ...readOptions(50, readMix), duration: 5 });

    const phases: Phase[] = [];
    const port = Number(new URL(server.baseUrl).port);
    /** Connections to the port held by each web worker (node children of the primary), half-way through a phase. */
    const spreadHalfWay = async (): Promise<number[]> => {
      await sleep((seconds * 1000) / 2);
      const workers = childrenOf(server.pid).filter((pid) => {
        try {
          return fs.readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('index.js');
        } catch {
          return false;
        }
      });
      return workers.map((pid) => tcpConnectionsOf(pid, (local) => local === port));
    };
    /** Runs phases together and gives the server's CPU per request over all of them. */
    const measured = async <T extends autocannon.Result[]>(runs: () => Promise<T>): Promise<[T, Cpu]> => {
      const before = serverCpuMs(server.pid, dataDir);
      const results = await runs();
      const after = serverCpuMs(server.pid, dataDir);
      const requests = results.reduce((sum, result) => sum + result.requests.total, 0) || 1;
      return [
        results,
        { node: (after.node - before.node) / requests, postgres: (after.postgres - before.postgres) / requests },
      ];
    };
    const routesOnly = process.env.BENCH_LOAD_ROUTES === 'only';
    let waitLines: string[] = [];
    const [[bare], bareCpu] = await measured(async () => [
      await run({
        url: `${server.baseUrl}/api/health`,
        connections,
        duration: seconds,
        timeout: 20,
        ...(routesOnly ? { connections: 50, duration: Math.min(seconds, 15) } : {}),
      }),
    ]);
    phases.push({
      name: '/api/health (bare route)',
      connections: routesOnly ? 50 : connections,
      result: bare,
      load: loadAverage(),
      cpu: bareCpu,
    });
    let read = bare;
    if (!routesOnly) {
      const readSpread = spreadHalfWay();
      const [[readMixResult], readCpu] = await measured(async () => [await run(readOptions(connections, readMix))]);
      read = readMixResult;
      phases.push({
        name: 'read mix',
        connections,
        result: read,
        load: loadAverage(),
        cpu: readCpu,
        spread: await readSpread,
      });
      const writeConnections = Math.max(4, writeRate);
      const waits = sampleWaits ? sampleWaits(server.databaseUrl) : undefined;
      const withWritesSpread = spreadHalfWay();
      const [[readUnderWrites, writes], bothCpu] = await measured(() =>
        Promise.all([
          run(readOptions(connections, readMix)),
          run({
            url: server.baseUrl,
            connections: writeConnections,
            overallRate: writeRate,
            duration: seconds,
            requests: writeMix,
            timeout: 20,
          }),
        ]),
      );
      const loadNow = loadAverage();
      waitLines = (await waits?.stop()) ?? [];
      // The CPU of this phase is shared by reads and writes: per request of both together.
      phases.push({
        name: 'read mix, with writes',
        connections,
        result: readUnderWrites,
        load: loadNow,
        cpu: bothCpu,
        spread: await withWritesSpread,
      });
      phases.push({
        name: `writes (${writeRate}/s asked)`,
        connections: writeConnections,
        result: writes,
        load: loadNow,
      });
    }

    if (process.env.BENCH_LOAD_ROUTES === '1' || routesOnly) {
      const routes: Array<[string, string]> = [
        ['GET /api/session', '/api/session'],
        ['studies list', `${lab_}/studies`],
        ['studies list, pageSize=100', `${lab_}/studies?pageSize=100`],
        ['one study', `${lab_}/studies/${demoStudies[0]!.id}`],
        ['compounds', `${lab_}/compounds`],
        ['dashboard', `${lab_}/dashboard`],
      ];
      for (const [name, route] of routes) {
        const [[result], cpu] = await measured(async () => [
          await run({ ...readOptions(50, [{ path: route }]), duration: Math.min(seconds, 15) }),
        ]);
        phases.push({ name: `  ${name}`, connections: 50, result, load: loadAverage(), cpu });
      }
    }

    const perSecond = (result: autocannon.Result) =>
      (result.requests.total / Math.max(result.duration, 1e-9)).toFixed(1);
    console.log(
      `\n${seconds} s per phase on 127.0.0.1, signed in as the demo researcher; HALFLIGHT_WORKERS=${process.env.HALFLIGHT_WORKERS ?? '(default)'}`,
    );
    console.log(
      `${'phase'.padEnd(30)} ${'conns'.padStart(5)} ${'req/s'.padStart(8)} ${'p50 ms'.padStart(7)} ${'p99 ms'.padStart(7)} ${'non-2xx'.padStart(8)} ${'errors'.padStart(7)} ${'node ms/req'.padStart(12)} ${'pg ms/req'.padStart(10)}   load avg 1/5/15 at end`,
    );
    for (const phase of phases) {
      const { result } = phase;
      console.log(
        `${phase.name.padEnd(30)} ${String(phase.connections).padStart(5)} ${perSecond(result).padStart(8)} ${String(result.latency.p50).padStart(7)} ${String(result.latency.p99).padStart(7)} ${String(result.non2xx).padStart(8)} ${String(result.errors).padStart(7)} ${(phase.cpu?.node.toFixed(2) ?? '').padStart(12)} ${(phase.cpu?.postgres.toFixed(2) ?? '').padStart(10)}   ${phase.load}`,
      );
    }
    for (const phase of phases) {
      // One process serving alone has nothing to spread.
      if (phase.spread && phase.spread.length > 1)
        console.log(`${phase.name}: connections per web worker half-way through: ${phase.spread.join(' / ')}`);
    }
    if (debug) {
      for (const phase of phases)
        console.log(
          `${phase.name}: statuses ${JSON.stringify(phase.result.statusCodeStats)}, timeouts ${phase.result.timeouts}`,
        );
    }
    if (waitLines.length) {
      console.log(
        '\nPostgreSQL during the writes phase, app backends per sample by wait and statement (reads outside a transaction left out):',
      );
      for (const line of waitLines) console.log(line);
    }
    const failed = [...writesByKind.failed].map(([key, n]) => `${key}: ${n}`).join(', ');
    if (!routesOnly)
      console.log(
        `writes done: ${writesByKind.create} studies created, ${writesByKind.points} point replacements, ${writesByKind.upload} uploads${failed ? `; refused: ${failed}` : ''}`,
      );
    if (!routesOnly) for (const line of timedWrites.lines()) console.log(line);
    const ratio = read.requests.total / read.duration / (bare.requests.total / bare.duration);
    if (!routesOnly) console.log(`ratio read mix / bare route: ${ratio.toFixed(2)}`);
  } finally {
    const code = await server.stop().catch((error: Error) => {
      console.error(error.message);
      return null;
    });
    if (debug) console.log(server.output());
    if (code !== 0) console.error(`The server stopped with code ${code}:\n${server.output()}`);
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
}

await main();
