import path from 'node:path';
import { fileURLToPath, URL } from 'node:url';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';
import type { Plugin } from 'vite';
import { defineConfig } from 'vitest/config';
import { describeFirstLoad, firstLoadBudgets, measureFirstLoad } from './tests/support/first-load';

const alias = {
  '@': fileURLToPath(new URL('./src', import.meta.url)),
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
};

// The API server listens on PORT (default 4310); the Vite dev server proxies /api to it.
const apiPort = process.env.PORT ?? '4310';

/** After a build, prints what the budgeted screens load first (tests/e2e/first-load-budget.test.ts checks it). */
function firstLoadReport(): Plugin {
  let outDir = 'dist';
  return {
    name: 'halflight-first-load-report',
    apply: 'build',
    configResolved(config) {
      outDir = path.resolve(config.root, config.build.outDir);
    },
    closeBundle() {
      for (const budget of firstLoadBudgets) {
        this.info(describeFirstLoad(measureFirstLoad(outDir, budget), budget));
      }
    },
  };
}

export default defineConfig({
  // Brotli and gzip copies of every text asset, made once at build so the server never compresses
  // them per request (server/app.ts serves the copy the browser accepts).
  plugins: [
    react(),
    tailwindcss(),
    compression({ algorithms: ['brotliCompress', 'gzip'], threshold: 1024, logLevel: 'silent' }),
    firstLoadReport(),
  ],
  resolve: { alias },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  // The client goes to dist/client; the compiled server to dist/server (.config/build-server.mjs).
  build: { outDir: 'dist/client', emptyOutDir: true, manifest: true },
  test: {
    reporters: ['default', './tests/support/plain-summary-reporter.ts'],
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        // React components and pure client logic in a simulated browser (jsdom); no server, no network.
        extends: true,
        test: {
          name: 'component',
          include: ['tests/component/**/*.test.{ts,tsx}'],
          environment: 'jsdom',
          setupFiles: ['tests/support/component-setup.ts'],
          // Waits, not speed targets: a loaded CI machine can take seconds to render a screen.
          testTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/global-database.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
          fileParallelism: false,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/global-database.ts'],
          testTimeout: 60_000,
          hookTimeout: 90_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
