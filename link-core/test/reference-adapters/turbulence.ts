/**
 * Reference adapters for METHODS.md §6 (turbulence). Each calls the engine's exported functions.
 */
import { andrewsPhillipsBeamParameters } from '../../src/beam/launch.ts';
import { collimatedBeamWander, longTermBeamRadius } from '../../src/turbulence/beam-wander.ts';
import {
  fadeMarginDb,
  gammaGammaCdf,
  gammaGammaPdf,
  gammaGammaQuantile,
} from '../../src/turbulence/fade-statistics.ts';
import {
  gaussianBeamRytovRatio,
  gaussianBeamRytovRatioApproximate,
  gaussianBeamRytovRatioIntegral,
  gaussianBeamScintillationIndex,
} from '../../src/turbulence/gaussian-beam-scintillation.ts';
import { coherenceRadiusM, fresnelZoneM, friedParameterM, rytovVariance, wavenumberRadPerM } from '../../src/turbulence/rytov.ts';
import {
  gammaGammaParameters,
  normalisedApertureSquared,
  scintillationIndexAllRegimes,
  weakApertureAveraging,
  weakApertureAveragingNumerical,
} from '../../src/turbulence/scintillation.ts';
import { normalQuantileOf } from '../../src/numeric/normal.ts';
import type { NotCovered, ReferenceAdapters, ReferenceInputs } from './types.ts';

const CN2 = 'Cn2_m^-2/3';

function phaseFront(value: number | string): number {
  return typeof value === 'string' ? Infinity : value;
}

function beam(inputs: ReferenceInputs) {
  return andrewsPhillipsBeamParameters({
    wavelengthM: inputs.wavelength_m,
    apertureBeamRadiusM: inputs.W0_1e2_m,
    phaseFrontRadiusM: phaseFront(inputs.F0_m ?? 'inf'),
    rangeM: inputs.L_m,
  });
}

export const adapters: ReferenceAdapters = {
  rytov_variance: (inputs) => {
    const common = { cn2: inputs[CN2], wavelengthM: inputs.wavelength_m, distanceM: inputs.L_m };
    return {
      wavenumber_rad_per_m: wavenumberRadPerM(inputs.wavelength_m),
      rytov_plane_sigma_R2: rytovVariance({ ...common, wave: 'plane' }),
      rytov_spherical_beta0_2: rytovVariance({ ...common, wave: 'spherical' }),
      fresnel_zone_sqrt_L_over_k_m: fresnelZoneM(inputs.wavelength_m, inputs.L_m),
      coherence_radius_plane_rho0_m: coherenceRadiusM({ ...common, wave: 'plane' }),
      coherence_radius_spherical_rho0_m: coherenceRadiusM({ ...common, wave: 'spherical' }),
      fried_r0_plane_m: friedParameterM({ ...common, wave: 'plane' }),
      fried_r0_spherical_m: friedParameterM({ ...common, wave: 'spherical' }),
    };
  },
  gaussian_beam_rytov_on_axis: (inputs) => {
    const { theta, lambda } = beam(inputs);
    return {
      Theta: theta,
      Lambda: lambda,
      'ratio_sigmaB2_over_sigmaR2_approx_0.40_form': gaussianBeamRytovRatioApproximate(theta, lambda),
      ratio_sigmaB2_over_sigmaR2_hypergeometric: gaussianBeamRytovRatio(theta, lambda),
      ratio_sigmaB2_over_sigmaR2_numerical_integral: gaussianBeamRytovRatioIntegral(theta, lambda),
    };
  },
  gaussian_beam_scintillation_all_regimes: (inputs) => {
    const { theta, lambda } = beam(inputs);
    const sigmaR2 = rytovVariance({ cn2: inputs[CN2], wavelengthM: inputs.wavelength_m, distanceM: inputs.L_m, wave: 'plane' });
    const sigmaB2 = sigmaR2 * gaussianBeamRytovRatio(theta, lambda);
    return { Theta: theta, Lambda: lambda, sigma_R2: sigmaR2, sigma_B2: sigmaB2, scintillation_index_on_axis: gaussianBeamScintillationIndex(sigmaB2, theta) };
  },
  scintillation_index_and_gamma_gamma_plane: (inputs) => {
    const parameters = gammaGammaParameters({ rytovVariance: inputs.rytov_plane_sigma_R2, wave: 'plane', apertureD2: inputs.aperture_d2 });
    return {
      scintillation_index: scintillationIndexAllRegimes(inputs.rytov_plane_sigma_R2, 'plane'),
      alpha: parameters.alpha,
      beta: parameters.beta,
      // The weak limit of the scintillation index is the Rytov variance itself (Andrews & Phillips ch. 8).
      weak_limit_sigmaI2_equals_sigmaR2: inputs.rytov_plane_sigma_R2,
    };
  },
  scintillation_index_and_gamma_gamma_spherical: (inputs) => {
    const parameters = gammaGammaParameters({ rytovVariance: inputs.rytov_spherical_beta0_2, wave: 'spherical', apertureD2: inputs.aperture_d2 });
    return {
      scintillation_index: scintillationIndexAllRegimes(inputs.rytov_spherical_beta0_2, 'spherical'),
      alpha: parameters.alpha,
      beta: parameters.beta,
    };
  },
  fade_margin_gamma_gamma: (inputs) => {
    const { alpha, beta, scintillationIndex } = gammaGammaParameters({ rytovVariance: inputs.rytov_plane_sigma_R2, wave: 'plane', apertureD2: inputs.aperture_d2 });
    const result: Record<string, number> = {
      alpha,
      beta,
      scintillation_index: scintillationIndex,
      'pdf_at_I_0.3': gammaGammaPdf(0.3, alpha, beta),
      'cdf_at_I_0.3': gammaGammaCdf(0.3, alpha, beta),
    };
    for (const [label, probability] of [['0.001', 1e-3], ['1e-06', 1e-6]] as const) {
      result[`threshold_I_over_mean_p${label}`] = gammaGammaQuantile(alpha, beta, probability);
      result[`fade_margin_dB_p${label}`] = fadeMarginDb({ model: 'gamma-gamma', alpha, beta, probability });
      result[`lognormal_same_SI_fade_margin_dB_p${label}`] = fadeMarginDb({ model: 'lognormal', scintillationIndex, probability });
    }
    return result;
  },
  fade_margin_lognormal: (inputs) => {
    const scintillationIndex = inputs.scintillation_index;
    const result: Record<string, number> = { sigma_lnI2: Math.log1p(scintillationIndex) };
    for (const [label, probability] of [['0.001', 1e-3], ['1e-06', 1e-6]] as const) {
      result[`z_p${label}`] = normalQuantileOf(probability);
      result[`fade_margin_dB_p${label}`] = fadeMarginDb({ model: 'lognormal', scintillationIndex, probability });
    }
    return result;
  },
  aperture_averaging_weak: (inputs) => {
    const d2 = normalisedApertureSquared(inputs.wavelength_m, inputs.L_m, inputs.rx_diameter_m);
    const factors = weakApertureAveraging(d2);
    return { d2_kD2_over_4L: d2, A_plane_andrews: factors.planeAndrews, A_spherical_andrews: factors.sphericalAndrews, A_plane_churnside: factors.planeChurnside };
  },
  aperture_averaging_weak_numerical: (inputs) => {
    const d2 = inputs.d2_kD2_over_4L;
    const factors = weakApertureAveraging(d2);
    return {
      A_plane_numerical: weakApertureAveragingNumerical(d2, 'plane'),
      A_plane_andrews_fit: factors.planeAndrews,
      A_spherical_numerical: weakApertureAveragingNumerical(d2, 'spherical'),
      A_spherical_andrews_fit: factors.sphericalAndrews,
    };
  },
  aperture_averaged_gamma_gamma: (inputs) => {
    const d2 = normalisedApertureSquared(inputs.wavelength_m, inputs.L_m, inputs.rx_diameter_m);
    const plane = gammaGammaParameters({ rytovVariance: inputs.rytov_plane_sigma_R2, wave: 'plane', apertureD2: d2 });
    // β0² = (0.50/1.23)·σ_R² for the same path (METHODS.md §6.2).
    const beta02 = (inputs.rytov_plane_sigma_R2 * 0.5) / 1.23;
    const spherical = gammaGammaParameters({ rytovVariance: beta02, wave: 'spherical', apertureD2: d2 });
    return {
      d2,
      plane_SI_D: plane.scintillationIndex,
      plane_alpha: plane.alpha,
      plane_beta: plane.beta,
      spherical_beta0_2: beta02,
      spherical_SI_D: spherical.scintillationIndex,
      spherical_alpha: spherical.alpha,
      spherical_beta: spherical.beta,
      'spherical_fade_margin_dB_p0.001': fadeMarginDb({ model: 'gamma-gamma', alpha: spherical.alpha, beta: spherical.beta, probability: 1e-3 }),
    };
  },
  beam_wander_collimated: (inputs) => {
    const wander = collimatedBeamWander(inputs[CN2], inputs.L_m, inputs.W0_1e2_m);
    return {
      wander_variance_m2: wander.wanderVarianceM2,
      wander_rms_radial_m: wander.wanderRmsRadialM,
      wander_sigma_per_axis_m: wander.wanderSigmaPerAxisM,
      wander_rms_angle_rad: wander.wanderRmsAngleRad,
    };
  },
  long_term_beam_radius: (inputs) => {
    const parameters = beam(inputs);
    const sigmaR2 = rytovVariance({ cn2: inputs[CN2], wavelengthM: inputs.wavelength_m, distanceM: inputs.L_m, wave: 'plane' });
    const longTerm = longTermBeamRadius(parameters.beamRadiusM, parameters.lambda, sigmaR2);
    return { W_m: parameters.beamRadiusM, Lambda: parameters.lambda, sigma_R2: sigmaR2, W_LT_weak_m: longTerm.weakM, W_LT_strong_m: longTerm.strongM };
  },
};

export const notCovered: NotCovered = {};
