import type { LinkDesignInput, VisibilityDefinition } from '@beamwright/link-core';

/** The organisation's defaults a new design takes (organisation settings); absent = the engine's own. */
export interface StarterDefaults {
  fadeProbability?: number;
  visibilityDefinition?: VisibilityDefinition;
}

/**
 * What a new link starts from: typical figures of a rooftop link at 1550 nm (values of the worked
 * budget example in the project's reference notes, illustrative only). Every figure is meant to be
 * replaced by the terminals' datasheets in the workspace.
 */
export function starterDesign(rangeM: number, defaults: StarterDefaults = {}): LinkDesignInput {
  return {
    rangeM,
    transmitter: { wavelengthM: 1550e-9, powerDbm: 20, waistRadiusM: 0.025, halfAngleDivergenceRad: 1e-3, m2: 1, opticsLossDb: 1 },
    receiver: { apertureDiameterM: 0.1, sensitivityDbm: -36, opticsLossDb: 1.5, obscurationRatio: 0 },
    pointing: { jitterSigmaPerAxisRad: 50e-6, staticErrorRad: 100e-6 },
    atmosphere: { model: 'kim', visibilityM: 5000, visibilityDefinition: defaults.visibilityDefinition ?? 'contrast-2-percent', cn2: 5e-14 },
    scintillation: { include: true, probability: defaults.fadeProbability ?? 1e-3 },
    systemMarginDb: 0,
  };
}
