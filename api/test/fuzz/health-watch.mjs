// Worker thread of the fuzz suite: polls /api/health on its own event loop, so the latency it
// measures is the server's, not the fuzzer's. Posts { samples, maxMs, slowest } when told to stop.
import { parentPort, workerData } from 'node:worker_threads';

const { healthUrl, intervalMs } = workerData;
const latencies = [];
const slowest = [];
let stopped = false;

parentPort.on('message', (message) => {
  if (message === 'stop') stopped = true;
});

while (!stopped) {
  const startedAt = performance.now();
  let status;
  try {
    const response = await fetch(healthUrl, { signal: AbortSignal.timeout(5000) });
    status = response.status;
    await response.arrayBuffer();
  } catch {
    status = -1;
  }
  const elapsedMs = performance.now() - startedAt;
  latencies.push(elapsedMs);
  if (status !== 200) slowest.push({ elapsedMs, status });
  await new Promise((resolve) => setTimeout(resolve, intervalMs));
}
latencies.sort((a, b) => a - b);
parentPort.postMessage({
  samples: latencies.length,
  maxMs: latencies.at(-1) ?? 0,
  p50Ms: latencies[Math.floor(latencies.length / 2)] ?? 0,
  p99Ms: latencies[Math.floor(latencies.length * 0.99)] ?? 0,
  failures: slowest,
});
