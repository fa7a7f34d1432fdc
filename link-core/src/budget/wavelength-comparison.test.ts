import { describe, expect, it } from 'vitest';
import { workedExampleDesign } from '../examples/worked-example.js';
import { assessEyeSafety } from '../safety/classification.js';
import { eyeSafetyInputOf } from '../safety/eye-safety-input.js';
import { rytovVariance } from '../turbulence/rytov.js';
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { evaluateLink } from './evaluate-link.js';
import { marginVsVisibility } from './samplers.js';
import { compareWavelengths, referenceWeather, USUAL_FSO_WAVELENGTHS_M } from './wavelength-comparison.js';

const worked = workedExampleDesign();
const comparison = compareWavelengths(worked);

function atWavelength(design: LinkDesignInput, wavelengthM: number): LinkDesignInput {
  return { ...design, transmitter: { ...design.transmitter, wavelengthM } };
}

describe('compareWavelengths', () => {
  it('compares the four usual wavelengths by default, in order', () => {
    expect(comparison.rows.map((row) => row.wavelengthM)).toEqual([785e-9, 850e-9, 1310e-9, 1550e-9]);
    expect(USUAL_FSO_WAVELENGTHS_M).toEqual([785e-9, 850e-9, 1310e-9, 1550e-9]);
  });

  it('gives each row the budget of the same design at that wavelength', () => {
    for (const row of comparison.rows) {
      const budget = evaluateLink(atWavelength(worked, row.wavelengthM));
      expect(row.linkMarginDb).toBe(budget.linkMarginDb);
      expect(row.geometricLossDb).toBe(budget.geometricLossDb);
      expect(row.beamRadiusAtReceiverM).toBe(budget.beamRadiusAtReceiverM);
      expect(row.scintillationFadeMarginDb).toBe(budget.scintillationFadeMarginDb);
      expect(row.receivedPowerDbm).toBe(budget.receivedPowerDbm);
      // diffraction half-angle M²λ/(πW0) of a 25 mm beam (Kogelnik & Li 1966; METHODS.md §1.1)
      expect(row.diffractionHalfAngleRad).toBeCloseTo(row.wavelengthM / (Math.PI * 0.025), 15);
      // LB-01's 1 mrad datasheet divergence dominates at every wavelength: the same spot, the same geometric loss
      expect(row.beamModel).toBe('defocused');
      expect(row.halfAngleDivergenceRad).toBe(1e-3);
    }
    // the diffraction angle only adds in quadrature to the defocused spot (METHODS.md §1.5): 1.5e-5 dB apart
    expect(Math.abs(comparison.rows[3]!.geometricLossDb - comparison.rows[0]!.geometricLossDb)).toBeLessThan(1e-4);
    expect(comparison.rows[3]!.geometricLossDb).not.toBe(comparison.rows[0]!.geometricLossDb);
  });

  it('gives Kim-model attenuation at the design visibility as the independent recomputation (ATT-KIM-*-V5)', () => {
    // Kim, McArthur & Korevaar, Proc. SPIE 4214 (2001): β = (3.91/V)(λ/550 nm)^(−q), q = 0.16V + 0.34
    // for 1 < V ≤ 6 km; evaluated independently with numpy (fixtures/reference, ATT-KIM-785/850/1310/1550-V5).
    const published = [2.263878535, 2.067602055, 1.262743825, 1.042380779];
    comparison.rows.forEach((row, i) => expect(row.specificAttenuationDbPerKm).toBeCloseTo(published[i]!, 6));
  });

  it('reports haze, thin fog and moderate fog at the centres of their visibility-code classes', () => {
    expect(comparison.referenceWeather.map((weather) => weather.key)).toEqual(['haze', 'thin-fog', 'moderate-fog']);
    expect(comparison.referenceWeather.map((weather) => weather.visibilityM)).toEqual([Math.sqrt(2000 * 4000), Math.sqrt(1000 * 2000), Math.sqrt(200 * 500)]);
    expect(referenceWeather()).toEqual(comparison.referenceWeather);
    // In fog below 500 m Kim's exponent is 0: the attenuation is the same at every wavelength,
    // 4.343·3.91/V (Kim et al. 2001, their central finding; 53.70 dB/km at V = 316 m).
    const fog = comparison.rows.map((row) => row.referenceAttenuationDbPerKm[2]!);
    for (const value of fog) expect(value).toBeCloseTo(((10 / Math.LN10) * 3.91) / 0.31622776601683794, 6);
    // in haze the longer wavelength suffers less (q > 0)
    const haze = comparison.rows.map((row) => row.referenceAttenuationDbPerKm[0]!);
    expect(haze[3]!).toBeLessThan(haze[0]!);
    // each value is the budget's own attenuation at that visibility (2 % contrast)
    const hazeAt1550 = evaluateLink({ ...atWavelength(worked, 1550e-9), atmosphere: { ...worked.atmosphere, visibilityM: Math.sqrt(8e6) } }).specificAttenuationDbPerKm;
    expect(haze[3]).toBe(hazeAt1550);
  });

  it('scales the spherical-wave Rytov variance as λ^(−7/6) (β0² = 0.5·Cn²·k^(7/6)·L^(11/6), METHODS.md §6.2)', () => {
    for (const row of comparison.rows) {
      expect(row.rytovVarianceSpherical).toBeCloseTo(rytovVariance({ cn2: 5e-14, wavelengthM: row.wavelengthM, distanceM: 2000, wave: 'spherical' }), 10);
    }
    const ratio = comparison.rows[0]!.rytovVarianceSpherical / comparison.rows[3]!.rytovVarianceSpherical;
    expect(ratio).toBeCloseTo((785 / 1550) ** (-7 / 6), 10);
  });

  it('assesses eye safety per wavelength with the caution, and says why where the limits stop', () => {
    for (const row of comparison.rows) {
      const design = atWavelength(worked, row.wavelengthM);
      expect(row.eyeSafety).toEqual(assessEyeSafety(eyeSafetyInputOf(design, evaluateLink(design))));
      expect(row.eyeSafety!.caution).toMatch(/Indicative only/);
    }
    // IEC 60825-1:2007 Table A.1 and ICNIRP (2013): 1000 W/m² at 1500–1800 nm for t ≥ 10 s (from memory)
    expect(comparison.rows[3]!.eyeSafety!.mpeWPerM2).toBe(1000);
    const outside = compareWavelengths(worked, [1450e-9]);
    expect(outside.rows[0]!.eyeSafety).toBeNull();
    expect(outside.rows[0]!.eyeSafetyUnavailableReason).toMatch(/wavelengthM: eye-safety limits are implemented for 700–1400 nm and 1500–1800 nm only/);
    expect(outside.rows[0]!.linkMarginDb).toBeTypeOf('number');
    expect(comparison.notes.join(' ')).toMatch(/laser safety officer/);
  });

  it('gives one margin-against-visibility line per wavelength on a shared axis', () => {
    expect(comparison.visibilityM).toHaveLength(61);
    for (const row of comparison.rows) {
      const sweep = marginVsVisibility(atWavelength(worked, row.wavelengthM));
      expect(row.marginVsVisibilityDb).toEqual(sweep.linkMarginDb);
      expect(comparison.visibilityM).toEqual(sweep.visibilityM);
    }
    // a series ending at the design visibility ends at the row's margin
    const ending = compareWavelengths(worked, [850e-9], { fromVisibilityM: 500, toVisibilityM: 5000, points: 3 });
    expect(ending.rows[0]!.marginVsVisibilityDb[2]!).toBeCloseTo(ending.rows[0]!.linkMarginDb, 9);
  });

  it('rejects bad input naming the wavelength, the option or the design field', () => {
    expect(() => compareWavelengths(worked, [])).toThrow(/wavelengthsM: must hold at least one wavelength/);
    expect(() => compareWavelengths(worked, Array(9).fill(850e-9))).toThrow(/wavelengthsM: must hold at most 8 wavelengths/);
    expect(() => compareWavelengths(worked, [850e-9, 1550e-9, 1550])).toThrow(/wavelengthsM\.2: must be at most 20 µm/);
    expect(() => compareWavelengths(worked, undefined, { points: 1 })).toThrow(/options\.points: must be at least 2/);
    expect(() => compareWavelengths(worked, undefined, { fromVisibilityM: 5000, toVisibilityM: 100 })).toThrow(/options\.toVisibilityM: must be greater than fromVisibilityM/);
    expect(() => compareWavelengths({ ...worked, rangeM: Number.NaN })).toThrow(/compareWavelengths: design\.rangeM: must be a finite number/);
  });
});
