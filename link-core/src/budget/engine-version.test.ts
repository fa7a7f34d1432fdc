import { describe, expect, it } from 'vitest';
import { LINK_CORE_VERSION } from '../version.js';
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { evaluateLink } from './evaluate-link.js';
import { compareEngineVersions, currentEngineFigures, readStoredDesign } from './engine-version.js';

const stored: LinkDesignInput = {
  rangeM: 3000,
  transmitter: { wavelengthM: 1.55e-6, powerDbm: 20, waistRadiusM: 0.025, opticsLossDb: 1 },
  receiver: { apertureDiameterM: 0.1, sensitivityDbm: -36, opticsLossDb: 1.5 },
  pointing: { jitterSigmaPerAxisRad: 10e-6, staticErrorRad: 10e-6 },
  atmosphere: { model: 'kim', visibilityM: 10_000, cn2: 5e-14 },
};

describe('versioned reads of stored designs', () => {
  it('orders versions numerically', () => {
    expect(compareEngineVersions('0.1.0', '0.2.0')).toBeLessThan(0);
    expect(compareEngineVersions('0.10.0', '0.2.0')).toBeGreaterThan(0);
    expect(compareEngineVersions(LINK_CORE_VERSION, LINK_CORE_VERSION)).toBe(0);
  });

  it('reads a design stored before 0.2.0 without a turbulence model as the spherical wave, without changing it', () => {
    const read = readStoredDesign(stored, '0.1.0');
    expect(read.atmosphere.turbulenceModel).toBe('spherical-wave');
    expect(stored.atmosphere.turbulenceModel).toBeUndefined();
    expect(readStoredDesign(stored, '0.2.0')).toBe(stored);
    const chosen = { ...stored, atmosphere: { ...stored.atmosphere, turbulenceModel: 'gaussian-beam' as const } };
    expect(readStoredDesign(chosen, '0.1.0')).toBe(chosen);
  });

  it('puts the current engine beside a revision of an older engine, with the difference', () => {
    const oldMargin = 4.2;
    const figures = currentEngineFigures(stored, '0.1.0', oldMargin)!;
    const current = evaluateLink({ ...stored, atmosphere: { ...stored.atmosphere, turbulenceModel: 'spherical-wave' } });
    expect(figures.linkCoreVersion).toBe(LINK_CORE_VERSION);
    expect(figures.linkMarginDb).toBe(current.linkMarginDb);
    expect(figures.marginChangeDb).toBeCloseTo(current.linkMarginDb - oldMargin, 12);
    expect(figures.belowRequiredMargin).toBe(current.linkMarginDb < 3);
    expect(currentEngineFigures(stored, LINK_CORE_VERSION, 1)).toBeNull();
  });
});
