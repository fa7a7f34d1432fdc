// Runs before any zod schema is built in the worker (see ui/public/zod-jitless.js for the page).
const holder = globalThis as { __zod_globalConfig?: Record<string, unknown> };
holder.__zod_globalConfig = Object.assign(holder.__zod_globalConfig ?? {}, { jitless: true });
export {};
