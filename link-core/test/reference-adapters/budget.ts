/**
 * Reference adapters of the link budget (METHODS.md §10–§11): the worked example LB-01, the maximum
 * ranges LB-02-* and the availability from a (synthetic) visibility climatology LB-03. The case
 * inputs use the key names of the reference file; they are mapped onto a LinkDesign here.
 */
import { availabilityFromClimatology, evaluateLink, maxRange, type LinkDesignInput } from '../../src/index.js';
import type { NotCovered, ReferenceAdapters, ReferenceInputs } from './types.ts';

/** The reference chain: Kim model with K = 3.91, 2 % visibility, spherical-wave gamma-gamma fade margin. */
function designFromInputs(inputs: ReferenceInputs): LinkDesignInput {
  return {
    rangeM: inputs.L_m ?? 1000,
    transmitter: {
      wavelengthM: inputs.wavelength_m,
      powerDbm: inputs.P_tx_dBm,
      waistRadiusM: inputs.W0_1e2_m,
      halfAngleDivergenceRad: inputs.half_angle_divergence_1e2_rad,
      opticsLossDb: inputs.tx_optics_loss_dB,
    },
    receiver: { apertureDiameterM: inputs.rx_diameter_m, sensitivityDbm: inputs.sensitivity_dBm, opticsLossDb: inputs.rx_optics_loss_dB },
    pointing: { jitterSigmaPerAxisRad: inputs.jitter_sigma_per_axis_rad, staticErrorRad: inputs.static_pointing_error_rad },
    // LB-03 has no visibility of its own (the climatology supplies it); 10 km is a placeholder the
    // availability routine does not read.
    atmosphere: { model: 'kim', visibilityM: inputs.visibility_m ?? 10_000, cn2: inputs['Cn2_m^-2/3'] },
    scintillation: { include: inputs.include_scintillation ?? true, probability: inputs.fade_probability },
  };
}

export const adapters: ReferenceAdapters = {
  link_budget_worked_example: (inputs) => {
    const budget = evaluateLink(designFromInputs(inputs));
    return {
      W_at_rx_m: budget.beamRadiusAtReceiverM,
      geometric_loss_dB: budget.geometricLossDb,
      atmospheric_loss_dB: budget.atmosphericLossDb,
      mean_pointing_loss_dB: budget.pointingLossDb,
      received_power_mean_dBm: budget.receivedPowerDbm,
      scintillation_index_aperture_averaged: budget.scintillationIndex,
      scintillation_fade_margin_dB: budget.scintillationFadeMarginDb,
      link_margin_dB: budget.linkMarginDb,
    };
  },
  maximum_range_for_margin: (inputs) => {
    const result = maxRange(designFromInputs(inputs), inputs.required_margin_dB);
    return { max_range_m: result.rangeM, margin_at_max_range_dB: result.marginAtRangeDb };
  },
  availability_from_visibility_climatology: (inputs) => {
    if (inputs.interpolation !== 'log10(P) linear in log10(V)') throw new Error(`unexpected interpolation ${String(inputs.interpolation)}`);
    const result = availabilityFromClimatology(designFromInputs(inputs), {
      visibilityM: (inputs.climatology_visibility_km as number[]).map((km) => km * 1000),
      probabilityBelow: inputs.climatology_prob_visibility_below as number[],
    });
    return {
      clear_air_margin_dB: result.clearAirMarginDb,
      max_specific_attenuation_dB_per_km: result.maxSpecificAttenuationDbPerKm,
      V_min_m: result.minimumVisibilityM,
      unavailability: result.unavailability,
      availability: result.availability,
      availability_percent: result.availabilityPercent,
    };
  },
};

export const notCovered: NotCovered = {};
