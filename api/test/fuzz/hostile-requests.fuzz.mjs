// The fuzz suite of `npm test`: several thousand hostile requests against the running, seeded app
// (BASE_URL), every route read from its own OpenAPI document. It asserts that nothing answers 5xx,
// that no answer carries a stack trace or SQL text, and that /api/health, polled from a worker
// thread all along, answers within 200 ms throughout. Bounded by FUZZ_SECONDS (default 60).
//
// It writes to the database it is pointed at (links, sites, revisions): run it on a throwaway one.
import { after, before, describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import http from 'node:http';
import { Worker } from 'node:worker_threads';

const BASE_URL = (process.env.BASE_URL ?? 'http://127.0.0.1:3100').replace(/\/$/, '');
const DEMO_PASSWORD = process.env.DEMO_PASSWORD ?? 'demo-pass-2026';
const FUZZ_SECONDS = Number(process.env.FUZZ_SECONDS ?? 60);
const CONCURRENCY = 2;
const HEALTH_BOUND_MS = 200;
const MIN_REQUESTS = 3000;

// A deterministic generator (mulberry32) so a failing run can be replayed with the same FUZZ_SEED.
const seed = Number(process.env.FUZZ_SEED ?? 20261203);
function mulberry32(state) {
  return () => {
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), 1 | state);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const random = mulberry32(seed);
const pick = (items) => items[Math.floor(random() * items.length)];

/** Answers that leak internals: a stack frame, a file path, or the database's own words. */
const LEAKS = [
  /\bat [\w.<>]+ \(.*:\d+:\d+\)/,
  /node_modules|\/work\/|dist\/[\w/-]+\.js/,
  /QueryFailedError|EntityNotFound|TypeORMError/,
  /\b(SELECT|INSERT INTO|UPDATE \w+ SET|DELETE FROM)\b/,
  /syntax error at or near|violates (foreign key|unique|check|not-null) constraint|duplicate key value|invalid input syntax for type|relation "\w+"/,
];

const HOSTILE_STRINGS = [
  '',
  '\u0000',
  'name\u0000with-nul',
  'bell\u0007',
  '\u001b[31mred',
  'x'.repeat(70_000),
  '../../../../etc/passwd',
  '..%2f..%2f..%2fetc%2fpasswd',
  "'; DROP TABLE links; --",
  '" OR 1=1 --',
  '<script>alert(1)</script>',
  '\u202etxt.exe',
  '\ud800',
  '__proto__',
  'constructor',
  '%00',
  '${7*7}{{7*7}}',
  '😀'.repeat(500),
];
const HOSTILE_NUMBERS = [0, -0, -1, 1, 0.5, 1e-17, 1e-300, 5e-324, 1e308, -1e308, 2 ** 53 + 1, -(2 ** 31), 123456789.123];
const HOSTILE_OTHERS = [null, true, false, [], {}, [1, 2, 3], { nested: { deeper: [null] } }, 'NaN', 'Infinity', '1e400'];
const PROBABILITIES = [0, 1, -1e-9, 1e-300, 1e-17, 1e-16, 1e-9, 5e-324, 0.5, 0.9999999, 2];

/** Raw bodies JSON.parse would mangle or choke on; sent as application/json text. */
const RAW_BODIES = [
  '{"name":',
  '[]',
  '"a string"',
  '123',
  'null',
  '{"__proto__":{"polluted":true},"constructor":{"prototype":{"polluted":true}}}',
  '{"design":{"rangeM":1e400}}',
  `${'['.repeat(5000)}${']'.repeat(5000)}`,
  `{"a":${'{"a":'.repeat(2000)}1${'}'.repeat(2000)}}`,
  '\ufeff{"email":"a@b.c","password":"x"}',
  '{"email":"a@b.c","email":"b@c.d","password":"x"}',
];

function leavesOf(value, path = []) {
  if (value === null || typeof value !== 'object') return [path];
  const entries = Array.isArray(value) ? value.map((item, index) => [index, item]) : Object.entries(value);
  if (entries.length === 0) return [path];
  return entries.flatMap(([key, item]) => leavesOf(item, [...path, key]));
}

function withLeaf(value, path, replacement) {
  if (path.length === 0) return replacement;
  const copy = Array.isArray(value) ? [...value] : { ...value };
  copy[path[0]] = withLeaf(value[path[0]], path.slice(1), replacement);
  return copy;
}

function leafAt(value, path) {
  return path.reduce((node, key) => (node == null ? undefined : node[key]), value);
}

/** A plausible body from an OpenAPI schema, so mutations start from something near valid. */
function sampleFromSchema(schema, name = '') {
  if (!schema) return {};
  if (schema.oneOf || schema.anyOf) return sampleFromSchema((schema.oneOf ?? schema.anyOf)[0], name);
  if (schema.allOf) return Object.assign({}, ...schema.allOf.map((part) => sampleFromSchema(part, name)));
  if (schema.enum) return schema.enum[0];
  if (schema.default !== undefined) return schema.default;
  switch (schema.type) {
    case 'object':
      return Object.fromEntries(Object.entries(schema.properties ?? {}).map(([key, child]) => [key, sampleFromSchema(child, key)]));
    case 'array':
      return [sampleFromSchema(schema.items, name)];
    case 'integer':
      return Math.max(1, schema.minimum ?? 1);
    case 'number':
      return schema.minimum !== undefined && schema.maximum !== undefined ? (schema.minimum + schema.maximum) / 2 : (schema.minimum ?? 1);
    case 'boolean':
      return false;
    case 'string':
      if (schema.format === 'uuid') return '00000000-0000-4000-8000-000000000000';
      if (schema.format === 'email') return 'fuzz@demo.test';
      return `fuzz ${name}`.slice(0, schema.maxLength ?? 50);
    default:
      return {};
  }
}

/** The server's event-loop figures, when npm test runs it with the probe (EVENT_LOOP_REPORT). */
function readEventLoopReport() {
  const file = process.env.EVENT_LOOP_REPORT;
  if (!file) return undefined;
  try {
    return JSON.parse(readFileSync(file, 'utf8'));
  } catch {
    return undefined;
  }
}

async function signIn(email) {
  const response = await fetch(`${BASE_URL}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  assert.equal(response.status, 200, `signing in as ${email}`);
  const body = await response.json();
  return body.accessToken;
}

/** Sends one request with exactly these headers (node:http lets a test declare a false Content-Length). */
function rawRequest({ method, path, headers, body }) {
  return new Promise((resolve) => {
    const url = new URL(path, BASE_URL);
    const startedAt = performance.now();
    const request = http.request(url, { method, headers, timeout: 15_000 }, (response) => {
      let text = '';
      response.setEncoding('utf8');
      response.on('data', (chunk) => (text += chunk));
      response.on('end', () => resolve({ status: response.statusCode ?? 0, text, elapsedMs: performance.now() - startedAt }));
      response.on('error', () => resolve({ status: response.statusCode ?? 0, text, elapsedMs: performance.now() - startedAt }));
    });
    request.on('timeout', () => request.destroy(new Error('timeout')));
    // The server may close the connection as soon as it refuses a declared body: that is the point.
    request.on('error', (error) => resolve({ status: -1, text: String(error.message), elapsedMs: performance.now() - startedAt, socketError: true }));
    if (body !== undefined) request.write(body);
    request.end();
  });
}

describe('hostile requests against every route of the OpenAPI document', () => {
  const cases = [];
  const outcomes = [];
  let tokens;
  let health;

  before(async () => {
    const documentResponse = await fetch(`${BASE_URL}/api/docs-json`);
    assert.equal(documentResponse.status, 200, 'the OpenAPI document is served');
    const openApi = await documentResponse.json();
    tokens = {
      engineer: await signIn('engineer@demo.test'),
      reviewer: await signIn('reviewer@demo.test'),
      installer: await signIn('installer@demo.test'),
      admin: await signIn('admin@demo.test'),
    };
    const authorised = (role) => ({ authorization: `Bearer ${tokens[role]}` });
    const links = await (await fetch(`${BASE_URL}/api/links?pageSize=100`, { headers: authorised('engineer') })).json();
    const realLinkIds = links.items.map((link) => link.id);
    const detail = await (await fetch(`${BASE_URL}/api/links/${realLinkIds[0]}`, { headers: authorised('engineer') })).json();
    const realDesign = detail.design;
    const sites = await (await fetch(`${BASE_URL}/api/sites`, { headers: authorised('engineer') })).json();
    const realSiteIds = (sites.items ?? sites).map((site) => site.id);
    assert.ok(realLinkIds.length > 0 && realDesign && realSiteIds.length > 0, 'the seeded demo is there to aim at');

    const hostileIds = ['not-a-uuid', '../../etc/passwd', '%00', "1' OR '1'='1", '00000000-0000-4000-8000-000000000000', 'x'.repeat(3000), '-1', '1e309', '__proto__'];
    const hostileRevisions = ['0', '-1', '1.5', '99999999999999999999', 'NaN', '1e3', 'abc', '%00'];
    const roleFor = (path) => (/(approve|return)$/.test(path) ? 'reviewer' : /install$/.test(path) ? 'installer' : 'engineer');

    for (const [template, operations] of Object.entries(openApi.paths)) {
      for (const [method, operation] of Object.entries(operations)) {
        const verb = method.toUpperCase();
        // sign-out would end the very sessions the rest of the run uses: it gets forged tokens only
        const endsSession = template === '/api/auth/logout';
        const role = endsSession ? 'garbage' : roleFor(template);
        const destructive = verb === 'DELETE';
        const pathWith = (id, revision = '1') => template.replace('{id}', encodeURIComponent(id)).replace('{revision}', encodeURIComponent(revision));
        const ids = template.includes('{id}')
          ? [...hostileIds, ...(destructive ? [] : template.startsWith('/api/sites') ? realSiteIds.slice(0, 2) : realLinkIds.slice(0, 2))]
          : [''];
        const revisions = template.includes('{revision}') ? [...hostileRevisions, '1', '2'] : ['1'];
        const bodySchema = operation.requestBody?.content?.['application/json']?.schema;
        let baseBody = bodySchema ? sampleFromSchema(bodySchema) : undefined;
        if (baseBody && typeof baseBody === 'object' && 'design' in baseBody) baseBody = { ...baseBody, design: realDesign };
        if (baseBody && typeof baseBody === 'object' && 'baseRevision' in baseBody) baseBody = { ...baseBody, baseRevision: 1 };

        // path parameters, with and without a body, under every role and none
        for (const id of ids) {
          for (const revision of revisions.slice(0, template.includes('{revision}') ? revisions.length : 1)) {
            cases.push({ method: verb, path: pathWith(id, revision), role, json: baseBody });
          }
        }
        const realPath = pathWith(template.startsWith('/api/sites') ? realSiteIds[0] : realLinkIds[0], '1');
        if (!destructive) {
          for (const who of endsSession ? [undefined, 'garbage'] : [undefined, 'admin', 'installer', 'reviewer', 'garbage']) {
            cases.push({ method: verb, path: realPath, role: who, json: baseBody });
          }
        }

        // query parameters: the declared ones and some that are not declared
        for (const parameter of operation.parameters ?? []) {
          if (parameter.in !== 'query') continue;
          const names = parameter.schema?.properties ? Object.keys(parameter.schema.properties) : [parameter.name];
          for (const name of [...names, 'q', '__proto__', 'constructor[prototype][polluted]']) {
            for (const value of [...HOSTILE_STRINGS.slice(0, 12), '-1', '0', '1e309', 'NaN', '99999999999999999999']) {
              cases.push({ method: verb, path: `${realPath}?${encodeURIComponent(name)}=${encodeURIComponent(value)}`, role });
            }
            cases.push({ method: verb, path: `${realPath}?${name}[]=a&${name}[]=b`, role });
            cases.push({ method: verb, path: `${realPath}?${name}[a][b][c]=d`, role });
          }
        }

        if (!baseBody || destructive) continue;
        const bodyPath = realPath;
        // every leaf of the body, replaced by every kind of hostile value
        for (const leaf of leavesOf(baseBody)) {
          const current = leafAt(baseBody, leaf);
          const key = String(leaf.at(-1) ?? '');
          const replacements = /probability/i.test(key)
            ? PROBABILITIES
            : typeof current === 'number'
              ? [...HOSTILE_NUMBERS, ...HOSTILE_OTHERS.slice(0, 4), '12']
              : typeof current === 'string'
                ? [...HOSTILE_STRINGS, 42, null, ['list']]
                : [...HOSTILE_OTHERS, ...HOSTILE_NUMBERS.slice(0, 3), HOSTILE_STRINGS[1]];
          for (const replacement of replacements) cases.push({ method: verb, path: bodyPath, role, json: withLeaf(baseBody, leaf, replacement) });
        }
        // keys that are not in the schema, prototype keys, and whole bodies of the wrong shape
        cases.push({ method: verb, path: bodyPath, role, raw: JSON.stringify(baseBody).replace(/^\{/, '{"__proto__":{"isAdmin":true},"extra":1,') });
        for (const raw of RAW_BODIES) cases.push({ method: verb, path: bodyPath, role, raw });
        // wrong content types
        for (const contentType of ['text/plain', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x', 'application/xml', 'application/json; charset=utf-16']) {
          cases.push({ method: verb, path: bodyPath, role, raw: JSON.stringify(baseBody), contentType });
        }
        // a declared body far over the limit, and a declared length the body does not match
        cases.push({ method: verb, path: bodyPath, role, raw: '{"a":1}', declaredLength: 500 * 1024 * 1024 });
        cases.push({ method: verb, path: bodyPath, role, raw: JSON.stringify(baseBody), declaredLength: 3 });
      }
    }
    // traversal and odd paths outside the documented routes
    for (const path of ['/api/../../etc/passwd', '/api/%2e%2e/%2e%2e/etc/passwd', '/api/links/..%2f..%2f', '/api/docs/../../package.json', '/%00', '/api/links%00', '/api/' + 'a'.repeat(5000)]) {
      cases.push({ method: 'GET', path, role: 'engineer' });
    }

    health = new Worker(new URL('./health-watch.mjs', import.meta.url), { workerData: { healthUrl: `${BASE_URL}/api/health`, intervalMs: 100 } });
  });

  after(async () => {
    await health?.terminate();
  });

  it(`answers ${MIN_REQUESTS}+ hostile requests with no 5xx, no leaked internals, and a responsive health route`, async () => {
    // shuffle (seeded) so no route is starved when the time bound ends the run
    for (let index = cases.length - 1; index > 0; index -= 1) {
      const other = Math.floor(random() * (index + 1));
      [cases[index], cases[other]] = [cases[other], cases[index]];
    }
    // the server's event-loop probe (npm test preloads it) measures from here on
    await fetch(`${BASE_URL}/api/health`, { headers: { 'x-event-loop-probe': 'reset' } });
    const startedAt = performance.now();
    const deadline = startedAt + FUZZ_SECONDS * 1000;
    let next = 0;
    async function worker() {
      while (next < cases.length && performance.now() < deadline) {
        const item = cases[next++];
        const headers = {};
        if (item.role === 'garbage') headers.authorization = `Bearer ${pick(['x', 'eyJhbGciOiJub25lIn0.eyJzdWIiOiIxIn0.', `${tokens.engineer}x`])}`;
        else if (item.role) headers.authorization = `Bearer ${tokens[item.role]}`;
        let body;
        if (item.raw !== undefined) body = item.raw;
        else if (item.json !== undefined && item.method !== 'GET' && item.method !== 'DELETE') body = JSON.stringify(item.json);
        if (body !== undefined) {
          headers['content-type'] = item.contentType ?? 'application/json';
          headers['content-length'] = String(item.declaredLength ?? Buffer.byteLength(body));
        }
        const outcome = await rawRequest({ method: item.method, path: item.path, headers, body });
        outcomes.push({ ...outcome, method: item.method, path: item.path.slice(0, 160) });
      }
    }
    await Promise.all(Array.from({ length: CONCURRENCY }, worker));
    const elapsedS = (performance.now() - startedAt) / 1000;
    health.postMessage('stop');
    const healthReport = await new Promise((resolve) => health.once('message', resolve));

    const byStatus = {};
    for (const outcome of outcomes) byStatus[outcome.status] = (byStatus[outcome.status] ?? 0) + 1;
    const serverErrors = outcomes.filter((outcome) => outcome.status >= 500);
    const leaks = outcomes.filter((outcome) => LEAKS.some((pattern) => pattern.test(outcome.text)));
    // A refused declared body may end in a reset while the client still writes: never anything else.
    const dropped = outcomes.filter((outcome) => outcome.status === -1 && !/ECONNRESET|EPIPE|socket hang up/.test(outcome.text));
    const slowestAnswer = outcomes.reduce((slowest, outcome) => (outcome.elapsedMs > slowest.elapsedMs ? outcome : slowest), { elapsedMs: 0 });

    console.log(`fuzz: ${outcomes.length} of ${cases.length} prepared requests in ${elapsedS.toFixed(1)} s (bound ${FUZZ_SECONDS} s, ${CONCURRENCY} at a time, seed ${seed}); statuses ${JSON.stringify(byStatus)}`);
    const resets = outcomes.filter((outcome) => outcome.status === -1);
    if (resets.length) console.log(`fuzz: ${resets.length} connection(s) closed by the server before an answer was read: ${JSON.stringify(resets.slice(0, 3).map(({ method, path, text }) => `${method} ${path.slice(0, 60)}: ${text}`))}`);
    console.log(`fuzz: slowest answer ${slowestAnswer.elapsedMs.toFixed(1)} ms (${slowestAnswer.method} ${slowestAnswer.path})`);
    const loop = readEventLoopReport();
    if (loop) console.log(`fuzz: the server's longest event-loop block during the run: ${loop.maxMs} ms (p99 ${loop.p99Ms} ms, mean ${loop.meanMs} ms over ${loop.samples} samples of 10 ms)`);
    console.log(`fuzz: /api/health polled ${healthReport.samples} times: p50 ${healthReport.p50Ms.toFixed(1)} ms, p99 ${healthReport.p99Ms.toFixed(1)} ms, max ${healthReport.maxMs.toFixed(1)} ms (bound ${HEALTH_BOUND_MS} ms)`);

    assert.deepEqual(serverErrors.slice(0, 5).map(({ method, path, status, text }) => ({ method, path, status, text: text.slice(0, 200) })), [], 'no 5xx');
    assert.deepEqual(leaks.slice(0, 5).map(({ method, path, status, text }) => ({ method, path, status, text: text.slice(0, 300) })), [], 'no stack or SQL text');
    assert.deepEqual(dropped.slice(0, 5).map(({ method, path, text }) => ({ method, path, text })), [], 'no request left unanswered');
    assert.ok(outcomes.length >= MIN_REQUESTS, `at least ${MIN_REQUESTS} requests were sent (${outcomes.length})`);
    assert.deepEqual(healthReport.failures, [], '/api/health answered 200 every time');
    assert.ok(healthReport.maxMs < HEALTH_BOUND_MS, `/api/health stayed under ${HEALTH_BOUND_MS} ms (max ${healthReport.maxMs.toFixed(1)} ms)`);
  });
});
