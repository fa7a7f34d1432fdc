/**
 * Every published or independently computed check case (fixtures/reference/check-values.json,
 * copied from the project's reference set with each case's source and tolerance) is run against
 * the engine. Tolerance rule of the file: |value − expected| ≤ max(abs, rel·|expected|).
 */
import { readFileSync, readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import type { NotCovered, ReferenceAdapters, ReferenceInputs, ReferenceValue } from './reference-adapters/types.ts';

interface CheckCase {
  id: string;
  method: string;
  inputs: ReferenceInputs;
  expected: Record<string, ReferenceValue>;
  tolerance: { rel?: number; abs?: number };
  source: string;
  notes?: string;
}

const here = dirname(fileURLToPath(import.meta.url));
const casesPath = join(here, '../../fixtures/reference/check-values.json');
const cases = JSON.parse(readFileSync(casesPath, 'utf8')) as CheckCase[];

const adapters: ReferenceAdapters = {};
const notCovered: NotCovered = {};
const adapterDir = join(here, 'reference-adapters');
for (const file of readdirSync(adapterDir).sort()) {
  if (!file.endsWith('.ts') || file === 'types.ts') continue;
  const module = (await import(pathToFileURL(join(adapterDir, file)).href)) as {
    adapters?: ReferenceAdapters;
    notCovered?: NotCovered;
  };
  for (const [method, adapter] of Object.entries(module.adapters ?? {})) {
    if (adapters[method]) throw new Error(`reference adapter for ${method} defined twice (${file})`);
    adapters[method] = adapter;
  }
  Object.assign(notCovered, module.notCovered ?? {});
}

function withinTolerance(actual: number, expected: number, tolerance: CheckCase['tolerance']): boolean {
  const allowed = Math.max(tolerance.abs ?? 0, (tolerance.rel ?? 0) * Math.abs(expected));
  return Math.abs(actual - expected) <= allowed;
}

describe('reference check cases', () => {
  it('every method is either covered by an adapter or listed as not covered with a reason', () => {
    const missing = [...new Set(cases.map((c) => c.method))].filter((m) => !adapters[m] && !notCovered[m]);
    expect(missing).toEqual([]);
  });

  for (const checkCase of cases) {
    const adapter = adapters[checkCase.method];
    if (!adapter) continue;
    it(`${checkCase.id} (${checkCase.method}) — ${checkCase.source}`, () => {
      const actual = adapter(checkCase.inputs, checkCase.id);
      const failures: string[] = [];
      for (const [key, expected] of Object.entries(checkCase.expected)) {
        if (!(key in actual)) {
          if (!notCovered[`${checkCase.method}.${key}`]) failures.push(`${key}: not computed and not listed as not covered`);
          continue;
        }
        const value = actual[key];
        if (typeof expected === 'number' && typeof value === 'number') {
          if (!withinTolerance(value, expected, checkCase.tolerance)) {
            failures.push(`${key}: got ${value}, expected ${expected} (tolerance ${JSON.stringify(checkCase.tolerance)})`);
          }
        } else if (value !== expected) {
          failures.push(`${key}: got ${JSON.stringify(value)}, expected ${JSON.stringify(expected)}`);
        }
      }
      expect(failures).toEqual([]);
    });
  }
});
