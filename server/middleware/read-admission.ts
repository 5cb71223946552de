import type { RequestHandler, Response } from 'express';
import { unavailable } from '../lib/app-error';

/** How many API reads of one process run at once, and how many may wait for a turn. */
export interface ReadAdmissionSettings {
  /** GET and HEAD API requests of this process that run at the same time. */
  concurrency: number;
  /** Reads that may wait for a turn; one more is answered 503 with Retry-After. */
  queue: number;
  /**
   * Reads that run at once while a request that changes something is in progress in this process
   * (at most `concurrency`): a write's statements each wait for the event loop, so fewer reads
   * beside it let it finish sooner. bench:load, same build, 4 against 2 on a busy machine (bare
   * route and read mix alone within 10 % of each other): writes 4.2 and 6.4/s done of 20 asked,
   * write p50 2,090 and 1,376 ms, p99 8.2 and 6.8 s; reads beside them 27.9 and 25.8 req/s.
   */
  whileWriting: number;
}

/**
 * Four running reads keep a core busy (a read costs ~3 ms of node CPU and waits ~2 ms on
 * PostgreSQL), and fewer in the event loop let writes through: bench:load on this 2-core machine,
 * same minute, 200 connections, 4 against 16 turns: reads 74 and 74 req/s, read p99 6.6 and 11.1 s,
 * writes 7.9 and 1.3 per second (20 asked) under a load average of 12-16 from other work.
 * 500 waiting reads drain in about two seconds at the rate a process serves them.
 */
export const defaultReadAdmission: ReadAdmissionSettings = { concurrency: 4, queue: 500, whileWriting: 2 };

/** Seconds a refused read is told to wait: the queue drains in well under that at any sane load. */
const busyRetryAfterSeconds = 2;

const waitingMethods = new Set(['GET', 'HEAD']);

export interface ReadAdmission {
  /** Mount under /api, before the session middleware (it reads nothing itself). */
  middleware: RequestHandler;
  /** Reads running now, reads waiting for a turn, and writes in progress (for tests and diagnostics). */
  readonly running: number;
  readonly waiting: number;
  readonly writing: number;
}

/**
 * Calls `ended` once, when the answer's headers go out (by then a request has done its database
 * and CPU work; a download to a slow client must not count while its bytes trickle out), or when
 * the connection closes before any header is sent. Node writes headers through writeHead, also
 * when res.end or res.write sends them implicitly; 'finish' is a safety net.
 */
function whenAnswered(res: Response, ended: () => void): void {
  let done = false;
  const end = () => {
    if (done) return;
    done = true;
    ended();
  };
  const writeHead = res.writeHead;
  res.writeHead = function (this: Response, ...args: unknown[]) {
    end();
    return (writeHead as (...all: unknown[]) => Response).apply(this, args);
  } as Response['writeHead'];
  res.once('finish', end);
  res.once('close', end);
}

/**
 * Admission control for API reads. With many clients that never pause, every read of a process
 * used to start at once: a hundred of them queued in the event loop and the database pools, and a
 * request that writes (6-10 round trips one after the other) waited behind that queue at each
 * step. Here at most `concurrency` GET/HEAD requests run; later ones wait in arrival order and
 * start as earlier ones end (their answer's headers go out or the connection closes, counted once).
 * Requests that change something and /api/health never wait, so they meet short queues only.
 * A waiting read whose client has gone away leaves the queue without running; past `queue`
 * waiting reads, a read is refused at once (503, Retry-After) instead of waiting for minutes.
 */
export function createReadAdmission(settings: ReadAdmissionSettings): ReadAdmission {
  const { concurrency, queue } = settings;
  const whileWriting = Math.min(concurrency, settings.whileWriting);
  let running = 0;
  let writing = 0;
  const limit = () => (writing > 0 ? whileWriting : concurrency);
  // A Set keeps insertion order and removes any member in O(1): the FIFO and the way out of it.
  const waiting = new Set<() => void>();

  const admitWaiting = () => {
    while (running < limit() && waiting.size > 0) {
      const turn = waiting.values().next().value!;
      waiting.delete(turn);
      turn();
    }
  };

  const run = (res: Response, next: () => void) => {
    running += 1;
    whenAnswered(res, () => {
      running -= 1;
      admitWaiting();
    });
    next();
  };

  // A request that changes something never waits; while one is in progress, fewer reads start.
  const write = (res: Response, next: () => void) => {
    writing += 1;
    whenAnswered(res, () => {
      writing -= 1;
      admitWaiting();
    });
    next();
  };

  const middleware: RequestHandler = (req, res, next) => {
    if (req.path === '/health') return next();
    if (!waitingMethods.has(req.method)) return write(res, next);
    if (running < limit() && waiting.size === 0) return run(res, next);
    if (waiting.size >= queue) {
      return next(
        unavailable(
          'server_busy',
          'The server has too many requests waiting to be read. Try again in a few seconds.',
          busyRetryAfterSeconds,
        ),
      );
    }
    // A socket destroyed whose 'close' has not been emitted yet is skipped here as well.
    const turn = () => {
      if (!req.socket.destroyed) run(res, next);
    };
    waiting.add(turn);
    // A client that gives up while waiting: its read never runs (a no-op once it has started).
    res.once('close', () => waiting.delete(turn));
  };

  return {
    middleware,
    get running() {
      return running;
    },
    get waiting() {
      return waiting.size;
    },
    get writing() {
      return writing;
    },
  };
}
