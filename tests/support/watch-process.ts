/**
 * Watches this process while `work` runs: asks /api/health one request after another and
 * samples the resident set size, so a test can tell a busy app from a frozen one.
 */
export async function whileWatching<T>(baseUrl: string, work: () => Promise<T>) {
  const latencies: number[] = [];
  let peakRss = process.memoryUsage().rss;
  let done = false;
  const started = performance.now();
  const sampler = setInterval(() => (peakRss = Math.max(peakRss, process.memoryUsage().rss)), 20);
  const health = (async () => {
    while (!done) {
      const asked = performance.now();
      const response = await fetch(`${baseUrl}/api/health`);
      await response.arrayBuffer();
      latencies.push(performance.now() - asked);
      if (response.status !== 200) throw new Error(`/api/health answered ${response.status}`);
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
  })();
  let result: T;
  let seconds: number;
  try {
    result = await work();
    seconds = (performance.now() - started) / 1000;
  } finally {
    done = true;
    clearInterval(sampler);
    await health;
  }
  peakRss = Math.max(peakRss, process.memoryUsage().rss);
  const sorted = [...latencies].sort((a, b) => a - b);
  return {
    result,
    seconds,
    healthAnswers: sorted.length,
    healthMedianMs: sorted[Math.floor(sorted.length / 2)] ?? 0,
    healthP95Ms: sorted[Math.floor(sorted.length * 0.95)] ?? 0,
    healthMaxMs: sorted.at(-1) ?? 0,
    peakRssMb: peakRss / 1024 / 1024,
  };
}

/** One line of figures for the test log: what was sent, the answer, time, memory and /api/health latency. */
export function printWatch(label: string, status: number, watched: Awaited<ReturnType<typeof whileWatching>>) {
  process.stdout.write(
    `${label}: ${status} after ${watched.seconds.toFixed(2)} s; peak RSS ${watched.peakRssMb.toFixed(0)} MB; ` +
      `/api/health median ${watched.healthMedianMs.toFixed(1)} ms, p95 ${watched.healthP95Ms.toFixed(1)} ms, ` +
      `max ${watched.healthMaxMs.toFixed(1)} ms over ${watched.healthAnswers} answers\n`,
  );
}
