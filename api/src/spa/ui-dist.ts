import { existsSync } from 'node:fs';
import { join } from 'node:path';

/** True when the folder holds a built UI (its index.html). */
export function isUiBuilt(uiDistDir: string): boolean {
  return existsSync(join(uiDistDir, 'index.html'));
}

/** Anything under /api is the API's, never the SPA's (its 404s stay JSON). */
export const API_PATH_PATTERN = /^\/api(\/|$)/;
