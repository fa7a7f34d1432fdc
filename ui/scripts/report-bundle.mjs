// Measures the JavaScript a browser must fetch before the first screen: the entry script of
// dist/index.html plus every chunk it preloads, gzip-compressed as a server would send it.
// Fails the build when the total exceeds the budget, so a heavy import cannot slip into it.
import { readFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';

const BUDGET_KB = 250;
const distDir = join(dirname(fileURLToPath(import.meta.url)), '..', 'dist');
const html = readFileSync(join(distDir, 'index.html'), 'utf8');

const scripts = new Set();
for (const match of html.matchAll(/<script[^>]+src="([^"]+\.js)"/g)) scripts.add(match[1]);
for (const match of html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+\.js)"/g)) scripts.add(match[1]);
for (const match of html.matchAll(/<link[^>]+href="([^"]+\.js)"[^>]+rel="modulepreload"/g)) scripts.add(match[1]);

let totalGzipBytes = 0;
let totalRawBytes = 0;
const rows = [];
for (const src of scripts) {
  const content = readFileSync(join(distDir, src.replace(/^\//, '')));
  const gzipBytes = gzipSync(content, { level: 9 }).length;
  totalGzipBytes += gzipBytes;
  totalRawBytes += content.length;
  rows.push(`  ${src}  ${(content.length / 1000).toFixed(1)} kB raw, ${(gzipBytes / 1000).toFixed(1)} kB gzip`);
}

// kB = 1000 bytes, as Vite prints them
const totalKb = totalGzipBytes / 1000;
console.log(`initial JS (entry + preloaded chunks):\n${rows.join('\n')}`);
console.log(`bench ui-initial-js: ${totalKb.toFixed(1)} kB gzip (target <= ${BUDGET_KB} kB gzip; ${(totalRawBytes / 1000).toFixed(1)} kB raw)`);
if (totalKb > BUDGET_KB) {
  console.error(`initial JS is over budget: ${totalKb.toFixed(1)} kB gzip > ${BUDGET_KB} kB`);
  process.exit(1);
}
