/**
 * Reference adapters for METHODS.md §8 (eye safety). Each calls the engine's exported functions.
 */
import { accessiblePowerW, measurementConditions } from '../../src/safety/classification.ts';
import {
  classOneAel,
  classOneAelW,
  correctionFactorC4,
  correctionFactorC7,
  limitingApertureDiameterM,
  mpePowerThroughLimitingApertureW,
  ocularMpeDetails,
  ocularMpeRadiantExposureJPerM2,
  ocularMpeWPerM2,
} from '../../src/safety/exposure-limits.ts';
import { BINOCULAR_7X50_GAIN, exitPeakIrradianceWPerM2, nohdFarFieldM, nohdM } from '../../src/safety/hazard-distance.ts';
import type { NotCovered, ReferenceAdapters } from './types.ts';

// ">=10" in the cases: any exposure of 10 s or more gives the same CW MPE; 100 s is the IEC time base.
const LONG_EXPOSURE_S = 100;

export const adapters: ReferenceAdapters = {
  mpe_ocular_cw_small_source: (inputs) => {
    const wavelengthM = inputs.wavelength_m;
    const mpe = ocularMpeWPerM2({ wavelengthM, exposureS: LONG_EXPOSURE_S });
    return {
      C4: correctionFactorC4(wavelengthM),
      C7: correctionFactorC7(wavelengthM),
      MPE_W_per_m2: mpe,
      MPE_mW_per_cm2: mpe / 10, // 1 W/m² = 0.1 mW/cm²
      MPE_H_1s_J_per_m2: ocularMpeRadiantExposureJPerM2({ wavelengthM, exposureS: 1 }),
      MPE_H_10s_J_per_m2: ocularMpeRadiantExposureJPerM2({ wavelengthM, exposureS: 10 }),
      power_through_7mm_at_MPE_W: mpePowerThroughLimitingApertureW({ wavelengthM, exposureS: LONG_EXPOSURE_S }),
      class1_AEL_W: classOneAelW(wavelengthM),
    };
  },
  mpe_ocular_cw_small_source_1310: (inputs) => {
    const wavelengthM = inputs.wavelength_m;
    const old = ocularMpeDetails({ wavelengthM, exposureS: LONG_EXPOSURE_S, edition: 'IEC 60825-1:2007' });
    const current = ocularMpeDetails({ wavelengthM, exposureS: LONG_EXPOSURE_S, edition: 'IEC 60825-1:2014' });
    const currentAel = classOneAel(wavelengthM, LONG_EXPOSURE_S, 'IEC 60825-1:2014');
    return {
      C4: old.c4,
      C7_2007_edition: old.c7,
      C7_2014_edition: current.c7,
      MPE_retinal_2007_W_per_m2: old.retinalMpeWPerM2,
      MPE_retinal_2014_W_per_m2: current.retinalMpeWPerM2,
      class1_AEL_2007_W: classOneAelW(wavelengthM, 'IEC 60825-1:2007'),
      class1_AEL_2014_retinal_W: currentAel.retinalPowerW,
      class1_AEL_2014_with_3B_dual_limit_W: currentAel.powerW,
      skin_MPE_used_as_corneal_guide_W_per_m2: current.cornealGuideMpeWPerM2,
    };
  },
  mpe_ocular_1550: (inputs) => {
    const wavelengthM = inputs.wavelength_m;
    return {
      MPE_E_t_ge_10s_W_per_m2: ocularMpeWPerM2({ wavelengthM, exposureS: LONG_EXPOSURE_S }),
      'MPE_H_1e-9_to_10s_J_per_m2': ocularMpeRadiantExposureJPerM2({ wavelengthM, exposureS: 1 }),
      limiting_aperture_t_ge_10s_m: limitingApertureDiameterM(wavelengthM, LONG_EXPOSURE_S),
      'power_through_3.5mm_at_MPE_W': mpePowerThroughLimitingApertureW({ wavelengthM, exposureS: LONG_EXPOSURE_S }),
      class1_AEL_t_ge_10s_W: classOneAelW(wavelengthM),
      class1_AEL_t_1s_J: classOneAel(wavelengthM, 1).energyJ,
    };
  },
  nohd_gaussian: (inputs) => {
    const mpe = ocularMpeWPerM2({ wavelengthM: inputs.wavelength_m, exposureS: LONG_EXPOSURE_S });
    const beam = {
      powerW: inputs.power_W,
      mpeWPerM2: mpe,
      wavelengthM: inputs.wavelength_m,
      waistRadiusM: inputs.exit_beam_radius_1e2_m,
      halfAngleDivergenceRad: inputs.half_angle_divergence_1e2_rad,
    };
    return {
      MPE_W_per_m2: mpe,
      exit_peak_irradiance_W_per_m2: exitPeakIrradianceWPerM2(inputs.power_W, inputs.exit_beam_radius_1e2_m),
      NOHD_m: nohdM(beam),
      NOHD_ansi_far_field_m: nohdFarFieldM(beam),
      NOHD_7x50_binocular_m: nohdM({ ...beam, opticalGain: BINOCULAR_7X50_GAIN }),
    };
  },
  accessible_power_through_apertures: (inputs) => {
    const { condition1, condition3 } = measurementConditions(inputs.wavelength_m);
    // The case computed the beam radius with the linear rule W0 + θz (its source code says so); the
    // engine's default exact Gaussian radius is slightly smaller (3e-6 relative here, conservative).
    const beam = {
      powerW: inputs.power_W,
      wavelengthM: inputs.wavelength_m,
      apertureBeamRadiusM: inputs.exit_beam_radius_1e2_m,
      halfAngleDivergenceRad: inputs.half_angle_divergence_1e2_rad,
      beamGrowth: 'linear' as const,
    };
    return {
      'cond3_power_7mm_at_0.1m_W': accessiblePowerW({ ...beam, measurementApertureDiameterM: condition3.apertureDiameterM, distanceM: condition3.distanceM }),
      cond1_power_50mm_at_2m_W: accessiblePowerW({ ...beam, measurementApertureDiameterM: condition1.apertureDiameterM, distanceM: condition1.distanceM }),
      class1_AEL_W: classOneAelW(inputs.wavelength_m),
    };
  },
};

export const notCovered: NotCovered = {};
