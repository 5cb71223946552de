import cluster from 'node:cluster';
import type { Worker } from 'node:cluster';
import { setTimeout as sleep } from 'node:timers/promises';
import type { Logger } from 'pino';
import { createConnectionBalancer } from './connection-balancer';

/** What the primary tells each web worker once it is forked. */
export interface WorkerBoot {
  type: 'boot';
  databaseUrl: string;
  embeddedDatabase: boolean;
  /** Slot 0 runs the job queue's worker and the local mail catcher; the others only queue jobs. */
  runsJobs: boolean;
}

/**
 * A web worker asks for its boot message once it listens for messages (one sent earlier would be
 * lost), and says when its web server is ready for connections.
 */
export interface WorkerMessage {
  type: 'hello' | 'ready';
}

/** How long stopping workers may take (each drains its requests for at most 10 s) before they are killed. */
const stopWithinMs = 20_000;
/** More unplanned exits than this within a minute means something is broken: stop rather than loop. */
const maxRestartsPerMinute = 5;

/**
 * The web workers of the primary process (node:cluster): `count` processes sharing one database.
 * The primary listens on the port and hands each connection to the worker holding the fewest
 * (connection-balancer.ts). A worker that ends while Halflight runs (a crash, or killed) is
 * replaced in its slot; slot 0 keeps the job queue. `ready` resolves once all of them are ready
 * and the port listens, and rejects if one ends before that (a bad setting; replacing it would
 * fail the same way) or the port cannot be had.
 */
export function startWorkers(options: {
  count: number;
  port: number;
  host: string;
  databaseUrl: string;
  embeddedDatabase: boolean;
  runJobs: boolean;
  logger: Logger;
  /** Called when workers keep failing after the start: Halflight should stop. */
  onFatal(reason: string): void;
}) {
  const { logger } = options;
  const slots = new Map<Worker, number>();
  const balancer = createConnectionBalancer();
  const restarts: number[] = [];
  let stopping = false;
  let started = false;
  let readyCount = 0;
  let markReady: () => void = () => {};
  let failStart: (error: Error) => void = () => {};
  const ready = new Promise<void>((resolve, reject) => {
    markReady = resolve;
    failStart = reject;
  });

  function fork(slot: number): void {
    const worker = cluster.fork({ HALFLIGHT_WORKER_SLOT: String(slot) });
    slots.set(worker, slot);
    const boot: WorkerBoot = {
      type: 'boot',
      databaseUrl: options.databaseUrl,
      embeddedDatabase: options.embeddedDatabase,
      runsJobs: slot === 0 && options.runJobs,
    };
    worker.on('message', (message: WorkerMessage) => {
      if (message?.type === 'hello') worker.send(boot);
      if (message?.type !== 'ready') return;
      balancer.add(slot, worker);
      if (started) {
        logger.info(`Web worker ${slot} (pid ${worker.process.pid}) is serving again.`);
        return;
      }
      if (++readyCount === options.count) {
        balancer.listen(options.port, options.host).then(() => {
          started = true;
          markReady();
        }, failStart);
      }
    });
  }

  cluster.on('exit', (worker, code, signal) => {
    const slot = slots.get(worker);
    slots.delete(worker);
    if (slot !== undefined) balancer.remove(slot, worker);
    if (slot === undefined || stopping) return;
    const how = signal ? `was killed (${signal})` : `ended with code ${code}`;
    if (!started) {
      failStart(new Error(`Web worker ${slot} ${how} while starting.`));
      return;
    }
    const now = Date.now();
    restarts.push(now);
    while (restarts[0]! < now - 60_000) restarts.shift();
    if (restarts.length > maxRestartsPerMinute) {
      options.onFatal(`Web workers ended ${restarts.length} times within a minute; stopping Halflight.`);
      return;
    }
    logger.warn(`Web worker ${slot} (pid ${worker.process.pid}) ${how}; starting a new one in its place.`);
    fork(slot);
  });

  for (let slot = 0; slot < options.count; slot++) fork(slot);

  return {
    ready,
    /** Pids of the running workers, by slot. */
    pids: () => [...slots].sort((a, b) => a[1] - b[1]).map(([worker]) => worker.process.pid!),
    /** Open connections of each slot's worker (undefined: not taking connections). */
    openConnections: () => balancer.openBySlot(),
    /** Stops taking connections, SIGTERM to every worker (each finishes its requests), then waits for them; kills what is left after 20 s. */
    async stop(): Promise<void> {
      stopping = true;
      balancer.close();
      const running = [...slots.keys()].filter((worker) => !worker.isDead());
      const exits = running.map(
        (worker) => new Promise<void>((resolve) => worker.process.once('exit', () => resolve())),
      );
      for (const worker of running) worker.process.kill('SIGTERM');
      const allDone = Promise.all(exits).then(() => true);
      if (!(await Promise.race([allDone, sleep(stopWithinMs).then(() => false)]))) {
        logger.warn('Web workers did not stop within 20 s; ending them.');
        for (const worker of running) if (!worker.isDead()) worker.process.kill('SIGKILL');
        await allDone;
      }
    },
  };
}
