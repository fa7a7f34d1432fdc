/**
 * Indicative laser class of an FSO terminal from the power accessible through the measurement
 * apertures (Condition 1: optics; Condition 3: naked eye), and the one-call eye-safety assessment
 * for the planner and budget screens. Every result carries a caution: indicative, not a certification.
 */
import { requireNonNegative, requirePositive } from '../numeric/input-guards.js';
import { BINOCULAR_7X50_GAIN, nohdFarFieldM, nohdM } from './hazard-distance.js';
import { diffractionHalfAngleRad } from '../beam/gaussian-beam.js';
import {
  CLASS_3B_CW_LIMIT_W,
  classOneAel,
  eyeSafetyCaution,
  normaliseLaserSafetyEdition,
  ocularMpeDetails,
  type LaserSafetyEdition,
  type LaserSafetyEditionInput,
} from './exposure-limits.js';

/** How the beam radius grows between the exit aperture and a measurement aperture. */
export type BeamGrowthModel = 'gaussian' | 'linear';

/** Input of {@link accessiblePowerW}. */
export interface AccessiblePowerInput {
  /** Emitted power [W], > 0. */
  powerW: number;
  /** Vacuum wavelength [m], > 0. */
  wavelengthM: number;
  /** Exit beam radius W0 (1/e²) [m], > 0. */
  apertureBeamRadiusM: number;
  /** Far-field half-angle (1/e²) [rad], ≥ 0. */
  halfAngleDivergenceRad: number;
  /** Measurement aperture diameter [m], > 0. */
  measurementApertureDiameterM: number;
  /** Distance from the exit aperture to the measurement aperture [m], ≥ 0. */
  distanceM: number;
  /**
   * `gaussian` (default): exact radius of the defocused launch, W² = (W0 + z·sqrt(θ² − θ_d²))² + (θ_d z)²;
   * `linear`: W = W0 + θz (the far-field rule; slightly larger, so slightly less power: not conservative).
   */
  beamGrowth?: BeamGrowthModel;
}

/**
 * Power of a centred Gaussian beam passing a circular measurement aperture at a distance:
 * P·(1 − exp(−2(d/2)²/W(z)²)).
 *
 * @param input power [W], wavelength [m], W0 [m], θ [rad], aperture diameter [m], distance [m], growth model
 * @returns accessible power [W], in [0, P]
 * @see Siegman (1986), ch. 17 (power through a circular aperture); measurement conditions of IEC
 *   60825-1 [from memory].
 */
export function accessiblePowerW(input: AccessiblePowerInput): number {
  requirePositive('powerW', input.powerW);
  requirePositive('wavelengthM', input.wavelengthM);
  requirePositive('apertureBeamRadiusM', input.apertureBeamRadiusM);
  requireNonNegative('halfAngleDivergenceRad', input.halfAngleDivergenceRad);
  requirePositive('measurementApertureDiameterM', input.measurementApertureDiameterM);
  requireNonNegative('distanceM', input.distanceM);
  const w0 = input.apertureBeamRadiusM;
  const z = input.distanceM;
  let radius: number;
  if (input.beamGrowth === 'linear') {
    radius = w0 + input.halfAngleDivergenceRad * z;
  } else {
    const diffraction = diffractionHalfAngleRad(input.wavelengthM, w0);
    const excess = Math.sqrt(Math.max(0, input.halfAngleDivergenceRad ** 2 - diffraction ** 2));
    radius = Math.hypot(w0 + excess * z, diffraction * z);
  }
  const apertureRadius = input.measurementApertureDiameterM / 2;
  return -input.powerW * Math.expm1((-2 * apertureRadius * apertureRadius) / (radius * radius));
}

/** A measurement condition: aperture diameter and its distance from the exit aperture. */
export interface MeasurementCondition {
  /** Aperture stop diameter [m]. */
  apertureDiameterM: number;
  /** Distance from the reference point [m]. */
  distanceM: number;
}

/**
 * Measurement conditions for Class 1 / 1M, recalled from IEC 60825-1 [from memory; verify against
 * the edition]: Condition 1 (telescope or binoculars) 50 mm at 2000 mm; Condition 3 (naked eye)
 * 7 mm at 100 mm for 400–1400 nm and 3.5 mm at 100 mm for 1400–4000 nm (t ≥ 10 s). Condition 1 is
 * applied at every supported wavelength here, because glass optics transmit at 1550 nm too.
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @returns Conditions 1 and 3
 * @see IEC 60825-1:2007/2014, measurement conditions table (Table 10/11) [from memory].
 */
export function measurementConditions(wavelengthM: number): { condition1: MeasurementCondition; condition3: MeasurementCondition } {
  requirePositive('wavelengthM', wavelengthM);
  return {
    condition1: { apertureDiameterM: 50e-3, distanceM: 2 },
    condition3: { apertureDiameterM: wavelengthM <= 1400e-9 ? 7e-3 : 3.5e-3, distanceM: 0.1 },
  };
}

/** Indicative laser class label. */
export type IndicativeLaserClass = '1' | '1M' | '3R' | '3B' | '4';

/** Input of {@link indicativeLaserClass}. */
export interface LaserClassInput {
  /** Emitted power [W], > 0 (CW). */
  powerW: number;
  /** Vacuum wavelength [m], 700–1400 or 1500–1800 nm. */
  wavelengthM: number;
  /** Exit beam radius W0 (1/e²) [m], > 0. */
  apertureBeamRadiusM: number;
  /** Far-field half-angle (1/e²) [rad], ≥ 0. */
  halfAngleDivergenceRad: number;
  /** IEC 60825-1 edition (default 2007). */
  edition?: LaserSafetyEditionInput;
  /** Beam growth model for the accessible power (default `gaussian`). */
  beamGrowth?: BeamGrowthModel;
}

/** Result of {@link indicativeLaserClass}. */
export interface LaserClassIndication {
  /** Indicative class. */
  indicativeClass: IndicativeLaserClass;
  /** Power through the Condition 3 (naked-eye) aperture [W]. */
  condition3PowerW: number;
  /** Power through the Condition 1 (optics) aperture [W]. */
  condition1PowerW: number;
  /** Class 1 AEL applied [W]. */
  classOneAelW: number;
  /** Condition 3 power as a fraction of the AEL (≤ 1 passes; close to 1 leaves no room for measurement uncertainty). */
  condition3FractionOfAel: number;
  /** Condition 1 power as a fraction of the AEL. */
  condition1FractionOfAel: number;
  /** Edition applied. */
  edition: LaserSafetyEdition;
  /** Indicative, not a certification: see the text. */
  caution: string;
}

/**
 * Indicative class of a CW FSO terminal: Class 1 when the power through both measurement apertures
 * is within the Class 1 AEL; Class 1M when only Condition 3 (naked eye) passes; otherwise 3R up to
 * 5 × the Class 1 AEL, 3B up to 0.5 W and 4 above (judged on the Condition 3 power).
 *
 * @param input power [W], wavelength [m], W0 [m], θ [rad], optional edition and beam growth model
 * @returns the indication with both accessible powers, the AEL and the caution
 * @see IEC 60825-1:2007/2014 (Class 1, 1M, 3R, 3B limits and measurement conditions) [from memory];
 *   the 3R factor of 5 is recalled [from memory].
 */
export function indicativeLaserClass(input: LaserClassInput): LaserClassIndication {
  const edition = normaliseLaserSafetyEdition(input.edition);
  const ael = classOneAel(input.wavelengthM, 100, edition).powerW!;
  const { condition1, condition3 } = measurementConditions(input.wavelengthM);
  const common = {
    powerW: input.powerW,
    wavelengthM: input.wavelengthM,
    apertureBeamRadiusM: input.apertureBeamRadiusM,
    halfAngleDivergenceRad: input.halfAngleDivergenceRad,
    beamGrowth: input.beamGrowth,
  };
  const condition3PowerW = accessiblePowerW({ ...common, measurementApertureDiameterM: condition3.apertureDiameterM, distanceM: condition3.distanceM });
  const condition1PowerW = accessiblePowerW({ ...common, measurementApertureDiameterM: condition1.apertureDiameterM, distanceM: condition1.distanceM });
  let indicativeClass: IndicativeLaserClass;
  if (condition3PowerW <= ael) indicativeClass = condition1PowerW <= ael ? '1' : '1M';
  else if (condition3PowerW <= 5 * ael) indicativeClass = '3R';
  else if (condition3PowerW <= CLASS_3B_CW_LIMIT_W) indicativeClass = '3B';
  else indicativeClass = '4';
  return {
    indicativeClass,
    condition3PowerW,
    condition1PowerW,
    classOneAelW: ael,
    condition3FractionOfAel: condition3PowerW / ael,
    condition1FractionOfAel: condition1PowerW / ael,
    edition,
    caution: eyeSafetyCaution(edition),
  };
}

/** Input of {@link assessEyeSafety}. */
export interface EyeSafetyInput {
  /** Emitted CW power [W], > 0. */
  powerW: number;
  /** Vacuum wavelength [m], 700–1400 or 1500–1800 nm. */
  wavelengthM: number;
  /** Exit beam radius W0 (1/e²) [m], > 0. */
  apertureBeamRadiusM: number;
  /** Far-field half-angle (1/e²) [rad], ≥ 0. */
  halfAngleDivergenceRad: number;
  /** Exposure duration for the MPE [s] (default 100 s, the IEC time base; the MPE is the same for any t ≥ 10 s). */
  exposureS?: number;
  /** IEC 60825-1 edition (default 2007, conservative). */
  edition?: LaserSafetyEditionInput;
  /** Gain of the viewing optics assumed for aided viewing (default 7×50 binoculars, (50/7)² ≈ 51). */
  opticalGain?: number;
}

/** Result of {@link assessEyeSafety}. */
export interface EyeSafetyAssessment {
  /** MPE at the cornea [W/m²]. */
  mpeWPerM2: number;
  /** Peak irradiance at the exit aperture [W/m²]. */
  exitPeakIrradianceWPerM2: number;
  /** NOHD for the naked eye, exact Gaussian form [m]. */
  nohdUnaidedM: number;
  /** NOHD with the viewing optics, exact Gaussian form [m]. */
  nohdWithOpticsM: number;
  /** Far-field (ANSI hazard-evaluation) NOHD for the naked eye, shown beside the exact one [m]; null for θ = 0. */
  nohdUnaidedFarFieldM: number | null;
  /** Optical gain assumed for aided viewing. */
  opticalGain: number;
  /** Indicative class with the accessible powers. */
  classification: LaserClassIndication;
  /** Indicative class label (same as classification.indicativeClass). */
  indicativeClass: IndicativeLaserClass;
  /** Edition applied. */
  edition: LaserSafetyEdition;
  /** Indicative, not a certification. */
  caution: string;
  /** Further remarks for the screen (e.g. small margin to the AEL, aided hazard with a harmless naked-eye beam). */
  notes: string[];
}

/**
 * One-call eye-safety assessment for the planner and budget screens: MPE, NOHD unaided and with
 * optics (exact Gaussian form, far-field form beside it), indicative class (1 / 1M / 3R / 3B / 4)
 * from the two measurement conditions, and the caution.
 *
 * @param input power [W] > 0, wavelength [m] (700–1400 or 1500–1800 nm), W0 [m] > 0, θ [rad] ≥ 0,
 *   optional exposure [s], edition and optical gain
 * @returns the assessment (see {@link EyeSafetyAssessment}); indicative, never a certification
 * @see IEC 60825-1:2007/2014; ANSI Z136.1; METHODS.md §8 [limits from memory].
 */
export function assessEyeSafety(input: EyeSafetyInput): EyeSafetyAssessment {
  const edition = normaliseLaserSafetyEdition(input.edition);
  const exposureS = input.exposureS ?? 100;
  const opticalGain = input.opticalGain ?? BINOCULAR_7X50_GAIN;
  const mpe = ocularMpeDetails({ wavelengthM: input.wavelengthM, exposureS, edition }).mpeWPerM2;
  const beam = {
    powerW: input.powerW,
    mpeWPerM2: mpe,
    wavelengthM: input.wavelengthM,
    waistRadiusM: input.apertureBeamRadiusM,
    halfAngleDivergenceRad: input.halfAngleDivergenceRad,
  };
  const nohdUnaidedM = nohdM(beam);
  const nohdWithOpticsM = nohdM({ ...beam, opticalGain });
  const nohdUnaidedFarFieldM = input.halfAngleDivergenceRad > 0 ? nohdFarFieldM(beam) : null;
  const classification = indicativeLaserClass({ ...input, edition });
  const notes: string[] = [];
  if (classification.indicativeClass === '1' && classification.condition3FractionOfAel > 0.8) {
    notes.push(`Condition 3 power is ${(100 * classification.condition3FractionOfAel).toFixed(0)} % of the Class 1 limit: little room for measurement uncertainty and single faults.`);
  }
  if (nohdUnaidedM === 0 && nohdWithOpticsM > 0) {
    notes.push(`Harmless to the naked eye, but hazardous through binoculars or a telescope up to about ${nohdWithOpticsM.toFixed(0)} m.`);
  }
  if (nohdWithOpticsM > 0) {
    notes.push('Check that no walkable roof, window or access route lies inside the NOHD, and show the beam height above walkable surfaces.');
  }
  if (edition === 'IEC 60825-1:2014' && input.wavelengthM >= 1200e-9 && input.wavelengthM <= 1400e-9) {
    notes.push('The 2014 limits at 1200–1400 nm include a corneal dual limit recalled from secondary sources: verify against the licensed text.');
  }
  return {
    mpeWPerM2: mpe,
    exitPeakIrradianceWPerM2: (2 * input.powerW) / (Math.PI * input.apertureBeamRadiusM ** 2),
    nohdUnaidedM,
    nohdWithOpticsM,
    nohdUnaidedFarFieldM,
    opticalGain,
    classification,
    indicativeClass: classification.indicativeClass,
    edition,
    caution: eyeSafetyCaution(edition),
    notes,
  };
}
