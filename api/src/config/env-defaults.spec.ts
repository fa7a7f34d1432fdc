import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CHECKOUT_ROOT } from './checkout-paths.js';
import { ENV_DEFAULTS, EnvSchema } from './env.schema.js';

/** `KEY=value` lines of .env.example (commented settings, `# KEY=`, count as documented without a value). */
function envExample(): { values: Map<string, string>; documented: Set<string> } {
  const text = readFileSync(resolve(CHECKOUT_ROOT, '.env.example'), 'utf8');
  const values = new Map<string, string>();
  const documented = new Set<string>();
  for (const line of text.split('\n')) {
    const set = /^([A-Z][A-Z0-9_]*)=(.*)$/.exec(line);
    if (set) {
      values.set(set[1]!, set[2]!);
      documented.add(set[1]!);
    }
    const commented = /^# ([A-Z][A-Z0-9_]*)=/.exec(line);
    if (commented) documented.add(commented[1]!);
  }
  return { values, documented };
}

describe('the one list of environment defaults (env-defaults.json)', () => {
  it('is what the schema falls back to for every setting left unset', () => {
    const parsed = EnvSchema.parse({ JWT_SECRET: 'x'.repeat(16) });
    for (const [name, value] of Object.entries(ENV_DEFAULTS)) {
      expect(String(parsed[name as keyof typeof parsed]), name).toBe(value);
    }
  });

  it('gives every setting of the schema a default, except the secret and the ui folder', () => {
    const withoutDefault = Object.keys(EnvSchema.shape).filter((name) => !(name in ENV_DEFAULTS));
    expect(withoutDefault.sort()).toEqual(['JWT_SECRET', 'UI_DIST_DIR']);
  });

  it('is what .env.example documents, value for value, and .env.example names every setting', () => {
    const { values, documented } = envExample();
    for (const [name, value] of Object.entries(ENV_DEFAULTS)) expect(values.get(name), name).toBe(value);
    for (const name of Object.keys(EnvSchema.shape)) expect(documented.has(name), `${name} in .env.example`).toBe(true);
  });

  it('appears in the README configuration table', () => {
    const readme = readFileSync(resolve(CHECKOUT_ROOT, 'README.md'), 'utf8');
    for (const [name, value] of Object.entries(ENV_DEFAULTS)) {
      expect(readme, name).toMatch(new RegExp(`\\| \`${name}\` \\| \`${value.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}\` \\|`));
    }
  });
});
