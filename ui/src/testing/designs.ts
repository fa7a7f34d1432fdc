import type { LinkDesignInput } from '@beamwright/link-core';

/**
 * The worked budget example LB-01 of link-core/METHODS.md §10.1 (fixtures/reference): 20 dBm at
 * 1550 nm, W0 = 25 mm, θ = 1 mrad, 2 km, 100 mm receiver; its published margin is 12.33 dB.
 */
export const workedExampleDesign: LinkDesignInput = {
  rangeM: 2000,
  transmitter: { wavelengthM: 1550e-9, powerDbm: 20, waistRadiusM: 0.025, halfAngleDivergenceRad: 1e-3, opticsLossDb: 1 },
  receiver: { apertureDiameterM: 0.1, sensitivityDbm: -36, opticsLossDb: 1.5 },
  pointing: { jitterSigmaPerAxisRad: 50e-6, staticErrorRad: 100e-6 },
  atmosphere: { model: 'kim', visibilityM: 5000, cn2: 5e-14 },
  scintillation: { include: true, probability: 1e-3 },
};
