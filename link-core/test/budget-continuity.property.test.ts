/**
 * No output steps as an input varies: each input is scanned finely (log-spaced) on designs of
 * practice, for both turbulence models, and the second difference of the link margin is bounded.
 * A jump of 0.011 dB (the old hard gamma-gamma/log-normal switch at min(α, β) = 500) would show as a
 * second difference of about that size at one sample, where smooth curvature changes little from
 * one sample to the next.
 * Published piecewise models keep their own steps (Kim at 50 km, Kruse at 6 and 50 km visibility,
 * the divergence/diffraction corner): the scans stay clear of them, and the budget names them.
 */
import { describe, expect, it } from 'vitest';
import { evaluateLink, type LinkDesignInput } from '../src/index.js';

const SECOND_DIFFERENCE_BOUND_DB = 2e-3;
const POINTS = 1200;

const base: LinkDesignInput = {
  rangeM: 2000,
  transmitter: { wavelengthM: 1.55e-6, powerDbm: 20, waistRadiusM: 0.025, halfAngleDivergenceRad: 1e-3, opticsLossDb: 1 },
  receiver: { apertureDiameterM: 0.1, sensitivityDbm: -36, opticsLossDb: 1.5 },
  pointing: { jitterSigmaPerAxisRad: 50e-6, staticErrorRad: 100e-6 },
  atmosphere: { model: 'kim', visibilityM: 5000, cn2: 1e-15 },
  scintillation: { include: true, probability: 1e-3 },
};
const narrow: LinkDesignInput = {
  ...base,
  transmitter: { ...base.transmitter, waistRadiusM: 0.02, halfAngleDivergenceRad: undefined },
  receiver: { ...base.receiver, obscurationRatio: 0.3 },
};

type Scan = { name: string; from: number; to: number; set: (design: LinkDesignInput, value: number) => LinkDesignInput };
const scans: Scan[] = [
  { name: 'Cn²', from: 1e-17, to: 1e-13, set: (d, v) => ({ ...d, atmosphere: { ...d.atmosphere, cn2: v } }) },
  { name: 'range', from: 200, to: 8000, set: (d, v) => ({ ...d, rangeM: v }) },
  { name: 'jitter', from: 1e-6, to: 3e-4, set: (d, v) => ({ ...d, pointing: { ...d.pointing, jitterSigmaPerAxisRad: v } }) },
  { name: 'bias', from: 1e-6, to: 3e-4, set: (d, v) => ({ ...d, pointing: { ...d.pointing, staticErrorRad: v } }) },
  { name: 'power', from: 0.1, to: 30, set: (d, v) => ({ ...d, transmitter: { ...d.transmitter, powerDbm: v } }) },
  { name: 'receive aperture', from: 0.02, to: 0.4, set: (d, v) => ({ ...d, receiver: { ...d.receiver, apertureDiameterM: v } }) },
  { name: 'transmit beam radius', from: 0.005, to: 0.05, set: (d, v) => ({ ...d, transmitter: { ...d.transmitter, waistRadiusM: v } }) },
  { name: 'obscuration', from: 0.01, to: 0.6, set: (d, v) => ({ ...d, receiver: { ...d.receiver, obscurationRatio: v } }) },
];

function largestSecondDifference(design: LinkDesignInput, scan: Scan): { value: number; at: number } {
  const margins: number[] = [];
  const ratio = Math.log(scan.to / scan.from);
  for (let i = 0; i < POINTS; i++) margins.push(evaluateLink(scan.set(design, scan.from * Math.exp((ratio * i) / (POINTS - 1)))).linkMarginDb);
  const second = (i: number) => Math.abs(margins[i + 1]! - 2 * margins[i]! + margins[i - 1]!);
  // A step between two samples shows in the second differences at those two samples only; smooth
  // curvature shows alike two samples away. So each second difference is measured against the bound
  // plus twice the larger of its neighbours two samples away (steep but smooth margins, e.g. a
  // pointing loss of hundreds of dB, pass; a jump does not).
  let worst = { value: 0, at: 0 };
  for (let i = 3; i < POINTS - 3; i++) {
    const excess = second(i) - 2 * Math.max(second(i - 2), second(i + 2));
    if (excess > worst.value) worst = { value: excess, at: scan.from * Math.exp((ratio * i) / (POINTS - 1)) };
  }
  return worst;
}

describe('the margin has no step along any input', () => {
  for (const [label, design] of [
    ['divergent beam, spherical wave', { ...base, atmosphere: { ...base.atmosphere, turbulenceModel: 'spherical-wave' as const } }],
    ['divergent beam, Gaussian beam', base],
    ['narrow collimated beam, obscured aperture, Gaussian beam', narrow],
  ] as const) {
    for (const scan of scans) {
      it(`${label}: ${scan.name}`, () => {
        const worst = largestSecondDifference(design, scan);
        expect(worst.value, `largest isolated second difference at ${scan.name} = ${worst.at}`).toBeLessThan(SECOND_DIFFERENCE_BOUND_DB);
      });
    }
  }

  it('would see the old hard switch: the fade margin crosses min(α, β) = 500 inside the Cn² scan', () => {
    // σ_I² ≈ 1/α + 1/β: the switch lies where σ_I² ≈ 0.004, which the Cn² scan spans
    const low = evaluateLink({ ...base, atmosphere: { ...base.atmosphere, cn2: 1e-17 } }).scintillationIndex;
    const high = evaluateLink({ ...base, atmosphere: { ...base.atmosphere, cn2: 1e-13 } }).scintillationIndex;
    expect(low).toBeLessThan(0.002);
    expect(high).toBeGreaterThan(0.01);
  });
});
