/**
 * Reference adapters for receive-capture cases (CAP-*): exact capture via the noncentral chi-square
 * CDF (scipy ncx2, cross-checked by quadrature in the case source); approximation of Farid &
 * Hranilovic, J. Lightwave Technol. 25(7) 1702 (2007).
 */
import {
  captureFraction,
  faridHranilovicCapture,
  faridHranilovicCaptureFraction,
  geometricLossDb,
  smallApertureCaptureApproximation,
  topHatCaptureRatio,
} from '../../src/capture/capture.js';
import { linearSpotRadiusM } from '../../src/beam/launch.js';
import type { NotCovered, ReferenceAdapters } from './types.ts';

export const adapters: ReferenceAdapters = {
  capture_centred: (inputs) => {
    const fraction = captureFraction({ beamRadiusM: inputs.beam_radius_1e2_m, apertureRadiusM: inputs.rx_aperture_radius_m });
    return {
      captured_fraction: fraction,
      geometric_loss_dB: geometricLossDb(fraction),
      small_aperture_approx_2a2_over_w2: smallApertureCaptureApproximation(inputs.beam_radius_1e2_m, inputs.rx_aperture_radius_m),
    };
  },
  capture_offset: (inputs) => {
    const w = inputs.beam_radius_1e2_m as number;
    const a = inputs.rx_aperture_radius_m as number;
    const fraction = captureFraction({ beamRadiusM: w, apertureRadiusM: a, offsetM: inputs.offset_m });
    const centred = captureFraction({ beamRadiusM: w, apertureRadiusM: a });
    const model = faridHranilovicCapture(w, a);
    return {
      captured_fraction: fraction,
      captured_fraction_relative_to_centred: fraction / centred,
      farid_A0: model.peakFraction,
      farid_w_eq_m: model.equivalentBeamRadiusM,
      farid_approx_fraction: faridHranilovicCaptureFraction(w, a, inputs.offset_m),
    };
  },
  tophat_vs_gaussian_geometric_loss: (inputs) => {
    const ratio = topHatCaptureRatio({
      transmitBeamDiameterM: inputs.tx_beam_diameter_m,
      fullAngleDivergenceRad: inputs.full_angle_divergence_1e2_rad,
      rangeM: inputs.L_m,
      receiveApertureDiameterM: inputs.rx_diameter_m,
    });
    // The case compares with a Gaussian of the same 1/e² size: radius W0 + θ_half·L.
    const beamRadius = linearSpotRadiusM(inputs.tx_beam_diameter_m / 2, inputs.full_angle_divergence_1e2_rad / 2, inputs.L_m);
    const gaussian = captureFraction({ beamRadiusM: beamRadius, apertureRadiusM: inputs.rx_diameter_m / 2 });
    return {
      tophat_ratio: ratio,
      tophat_loss_dB: geometricLossDb(ratio),
      gaussian_beam_radius_m: beamRadius,
      gaussian_centred_fraction: gaussian,
      gaussian_centred_loss_dB: geometricLossDb(gaussian),
    };
  },
};

export const notCovered: NotCovered = {};
