// Loaded by index.html before the app's modules. zod probes whether the page allows `new Function`
// when its first object schema is built, and a strict Content-Security-Policy (script-src 'self',
// no 'unsafe-eval') reports that probe as a violation even though zod handles the refusal. Under
// `jitless` it never probes and parses with its interpreter, which is as correct. It must be set
// before any module runs: the bundler evaluates shared chunks (where the schemas are built) before
// the entry's own code, so a call in the entry would come too late.
globalThis.__zod_globalConfig = Object.assign(globalThis.__zod_globalConfig || {}, { jitless: true });
