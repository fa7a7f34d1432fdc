/**
 * Reference adapters for Gaussian-beam cases (GB-*): Kogelnik & Li 1966, Siegman 1986 ch. 17,
 * ISO 11146-1 (M²), Andrews & Phillips 2005 ch. 4; values computed with scipy/numpy as recorded in
 * each case's `source`.
 */
import { gaussianBeam } from '../../src/beam/gaussian-beam.js';
import { encircledPowerFraction, gaussianPeakIntensityWPerM2, relativeIntensity } from '../../src/beam/intensity.js';
import {
  andrewsPhillipsBeamParameters,
  beamRadiusAtRangeM,
  defocusedLaunch,
  linearSpotRadiusM,
  quadratureSpotRadiusM,
} from '../../src/beam/launch.js';
import { beamWidthDefinitionRatio, convertBeamWidth, radiansToDegrees } from '../../src/units/beam-width.js';
import type { NotCovered, ReferenceAdapters } from './types.ts';

export const adapters: ReferenceAdapters = {
  gaussian_beam_basic: (inputs) => {
    const beam = gaussianBeam({ wavelengthM: inputs.wavelength_m, waistRadiusM: inputs.waist_radius_1e2_m, m2: inputs.M2 });
    const zR = beam.rayleighRangeM;
    return {
      rayleigh_range_m: zR,
      half_angle_divergence_rad: beam.halfAngleDivergenceRad,
      half_angle_divergence_deg: radiansToDegrees(beam.halfAngleDivergenceRad),
      full_angle_divergence_rad: beam.fullAngleDivergenceRad,
      full_angle_divergence_mrad: beam.fullAngleDivergenceRad * 1e3,
      beam_radius_at_zR_m: beam.radiusAtM(zR),
      beam_radius_at_zR_over_w0: beam.radiusAtM(zR) / beam.waistRadiusM,
      wavefront_radius_at_zR_m: beam.wavefrontRadiusAtM(zR),
      intensity_1e_radius_at_waist_m: convertBeamWidth(
        { value: beam.waistRadiusM, definition: '1/e2', extent: 'radius' },
        { definition: '1/e', extent: 'radius' },
      ),
      fwhm_diameter_at_waist_m: convertBeamWidth(
        { value: beam.waistRadiusM, definition: '1/e2', extent: 'radius' },
        { definition: 'fwhm', extent: 'diameter' },
      ),
      beam_parameter_product_m_rad: beam.beamParameterProductMRad,
      confocal_parameter_m: beam.confocalParameterM,
    };
  },
  gaussian_beam_at_z: (inputs) => {
    const beam = gaussianBeam({ wavelengthM: inputs.wavelength_m, waistRadiusM: inputs.waist_radius_1e2_m, m2: inputs.M2 });
    const z = inputs.z_m as number;
    return {
      beam_radius_1e2_m: beam.radiusAtM(z),
      wavefront_radius_m: beam.wavefrontRadiusAtM(z),
      gouy_phase_rad: beam.gouyPhaseAtRad(z),
      far_field_approx_radius_m: beam.farFieldRadiusAtM(z),
    };
  },
  gaussian_beam_M2: (inputs) => {
    const beam = gaussianBeam({ wavelengthM: inputs.wavelength_m, waistRadiusM: inputs.waist_radius_1e2_m, m2: inputs.M2 });
    const ideal = gaussianBeam({ wavelengthM: inputs.wavelength_m, waistRadiusM: inputs.waist_radius_1e2_m });
    return {
      rayleigh_range_m: beam.rayleighRangeM,
      rayleigh_range_if_M2_1_m: ideal.rayleighRangeM,
      half_angle_divergence_rad: beam.halfAngleDivergenceRad,
      beam_radius_at_z_m: beam.radiusAtM(inputs.z_m),
      beam_parameter_product_m_rad: beam.beamParameterProductMRad,
    };
  },
  gaussian_intensity_and_encircled_power: (inputs) => {
    const w = inputs.beam_radius_1e2_m as number;
    const fwhmRadius = convertBeamWidth({ value: w, definition: '1/e2', extent: 'radius' }, { definition: 'fwhm', extent: 'radius' });
    return {
      peak_intensity_W_per_m2: gaussianPeakIntensityWPerM2(inputs.power_W, w),
      fraction_within_w: encircledPowerFraction(w, w),
      fraction_within_w_over_sqrt2: encircledPowerFraction(w, w / Math.SQRT2),
      fraction_within_fwhm_radius: encircledPowerFraction(w, fwhmRadius),
      intensity_at_w_over_peak: relativeIntensity(w, w),
      intensity_at_w_over_sqrt2_over_peak: relativeIntensity(w, w / Math.SQRT2),
    };
  },
  beam_width_definition_conversions: () => ({
    d_1e2_over_fwhm: beamWidthDefinitionRatio('1/e2', 'fwhm'),
    d_1e_over_fwhm: beamWidthDefinitionRatio('1/e', 'fwhm'),
    d_1e2_over_d_1e: beamWidthDefinitionRatio('1/e2', '1/e'),
  }),
  andrews_phillips_beam_parameters_collimated: (inputs) => {
    // "inf (collimated)" in the case file: F0 = ∞.
    const parameters = andrewsPhillipsBeamParameters({
      wavelengthM: inputs.wavelength_m,
      apertureBeamRadiusM: inputs.W0_1e2_m,
      phaseFrontRadiusM: Infinity,
      rangeM: inputs.L_m,
    });
    return {
      Theta0: parameters.theta0,
      Lambda0: parameters.lambda0,
      Theta: parameters.theta,
      Lambda: parameters.lambda,
      W_m: parameters.beamRadiusM,
    };
  },
  divergent_gaussian_from_datasheet: (inputs) => {
    const launch = defocusedLaunch({
      wavelengthM: inputs.wavelength_m,
      apertureBeamRadiusM: inputs.W0_1e2_m,
      halfAngleDivergenceRad: inputs.half_angle_divergence_1e2_rad,
    });
    const parameters = andrewsPhillipsBeamParameters({
      wavelengthM: inputs.wavelength_m,
      apertureBeamRadiusM: inputs.W0_1e2_m,
      phaseFrontRadiusM: launch.phaseFrontRadiusM,
      rangeM: inputs.L_m,
    });
    const budgetRadius = beamRadiusAtRangeM({
      wavelengthM: inputs.wavelength_m,
      apertureBeamRadiusM: inputs.W0_1e2_m,
      halfAngleDivergenceRad: inputs.half_angle_divergence_1e2_rad,
      rangeM: inputs.L_m,
    });
    if (Math.abs(budgetRadius - parameters.beamRadiusM) > 1e-12 * parameters.beamRadiusM) {
      throw new Error(`beamRadiusAtRangeM ${budgetRadius} disagrees with the Andrews–Phillips W(L) ${parameters.beamRadiusM}`);
    }
    return {
      diffraction_half_angle_rad: launch.diffractionHalfAngleRad,
      F0_m: launch.phaseFrontRadiusM,
      W_exact_m: budgetRadius,
      W_linear_W0_plus_theta_L_m: linearSpotRadiusM(inputs.W0_1e2_m, inputs.half_angle_divergence_1e2_rad, inputs.L_m),
      W_quadrature_m: quadratureSpotRadiusM(inputs.W0_1e2_m, inputs.half_angle_divergence_1e2_rad, inputs.L_m),
      Theta: parameters.theta,
      Lambda: parameters.lambda,
    };
  },
};

export const notCovered: NotCovered = {};
