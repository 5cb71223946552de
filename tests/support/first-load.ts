import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

/*
 * What a browser downloads before a screen can draw: the entry file of index.html and every file
 * it imports, plus the modules of the screen's routes (layouts and screen, loaded on demand) and
 * every file those import, read from Vite's build manifest (dist/.vite/manifest.json). Sizes are
 * deterministic: each file compressed alone, as the server sends it, with gzip at level 9 and
 * brotli at quality 11.
 */

interface ManifestChunk {
  file: string;
  imports?: string[];
  css?: string[];
}

/** A screen's route modules (as keyed in the manifest) and its budget for compressed JavaScript. */
export interface FirstLoadBudget {
  screen: string;
  routeModules: string[];
  /** The most brotli-compressed JavaScript allowed before the screen draws, in bytes (1 kB = 1000 bytes). */
  brotliBudget: number;
}

export const firstLoadBudgets: FirstLoadBudget[] = [
  { screen: 'sign-in', routeModules: ['src/routes/sign-in.tsx'], brotliBudget: 120_000 },
  {
    screen: 'study',
    routeModules: ['src/routes/root-layout.tsx', 'src/routes/lab-layout.tsx', 'src/routes/study.tsx'],
    brotliBudget: 250_000,
  },
];

export interface FirstLoad {
  screen: string;
  files: string[];
  js: { raw: number; gzip: number; brotli: number };
  css: { raw: number; gzip: number; brotli: number };
}

function readManifest(distDir: string): Record<string, ManifestChunk> {
  const file = path.join(distDir, '.vite', 'manifest.json');
  if (!fs.existsSync(file)) throw new Error(`No build manifest at ${file}: run "npm run build" first.`);
  return JSON.parse(fs.readFileSync(file, 'utf8')) as Record<string, ManifestChunk>;
}

function compressedSizes(files: string[]) {
  const sizes = { raw: 0, gzip: 0, brotli: 0 };
  for (const file of files) {
    const bytes = fs.readFileSync(file);
    sizes.raw += bytes.length;
    sizes.gzip += zlib.gzipSync(bytes, { level: 9 }).length;
    sizes.brotli += zlib.brotliCompressSync(bytes, {
      params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 11, [zlib.constants.BROTLI_PARAM_SIZE_HINT]: bytes.length },
    }).length;
  }
  return sizes;
}

/** The files and compressed sizes of one screen's first load in a finished build. */
export function measureFirstLoad(distDir: string, budget: FirstLoadBudget): FirstLoad {
  const manifest = readManifest(distDir);
  const keys = new Set<string>();
  const visit = (key: string) => {
    const chunk = manifest[key];
    if (!chunk) throw new Error(`The build manifest has no entry for ${key}.`);
    if (keys.has(key)) return;
    keys.add(key);
    for (const imported of chunk.imports ?? []) visit(imported);
  };
  for (const key of ['index.html', ...budget.routeModules]) visit(key);
  const js = [...keys].map((key) => manifest[key]!.file);
  const css = [...new Set([...keys].flatMap((key) => manifest[key]!.css ?? []))];
  return {
    screen: budget.screen,
    files: [...js, ...css],
    js: compressedSizes(js.map((file) => path.join(distDir, file))),
    css: compressedSizes(css.map((file) => path.join(distDir, file))),
  };
}

const kB = (bytes: number) => `${(bytes / 1000).toFixed(1)} kB`;

/** One line per screen, e.g. "first load sign-in: JS 370.8 kB, gzip 119.0 kB, brotli 103.7 kB (budget 120.0 kB) ...". */
export function describeFirstLoad(load: FirstLoad, budget: FirstLoadBudget): string {
  return (
    `first load ${load.screen}: JS ${kB(load.js.raw)}, gzip ${kB(load.js.gzip)}, brotli ${kB(load.js.brotli)} ` +
    `(budget ${kB(budget.brotliBudget)} brotli) in ${load.files.length} files; ` +
    `CSS ${kB(load.css.raw)}, gzip ${kB(load.css.gzip)}, brotli ${kB(load.css.brotli)}`
  );
}
