/**
 * Receiver sensitivity: Q factor and bit-error ratio of on-off keying, photons per bit, the
 * thermal-noise-limited PIN and APD sensitivities, and the overload check.
 */
import erfc from '@stdlib/math-base-special-erfc';
import erfcinv from '@stdlib/math-base-special-erfcinv';
import { requireInRange, requireOpenUnitInterval, requirePositive } from '../numeric/input-guards.js';

/** Planck constant h [J·s] (SI 2019 exact). */
export const PLANCK_CONSTANT_J_S = 6.62607015e-34;
/** Speed of light in vacuum c [m/s] (exact). */
export const SPEED_OF_LIGHT_M_PER_S = 299792458;
/** Elementary charge e [C] (SI 2019 exact). */
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;

/**
 * Q factor for a bit-error ratio of OOK with Gaussian noise: BER = ½·erfc(Q/√2) solved for Q.
 *
 * @param ber bit-error ratio in (0, 0.5)
 * @returns Q, dimensionless (3.090 at 1e-3, 5.998 at 1e-9, 7.034 at 1e-12)
 * @see Agrawal G.P., "Fiber-Optic Communication Systems", 4th ed., Wiley (2010), §4.5.1, eq. 4.5.10.
 */
export function qFactorForBer(ber: number): number {
  requireOpenUnitInterval('ber', ber);
  if (!(ber < 0.5)) throw new RangeError(`ber: must be below 0.5 (got ${ber})`);
  return Math.SQRT2 * erfcinv(2 * ber);
}

/**
 * Bit-error ratio of OOK for a Q factor: BER = ½·erfc(Q/√2).
 *
 * @param q Q factor ≥ 0
 * @returns BER in (0, 0.5]
 * @see Agrawal (2010), §4.5.1, eq. 4.5.10.
 */
export function berForQFactor(q: number): number {
  if (!(q >= 0) || !Number.isFinite(q)) throw new RangeError(`q: must be a finite number ≥ 0 (got ${String(q)})`);
  return 0.5 * erfc(q / Math.SQRT2);
}

/**
 * Q factor in decibels, 20·log10(Q) (the convention of BER test sets).
 *
 * @param q Q factor > 0
 * @returns Q [dB]
 * @see Agrawal (2010), §4.5 (common practice for the dB form).
 */
export function qFactorDb(q: number): number {
  requirePositive('q', q);
  return 20 * Math.log10(q);
}

/**
 * Photon energy E = h·c/λ.
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @returns E [J]
 * @see CODATA 2018 (exact h and c).
 */
export function photonEnergyJ(wavelengthM: number): number {
  requirePositive('wavelengthM', wavelengthM);
  return (PLANCK_CONSTANT_J_S * SPEED_OF_LIGHT_M_PER_S) / wavelengthM;
}

/**
 * Mean number of photons per bit at an average optical power: N = P/(R_b·h·c/λ).
 *
 * @param powerW average optical power [W], > 0
 * @param wavelengthM vacuum wavelength [m], > 0
 * @param lineRateBitPerS line rate R_b [bit/s], > 0
 * @returns photons per bit, dimensionless
 * @see Agrawal (2010), §4.5.3 (quantum limit; photons per bit).
 */
export function photonsPerBit(powerW: number, wavelengthM: number, lineRateBitPerS: number): number {
  requirePositive('powerW', powerW);
  requirePositive('lineRateBitPerS', lineRateBitPerS);
  return powerW / (lineRateBitPerS * photonEnergyJ(wavelengthM));
}

/**
 * Responsivity of an ideal photodiode (quantum efficiency 1): R = e·λ/(h·c).
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @returns R [A/W] (1.250 at 1550 nm, 0.686 at 850 nm)
 * @see Agrawal (2010), §4.1.1, eq. 4.1.3.
 */
export function idealResponsivityAPerW(wavelengthM: number): number {
  return ELEMENTARY_CHARGE_C / photonEnergyJ(wavelengthM);
}

/** Input of {@link receiverSensitivity}. */
export interface ReceiverSensitivityInput {
  /** Line rate [bit/s], > 0. */
  lineRateBitPerS: number;
  /** Noise bandwidth Δf [Hz], > 0; default 0.75 × line rate. */
  noiseBandwidthHz?: number;
  /** Input-referred noise current density i_n [A/√Hz], > 0 (e.g. 15 pA/√Hz). */
  inputNoiseCurrentDensityAPerSqrtHz: number;
  /** Responsivity R [A/W] at unity gain, > 0. */
  responsivityAPerW: number;
  /** APD multiplication gain M ≥ 1 (default 1: PIN). */
  apdGain?: number;
  /** APD ionisation-coefficient ratio k_A in [0, 1] (≈ 0.02–0.05 Si, 0.4–0.7 InGaAs); ignored for M = 1. */
  apdIonisationRatio?: number;
  /** Q factor of the target BER (default from `ber`, else 7.034 ≈ BER 1e-12). */
  q?: number;
  /** Target BER in (0, 0.5) (used when `q` is not given). */
  ber?: number;
}

/** Result of {@link receiverSensitivity}. */
export interface ReceiverSensitivity {
  /** Q factor used. */
  q: number;
  /** Noise bandwidth used [Hz]. */
  noiseBandwidthHz: number;
  /** Thermal-noise rms current σ_T = i_n·sqrt(Δf) [A]. */
  thermalNoiseRmsA: number;
  /** APD excess noise factor F_A = k_A·M + (1 − k_A)(2 − 1/M); 1 for a PIN. */
  excessNoiseFactor: number;
  /** Sensitivity (average power at the detector) [W]. */
  sensitivityW: number;
  /** Sensitivity [dBm]. */
  sensitivityDbm: number;
}

/**
 * Receiver sensitivity from noise figures (infinite extinction ratio, no dark current):
 * thermal-noise-limited PIN P = Q·σ_T/R; APD P = (Q/R)·(σ_T/M + e·F_A·Q·Δf), σ_T = i_n·sqrt(Δf).
 * Use the datasheet sensitivity when one exists: these are illustrative estimates.
 *
 * @param input line rate [bit/s] > 0, optional noise bandwidth [Hz], noise density [A/√Hz] > 0,
 *   responsivity [A/W] > 0, APD gain M ≥ 1 and k_A in [0, 1], Q (or BER)
 * @returns Q, Δf [Hz], σ_T [A], F_A, sensitivity [W] and [dBm]
 * @see Agrawal G.P., "Fiber-Optic Communication Systems", 4th ed., Wiley (2010), §4.4–4.5
 *   (eq. 4.5.14 PIN thermal limit, eq. 4.5.12 APD, eq. 4.4.18 excess noise) [equation numbers from memory].
 */
export function receiverSensitivity(input: ReceiverSensitivityInput): ReceiverSensitivity {
  requirePositive('lineRateBitPerS', input.lineRateBitPerS);
  requirePositive('inputNoiseCurrentDensityAPerSqrtHz', input.inputNoiseCurrentDensityAPerSqrtHz);
  requirePositive('responsivityAPerW', input.responsivityAPerW);
  const noiseBandwidthHz = input.noiseBandwidthHz ?? 0.75 * input.lineRateBitPerS;
  requirePositive('noiseBandwidthHz', noiseBandwidthHz);
  const gain = input.apdGain ?? 1;
  if (!(gain >= 1) || !Number.isFinite(gain)) throw new RangeError(`apdGain: must be a finite number ≥ 1 (got ${String(gain)})`);
  const ionisationRatio = input.apdIonisationRatio ?? 0;
  requireInRange('apdIonisationRatio', ionisationRatio, 0, 1);
  const q = input.q ?? (input.ber !== undefined ? qFactorForBer(input.ber) : 7.034);
  requirePositive('q', q);
  const thermalNoiseRmsA = input.inputNoiseCurrentDensityAPerSqrtHz * Math.sqrt(noiseBandwidthHz);
  let excessNoiseFactor = 1;
  let sensitivityW: number;
  if (gain === 1) {
    sensitivityW = (q * thermalNoiseRmsA) / input.responsivityAPerW;
  } else {
    excessNoiseFactor = ionisationRatio * gain + (1 - ionisationRatio) * (2 - 1 / gain);
    sensitivityW = (q / input.responsivityAPerW) * (thermalNoiseRmsA / gain + ELEMENTARY_CHARGE_C * excessNoiseFactor * q * noiseBandwidthHz);
  }
  return { q, noiseBandwidthHz, thermalNoiseRmsA, excessNoiseFactor, sensitivityW, sensitivityDbm: 10 * Math.log10(sensitivityW / 1e-3) };
}

/** Verdict of {@link checkReceivedPower}. */
export interface ReceivedPowerVerdict {
  /** `ok` inside the window, `below-sensitivity` or `overload`. */
  status: 'ok' | 'below-sensitivity' | 'overload';
  /** Received power minus sensitivity [dB] (positive: above the sensitivity). */
  marginAboveSensitivityDb: number;
  /** Overload level minus received power [dB] (positive: below overload); null without an overload figure. */
  headroomBelowOverloadDb: number | null;
  /** Plain-language explanation for the UI. */
  message: string;
}

/**
 * Checks a received power against the receiver's window (sensitivity to overload). A very short
 * link may need an attenuator when the power exceeds the overload level.
 *
 * @param receivedPowerDbm received average power [dBm], finite
 * @param sensitivityDbm datasheet (or computed) sensitivity at the target BER [dBm], finite
 * @param overloadDbm datasheet overload (maximum input) [dBm], finite and above the sensitivity; optional
 * @returns the verdict object
 * @see common practice (overload typically −3 to −10 dBm for APD receivers).
 */
export function checkReceivedPower(receivedPowerDbm: number, sensitivityDbm: number, overloadDbm?: number): ReceivedPowerVerdict {
  for (const [field, value] of [['receivedPowerDbm', receivedPowerDbm], ['sensitivityDbm', sensitivityDbm]] as const) {
    if (!Number.isFinite(value)) throw new RangeError(`${field}: must be a finite number (got ${String(value)})`);
  }
  if (overloadDbm !== undefined && (!Number.isFinite(overloadDbm) || !(overloadDbm > sensitivityDbm))) {
    throw new RangeError(`overloadDbm: must be a finite number above sensitivityDbm (got ${String(overloadDbm)})`);
  }
  const marginAboveSensitivityDb = receivedPowerDbm - sensitivityDbm;
  const headroomBelowOverloadDb = overloadDbm === undefined ? null : overloadDbm - receivedPowerDbm;
  if (headroomBelowOverloadDb !== null && headroomBelowOverloadDb < 0) {
    return {
      status: 'overload',
      marginAboveSensitivityDb,
      headroomBelowOverloadDb,
      message: `Received power exceeds the receiver overload by ${(-headroomBelowOverloadDb).toFixed(1)} dB: add attenuation or reduce transmit power.`,
    };
  }
  if (marginAboveSensitivityDb < 0) {
    return {
      status: 'below-sensitivity',
      marginAboveSensitivityDb,
      headroomBelowOverloadDb,
      message: `Received power is ${(-marginAboveSensitivityDb).toFixed(1)} dB below the receiver sensitivity.`,
    };
  }
  return {
    status: 'ok',
    marginAboveSensitivityDb,
    headroomBelowOverloadDb,
    message: `Received power is ${marginAboveSensitivityDb.toFixed(1)} dB above the sensitivity${headroomBelowOverloadDb === null ? '' : ` and ${headroomBelowOverloadDb.toFixed(1)} dB below overload`}.`,
  };
}

/** Where a sensitivity comes from: the terminal datasheet (preferred) or noise figures. */
export type SensitivitySource =
  | { kind: 'datasheet'; sensitivityDbm: number; ber?: number }
  | ({ kind: 'noise-figures' } & ReceiverSensitivityInput);

/** Result of {@link resolveSensitivity}. */
export interface ResolvedSensitivity {
  /** Sensitivity at the target BER [dBm]. */
  sensitivityDbm: number;
  /** `datasheet`, `pin-thermal-limit` or `apd`. */
  method: 'datasheet' | 'pin-thermal-limit' | 'apd';
  /** Citation of the method, for the budget's term list. */
  source: string;
}

/**
 * The sensitivity to use in the budget: the datasheet figure when the user gives one, otherwise the
 * Agrawal estimate from noise figures ({@link receiverSensitivity}).
 *
 * @param input `{ kind: 'datasheet', sensitivityDbm }` (finite) or `{ kind: 'noise-figures', ...ReceiverSensitivityInput }`
 * @returns sensitivity [dBm], the method and its source
 * @see Agrawal (2010), ch. 4; common practice (prefer the terminal datasheet at the link's BER target).
 */
export function resolveSensitivity(input: SensitivitySource): ResolvedSensitivity {
  if (input.kind === 'datasheet') {
    if (!Number.isFinite(input.sensitivityDbm)) throw new RangeError(`sensitivityDbm: must be a finite number (got ${String(input.sensitivityDbm)})`);
    return { sensitivityDbm: input.sensitivityDbm, method: 'datasheet', source: 'terminal datasheet' };
  }
  const result = receiverSensitivity(input);
  const apd = (input.apdGain ?? 1) > 1;
  return {
    sensitivityDbm: result.sensitivityDbm,
    method: apd ? 'apd' : 'pin-thermal-limit',
    source: `Agrawal, Fiber-Optic Communication Systems, 4th ed. (2010), ch. 4: ${apd ? 'APD, P = (Q/R)(σ_T/M + e·F_A·Q·Δf)' : 'thermal-noise-limited PIN, P = Q·σ_T/R'}`,
  };
}
