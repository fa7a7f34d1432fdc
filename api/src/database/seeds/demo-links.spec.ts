import { describe, expect, it } from 'vitest';
import { mergeDesign } from './demo-links.js';

describe('mergeDesign (demo history changes)', () => {
  it('merges nested objects and replaces leaves, leaving the base untouched', () => {
    const base = { rangeM: 1000, transmitter: { powerDbm: 20, m2: 1 }, pointing: { jitterSigmaPerAxisRad: 5e-5 } };
    const merged = mergeDesign(base, { transmitter: { powerDbm: 23 }, rangeM: 1200 });
    expect(merged).toEqual({ rangeM: 1200, transmitter: { powerDbm: 23, m2: 1 }, pointing: { jitterSigmaPerAxisRad: 5e-5 } });
    expect(base.transmitter.powerDbm).toBe(20);
  });
});
