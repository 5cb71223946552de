import type { RequestHandler } from 'express';

/**
 * Counts the API route handlers of one app that have started and not yet ended. A handler goes on
 * when its client goes away (a closed tab, a proxy's timeout): its connection is gone but its
 * statements, upload thread and session write are not. Stopping a process waits for these too
 * (boot/web.ts), not only for open connections, before it closes the pools and threads they use.
 */
export function createHandlersInProgress() {
  let running = 0;
  let whenIdle: Array<() => void> = [];

  const ended = () => {
    running -= 1;
    if (running > 0) return;
    const waiting = whenIdle;
    whenIdle = [];
    for (const resolve of waiting) resolve();
  };

  return {
    get running() {
      return running;
    },
    /** The handler, counted from its call until its promise settles (Express 5 passes a rejection to next). */
    track(handler: RequestHandler): RequestHandler {
      return async (req, res, next) => {
        running += 1;
        try {
          await handler(req, res, next);
        } finally {
          ended();
        }
      };
    },
    /** Resolves true once no handler runs, or false at `deadline` (ms since the epoch) if some still do. */
    settled(deadline: number): Promise<boolean> {
      if (running === 0) return Promise.resolve(true);
      return new Promise<boolean>((resolve) => {
        const timer = setTimeout(() => resolve(false), Math.max(0, deadline - Date.now()));
        whenIdle.push(() => {
          clearTimeout(timer);
          resolve(true);
        });
      });
    },
  };
}
