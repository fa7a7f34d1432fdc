/**
 * Reference adapters for transmit-aperture cases (TR-*): Klein & Degnan, Appl. Opt. 13(9) 2134
 * (1974); values computed with scipy/numpy as recorded in each case's `source`.
 */
import {
  fraunhoferDistanceM,
  friisPowerRatio,
  gaussianBeamOnAxisGain,
  onAxisFarFieldIrradianceWPerM2,
  optimumTruncation,
  transmittedFraction,
  truncatedGaussianGain,
  truncationGainEfficiency,
  uniformApertureGain,
} from '../../src/transmit/truncation.js';
import { centredCaptureFraction, smallApertureCaptureApproximation } from '../../src/capture/capture.js';
import { ratioToDb } from '../../src/units/decibels.js';
import type { NotCovered, ReferenceAdapters } from './types.ts';

export const adapters: ReferenceAdapters = {
  truncation_optimum_unobscured: (inputs) => {
    const optimum = optimumTruncation({ obscurationRatio: inputs.obscuration_ratio });
    return {
      alpha_opt_aperture_radius_over_w: optimum.apertureToBeamRatio,
      beam_radius_over_aperture_radius: optimum.beamToApertureRatio,
      gain_efficiency_g: optimum.onAxisGainEfficiency,
      gain_efficiency_dB: optimum.onAxisGainEfficiencyDb,
      transmitted_fraction: optimum.transmittedFraction,
      clipping_loss_dB: optimum.clippingLossDb,
    };
  },
  truncation_optimum_obscured: (inputs) => {
    const optimum = optimumTruncation({ obscurationRatio: inputs.obscuration_ratio });
    return {
      alpha_opt: optimum.apertureToBeamRatio,
      gain_efficiency_g: optimum.onAxisGainEfficiency,
      'alpha_fit_1.12-1.30g2+2.12g4': optimum.apertureToBeamRatioFit,
    };
  },
  truncation_gain_efficiency: (inputs) => ({
    gain_efficiency_g: truncationGainEfficiency(inputs.alpha, inputs.obscuration_ratio),
    transmitted_fraction: transmittedFraction(inputs.alpha, inputs.obscuration_ratio),
  }),
  truncated_gaussian_far_field_gain: (inputs) => {
    const gain = truncatedGaussianGain({ apertureDiameterM: inputs.aperture_diameter_m, wavelengthM: inputs.wavelength_m, alpha: inputs.alpha });
    return {
      uniform_gain_dBi: ratioToDb(uniformApertureGain(inputs.aperture_diameter_m, inputs.wavelength_m)),
      optimum_gain_dBi: ratioToDb(gain),
      fraunhofer_distance_pi_a2_over_lambda_m: fraunhoferDistanceM(inputs.aperture_diameter_m / 2, inputs.wavelength_m),
      on_axis_far_field_irradiance_W_per_m2: onAxisFarFieldIrradianceWPerM2(inputs.power_W, gain, inputs.L_m),
    };
  },
  gaussian_gain_vs_capture_consistency: (inputs) => {
    const theta = inputs.half_angle_divergence_1e2_rad as number;
    const transmitGain = gaussianBeamOnAxisGain(theta);
    const receiveGain = uniformApertureGain(inputs.rx_diameter_m, inputs.wavelength_m);
    const beamRadius = theta * inputs.L_m;
    return {
      tx_gain_8_over_theta2_dBi: ratioToDb(transmitGain),
      rx_gain_dBi: ratioToDb(receiveGain),
      friis_ratio: friisPowerRatio(transmitGain, receiveGain, inputs.wavelength_m, inputs.L_m),
      small_aperture_capture_D2_over_2theta2L2: smallApertureCaptureApproximation(beamRadius, inputs.rx_diameter_m / 2),
      exact_centred_capture_w_theta_L: centredCaptureFraction(beamRadius, inputs.rx_diameter_m / 2),
    };
  },
};

export const notCovered: NotCovered = {};
