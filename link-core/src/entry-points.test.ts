/**
 * The engine's public surface (METHODS.md §0, link-core/README.md "Entries"): the product entry holds
 * what the api and the ui use plus the reference names fixed for outside callers; `./physics` holds
 * the building blocks; positional fast twins and numerical machinery stay internal.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import * as contracts from './contracts/index.js';
import * as product from './index.js';
import * as physics from './physics.js';
import * as units from './units/parse-quantity.js';

const ENTRIES: Record<string, Record<string, unknown>> = {
  '@beamwright/link-core': product,
  '@beamwright/link-core/physics': physics,
  '@beamwright/link-core/units': units,
  '@beamwright/link-core/contracts': contracts,
};

/** Names an outside reference suite calls from the package root since the first engine release. */
const FIXED_REFERENCE_NAMES = [
  'gaussianBeam', 'captureFraction', 'optimumTruncation', 'pointingOutageProbability',
  'visibilityAttenuationDbPerKm', 'rytovVariance', 'gammaGammaParameters', 'fadeMarginDb',
  'ocularMpeWPerM2', 'nohdM', 'linkGeometry', 'evaluateLink', 'maxRangeM',
  'collimatedBeamWander', 'longTermBeamRadius', 'eyeSafetyInputOf', 'formatZodIssues', 'seededUniform', 'solveDesign',
];

/** Internals: the budget chain's positional twins and the numerical machinery behind them. */
const INTERNAL_NAMES = [
  'visibilityExtinctionPerKmFast', 'rytovVarianceFast', 'apertureAveragedScintillationIndexFast',
  'beamWaveAtReceiverFast', 'beamWaveScintillationFast', 'noncentralChiSquare2TailsFast',
  'noncentralChiSquare2Tails', 'logNoncentralChiSquare2TailsScaled', 'findRootBrent', 'minimiseBrent', 'integrate', 'besselI0Scaled',
];

describe('engine entries', () => {
  it('keeps every name fixed for outside callers at the package root', () => {
    for (const name of FIXED_REFERENCE_NAMES) expect(typeof (product as Record<string, unknown>)[name], name).toBe('function');
  });

  it('exposes no fast twin or numerical internal from either entry', () => {
    for (const entry of [product, physics]) {
      const names = Object.keys(entry);
      for (const name of INTERNAL_NAMES) expect(names).not.toContain(name);
      expect(names.filter((name) => name.endsWith('Fast'))).toEqual([]);
    }
  });

  it('re-exports the physics functions at the root as the very same functions', () => {
    const shared = Object.keys(product).filter((name) => name in physics);
    expect(shared.length).toBeGreaterThan(10);
    for (const name of shared) expect((product as Record<string, unknown>)[name], name).toBe((physics as Record<string, unknown>)[name]);
  });

  it('keeps the product entry small: the budget, its schemas and units, eye safety, geometry', () => {
    // A new root export is a decision: add it here and to link-core/README.md "Entries".
    expect(Object.keys(product).length).toBeLessThanOrEqual(120);
    for (const name of ['evaluateLink', 'maxRange', 'beamEnvelope', 'marginVsRange', 'availabilityFromRecords', 'assessEyeSafety', 'linkGeometry', 'LinkDesignSchema', 'LinkBudgetSchema', 'wattsToDbm', 'compareWavelengths', 'marginSweep', 'marginGrid', 'evaluateLinkMargins', 'analyseRecordsAvailability']) {
      expect(product).toHaveProperty(name);
    }
  });

  it('imports every name of the README examples from the entry that holds it', () => {
    const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
    const imports = [...readme.matchAll(/^import \{ ([^}]+) \} from '([^']+)';$/gm)];
    expect(imports.length).toBeGreaterThan(10);
    for (const [, names, specifier] of imports) {
      const entry = ENTRIES[specifier];
      expect(entry, specifier).toBeDefined();
      for (const name of names.split(',').map((part) => part.trim())) expect(entry, `${name} from ${specifier}`).toHaveProperty(name);
    }
  });
});
