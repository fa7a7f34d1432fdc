/**
 * Reference adapters for pointing cases (PT-*): Rayleigh/Rician tails (Marcum Q1; scipy ncx2 with
 * quadrature cross-checks in the case source), Farid & Hranilovic 2007 statistics, EN 1991-1-4
 * Annex F (from memory, as the case says), elementary beam theory for building tilt.
 */
import {
  angularPointingLossDb,
  faridHranilovicOutageProbability,
  faridHranilovicPointingStatistics,
  meanPointingLossDb,
  meanPointingRelativePower,
  pointingJitterBudget,
  pointingLossAtOutageDb,
  pointingOutageProbability,
  requiredThresholdOverSigma,
} from '../../src/pointing/pointing.js';
import { buildingFundamentalFrequencyHz, buildingTiltEstimates } from '../../src/pointing/building-sway.js';
import { offsetForRelativeCapture } from '../../src/capture/capture.js';
import { exactMeanPointingLossDb, exactOutagePointingLossDb, ricianOutageRadius } from '../../src/pointing/exact-pointing.js';
import { DB_PER_NATURAL_LOG_POWER } from '../../src/units/constants.js';
import type { NotCovered, ReferenceAdapters } from './types.ts';

export const adapters: ReferenceAdapters = {
  mean_pointing_loss_exact: (inputs) => ({
    mean_pointing_loss_dB: exactMeanPointingLossDb(
      inputs.beam_radius_1e2_m,
      inputs.aperture_radius_m,
      inputs.obscuration_radius_m,
      inputs.jitter_sigma_per_axis_m,
      inputs.static_offset_m,
    ),
    small_receiver_form_dB: meanPointingLossDb(inputs.beam_radius_1e2_m, inputs.jitter_sigma_per_axis_m, inputs.static_offset_m),
  }),
  outage_pointing_loss_exact: (inputs) => ({
    outage_radius_m: ricianOutageRadius(inputs.jitter_sigma_per_axis_m, inputs.static_offset_m, inputs.outage_probability),
    outage_pointing_loss_dB: exactOutagePointingLossDb(
      inputs.beam_radius_1e2_m,
      inputs.aperture_radius_m,
      inputs.obscuration_radius_m,
      inputs.jitter_sigma_per_axis_m,
      inputs.static_offset_m,
      inputs.outage_probability,
    ),
    small_receiver_form_dB: pointingLossAtOutageDb({
      beamRadiusM: inputs.beam_radius_1e2_m,
      jitterSigmaPerAxisM: inputs.jitter_sigma_per_axis_m,
      staticOffsetM: inputs.static_offset_m,
      outageProbability: inputs.outage_probability,
    }),
  }),
  pointing_outage_rayleigh: (inputs) => ({
    outage_probability: pointingOutageProbability({ jitterSigmaPerAxisM: inputs.jitter_sigma_per_axis_m, thresholdRadiusM: inputs.threshold_radius_m }),
  }),
  pointing_outage_rician: (inputs) => ({
    outage_probability: pointingOutageProbability({
      jitterSigmaPerAxisM: inputs.jitter_sigma_per_axis_m,
      staticOffsetM: inputs.static_offset_m,
      thresholdRadiusM: inputs.threshold_radius_m,
    }),
  }),
  pointing_required_ratio_rayleigh: (inputs) => ({
    threshold_over_sigma: requiredThresholdOverSigma({ outageProbability: inputs.outage_probability }),
  }),
  pointing_required_ratio_rician: (inputs) => ({
    threshold_over_sigma: requiredThresholdOverSigma({
      outageProbability: inputs.outage_probability,
      staticOffsetOverSigma: inputs.static_offset_over_sigma,
    }),
  }),
  pointing_mean_loss_small_aperture: (inputs) => ({
    mean_relative_power: meanPointingRelativePower(inputs.beam_radius_1e2_m, inputs.jitter_sigma_per_axis_m, inputs.static_offset_m),
    mean_loss_dB: meanPointingLossDb(inputs.beam_radius_1e2_m, inputs.jitter_sigma_per_axis_m, inputs.static_offset_m),
  }),
  farid_hranilovic_pointing_statistics: (inputs) => {
    const statistics = faridHranilovicPointingStatistics({
      beamRadiusM: inputs.beam_radius_1e2_m,
      apertureRadiusM: inputs.rx_aperture_radius_m,
      jitterSigmaPerAxisM: inputs.jitter_sigma_per_axis_m,
    });
    const halfPowerRadius = offsetForRelativeCapture({
      beamRadiusM: inputs.beam_radius_1e2_m,
      apertureRadiusM: inputs.rx_aperture_radius_m,
      relativeFraction: inputs.fade_threshold_relative_to_A0,
    });
    return {
      A0: statistics.peakFraction,
      w_eq_m: statistics.equivalentBeamRadiusM,
      xi: statistics.xi,
      mean_hp: statistics.meanFraction,
      mean_hp_over_A0: statistics.meanFractionOverPeak,
      outage_probability_farid: faridHranilovicOutageProbability(statistics.xi, inputs.fade_threshold_relative_to_A0),
      outage_probability_exact_capture: pointingOutageProbability({
        jitterSigmaPerAxisM: inputs.jitter_sigma_per_axis_m,
        thresholdRadiusM: halfPowerRadius,
      }),
      exact_half_power_radius_m: halfPowerRadius,
    };
  },
  pointing_loss_angular_ratio: (inputs) => {
    const x = inputs.offset_angle_over_half_divergence_1e2 as number;
    return {
      loss_dB: angularPointingLossDb(x),
      // The case restates the same loss through the 8.686 = 20/ln 10 coefficient.
      'loss_dB_coefficient_8.686_x2': 2 * DB_PER_NATURAL_LOG_POWER * x * x,
    };
  },
  pointing_jitter_budget: (inputs) => {
    const budget = pointingJitterBudget({
      beamRadiusM: inputs.beam_radius_1e2_m,
      allowedPointingLossDb: inputs.allowed_pointing_loss_dB,
      outageProbability: inputs.outage_probability,
      rangeM: inputs.L_m,
    });
    return {
      allowed_offset_m: budget.allowedOffsetM,
      max_sigma_per_axis_m: budget.maxSigmaPerAxisM,
      max_sigma_per_axis_rad: budget.maxSigmaPerAxisRad,
    };
  },
  building_fundamental_frequency_EN1991: (inputs) => {
    const frequency = buildingFundamentalFrequencyHz(inputs.building_height_m);
    return { n1_Hz: frequency, period_s: 1 / frequency };
  },
  building_tilt_estimates: (inputs) => {
    const tilt = buildingTiltEstimates({
      driftRatio: inputs.drift_ratio_delta_over_H,
      heightM: inputs.height_m,
      widthM: inputs.width_m,
      thermalExpansionPerK: inputs.thermal_expansion_per_K,
      temperatureDifferenceK: inputs.temperature_difference_K,
      rangeM: inputs.L_m,
    });
    return {
      flexural_cantilever_tilt_rad: tilt.flexuralCantileverTiltRad,
      shear_building_tilt_rad: tilt.shearFrameTiltRad,
      thermal_bowing_tilt_rad: tilt.thermalBowingTiltRad,
      thermal_bowing_top_displacement_m: tilt.thermalBowingTopDisplacementM,
      beam_displacement_at_L_from_thermal_tilt_m: tilt.thermalBeamDisplacementAtRangeM,
    };
  },
};

export const notCovered: NotCovered = {};
