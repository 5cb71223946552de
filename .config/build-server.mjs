/* global console */
// Compiles the server to plain JavaScript in dist/server/ so production runs under `node` alone
// (no TypeScript loader in the serving path). Each entry is bundled on its own with our code
// inlined and every npm package left as an import; migrations stay one file each, because the
// migrator finds them by listing the folder, and each worker-thread entry (*.worker.ts) is
// compiled to its source path under dist/server, where its loader looks for it.
import fs from 'node:fs';
import path from 'node:path';
import { build } from 'esbuild';

const root = path.resolve(import.meta.dirname, '..');
const migrations = fs
  .readdirSync(path.join(root, 'server/migrations'))
  .filter((file) => file.endsWith('.ts') && !file.endsWith('.d.ts'))
  .map((file) => `server/migrations/${file}`);
const workers = fs
  .readdirSync(path.join(root, 'server'), { recursive: true })
  .filter((file) => file.endsWith('.worker.ts'))
  .map((file) => `server/${file}`);
const outdir = path.join(root, 'dist/server');

fs.rmSync(outdir, { recursive: true, force: true });
await build({
  absWorkingDir: root,
  entryPoints: ['server/index.ts', ...migrations, ...workers],
  outbase: 'server',
  outdir,
  bundle: true,
  packages: 'external',
  platform: 'node',
  format: 'esm',
  target: 'node20',
  sourcemap: true,
  // Sequelize names each model after its class, and SQL fragments name the models ("Study"."title"):
  // without this the bundler renames clashing classes (_Study) and those queries fail in production.
  keepNames: true,
  alias: { '@shared': './shared', '@server': './server' },
  logLevel: 'warning',
});
console.log(
  `Server compiled to ${path.relative(root, outdir)}/ (${migrations.length} migrations, ${workers.length} worker entries).`,
);
