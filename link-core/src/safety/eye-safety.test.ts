import { describe, expect, it } from 'vitest';
import { accessiblePowerW, assessEyeSafety, indicativeLaserClass } from './classification.js';
import { classOneAelW, ocularMpeDetails, ocularMpeWPerM2 } from './exposure-limits.js';
import { BINOCULAR_7X50_GAIN, nohdFarFieldM, nohdM } from './hazard-distance.js';
import { eyeSafetyInputOf } from './eye-safety-input.js';
import { evaluateLink } from '../budget/evaluate-link.js';
import { workedExampleDesign } from '../examples/worked-example.js';
import type { LinkDesignInput } from '../schemas/link-design.schema.js';

describe('ocular MPE (IEC 60825-1 Table A.1 / ANSI Z136.1 Table 5a, from memory)', () => {
  it('14.79 W/m² at 785 nm, 19.95 W/m² at 850 nm, 1000 W/m² at 1550 nm for t ≥ 10 s', () => {
    expect(ocularMpeWPerM2({ wavelengthM: 785e-9, exposureS: 10 })).toBeCloseTo(14.79, 2);
    expect(ocularMpeWPerM2({ wavelengthM: 850e-9, exposureS: 3600 })).toBeCloseTo(19.95, 2);
    expect(ocularMpeWPerM2({ wavelengthM: 1550e-9, exposureS: 100 })).toBe(1000);
  });

  it('1310 nm: conservative 2007 value by default, higher 2014 value capped by the corneal guide (METHODS.md §8.4)', () => {
    expect(ocularMpeWPerM2({ wavelengthM: 1310e-9, exposureS: 100 })).toBeCloseTo(400, 9);
    expect(ocularMpeWPerM2({ wavelengthM: 1310e-9, exposureS: 100, edition: 2014 })).toBeCloseTo(10000, 9);
    expect(ocularMpeDetails({ wavelengthM: 1310e-9, exposureS: 100, edition: 'IEC 60825-1:2014' }).retinalMpeWPerM2).toBeCloseTo(12959.43, 1);
    expect(classOneAelW(1310e-9)).toBeCloseTo(0.0156, 9);
  });

  it('every result carries the caution naming the edition and deferring to a laser safety officer', () => {
    const details = ocularMpeDetails({ wavelengthM: 850e-9, exposureS: 100 });
    expect(details.caution).toMatch(/not a certification/);
    expect(details.caution).toMatch(/IEC 60825-1:2007/);
    expect(details.caution).toMatch(/laser safety officer/);
  });

  it('rejects wavelengths outside the implemented bands and too short exposures', () => {
    expect(() => ocularMpeWPerM2({ wavelengthM: 1450e-9, exposureS: 100 })).toThrow(/wavelengthM/);
    expect(() => ocularMpeWPerM2({ wavelengthM: 850e-9, exposureS: 1e-9 })).toThrow(/exposureS/);
    expect(() => ocularMpeWPerM2({ wavelengthM: 850e-9, exposureS: 100, edition: '2019' as '2014' })).toThrow(/edition/);
  });
});

describe('NOHD (METHODS.md §8.6)', () => {
  const beam = { powerW: 1, mpeWPerM2: 1000, wavelengthM: 1550e-9, waistRadiusM: 0.01 };

  it('the far-field form underestimates near-diffraction-limited beams: 305 m against 432 m at θ = 50 µrad', () => {
    expect(nohdM({ ...beam, halfAngleDivergenceRad: 50e-6 })).toBeCloseTo(432, 0);
    expect(nohdFarFieldM({ ...beam, halfAngleDivergenceRad: 50e-6 })).toBeCloseTo(305, 0);
    const diffraction = 1550e-9 / (Math.PI * 0.01);
    expect(nohdM({ ...beam, halfAngleDivergenceRad: diffraction })).toBeCloseTo(470, 0);
    expect(nohdFarFieldM({ ...beam, halfAngleDivergenceRad: diffraction })).toBeCloseTo(309, 0);
  });

  it('aided viewing at 1550 nm: 100 mW is harmless to the naked eye but hazardous to about 94 m with 7×50 binoculars', () => {
    const weak = { ...beam, powerW: 0.1, halfAngleDivergenceRad: 0.5e-3 };
    expect(nohdM(weak)).toBe(0);
    expect(nohdM({ ...weak, opticalGain: BINOCULAR_7X50_GAIN })).toBeCloseTo(94.06, 1);
  });

  it('at the NOHD the peak irradiance of the defocused Gaussian equals the MPE (derived)', () => {
    const input = { powerW: 0.05, mpeWPerM2: 19.95262315, wavelengthM: 850e-9, waistRadiusM: 0.01, halfAngleDivergenceRad: 0.5e-3 };
    const z = nohdM(input);
    const diffraction = input.wavelengthM / (Math.PI * input.waistRadiusM);
    const radius = Math.hypot(input.waistRadiusM + z * Math.sqrt(input.halfAngleDivergenceRad ** 2 - diffraction ** 2), diffraction * z);
    expect((2 * input.powerW) / (Math.PI * radius * radius) / input.mpeWPerM2).toBeCloseTo(1, 10);
  });
});

describe('indicative class and assessment', () => {
  const terminal = { powerW: 0.02, wavelengthM: 850e-9, apertureBeamRadiusM: 0.025, halfAngleDivergenceRad: 1e-3 };

  it('ES-05 terminal: passes Condition 3 (0.763 mW < 0.778 mW) but fails Condition 1: Class 1M', () => {
    const indication = indicativeLaserClass(terminal);
    expect(indication.indicativeClass).toBe('1M');
    expect(indication.condition3FractionOfAel).toBeGreaterThan(0.97);
    expect(indication.caution).toMatch(/laser safety officer/);
  });

  it('the exact Gaussian radius gives at least the power of the linear rule (conservative)', () => {
    for (const distanceM of [0.1, 2, 50]) {
      const common = { ...terminal, halfAngleDivergenceRad: 20e-6, measurementApertureDiameterM: 7e-3, distanceM };
      expect(accessiblePowerW(common)).toBeGreaterThanOrEqual(accessiblePowerW({ ...common, beamGrowth: 'linear' }));
    }
  });

  it('assessEyeSafety: 850 nm, 50 mW, W0 = 10 mm, θ = 0.5 mrad gives 59.9 m unaided and 551 m with 7×50 optics', () => {
    const result = assessEyeSafety({ powerW: 0.05, wavelengthM: 850e-9, apertureBeamRadiusM: 0.01, halfAngleDivergenceRad: 0.5e-3 });
    expect(result.nohdUnaidedM).toBeCloseTo(59.905, 2);
    expect(result.nohdWithOpticsM).toBeCloseTo(550.62, 1);
    expect(result.indicativeClass).toBe('3B');
    expect(result.caution).toMatch(/Indicative only/);
    expect(result.edition).toBe('IEC 60825-1:2007');
  });

  it('a 1550 nm terminal harmless to the naked eye still reports the aided hazard in its notes', () => {
    const result = assessEyeSafety({ powerW: 0.1, wavelengthM: 1550e-9, apertureBeamRadiusM: 0.01, halfAngleDivergenceRad: 0.5e-3 });
    expect(result.nohdUnaidedM).toBe(0);
    expect(result.nohdWithOpticsM).toBeGreaterThan(90);
    expect(result.notes.join(' ')).toMatch(/binoculars/);
  });
});

describe('eyeSafetyInputOf (the one rule that turns a design into an eye-safety input)', () => {
  // the LB-01 worked example, with a 10 mm exit beam
  const worked = workedExampleDesign();
  const design: LinkDesignInput = { ...worked, transmitter: { ...worked.transmitter, waistRadiusM: 0.01 } };

  it('takes the power in watts (20 dBm = 0.1 W), the wavelength and the exit beam radius from the transmitter', () => {
    const input = eyeSafetyInputOf(design);
    expect(input.powerW).toBeCloseTo(0.1, 12);
    expect(input.wavelengthM).toBe(1550e-9);
    expect(input.apertureBeamRadiusM).toBe(0.01);
  });

  it("prefers the budget's half angle (never below the diffraction limit), then the datasheet's, then a collimated beam", () => {
    expect(eyeSafetyInputOf(design, { halfAngleDivergenceRad: 2e-3 }).halfAngleDivergenceRad).toBe(2e-3);
    expect(eyeSafetyInputOf(design, null).halfAngleDivergenceRad).toBe(1e-3);
    const withoutDivergence = { ...design, transmitter: { ...design.transmitter, halfAngleDivergenceRad: undefined } };
    expect(eyeSafetyInputOf(withoutDivergence).halfAngleDivergenceRad).toBe(0);
  });

  it('is what assessEyeSafety needs for a design and its budget', () => {
    const budget = evaluateLink(design);
    const assessment = assessEyeSafety(eyeSafetyInputOf(design, budget));
    expect(assessment.caution).toMatch(/laser safety officer/i);
  });
});
