import net from 'node:net';
import type { Worker } from 'node:cluster';

/** Primary to web worker: the socket sent with this message is a new client connection to serve. */
export interface HandedConnection {
  type: 'connection';
}

/** Web worker to primary: one connection it was handed has closed. */
export interface ConnectionClosed {
  type: 'connection-closed';
}

/**
 * The slot to hand the next connection to: the one with the fewest open connections, and among
 * equals the first after `last` (so equal slots take turns). `open[slot]` is undefined for a slot
 * that takes no connections now (starting, or replaced after a crash).
 */
export function leastConnectedSlot(open: ReadonlyArray<number | undefined>, last: number): number | undefined {
  let best: number | undefined;
  for (let step = 1; step <= open.length; step++) {
    const slot = (last + step) % open.length;
    const count = open[slot];
    if (count !== undefined && (best === undefined || count < open[best]!)) best = slot;
  }
  return best;
}

/**
 * The primary's listener when there are several web workers: it accepts each connection without
 * reading from it and sends the socket to the worker that holds the fewest open connections.
 *
 * Why not node:cluster's own hand-out: it gives a queued connection to whichever worker answers
 * the previous hand-out first, so a worker that is busy at that moment (a large answer, a garbage
 * collection) gets fewer of a burst of connections, and keeps fewer for as long as the clients
 * keep them open (browsers, proxies and load generators keep them alive). Each worker then
 * serves its own share of clients at about the same rate, so the clients of the fuller one wait
 * longer: bench:load, 200 connections on 2 workers, measured inside the workers: 155 and 55
 * connections, reads waiting p50 3,024 against 1,111 ms (same rate of answers, 50 and 46 per
 * second), the whole spread of the read mix's latency between its p50 and p99.
 */
export function createConnectionBalancer() {
  /** By slot: the worker taking connections there and its open connections. */
  const slots: Array<{ worker: Worker; open: number } | undefined> = [];
  let last = -1;

  const handOut = (socket: net.Socket) => {
    const slot = leastConnectedSlot(
      slots.map((entry) => entry?.open),
      last,
    );
    if (slot === undefined) {
      // Every worker is starting again after a crash: the client retries, as with a refused connection.
      socket.destroy();
      return;
    }
    last = slot;
    const entry = slots[slot]!;
    entry.open += 1;
    const message: HandedConnection = { type: 'connection' };
    entry.worker.send(message, socket, (error) => {
      if (!error) return;
      // The worker went away as it was sent: the client sees a closed connection.
      socket.destroy();
      if (slots[slot] === entry) entry.open -= 1;
    });
  };

  const server = net.createServer({ pauseOnConnect: true, noDelay: true }, handOut);

  return {
    /** Starts handing connections to the worker in `slot` (once it serves). */
    add(slot: number, worker: Worker): void {
      const entry = { worker, open: 0 };
      slots[slot] = entry;
      worker.on('message', (message: ConnectionClosed) => {
        if (message?.type === 'connection-closed' && entry.open > 0) entry.open -= 1;
      });
    },
    /** Stops handing connections to the worker in `slot` (it ended; its connections ended with it). */
    remove(slot: number, worker: Worker): void {
      if (slots[slot]?.worker === worker) slots[slot] = undefined;
    },
    /** Open connections by slot (undefined: not taking connections), for tests and diagnostics. */
    openBySlot: () => slots.map((entry) => entry?.open),
    listen(port: number, host: string): Promise<void> {
      return new Promise((resolve, reject) => {
        server.once('error', reject);
        server.listen(port, host, () => {
          server.off('error', reject);
          resolve();
        });
      });
    },
    /**
     * Stops accepting. Connections already handed out stay with their workers, which drain them;
     * close's callback would wait for those (node asks each worker), so nothing waits for it here.
     */
    close(): void {
      if (server.listening) server.close();
    },
  };
}
