import { fileURLToPath, URL } from 'node:url';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';
import { defineConfig } from 'vitest/config';

const alias = {
  '@': fileURLToPath(new URL('./src', import.meta.url)),
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
};

// The API server listens on PORT (default 4310); the Vite dev server proxies /api to it.
const apiPort = process.env.PORT ?? '4310';

export default defineConfig({
  // Brotli and gzip copies of every text asset, made once at build so the server never compresses
  // them per request (server/app.ts serves the copy the browser accepts).
  plugins: [
    react(),
    tailwindcss(),
    compression({ algorithms: ['brotliCompress', 'gzip'], threshold: 1024, logLevel: 'silent' }),
  ],
  resolve: { alias },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  // The client goes to dist/client; the compiled server to dist/server (.config/build-server.mjs).
  build: { outDir: 'dist/client', emptyOutDir: true, chunkSizeWarningLimit: 1500 },
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
