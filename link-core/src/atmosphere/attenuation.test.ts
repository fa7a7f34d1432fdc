import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { alNaboulsiFogAttenuationDbPerKm, atmosphericPathLoss, rainAttenuationDbPerKm, snowAttenuationDbPerKm } from './fog-and-precipitation.js';
import { visibilityCodeClass } from './visibility-code.js';
import {
  VISIBILITY_2_PERCENT_PER_MOR,
  visibilityAttenuationDbPerKm,
  visibilityForAttenuationM,
  type VisibilityDefinition,
  type VisibilityModel,
} from './visibility-attenuation.js';

describe('visibility attenuation', () => {
  it('reproduces the Kim values of METHODS.md §5.2 (Kim, McArthur & Korevaar, Proc. SPIE 4214, 2001; K = 3.91)', () => {
    // Table values are printed to 4 significant figures.
    expect(visibilityAttenuationDbPerKm({ model: 'kim', visibilityM: 2000, wavelengthM: 850e-9 })).toBeCloseTo(6.37, 2);
    expect(visibilityAttenuationDbPerKm({ model: 'kim', visibilityM: 1000, wavelengthM: 1550e-9 })).toBeCloseTo(10.12, 2);
    expect(visibilityAttenuationDbPerKm({ model: 'kim', visibilityM: 200, wavelengthM: 1550e-9 })).toBeCloseTo(84.9, 1);
  });

  it('converts MOR (5 %) to the 2 % visibility before both K/V and q(V) (METHODS.md §5.1, Koschmieder 1924)', () => {
    const fromMor = visibilityAttenuationDbPerKm({ model: 'kim', visibilityM: 1000, wavelengthM: 1550e-9, visibilityDefinition: 'mor-5-percent' });
    const direct = visibilityAttenuationDbPerKm({ model: 'kim', visibilityM: 1000 * VISIBILITY_2_PERCENT_PER_MOR, wavelengthM: 1550e-9 });
    expect(fromMor).toBe(direct);
    // Feeding MOR straight into the 2 % formula overstates the loss (1.31–1.65× at 1550 nm, METHODS.md §5.1).
    const naive = visibilityAttenuationDbPerKm({ model: 'kim', visibilityM: 1000, wavelengthM: 1550e-9 });
    expect(naive / fromMor).toBeGreaterThan(1.3);
    expect(naive / fromMor).toBeLessThan(1.66);
  });

  it('inverts the attenuation: V_min = 540.3 m for 30.14 dB/km at 1550 nm (reference case LB-03, synthetic climatology)', () => {
    const vMin = visibilityForAttenuationM({ model: 'kim', wavelengthM: 1550e-9, attenuationDbPerKm: 30.14189631 });
    expect(vMin).toBeCloseTo(540.3173707, 4);
  });

  it('round-trips visibility → attenuation → visibility away from the q discontinuities', () => {
    for (const model of ['kim', 'kruse'] as const) {
      for (const visibilityM of [120, 700, 1500, 3000, 9000, 30000, 80000]) {
        const gamma = visibilityAttenuationDbPerKm({ model, visibilityM, wavelengthM: 1310e-9 });
        expect(visibilityForAttenuationM({ model, wavelengthM: 1310e-9, attenuationDbPerKm: gamma }) / visibilityM).toBeCloseTo(1, 9);
      }
    }
  });

  it('rejects bad input with the field name and the reason', () => {
    expect(() => visibilityAttenuationDbPerKm({ model: 'kim', visibilityM: -5, wavelengthM: 850e-9 })).toThrow(/visibilityM: must be greater than 0/);
    expect(() => visibilityAttenuationDbPerKm({ model: 'kim', visibilityM: 1000, wavelengthM: Number.NaN })).toThrow(/wavelengthM: must be a finite number/);
    expect(() => visibilityForAttenuationM({ model: 'kim', wavelengthM: 500e-9, attenuationDbPerKm: 3 })).toThrow(/wavelengthM/);
  });

  it('is non-increasing in visibility for every model and definition (property)', () => {
    const models: Array<(visibilityM: number, wavelengthM: number, definition: VisibilityDefinition) => number> = [
      ...(['kim', 'kruse'] as VisibilityModel[]).map(
        (model) => (visibilityM: number, wavelengthM: number, visibilityDefinition: VisibilityDefinition) =>
          visibilityAttenuationDbPerKm({ model, visibilityM, wavelengthM, visibilityDefinition }),
      ),
      (visibilityM, wavelengthM, visibilityDefinition) => alNaboulsiFogAttenuationDbPerKm({ fogType: 'advection', visibilityM, wavelengthM, visibilityDefinition }),
      (visibilityM, wavelengthM, visibilityDefinition) => alNaboulsiFogAttenuationDbPerKm({ fogType: 'radiation', visibilityM, wavelengthM, visibilityDefinition }),
    ];
    fc.assert(
      fc.property(
        fc.double({ min: 10, max: 200000, noNaN: true }),
        fc.double({ min: 10, max: 200000, noNaN: true }),
        fc.double({ min: 600e-9, max: 1700e-9, noNaN: true }),
        fc.constantFrom<VisibilityDefinition>('contrast-2-percent', 'mor-5-percent'),
        fc.integer({ min: 0, max: models.length - 1 }),
        (a, b, wavelengthM, definition, index) => {
          const [low, high] = a <= b ? [a, b] : [b, a];
          const model = models[index]!;
          return model(high, wavelengthM, definition) <= model(low, wavelengthM, definition);
        },
      ),
      { numRuns: 2000 },
    );
  });
});

describe('fog type, rain, snow and path loss', () => {
  it('Al Naboulsi at 1550 nm and V = 1 km lies well above Kim (METHODS.md §5.4: 19.10 against 10.12 dB/km)', () => {
    const advection = alNaboulsiFogAttenuationDbPerKm({ fogType: 'advection', visibilityM: 1000, wavelengthM: 1550e-9 });
    expect(advection).toBeGreaterThan(17);
    const radiation = alNaboulsiFogAttenuationDbPerKm({ fogType: 'radiation', visibilityM: 1000, wavelengthM: 1550e-9 });
    expect(radiation).toBeCloseTo(19.1, 1);
  });

  it('rain: 25 mm/h gives 9.30 dB/km and 100 mm/h 23.5 dB/km (Carbonneau & Wisely 1998 as widely quoted, METHODS.md §5.5)', () => {
    expect(rainAttenuationDbPerKm(25)).toBeCloseTo(9.3, 2);
    expect(rainAttenuationDbPerKm(100)).toBeCloseTo(23.54, 2);
    expect(rainAttenuationDbPerKm(25, 'geometric-upper')).toBeGreaterThan(rainAttenuationDbPerKm(25));
    expect(rainAttenuationDbPerKm(0)).toBe(0);
  });

  it('snow: dry snow attenuates more than wet snow at 5 mm/h (ITU-R P.1817-1 coefficients, indicative)', () => {
    expect(snowAttenuationDbPerKm(5, 1550e-9, 'dry')).toBeGreaterThan(snowAttenuationDbPerKm(5, 1550e-9, 'wet'));
  });

  it('path loss scales with length and transmittance is 10^(−loss/10)', () => {
    const path = atmosphericPathLoss(10, 2000);
    expect(path.pathLossDb).toBe(20);
    expect(path.transmittance).toBeCloseTo(0.01, 15);
  });

  it('labels visibilities with the international visibility code (Kim et al. 2001 table, from memory)', () => {
    expect(visibilityCodeClass(30).key).toBe('dense-fog');
    expect(visibilityCodeClass(200).key).toBe('moderate-fog');
    expect(visibilityCodeClass(1500).label).toBe('Thin fog or mist');
    expect(visibilityCodeClass(60000).key).toBe('exceptionally-clear');
  });
});
