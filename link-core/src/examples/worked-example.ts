import type { LinkDesignInput } from '../schemas/link-design.schema.js';

/**
 * The worked budget example LB-01 (METHODS.md §10.1; reference cases `LB-01` and
 * `LB-01-exact-pointing`): 20 dBm at 1550 nm from a 25 mm (1/e² radius) beam of 1 mrad half angle,
 * 2 km to a 100 mm receiver of −36 dBm sensitivity, 1 + 1.5 dB optics, 5 km visibility (Kim),
 * Cn² = 5e-14 m^(−2/3), 50 µrad jitter per axis and 100 µrad bias, fade probability 1e-3. With the
 * spherical wave its margin is 12.33 dB.
 *
 * The one example design of the repository: the tests of link-core, the api and the ui and the
 * README's examples all start from it. A fresh copy each call, so a caller may change it.
 * @example evaluateLink(workedExampleDesign()).linkMarginDb
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
