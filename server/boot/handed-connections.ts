import type { Server } from 'node:http';
import type { Socket } from 'node:net';
import { setTimeout as sleep } from 'node:timers/promises';
import type { ConnectionClosed, HandedConnection } from './connection-balancer';

/**
 * A web worker's HTTP server fed with the connections the primary hands it
 * (connection-balancer.ts) instead of listening on the port itself. Each one that closes is
 * reported back, so the primary knows how many this worker holds.
 *
 * `close` stops taking connections, ends idle ones, lets requests in progress finish (their
 * connections are ended as soon as they are idle) for at most `drainMs`, then ends the rest.
 */
export function serveHandedConnections(server: Server) {
  const open = new Set<Socket>();
  let closing = false;
  // http.Server starts its connection list on 'listening': the headersTimeout and requestTimeout
  // checks, and closeIdleConnections, work on it. This server never listens itself.
  server.emit('listening');

  const onMessage = (message: HandedConnection, socket: Socket | undefined) => {
    if (message?.type !== 'connection' || !socket) return;
    if (closing) {
      socket.destroy();
      return;
    }
    open.add(socket);
    socket.once('close', () => {
      open.delete(socket);
      // Once the primary is gone there is no one to tell (and this worker is stopping).
      if (process.connected) process.send!({ type: 'connection-closed' } satisfies ConnectionClosed, () => {});
    });
    server.emit('connection', socket);
    // The primary accepted it paused (pauseOnConnect); reading starts here.
    socket.resume();
  };
  process.on('message', onMessage);

  return {
    /** Connections open now. */
    get open() {
      return open.size;
    },
    async close(drainMs: number): Promise<void> {
      closing = true;
      // Ends idle connections and the timeout checks (it emits 'close' at once: nothing listens).
      server.close();
      const deadline = Date.now() + drainMs;
      while (open.size > 0 && Date.now() < deadline) {
        await sleep(50);
        server.closeIdleConnections();
      }
      server.closeAllConnections();
    },
  };
}
