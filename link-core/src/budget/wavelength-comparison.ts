/**
 * The same optics at several wavelengths, as data (METHODS.md §15.2): beam, geometric loss,
 * attenuation at the design visibility and in reference weather, turbulence, eye safety and margin
 * per wavelength, and one margin-against-visibility series per wavelength for a chart.
 */
import { z } from 'zod';
import { VISIBILITY_CODE, type VisibilityCodeClass } from '../atmosphere/visibility-code.js';
import { assessEyeSafety, type EyeSafetyAssessment } from '../safety/classification.js';
import { eyeSafetyInputOf } from '../safety/eye-safety-input.js';
import { boundedNumber } from '../schemas/fields.js';
import type { LinkBudget } from '../schemas/link-budget.schema.js';
import { TransmitterSchema, type LinkDesignInput } from '../schemas/link-design.schema.js';
import { evaluateLink } from './evaluate-link.js';
import { marginVsVisibility } from './samplers.js';
import { parseOrThrow, requireValidDesign } from './design-fields.js';

/** The four wavelengths terrestrial FSO terminals usually use [m] (common practice). */
export const USUAL_FSO_WAVELENGTHS_M: readonly number[] = [785e-9, 850e-9, 1310e-9, 1550e-9];

/** Most wavelengths in one comparison (as many as a revision holds variants). */
export const MAX_COMPARED_WAVELENGTHS = 8;

/** The visibility-code classes the comparison reports attenuation in, mildest first. */
export const REFERENCE_WEATHER_CLASSES = ['haze', 'thin-fog', 'moderate-fog'] as const satisfies readonly VisibilityCodeClass['key'][];
export type ReferenceWeatherClass = (typeof REFERENCE_WEATHER_CLASSES)[number];

/** A reference weather condition: a visibility-code class and the visibility that stands for it. */
export interface ReferenceWeather {
  key: ReferenceWeatherClass;
  label: string;
  /** geometric centre of the class, sqrt(min·max) [m], 2 % contrast: haze 2828 m, thin fog 1414 m, moderate fog 316 m */
  visibilityM: number;
  /** the class bounds [m] */
  minVisibilityM: number;
  maxVisibilityM: number;
}

/**
 * The reference weather of the comparison, from the international visibility code: each class
 * stands for its geometric centre (our convention: the classes span factors of 2–2.5, so the
 * centre on a log scale is the fair single value).
 * @returns haze, thin fog and moderate fog with their visibilities [m]
 * @see VISIBILITY_CODE (Kim, McArthur & Korevaar 2001; ITU-R P.1817, table from memory).
 */
export function referenceWeather(): ReferenceWeather[] {
  return REFERENCE_WEATHER_CLASSES.map((key) => {
    const row = VISIBILITY_CODE.find((entry) => entry.key === key)!;
    return { key, label: row.label, visibilityM: Math.sqrt(row.minVisibilityM * row.maxVisibilityM), minVisibilityM: row.minVisibilityM, maxVisibilityM: row.maxVisibilityM };
  });
}

/** One wavelength of {@link compareWavelengths}. */
export interface WavelengthComparisonRow {
  wavelengthM: number;
  /** diffraction half-angle M²λ/(πW0) of the design's transmit beam at this wavelength [rad] */
  diffractionHalfAngleRad: number;
  /** far-field half-angle the beam has: the datasheet divergence, or the diffraction limit when that is larger [rad] */
  halfAngleDivergenceRad: number;
  beamModel: LinkBudget['beamModel'];
  /** 1/e² beam radius at the receiver, without turbulence [m] */
  beamRadiusAtReceiverM: number;
  /** long-term beam radius with turbulence spread and wander [m] (the free-space radius for the spherical wave or Cn² = 0) */
  longTermBeamRadiusM: number;
  geometricLossDb: number;
  /** specific attenuation at the design's visibility [dB/km] */
  specificAttenuationDbPerKm: number;
  /** specific attenuation in each reference weather, in the order of `referenceWeather` [dB/km] */
  referenceAttenuationDbPerKm: number[];
  /** spherical-wave Rytov variance σ_R² (METHODS.md §6.2) */
  rytovVarianceSpherical: number;
  /** aperture-averaged scintillation index the fade margin uses */
  scintillationIndex: number;
  scintillationFadeMarginDb: number;
  receivedPowerDbm: number;
  linkMarginDb: number;
  /** the budget's findings at this wavelength (model validity, overload…) */
  checks: LinkBudget['checks'];
  /**
   * indicative eye-safety assessment (MPE, class, NOHD, with its caution); null where the limits are
   * not implemented (outside 700–1400 and 1500–1800 nm), with the reason in `eyeSafetyUnavailableReason`
   */
  eyeSafety: EyeSafetyAssessment | null;
  eyeSafetyUnavailableReason?: string;
  /** link margin at each visibility of `visibilityM` [dB] (one chart line) */
  marginVsVisibilityDb: number[];
}

/** Result of {@link compareWavelengths}. */
export interface WavelengthComparison {
  referenceWeather: ReferenceWeather[];
  /** the shared visibility axis of the margin series [m], in the design's visibility definition */
  visibilityM: number[];
  rows: WavelengthComparisonRow[];
  /** what is held fixed and what the figures leave out */
  notes: string[];
}

/** Options of {@link compareWavelengths} (the margin-against-visibility series). */
export const CompareWavelengthsOptionsSchema = z.strictObject({
  /** lowest visibility of the series [m] (default 50) */
  fromVisibilityM: boundedNumber({ greaterThan: 0, practicalMinimum: { value: 1, text: '1 m' }, atMost: 1e6, unitNote: { upper: '1000 km' } }).default(50),
  /** highest visibility of the series [m] (default 50 000) */
  toVisibilityM: boundedNumber({ greaterThan: 0, practicalMinimum: { value: 1, text: '1 m' }, atMost: 1e6, unitNote: { upper: '1000 km' } }).default(50_000),
  /** log-spaced samples of the series, 2 … 2000 (default 61) */
  points: z.int({ error: 'must be a whole number' }).min(2, 'must be at least 2').max(2000, 'must be at most 2000').default(61),
}).refine((options) => options.toVisibilityM > options.fromVisibilityM, { message: 'must be greater than fromVisibilityM', path: ['toVisibilityM'] });
export type CompareWavelengthsOptions = z.input<typeof CompareWavelengthsOptionsSchema>;

const WavelengthListSchema = z
  .array(TransmitterSchema.shape.wavelengthM, { error: 'must be a list of wavelengths in metres' })
  .min(1, 'must hold at least one wavelength')
  .max(MAX_COMPARED_WAVELENGTHS, `must hold at most ${MAX_COMPARED_WAVELENGTHS} wavelengths`);

/**
 * Compares the design at several wavelengths with the same optics: the same transmit beam radius
 * W0, datasheet divergence, M², power, receiver, pointing, weather and turbulence; only
 * `transmitter.wavelengthM` changes. Each row is `evaluateLink` of that design (beam, losses,
 * attenuation, Rytov variance, fade margin, margin), the specific attenuation in three reference
 * weathers (haze, thin fog, moderate fog at the centres of their visibility-code classes, 2 %
 * contrast, the design's attenuation model), the indicative eye-safety assessment of the beam
 * (assessEyeSafety on eyeSafetyInputOf: MPE, class, NOHD — indicative only, never a
 * classification; it defers to the applicable laser-safety standard, local rules and a qualified
 * laser safety officer), and the margin against visibility (marginVsVisibility, log spaced).
 *
 * @param design the link design (validated; a bad field throws naming `design.<path>`)
 * @param wavelengthsM 1 … 8 wavelengths [m], each 200 nm … 20 µm (default 785, 850, 1310, 1550 nm)
 * @param options the visibility series: from/to [m] and points (default 50 m … 50 km, 61 points)
 * @returns the reference weathers, the shared visibility axis, one row per wavelength in the given order, notes
 * @throws InvalidInputError naming the bad design field, wavelength (`wavelengthsM.2`) or option
 * @see METHODS.md §15.2; Kim, McArthur & Korevaar, Proc. SPIE 4214, 26–37 (2001) (attenuation);
 *   IEC 60825-1 (eye safety, METHODS.md §8).
 * @example compareWavelengths(workedExampleDesign()).rows.map((row) => row.linkMarginDb)
 */
export function compareWavelengths(design: LinkDesignInput, wavelengthsM: readonly number[] = USUAL_FSO_WAVELENGTHS_M, options: CompareWavelengthsOptions = {}): WavelengthComparison {
  requireValidDesign('compareWavelengths', design);
  const wavelengths = parseOrThrow('compareWavelengths', WavelengthListSchema, wavelengthsM, 'wavelengthsM');
  const series = parseOrThrow('compareWavelengths', CompareWavelengthsOptionsSchema, options, 'options');
  const weathers = referenceWeather();
  let visibilityM: number[] = [];
  const rows = wavelengths.map((wavelengthM) => {
    const atWavelength: LinkDesignInput = { ...design, transmitter: { ...design.transmitter, wavelengthM } };
    const budget = evaluateLink(atWavelength);
    const referenceAttenuationDbPerKm = weathers.map(
      (weather) => evaluateLink({ ...atWavelength, atmosphere: { ...atWavelength.atmosphere, visibilityM: weather.visibilityM, visibilityDefinition: 'contrast-2-percent' } }).specificAttenuationDbPerKm,
    );
    const sweep = marginVsVisibility(atWavelength, { fromM: series.fromVisibilityM, toM: series.toVisibilityM, points: series.points });
    visibilityM = sweep.visibilityM;
    const row: WavelengthComparisonRow = {
      wavelengthM,
      diffractionHalfAngleRad: budget.diffractionHalfAngleRad,
      halfAngleDivergenceRad: budget.halfAngleDivergenceRad,
      beamModel: budget.beamModel,
      beamRadiusAtReceiverM: budget.beamRadiusAtReceiverM,
      longTermBeamRadiusM: budget.longTermBeamRadiusM ?? budget.beamRadiusAtReceiverM,
      geometricLossDb: budget.geometricLossDb,
      specificAttenuationDbPerKm: budget.specificAttenuationDbPerKm,
      referenceAttenuationDbPerKm,
      rytovVarianceSpherical: budget.rytovVarianceSpherical,
      scintillationIndex: budget.scintillationIndex,
      scintillationFadeMarginDb: budget.scintillationFadeMarginDb,
      receivedPowerDbm: budget.receivedPowerDbm,
      linkMarginDb: budget.linkMarginDb,
      checks: budget.checks,
      eyeSafety: null,
      marginVsVisibilityDb: sweep.linkMarginDb,
    };
    try {
      row.eyeSafety = assessEyeSafety(eyeSafetyInputOf(atWavelength, budget));
    } catch (error) {
      // Only the limits' own "not implemented at this wavelength" is expected; anything else is a defect.
      if (!(error instanceof RangeError)) throw error;
      row.eyeSafetyUnavailableReason = error.message;
    }
    return row;
  });
  return {
    referenceWeather: weathers,
    visibilityM,
    rows,
    notes: [
      'Same optics at each wavelength: transmit beam radius, datasheet divergence, M², power, receiver (aperture, sensitivity, optics losses), pointing, weather and turbulence as designed. A real receiver\'s sensitivity changes with the detector (silicon below about 1000 nm, InGaAs above): enter it per variant to compare equipment.',
      'Eye-safety figures are indicative only, never a classification or certification: follow the applicable laser-safety standard, local regulations and a qualified laser safety officer.',
    ],
  };
}
