// Preloaded into the test server (node --import) by `npm test`: measures how long the event loop
// was blocked, so the fuzz suite can state its longest block. Measuring starts at the first request
// (the boot's module loading is not a block a user meets) and starts afresh on a request that
// carries `x-event-loop-probe: reset` (the fuzz suite sends one as it begins, so its figure covers
// its own run only). The figures are written as JSON to EVENT_LOOP_REPORT every 200 ms: NestJS
// ends the process by re-raising the signal, so an exit handler would not run.
import { subscribe } from 'node:diagnostics_channel';
import { writeFileSync } from 'node:fs';
import { monitorEventLoopDelay } from 'node:perf_hooks';

const reportFile = process.env.EVENT_LOOP_REPORT;
const histogram = monitorEventLoopDelay({ resolution: 10 });
let measuring = false;
let since = new Date().toISOString();

subscribe('http.server.request.start', ({ request }) => {
  if (!measuring) {
    measuring = true;
    histogram.enable();
  }
  if (request.headers['x-event-loop-probe'] === 'reset') {
    histogram.reset();
    since = new Date().toISOString();
  }
});

function writeReport() {
  if (!measuring) return;
  const ms = (nanoseconds) => Math.round(nanoseconds / 1e4) / 100;
  writeFileSync(reportFile, JSON.stringify({ since, maxMs: ms(histogram.max), p99Ms: ms(histogram.percentile(99)), meanMs: ms(histogram.mean), samples: histogram.count }));
}
if (reportFile) setInterval(writeReport, 200).unref();
