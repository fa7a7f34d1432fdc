import { readFileSync } from 'node:fs';
import { expect, it } from 'vitest';
import { LINK_CORE_VERSION } from './version.js';

it('LINK_CORE_VERSION follows the package version (stored with every revision)', () => {
  const manifest = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version: string };
  expect(LINK_CORE_VERSION).toBe(manifest.version);
});
