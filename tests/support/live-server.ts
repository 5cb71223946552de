import fs from 'node:fs';
import path from 'node:path';
import type { Server } from 'node:http';
import { projectRoot } from '../../server/config/env';
import { createTestApp } from './test-app';
import { freePort } from './free-port';

/** The real server with the built client, listening on a free loopback port, for browser tests. */
export async function startLiveServer() {
  if (!fs.existsSync(path.join(projectRoot, 'dist', 'client', 'index.html'))) {
    throw new Error('The client is not built: run "npm run build" (npm test does this first).');
  }
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  // Links in caught mail point at this very server.
  const { app, sequelize, close } = await createTestApp({ publicUrl: baseUrl });
  const server: Server = await new Promise((resolve) => {
    const listening = app.listen(port, '127.0.0.1', () => resolve(listening));
  });
  return {
    baseUrl,
    sequelize,
    async stop() {
      server.closeAllConnections();
      await new Promise((resolve) => server.close(resolve));
      await close();
    },
  };
}
