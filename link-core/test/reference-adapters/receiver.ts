/**
 * Reference adapters for METHODS.md §7 (receiver). Each calls the engine's exported functions.
 */
import {
  idealResponsivityAPerW,
  photonEnergyJ,
  photonsPerBit,
  qFactorDb,
  qFactorForBer,
  receiverSensitivity,
} from '../../src/receiver/sensitivity.ts';
import { dbmToWatts } from '../../src/units/decibels.ts';
import type { NotCovered, ReferenceAdapters } from './types.ts';

export const adapters: ReferenceAdapters = {
  q_factor_for_ber: (inputs) => {
    const q = qFactorForBer(inputs.ber);
    return { Q: q, Q_dB_20log10: qFactorDb(q) };
  },
  photons_per_bit: (inputs) => {
    const powerW = dbmToWatts(inputs.power_dBm);
    return {
      power_W: powerW,
      photon_energy_J: photonEnergyJ(inputs.wavelength_m),
      photons_per_bit: photonsPerBit(powerW, inputs.wavelength_m, inputs.line_rate_bit_per_s),
      ideal_responsivity_A_per_W: idealResponsivityAPerW(inputs.wavelength_m),
    };
  },
  receiver_sensitivity_agrawal: (inputs) => {
    const result = receiverSensitivity({
      lineRateBitPerS: inputs.line_rate_bit_per_s,
      noiseBandwidthHz: inputs.noise_bandwidth_Hz,
      inputNoiseCurrentDensityAPerSqrtHz: inputs.input_noise_current_density_A_per_sqrtHz,
      responsivityAPerW: inputs.responsivity_A_per_W,
      apdGain: inputs.apd_gain_M,
      apdIonisationRatio: inputs.apd_ionisation_ratio_kA,
      q: inputs.Q,
    });
    return {
      thermal_noise_rms_A: result.thermalNoiseRmsA,
      excess_noise_FA: result.excessNoiseFactor,
      sensitivity_W: result.sensitivityW,
      sensitivity_dBm: result.sensitivityDbm,
    };
  },
};

export const notCovered: NotCovered = {};
