import { describe, expect, it } from 'vitest';
import { berForQFactor, checkReceivedPower, photonsPerBit, qFactorForBer, receiverSensitivity } from './sensitivity.js';

describe('receiver sensitivity', () => {
  it('Q = 5.998 at BER 1e-9 and 7.034 at 1e-12 (Agrawal, Fiber-Optic Communication Systems, 4th ed., §4.5.1)', () => {
    expect(qFactorForBer(1e-9)).toBeCloseTo(5.998, 3);
    expect(qFactorForBer(1e-12)).toBeCloseTo(7.034, 3);
  });

  it('BER and Q are inverse functions', () => {
    for (const ber of [1e-3, 1e-6, 1e-9, 1e-12]) expect(berForQFactor(qFactorForBer(ber)) / ber).toBeCloseTo(1, 9);
  });

  it('photons per bit: 1 µW at 1550 nm and 1.25 Gbit/s is about 6242 photons (hc/λ = 1.2816e-19 J)', () => {
    expect(photonsPerBit(1e-6, 1550e-9, 1.25e9)).toBeCloseTo(6242.3, 1);
  });

  it('an APD with gain 1 reduces to the PIN formula, and gain improves a thermal-noise-limited receiver', () => {
    const base = { lineRateBitPerS: 1.25e9, inputNoiseCurrentDensityAPerSqrtHz: 15e-12, responsivityAPerW: 0.9, ber: 1e-12 };
    const pin = receiverSensitivity(base);
    expect(pin.excessNoiseFactor).toBe(1);
    const apd = receiverSensitivity({ ...base, apdGain: 10, apdIonisationRatio: 0.5 });
    expect(apd.sensitivityDbm).toBeLessThan(pin.sensitivityDbm - 5);
    expect(pin.noiseBandwidthHz).toBe(0.75 * 1.25e9);
  });

  it('rejects an APD gain below 1 with the field name', () => {
    expect(() => receiverSensitivity({ lineRateBitPerS: 1e9, inputNoiseCurrentDensityAPerSqrtHz: 1e-11, responsivityAPerW: 0.9, apdGain: 0.5 })).toThrow(/apdGain/);
  });

  it('gives a clear overload verdict (common practice: APD overload −3 to −10 dBm)', () => {
    expect(checkReceivedPower(-2, -36, -5).status).toBe('overload');
    expect(checkReceivedPower(-40, -36, -5).status).toBe('below-sensitivity');
    const ok = checkReceivedPower(-20, -36, -5);
    expect(ok).toMatchObject({ status: 'ok', marginAboveSensitivityDb: 16, headroomBelowOverloadDb: 15 });
    expect(checkReceivedPower(-20, -36).headroomBelowOverloadDb).toBeNull();
    expect(() => checkReceivedPower(-20, -36, -40)).toThrow(/overloadDbm/);
  });
});

describe('sensitivity source', () => {
  it('prefers the datasheet figure and otherwise estimates from noise figures', async () => {
    const { resolveSensitivity } = await import('./sensitivity.js');
    expect(resolveSensitivity({ kind: 'datasheet', sensitivityDbm: -36 })).toMatchObject({ sensitivityDbm: -36, method: 'datasheet' });
    const estimated = resolveSensitivity({ kind: 'noise-figures', lineRateBitPerS: 1.25e9, inputNoiseCurrentDensityAPerSqrtHz: 15e-12, responsivityAPerW: 0.9, q: 7.034 });
    // RX-03-pin-1G: −24.45 dBm (Agrawal ch. 4 with an illustrative 15 pA/√Hz).
    expect(estimated.sensitivityDbm).toBeCloseTo(-24.4496, 3);
    expect(estimated.method).toBe('pin-thermal-limit');
  });
});
