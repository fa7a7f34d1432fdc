// zod compiles object parsers with `new Function` when the page allows it; probing for that is a
// CSP violation under `script-src 'self'`, so parse without it (the interpreter is as correct).
// Its own module, bundled with zod itself (vite.config.ts): it runs before any schema is built,
// whichever chunk the bundler puts a schema in.
import * as z from 'zod/mini';

z.config({ jitless: true });
