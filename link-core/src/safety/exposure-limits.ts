/**
 * Ocular maximum permissible exposure (MPE) at the cornea for small sources (α ≤ 1.5 mrad, C6 = 1),
 * limiting apertures and Class 1 accessible emission limits, for the FSO wavelength bands
 * 700–1400 nm and 1500–1800 nm.
 *
 * The standards are copyrighted: the limits below are recalled from IEC 60825-1 (Ed. 2, 2007 and
 * Ed. 3, 2014, Annex A Table A.1 and the Class 1 AEL table) and ANSI Z136.1 Table 5a, cross-checked
 * against secondary reproductions [from memory]. Results are indicative, never a certification.
 */
import { requirePositive } from '../numeric/input-guards.js';

/** Editions of IEC 60825-1 whose limits differ in 1200–1400 nm. */
export type LaserSafetyEdition = 'IEC 60825-1:2007' | 'IEC 60825-1:2014';

/** Edition used when the caller names none: the conservative 2007 limits (METHODS.md §8.4). */
export const DEFAULT_LASER_SAFETY_EDITION: LaserSafetyEdition = 'IEC 60825-1:2007';

/** Accepted spellings of an edition: the full name, the year as text or as a number. */
export type LaserSafetyEditionInput = LaserSafetyEdition | '2007' | '2014' | 2007 | 2014;

/**
 * Normalises an edition given as a full name or a year.
 *
 * @param edition `'IEC 60825-1:2007'`, `'IEC 60825-1:2014'`, `2007`, `2014`, `'2007'` or `'2014'`; default 2007
 * @returns the full edition name
 * @see IEC 60825-1:2007 (Ed. 2) and IEC 60825-1:2014 (Ed. 3).
 */
export function normaliseLaserSafetyEdition(edition?: LaserSafetyEditionInput): LaserSafetyEdition {
  if (edition === undefined) return DEFAULT_LASER_SAFETY_EDITION;
  const text = String(edition);
  if (text === '2007' || text === 'IEC 60825-1:2007') return 'IEC 60825-1:2007';
  if (text === '2014' || text === 'IEC 60825-1:2014') return 'IEC 60825-1:2014';
  throw new RangeError(`edition: must be 'IEC 60825-1:2007' or 'IEC 60825-1:2014' (got ${text})`);
}

/**
 * The caution every eye-safety result carries.
 *
 * @param edition the IEC 60825-1 edition whose limits were applied
 * @returns the caution text
 * @see IEC 60825-1 and IEC 60825-12 (classification under single-fault conditions; FSO installations);
 *   common practice (deferring to a laser safety officer).
 */
export function eyeSafetyCaution(edition: LaserSafetyEdition): string {
  return (
    `Indicative only, not a certification or a classification. Limits are those of ${edition} (with ANSI Z136.1), ` +
    'recalled from the standard and checked against secondary sources; a formal classification must follow the ' +
    'applicable laser-safety standard (including IEC 60825-12 for free-space optical communication systems), ' +
    'reasonably foreseeable single-fault conditions and measurement uncertainty. Follow local regulations and the ' +
    'advice of a qualified laser safety officer. Never look into a transmit aperture, with or without optical instruments.'
  );
}

function wavelengthNm(wavelengthM: number): number {
  requirePositive('wavelengthM', wavelengthM);
  return wavelengthM * 1e9;
}

function requireSupportedBand(nm: number): 'near-infrared' | 'far-infrared' {
  if (nm >= 700 && nm <= 1400) return 'near-infrared';
  if (nm >= 1500 && nm <= 1800) return 'far-infrared';
  throw new RangeError(`wavelengthM: eye-safety limits are implemented for 700–1400 nm and 1500–1800 nm only (got ${nm.toFixed(1)} nm)`);
}

/**
 * Correction factor C4: 10^(0.002(λ − 700)) for 700–1050 nm, 5 for 1050–1400 nm.
 *
 * @param wavelengthM vacuum wavelength [m], 700–1400 nm
 * @returns C4, dimensionless, in [1, 5]
 * @see IEC 60825-1:2007/2014, Table A.1 notes; ANSI Z136.1 (C_A) [from memory].
 */
export function correctionFactorC4(wavelengthM: number): number {
  const nm = wavelengthNm(wavelengthM);
  if (nm < 700 || nm > 1400) throw new RangeError(`wavelengthM: C4 is defined for 700–1400 nm (got ${nm.toFixed(1)} nm)`);
  return nm < 1050 ? Math.pow(10, 0.002 * (nm - 700)) : 5;
}

/**
 * Correction factor C7: 1 below 1150 nm, 10^(0.018(λ − 1150)) for 1150–1200 nm, and for 1200–1400 nm
 * 8 (2007 edition, ICNIRP 2000) or 8 + 10^(0.04(λ − 1250)) (2014 edition, ICNIRP 2013, ANSI Z136.1-2014).
 *
 * @param wavelengthM vacuum wavelength [m], 700–1400 nm
 * @param edition IEC 60825-1 edition (default 2007, the conservative one)
 * @returns C7, dimensionless, ≥ 1
 * @see IEC 60825-1:2007 and :2014 Table A.1 notes; Schulmeister K. (2017), white paper on IEC 60825-1
 *   Ed. 3 [from memory / secondary].
 */
export function correctionFactorC7(wavelengthM: number, edition?: LaserSafetyEditionInput): number {
  const nm = wavelengthNm(wavelengthM);
  if (nm < 700 || nm > 1400) throw new RangeError(`wavelengthM: C7 is defined for 700–1400 nm (got ${nm.toFixed(1)} nm)`);
  if (nm < 1150) return 1;
  if (nm < 1200) return Math.pow(10, 0.018 * (nm - 1150));
  return normaliseLaserSafetyEdition(edition) === 'IEC 60825-1:2007' ? 8 : 8 + Math.pow(10, 0.04 * (nm - 1250));
}

/** Skin MPE used as a guide for the corneal limit at 1200–1400 nm in the 2014 edition: 2000·C4 W/m² [secondary]. */
const CORNEAL_GUIDE_FACTOR_W_PER_M2 = 2000;

/** Input of {@link ocularMpeWPerM2}. */
export interface OcularMpeInput {
  /** Vacuum wavelength [m]: 700–1400 nm or 1500–1800 nm. */
  wavelengthM: number;
  /** Exposure duration [s]: ≥ 1.8e-5 s (700–1050 nm), ≥ 5e-5 s (1050–1400 nm), ≥ 1e-9 s (1500–1800 nm). */
  exposureS: number;
  /** IEC 60825-1 edition (default 2007, conservative at 1200–1400 nm). */
  edition?: LaserSafetyEditionInput;
}

/** All parts of an ocular MPE evaluation. */
export interface OcularMpeDetails {
  /** Edition applied. */
  edition: LaserSafetyEdition;
  /** C4 (1 outside 700–1400 nm). */
  c4: number;
  /** C7 (1 outside 700–1400 nm). */
  c7: number;
  /** Retinal (thermal) limit as an irradiance averaged over the exposure [W/m²]. */
  retinalMpeWPerM2: number;
  /** 2014 edition at 1200–1400 nm only: the corneal guide value (skin MPE 2000·C4) [W/m²]; otherwise null. */
  cornealGuideMpeWPerM2: number | null;
  /** The MPE applied: the lower of the retinal and corneal values [W/m²]. */
  mpeWPerM2: number;
  /** The same limit as radiant exposure over the exposure, MPE·t [J/m²]. */
  mpeJPerM2: number;
  /** Limiting (averaging) aperture diameter [m]. */
  limitingApertureDiameterM: number;
  /** Indicative, not a certification: see the text. */
  caution: string;
}

/**
 * Ocular MPE at the cornea in full detail (small source, C6 = 1).
 * 700–1050 nm and 1050–1400 nm: H = 18·C4·C7·t^0.75 J/m² below 10 s (from 1.8e-5 s, resp. 5e-5 s),
 * E = 10·C4·C7 W/m² for t ≥ 10 s (to 3e4 s and beyond for these small sources). The two rows of the
 * table do not meet exactly at 10 s (149.7 against 147.9 J/m² at 785 nm); the irradiance row applies
 * from 10 s on, as the table states.
 * 1500–1800 nm: H = 1e4 J/m² from 1e-9 s to 10 s, E = 1000 W/m² beyond.
 * 2014 edition at 1200–1400 nm: the retinal value is capped by the corneal guide 2000·C4 W/m².
 *
 * @param input wavelength [m], exposure [s] > 0, optional edition
 * @returns the MPE parts (see {@link OcularMpeDetails})
 * @see IEC 60825-1:2007 and :2014, Annex A Table A.1; ANSI Z136.1-2014 Table 5a; ICNIRP, Health
 *   Physics 105(3), 271–295 (2013) [from memory, cross-checked against secondary reproductions].
 */
export function ocularMpeDetails(input: OcularMpeInput): OcularMpeDetails {
  const nm = wavelengthNm(input.wavelengthM);
  requirePositive('exposureS', input.exposureS);
  const edition = normaliseLaserSafetyEdition(input.edition);
  const t = input.exposureS;
  const band = requireSupportedBand(nm);
  const limitingApertureDiameterM = limitingApertureDiameterForBand(band, t);
  if (band === 'far-infrared') {
    if (t < 1e-9) throw new RangeError(`exposureS: pulses shorter than 1 ns are not covered (got ${t})`);
    const mpeWPerM2 = t <= 10 ? 1e4 / t : 1000;
    return {
      edition,
      c4: 1,
      c7: 1,
      retinalMpeWPerM2: mpeWPerM2,
      cornealGuideMpeWPerM2: null,
      mpeWPerM2,
      mpeJPerM2: mpeWPerM2 * t,
      limitingApertureDiameterM,
      caution: eyeSafetyCaution(edition),
    };
  }
  const c4 = correctionFactorC4(input.wavelengthM);
  const c7 = correctionFactorC7(input.wavelengthM, edition);
  const shortest = nm < 1050 ? 1.8e-5 : 5e-5;
  if (t < shortest) throw new RangeError(`exposureS: exposures shorter than ${shortest} s are not covered at ${nm.toFixed(0)} nm (got ${t})`);
  const retinalMpeWPerM2 = t < 10 ? (18 * c4 * c7 * Math.pow(t, 0.75)) / t : 10 * c4 * c7;
  const cornealGuideMpeWPerM2 = edition === 'IEC 60825-1:2014' && nm >= 1200 ? CORNEAL_GUIDE_FACTOR_W_PER_M2 * c4 : null;
  const mpeWPerM2 = cornealGuideMpeWPerM2 === null ? retinalMpeWPerM2 : Math.min(retinalMpeWPerM2, cornealGuideMpeWPerM2);
  return {
    edition,
    c4,
    c7,
    retinalMpeWPerM2,
    cornealGuideMpeWPerM2,
    mpeWPerM2,
    mpeJPerM2: mpeWPerM2 * t,
    limitingApertureDiameterM,
    caution: eyeSafetyCaution(edition),
  };
}

/**
 * Ocular MPE at the cornea as an irradiance averaged over the exposure (small source, C6 = 1, CW or
 * single exposure). For t ≥ 10 s: 10·C4·C7 W/m² at 700–1400 nm (785 nm 14.79, 850 nm 19.95; 1310 nm
 * 400 with the 2007 edition) and 1000 W/m² at 1500–1800 nm.
 *
 * @param input `{ wavelengthM, exposureS, edition? }`: wavelength 700–1400 or 1500–1800 nm; exposure [s] > 0
 *   (see {@link ocularMpeDetails} for the shortest exposure per band); edition default IEC 60825-1:2007
 * @returns MPE [W/m²], > 0; indicative — defer to the applicable standard and a laser safety officer
 * @see IEC 60825-1:2007/2014 Annex A Table A.1; ANSI Z136.1 Table 5a [from memory].
 */
export function ocularMpeWPerM2(input: OcularMpeInput): number {
  return ocularMpeDetails(input).mpeWPerM2;
}

/**
 * Ocular MPE as radiant exposure H over the exposure [J/m²] (MPE irradiance × t).
 * 700–1400 nm, t ≤ 10 s: 18·C4·C7·t^0.75 (850 nm, 1 s: 35.91 J/m²; at exactly 10 s the upper bound of
 * this row is used); 1500–1800 nm, t ≤ 10 s: 1e4 J/m²; beyond 10 s the irradiance MPE × t.
 *
 * @param input `{ wavelengthM, exposureS, edition? }` as for {@link ocularMpeWPerM2}
 * @returns H [J/m²]
 * @see IEC 60825-1 Annex A Table A.1 [from memory].
 */
export function ocularMpeRadiantExposureJPerM2(input: OcularMpeInput): number {
  const details = ocularMpeDetails(input);
  const nm = input.wavelengthM * 1e9;
  // The time-dependent row covers t up to and including 10 s (its upper bound).
  if (input.exposureS === 10 && nm <= 1400) {
    const retinal = 18 * details.c4 * details.c7 * Math.pow(10, 0.75);
    return details.cornealGuideMpeWPerM2 === null ? retinal : Math.min(retinal, details.cornealGuideMpeWPerM2 * 10);
  }
  return details.mpeJPerM2;
}

function limitingApertureDiameterForBand(band: 'near-infrared' | 'far-infrared', exposureS: number): number {
  if (band === 'near-infrared') return 7e-3;
  if (exposureS <= 0.35) return 1e-3;
  if (exposureS < 10) return 1.5e-3 * Math.pow(exposureS, 3 / 8);
  return 3.5e-3;
}

/**
 * Limiting (averaging) aperture diameter for ocular exposure: 7 mm for 400–1400 nm; from 1400 nm:
 * 1 mm for t ≤ 0.35 s, 1.5·t^(3/8) mm for 0.35–10 s, 3.5 mm for t ≥ 10 s (IEC; ANSI uses 0.3 s).
 *
 * @param wavelengthM vacuum wavelength [m], 700–1400 or 1500–1800 nm
 * @param exposureS exposure [s], > 0
 * @returns aperture diameter [m]
 * @see IEC 60825-1 Table A.3 / ANSI Z136.1 Table 8 [from memory].
 */
export function limitingApertureDiameterM(wavelengthM: number, exposureS: number): number {
  requirePositive('exposureS', exposureS);
  return limitingApertureDiameterForBand(requireSupportedBand(wavelengthNm(wavelengthM)), exposureS);
}

/**
 * Power collected by the limiting aperture when a uniform irradiance equals the MPE: MPE·π(d/2)².
 * A consistency check of the Class 1 AEL (AEL ≈ MPE × aperture area).
 *
 * @param input `{ wavelengthM, exposureS, edition? }`
 * @returns power [W]
 * @see IEC 60825-1 (AEL and MPE tables) [from memory].
 */
export function mpePowerThroughLimitingApertureW(input: OcularMpeInput): number {
  const details = ocularMpeDetails(input);
  return details.mpeWPerM2 * Math.PI * (details.limitingApertureDiameterM / 2) ** 2;
}

/** Class 3B accessible emission limit for CW emission, 0.5 W [from memory]. */
export const CLASS_3B_CW_LIMIT_W = 0.5;

/** Class 1 accessible emission limit, in all its parts. */
export interface ClassOneAel {
  /** Edition applied. */
  edition: LaserSafetyEdition;
  /** The AEL that applies [W] for t ≥ 10 s (null when a shorter exposure was asked: see `energyJ`). */
  powerW: number | null;
  /** For exposures below 10 s where the AEL is an energy: the AEL [J]; otherwise null. */
  energyJ: number | null;
  /** 700–1400 nm: the retinal AEL 3.9e-4·C4·C7 W before any dual limit; null elsewhere. */
  retinalPowerW: number | null;
  /** Indicative, not a certification: see the text. */
  caution: string;
}

/**
 * Class 1 accessible emission limit for small sources (CW, classification time t ≥ 10 s, or an
 * energy for 1500–1800 nm exposures of 0.35–10 s).
 * 700–1400 nm: 3.9e-4·C4·C7 W (785 nm 0.577 mW, 850 nm 0.778 mW, 1310 nm 15.6 mW with the 2007
 * edition); the 2014 edition at 1250–1400 nm caps it at the Class 3B limit 0.5 W (dual limit).
 * 1500–1800 nm: 10 mW for t ≥ 10 s; 1.8e-2·t^0.75 J for 0.35 ≤ t < 10 s.
 *
 * @param wavelengthM vacuum wavelength [m], 700–1400 or 1500–1800 nm
 * @param exposureS classification time [s] (default 100 s, the IEC time base for unintended viewing)
 * @param edition IEC 60825-1 edition (default 2007)
 * @returns the AEL parts (see {@link ClassOneAel})
 * @see IEC 60825-1:2007/2014, Class 1 AEL table (Table 3); Schulmeister (2017) for the 2014 dual
 *   limit [from memory / secondary].
 */
export function classOneAel(wavelengthM: number, exposureS = 100, edition?: LaserSafetyEditionInput): ClassOneAel {
  const nm = wavelengthNm(wavelengthM);
  requirePositive('exposureS', exposureS);
  const applied = normaliseLaserSafetyEdition(edition);
  if (requireSupportedBand(nm) === 'far-infrared') {
    if (exposureS >= 10) return { edition: applied, powerW: 1e-2, energyJ: null, retinalPowerW: null, caution: eyeSafetyCaution(applied) };
    if (exposureS >= 0.35) return { edition: applied, powerW: null, energyJ: 1.8e-2 * Math.pow(exposureS, 0.75), retinalPowerW: null, caution: eyeSafetyCaution(applied) };
    throw new RangeError(`exposureS: Class 1 limits for 1500–1800 nm are implemented for t ≥ 0.35 s (got ${exposureS})`);
  }
  if (exposureS < 10) throw new RangeError(`exposureS: Class 1 limits for 700–1400 nm are implemented for t ≥ 10 s (got ${exposureS})`);
  const retinalPowerW = 3.9e-4 * correctionFactorC4(wavelengthM) * correctionFactorC7(wavelengthM, applied);
  const powerW = applied === 'IEC 60825-1:2014' && nm >= 1250 ? Math.min(retinalPowerW, CLASS_3B_CW_LIMIT_W) : retinalPowerW;
  return { edition: applied, powerW, energyJ: null, retinalPowerW, caution: eyeSafetyCaution(applied) };
}

/**
 * Class 1 AEL as a power for CW emission (t ≥ 10 s); see {@link classOneAel}.
 *
 * @param wavelengthM vacuum wavelength [m], 700–1400 or 1500–1800 nm
 * @param edition IEC 60825-1 edition (default 2007)
 * @returns AEL [W]
 * @see IEC 60825-1 Class 1 AEL table [from memory].
 */
export function classOneAelW(wavelengthM: number, edition?: LaserSafetyEditionInput): number {
  return classOneAel(wavelengthM, 100, edition).powerW!;
}
