import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyseClimatologyAvailability, evaluateLink, type LinkDesignInput } from '@beamwright/link-core';
import { meanPointingLossDb } from '@beamwright/link-core/physics';
import { readClimatologyText } from '@/features/weather/climatology-text';

interface ReferenceCase {
  id: string;
  inputs: Record<string, number & number[]>;
  expected: Record<string, number>;
  tolerance: { rel: number; abs: number };
}

// Check case LB-03 of fixtures/reference/check-values.json: a synthetic climatology over 1 km,
// computed independently with scipy/numpy (fixtures/reference/SOURCES.md).
const cases = JSON.parse(readFileSync(resolve(process.cwd(), '..', 'fixtures', 'reference', 'check-values.json'), 'utf8')) as ReferenceCase[];
const lb03 = cases.find((entry) => entry.id === 'LB-03')!;

describe('a cumulative table typed or pasted', () => {
  it('gives the availability of check case LB-03 when pasted in km and percent', () => {
    const { inputs } = lb03;
    const pasted = ['Visibility (km)\tP(V < v) (%)', ...inputs.climatology_visibility_km.map((km, i) => `${km}\t${(inputs.climatology_prob_visibility_below[i]! * 100).toPrecision(6)}`)].join('\n');
    const reading = readClimatologyText(pasted, { visibilityUnit: 'km', probabilityFormat: 'percent', visibilityDefinition: 'contrast-2-percent' });
    if (!reading.ok) throw new Error(reading.message);
    const design: LinkDesignInput = {
      rangeM: inputs.L_m,
      transmitter: { wavelengthM: inputs.wavelength_m, powerDbm: inputs.P_tx_dBm, waistRadiusM: inputs.W0_1e2_m, halfAngleDivergenceRad: inputs.half_angle_divergence_1e2_rad, opticsLossDb: inputs.tx_optics_loss_dB },
      receiver: { apertureDiameterM: inputs.rx_diameter_m, sensitivityDbm: inputs.sensitivity_dBm, opticsLossDb: inputs.rx_optics_loss_dB },
      pointing: { jitterSigmaPerAxisRad: inputs.jitter_sigma_per_axis_rad, staticErrorRad: inputs.static_pointing_error_rad },
      atmosphere: { model: 'kim', visibilityM: 10_000, cn2: inputs['Cn2_m^-2/3'], turbulenceModel: 'spherical-wave' },
      scintillation: { include: false, probability: inputs.fade_probability },
    };
    // LB-03's chain budgets the small-receiver mean pointing loss; the difference to the engine's exact
    // capture (3e-4 dB) is carried as system allowance, as link-core's reference adapter does
    const budget = evaluateLink(design);
    const shiftDb = meanPointingLossDb(budget.beamRadiusAtReceiverM, inputs.jitter_sigma_per_axis_rad * inputs.L_m, inputs.static_pointing_error_rad * inputs.L_m) - budget.pointingLossDb;
    const { totals } = analyseClimatologyAvailability({ ...design, systemMarginDb: shiftDb }, reading.climatology);
    const within = (value: number, expected: number) => expect(Math.abs(value - expected)).toBeLessThanOrEqual(Math.max(lb03.tolerance.abs, lb03.tolerance.rel * Math.abs(expected)));
    within(totals.minimumVisibilityM!, lb03.expected.V_min_m!);
    within(totals.availability, lb03.expected.availability!);
    within(totals.clearAirMarginDb, lb03.expected.clear_air_margin_dB!);
  });

  it('reads metres and fractions separated by commas, semicolons or spaces', () => {
    const reading = readClimatologyText('100, 0.001\n500; 0.005\n1000   0.01\n', { visibilityUnit: 'm', probabilityFormat: 'fraction', visibilityDefinition: 'mor-5-percent' });
    expect(reading).toEqual({ ok: true, climatology: { visibilityM: [100, 500, 1000], probabilityBelow: [0.001, 0.005, 0.01], visibilityDefinition: 'mor-5-percent' } });
  });

  it('names the line of a mistake', () => {
    const options = { visibilityUnit: 'km', probabilityFormat: 'percent', visibilityDefinition: 'mor-5-percent' } as const;
    expect(readClimatologyText('0.1 0.1\n0.05 0.2', options)).toEqual({ ok: false, message: 'line 2: the visibility must be greater than the previous level' });
    expect(readClimatologyText('0.1 0.5\n0.2 0.2', options)).toEqual({ ok: false, message: 'line 2: the probability must not be less than the previous probability' });
    expect(readClimatologyText('0.1 0.5\nfog 3', options)).toMatchObject({ ok: false, message: expect.stringMatching(/^line 2: write two numbers/) });
    expect(readClimatologyText('0.1 0.5', options)).toEqual({ ok: false, message: 'needs at least two levels, one per line' });
  });
});
