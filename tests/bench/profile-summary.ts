/**
 * Where a CPU profile's time went: `npx tsx tests/bench/profile-summary.ts <file.cpuprofile>`
 * (from `npm run bench:load` with BENCH_LOAD_CPU_PROF=<folder>). Prints self time by package (or
 * our own folder), the top functions by self time, and the inclusive time of our own functions.
 */
import fs from 'node:fs';

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  children?: number[];
}
interface Profile {
  nodes: ProfileNode[];
  samples: number[];
  timeDeltas: number[];
}

const file = process.argv[2];
if (!file) throw new Error('usage: profile-summary.ts <file.cpuprofile>');
const profile = JSON.parse(fs.readFileSync(file, 'utf8')) as Profile;
const byId = new Map(profile.nodes.map((node) => [node.id, node]));
const parent = new Map<number, number>();
for (const node of profile.nodes) for (const child of node.children ?? []) parent.set(child, node.id);

const selfMs = new Map<number, number>();
profile.samples.forEach((id, i) => selfMs.set(id, (selfMs.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0) / 1000));
const total = [...selfMs.values()].reduce((sum, ms) => sum + ms, 0);

function where(url: string): string {
  if (!url) return '(native/idle)';
  if (url.startsWith('node:')) return 'node core';
  const modules = url.split('node_modules/');
  if (modules.length > 1) {
    const rest = modules.at(-1)!.split('/');
    return rest[0]!.startsWith('@') ? `${rest[0]}/${rest[1]}` : rest[0]!;
  }
  return url.includes('/dist/server/') ? 'halflight (dist/server)' : url.replace(/^.*\/(server|shared)\//, '$1/');
}

const label = (node: ProfileNode) =>
  `${node.callFrame.functionName || '(anonymous)'} ${where(node.callFrame.url)}:${node.callFrame.lineNumber + 1}`;
const add = (map: Map<string, number>, key: string, ms: number) => map.set(key, (map.get(key) ?? 0) + ms);
const byPackage = new Map<string, number>();
const byFunction = new Map<string, number>();
const inclusiveOurs = new Map<string, number>();
for (const [id, ms] of selfMs) {
  const node = byId.get(id)!;
  add(byPackage, where(node.callFrame.url), ms);
  add(byFunction, label(node), ms);
  // Inclusive time of our own named functions on the stack (each counted once per sample).
  const seen = new Set<string>();
  for (let at: number | undefined = id; at !== undefined; at = parent.get(at)) {
    const frame = byId.get(at)!;
    if (frame.callFrame.url.includes('/dist/server/') && frame.callFrame.functionName) {
      const key = label(frame);
      if (!seen.has(key)) add(inclusiveOurs, key, ms);
      seen.add(key);
    }
  }
}

const show = (title: string, map: Map<string, number>, count: number) => {
  console.log(`\n${title}`);
  for (const [key, ms] of [...map].sort((a, b) => b[1] - a[1]).slice(0, count))
    console.log(`  ${((100 * ms) / total).toFixed(1).padStart(5)} %  ${ms.toFixed(0).padStart(7)} ms  ${key}`);
};
console.log(`${file}: ${(total / 1000).toFixed(1)} s sampled`);
show('self time by package', byPackage, 25);
show('top functions by self time', byFunction, 30);
show('inclusive time of our functions', inclusiveOurs, 30);
