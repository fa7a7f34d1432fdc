import type { LinkDesignInput } from '@beamwright/link-core';

/**
 * The worked example LB-01 of link-core/METHODS.md §10.1: 20 dBm at 1550 nm,
 * W0 = 25 mm, θ = 1 mrad half-angle (1/e²), L = 2 km, D_rx = 0.1 m, 1 + 1.5 dB optics,
 * V = 5 km (Kim), Cn² = 5e-14, 50 µrad jitter and 100 µrad bias, p = 1e-3, S = −36 dBm.
 * Its published-in-the-notes margin is 12.33 dB.
 */
export function workedExampleDesign(): LinkDesignInput {
  return {
    rangeM: 2000,
    transmitter: { wavelengthM: 1550e-9, powerDbm: 20, waistRadiusM: 0.025, halfAngleDivergenceRad: 1e-3, opticsLossDb: 1 },
    receiver: { apertureDiameterM: 0.1, sensitivityDbm: -36, opticsLossDb: 1.5 },
    pointing: { jitterSigmaPerAxisRad: 50e-6, staticErrorRad: 100e-6 },
    atmosphere: { model: 'kim', visibilityM: 5000, cn2: 5e-14 },
    scintillation: { include: true, probability: 1e-3 },
  };
}

/** The worked example with a few fields changed, for revisions. */
export function designWith(changes: { rangeM?: number; powerDbm?: number; visibilityM?: number }): LinkDesignInput {
  const design = workedExampleDesign();
  if (changes.rangeM !== undefined) design.rangeM = changes.rangeM;
  if (changes.powerDbm !== undefined) design.transmitter.powerDbm = changes.powerDbm;
  if (changes.visibilityM !== undefined) design.atmosphere.visibilityM = changes.visibilityM;
  return design;
}
