// Preloaded into the test server (node --import) by `npm test`: measures how long the event loop
// was blocked while the server served the browser tests and the fuzz suite, so the fuzz suite can
// state its longest block. Measuring starts at the first request (the boot's module loading is not
// a block a user meets); the figures are written as JSON to EVENT_LOOP_REPORT every second (NestJS
// ends the process by re-raising the signal, so an exit handler would not run).
import { subscribe, unsubscribe } from 'node:diagnostics_channel';
import { writeFileSync } from 'node:fs';
import { monitorEventLoopDelay } from 'node:perf_hooks';

const reportFile = process.env.EVENT_LOOP_REPORT;
const histogram = monitorEventLoopDelay({ resolution: 10 });
let measuring = false;

function startMeasuring() {
  unsubscribe('http.server.request.start', startMeasuring);
  measuring = true;
  histogram.enable();
}
subscribe('http.server.request.start', startMeasuring);

function writeReport() {
  if (!measuring) return;
  const ms = (nanoseconds) => Math.round(nanoseconds / 1e4) / 100;
  writeFileSync(reportFile, JSON.stringify({ maxMs: ms(histogram.max), p99Ms: ms(histogram.percentile(99)), meanMs: ms(histogram.mean), samples: histogram.count }));
}
if (reportFile) setInterval(writeReport, 1000).unref();
