/**
 * Reference adapters for METHODS.md §5 (attenuation). Each calls the engine's exported functions.
 */
import { DB_PER_NATURAL_LOG_POWER } from '../../src/units/constants.ts';
import {
  alNaboulsiFogAttenuationDbPerKm,
  alNaboulsiFogExtinctionPerKm,
  atmosphericPathLoss,
  rainAttenuationDbPerKm,
  snowAttenuationDbPerKm,
} from '../../src/atmosphere/fog-and-precipitation.ts';
import {
  koschmiederConstant,
  kimExponent,
  kruseExponent,
  VISIBILITY_2_PERCENT_PER_MOR,
  visibilityAttenuationDbPerKm,
  visibilityExtinctionPerKm,
  type VisibilityModel,
} from '../../src/atmosphere/visibility-attenuation.ts';
import type { NotCovered, ReferenceAdapters, ReferenceInputs } from './types.ts';

function visibilityCase(model: VisibilityModel) {
  return (inputs: ReferenceInputs) => {
    const common = { model, visibilityM: inputs.visibility_m, wavelengthM: inputs.wavelength_m, koschmiederConstant: inputs.K_constant };
    const visibilityKm = inputs.visibility_m / 1000;
    return {
      q: model === 'kim' ? kimExponent(visibilityKm) : kruseExponent(visibilityKm),
      extinction_per_km: visibilityExtinctionPerKm(common),
      attenuation_dB_per_km: visibilityAttenuationDbPerKm(common),
    };
  };
}

export const adapters: ReferenceAdapters = {
  attenuation_kim: visibilityCase('kim'),
  attenuation_kruse: visibilityCase('kruse'),
  attenuation_al_naboulsi_fog: (inputs) => {
    const base = { visibilityM: inputs.visibility_m, wavelengthM: inputs.wavelength_m };
    return {
      advection_extinction_per_km: alNaboulsiFogExtinctionPerKm({ ...base, fogType: 'advection' }),
      advection_dB_per_km: alNaboulsiFogAttenuationDbPerKm({ ...base, fogType: 'advection' }),
      radiation_extinction_per_km: alNaboulsiFogExtinctionPerKm({ ...base, fogType: 'radiation' }),
      radiation_dB_per_km: alNaboulsiFogAttenuationDbPerKm({ ...base, fogType: 'radiation' }),
    };
  },
  attenuation_rain_carbonneau: (inputs) => ({
    attenuation_dB_per_km: rainAttenuationDbPerKm(inputs.rain_rate_mm_h),
    'alt_1.58R0.63_dB_per_km': rainAttenuationDbPerKm(inputs.rain_rate_mm_h, 'geometric-upper'),
  }),
  attenuation_snow_itu: (inputs) => ({
    wet_dB_per_km: snowAttenuationDbPerKm(inputs.snow_rate_mm_h, inputs.wavelength_m, 'wet'),
    dry_dB_per_km: snowAttenuationDbPerKm(inputs.snow_rate_mm_h, inputs.wavelength_m, 'dry'),
  }),
  visibility_threshold_conversion: () => ({
    K_2pct: koschmiederConstant(0.02),
    K_5pct: koschmiederConstant(0.05),
    V2pct_over_V5pct: VISIBILITY_2_PERCENT_PER_MOR,
    dB_per_km_times_V_km_2pct: DB_PER_NATURAL_LOG_POWER * koschmiederConstant(0.02),
    dB_per_km_times_V_km_5pct: DB_PER_NATURAL_LOG_POWER * koschmiederConstant(0.05),
  }),
  attenuation_path_total: (inputs) => {
    const gamma = visibilityAttenuationDbPerKm({ model: inputs.model, visibilityM: inputs.visibility_m, wavelengthM: inputs.wavelength_m });
    const path = atmosphericPathLoss(gamma, inputs.L_m);
    return { specific_dB_per_km: path.specificAttenuationDbPerKm, path_loss_dB: path.pathLossDb, transmittance: path.transmittance };
  },
};

export const notCovered: NotCovered = {};
