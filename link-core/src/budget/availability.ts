/**
 * Availability of a link over the weather (METHODS.md §11): from a visibility climatology (a cumulative
 * distribution P(V < v)) or from time-stamped visibility records. Following Kim & Korevaar (2001),
 * the link fails when the visibility attenuation exceeds the clear-air margin; scintillation is left
 * out because dense fog and strong turbulence rarely coincide.
 */
import { VISIBILITY_2_PERCENT_PER_MOR, VISIBILITY_REFERENCE_WAVELENGTH_M } from '../atmosphere/visibility-attenuation.js';
import type { LinkDesignInput, VisibilityDefinition } from '../schemas/link-design.schema.js';
import { evaluateChain, resolveDesign, specificAttenuationDbPerKm, visibility2PercentForAttenuationOfDesignKm, type ResolvedDesign } from './link-chain.js';

const HOURS_PER_YEAR = 8766; // 365.25 days
// Clamp of the atmosphere module's visibility inverse [km] (1 m … 1000 km).
const INVERSE_MIN_KM = 1e-3;
const INVERSE_MAX_KM = 1e3;

/** Options shared by the availability routines. */
export interface AvailabilityOptions {
  /** margin that must remain after the weather loss for the link to count as up [dB] (default 0) */
  requiredMarginDb?: number;
}

/**
 * Clear-air margin M0: the link margin with no atmospheric loss and no scintillation fade margin
 * (the system allowance still applies).
 *
 * @param design the link design
 * @returns M0 [dB]
 * @see METHODS.md §11.1; Kim I.I., Korevaar E., "Availability of free space optics (FSO) and
 *   hybrid FSO/RF systems", Proc. SPIE 4530, 84–95 (2001).
 */
export function clearAirMarginDb(design: LinkDesignInput): number {
  const resolved = resolveDesign(design);
  return evaluateChain(resolved, resolved.rangeM, 0, false).linkMarginDb;
}

function weatherAllowance(resolved: ResolvedDesign, requiredMarginDb: number) {
  const clearAir = evaluateChain(resolved, resolved.rangeM, 0, false).linkMarginDb;
  const allowedLossDb = clearAir - requiredMarginDb;
  return { clearAir, allowedLossDb, maxAttenuationDbPerKm: allowedLossDb / (resolved.rangeM / 1000) };
}

/** A visibility climatology: the cumulative distribution of visibility at the site. */
export interface VisibilityClimatology {
  /** visibility levels [m], strictly increasing, > 0 */
  visibilityM: readonly number[];
  /** P(V < visibilityM[i]), non-decreasing, in (0, 1] */
  probabilityBelow: readonly number[];
  /** definition of the visibility figures (default 'contrast-2-percent'; airport data are usually MOR) */
  visibilityDefinition?: VisibilityDefinition;
}

/** Result of {@link availabilityFromClimatology}. */
export interface ClimatologyAvailability {
  /** margin with no weather loss and no scintillation [dB] */
  clearAirMarginDb: number;
  /** largest specific attenuation the link tolerates, (M0 − M_req)/L_km [dB/km] */
  maxSpecificAttenuationDbPerKm: number;
  /** visibility below which the link fails, in the climatology's definition [m]; null if it always fails */
  minimumVisibilityM: number | null;
  /** P(V < V_min), in [0, 1] */
  unavailability: number;
  /** 1 − unavailability */
  availability: number;
  availabilityPercent: number;
  /** expected outage per year [h] (8766 h/year) */
  outageHoursPerYear: number;
  /** where V_min fell: inside the table, below its first level (power-law extrapolation) or above its last (last probability kept) */
  lookup: 'interpolated' | 'below-table' | 'above-table' | 'always-down';
}

function validateClimatology(climatology: VisibilityClimatology): void {
  const { visibilityM, probabilityBelow } = climatology;
  if (visibilityM.length < 2 || visibilityM.length !== probabilityBelow.length) {
    throw new RangeError('climatology: visibilityM and probabilityBelow must have the same length, at least 2');
  }
  for (let i = 0; i < visibilityM.length; i++) {
    const v = visibilityM[i]!;
    const p = probabilityBelow[i]!;
    if (!(v > 0) || !Number.isFinite(v)) throw new RangeError(`climatology.visibilityM.${i}: must be a finite number greater than 0`);
    if (!(p > 0 && p <= 1)) throw new RangeError(`climatology.probabilityBelow.${i}: probability must be in (0, 1]`);
    if (i > 0 && !(v > visibilityM[i - 1]!)) throw new RangeError(`climatology.visibilityM.${i}: must be greater than the previous level`);
    if (i > 0 && p < probabilityBelow[i - 1]!) throw new RangeError(`climatology.probabilityBelow.${i}: must not be less than the previous probability`);
  }
}

/**
 * P(V < v) from a climatology table: log10 P interpolated linearly in log10 V; below the first
 * level the first segment's power law is extended; above the last level the last probability is kept.
 */
function climatologyProbabilityBelow(climatology: VisibilityClimatology, visibilityM: number): { probability: number; lookup: ClimatologyAvailability['lookup'] } {
  const levels = climatology.visibilityM;
  const probabilities = climatology.probabilityBelow;
  const last = levels.length - 1;
  const x = Math.log10(visibilityM);
  if (visibilityM <= levels[0]!) {
    const slope = (Math.log10(probabilities[1]!) - Math.log10(probabilities[0]!)) / (Math.log10(levels[1]!) - Math.log10(levels[0]!));
    return { probability: probabilities[0]! * Math.pow(visibilityM / levels[0]!, slope), lookup: 'below-table' };
  }
  if (visibilityM >= levels[last]!) return { probability: probabilities[last]!, lookup: 'above-table' };
  let i = 1;
  while (levels[i]! < visibilityM) i++;
  const x0 = Math.log10(levels[i - 1]!);
  const x1 = Math.log10(levels[i]!);
  const y0 = Math.log10(probabilities[i - 1]!);
  const y1 = Math.log10(probabilities[i]!);
  return { probability: Math.pow(10, y0 + ((y1 - y0) * (x - x0)) / (x1 - x0)), lookup: 'interpolated' };
}

/**
 * Availability from a visibility climatology (METHODS.md §11.2): V_min solves γ(V_min) = (M0 − M_req)/L_km
 * (bisection on log V), and the unavailability is P(V < V_min) from the site's distribution.
 *
 * @param design the link design (its range, terminals and attenuation model; its own visibility is not used)
 * @param climatology cumulative visibility distribution (levels [m], probabilities in (0, 1])
 * @param options required margin [dB] (default 0)
 * @returns clear-air margin [dB], tolerable attenuation [dB/km], V_min [m], unavailability and availability
 * @throws RangeError for a malformed table, or a Kim/Kruse design below 550 nm (γ is not monotone in V there)
 * @see Kim I.I., Korevaar E., Proc. SPIE 4530, 84–95 (2001); log-log interpolation is common practice.
 */
export function availabilityFromClimatology(
  design: LinkDesignInput,
  climatology: VisibilityClimatology,
  options: AvailabilityOptions = {},
): ClimatologyAvailability {
  validateClimatology(climatology);
  const resolved = resolveDesign(design);
  if (resolved.fogNumeratorPerKm === 0 && resolved.wavelengthM < VISIBILITY_REFERENCE_WAVELENGTH_M) {
    throw new RangeError('transmitter.wavelengthM: availability from visibility needs a wavelength of at least 550 nm');
  }
  const { clearAir, allowedLossDb, maxAttenuationDbPerKm } = weatherAllowance(resolved, options.requiredMarginDb ?? 0);
  const result = (unavailability: number, minimumVisibilityM: number | null, lookup: ClimatologyAvailability['lookup']): ClimatologyAvailability => ({
    clearAirMarginDb: clearAir,
    maxSpecificAttenuationDbPerKm: maxAttenuationDbPerKm,
    minimumVisibilityM,
    unavailability,
    availability: 1 - unavailability,
    availabilityPercent: 100 * (1 - unavailability),
    outageHoursPerYear: unavailability * HOURS_PER_YEAR,
    lookup,
  });
  if (!(allowedLossDb > 0)) return result(1, null, 'always-down');
  const minimum2PercentM = visibility2PercentForAttenuationOfDesignKm(resolved, maxAttenuationDbPerKm) * 1000;
  const minimumM = climatology.visibilityDefinition === 'mor-5-percent' ? minimum2PercentM / VISIBILITY_2_PERCENT_PER_MOR : minimum2PercentM;
  const { probability, lookup } = climatologyProbabilityBelow(climatology, minimumM);
  return result(Math.min(1, probability), minimumM, lookup);
}

/** Time-stamped (or plainly hourly) visibility records of a site. */
export interface VisibilityRecords {
  /** visibility [m] per record; NaN, ≤ 0 or non-finite values count as missing */
  visibilityM: ArrayLike<number>;
  /** record times [ms since the epoch], strictly increasing; when absent every record lasts `recordIntervalH` */
  timestampsMs?: ArrayLike<number>;
  /** definition of the visibility figures (default 'contrast-2-percent'; METAR/SYNOP report MOR) */
  visibilityDefinition?: VisibilityDefinition;
}

/** Options of {@link availabilityFromRecords}. */
export interface RecordsAvailabilityOptions extends AvailabilityOptions {
  /** nominal duration of one record [h] (default 1: hourly reports) */
  recordIntervalH?: number;
  /** a gap between timestamps longer than this counts as missing data beyond one interval [h] (default 3) */
  maxGapH?: number;
}

/** Result of {@link availabilityFromRecords}. */
export interface RecordsAvailability {
  clearAirMarginDb: number;
  maxSpecificAttenuationDbPerKm: number;
  /** records given / with a usable visibility / missing */
  recordCount: number;
  usableCount: number;
  missingCount: number;
  /** time covered by usable records, up [h], down [h] */
  coveredHours: number;
  availableHours: number;
  unavailableHours: number;
  /** availableHours / coveredHours (NaN when nothing is usable) */
  availability: number;
  availabilityPercent: number;
  /** number of separate outages (consecutive down records, not interrupted by a gap) and the longest [h] */
  outageCount: number;
  longestOutageH: number;
  /** lowest margin left after the weather loss over the records [dB] */
  worstMarginDb: number;
}

/**
 * Availability over time-stamped visibility records: every record's margin M0 − γ(V)·L_km is
 * compared with the required margin, weighted by the time it stands for. Allocation-free over the
 * records (ten years of hourly data in a few milliseconds).
 *
 * @param design the link design (range, terminals, attenuation model; its own visibility is not used)
 * @param records visibility [m] per record, optional timestamps [ms], visibility definition
 * @param options required margin [dB] (default 0), record interval [h] (default 1), longest gap [h] (default 3)
 * @returns counts, hours up and down, availability in [0, 1], outages and the worst margin
 * @throws RangeError for non-increasing timestamps or mismatched lengths
 * @see Kim I.I., Korevaar E., Proc. SPIE 4530, 84–95 (2001) (method); METHODS.md §11.3.
 */
export function availabilityFromRecords(design: LinkDesignInput, records: VisibilityRecords, options: RecordsAvailabilityOptions = {}): RecordsAvailability {
  const resolved = resolveDesign(design);
  const { clearAir, maxAttenuationDbPerKm } = weatherAllowance(resolved, options.requiredMarginDb ?? 0);
  const requiredMarginDb = options.requiredMarginDb ?? 0;
  const intervalH = options.recordIntervalH ?? 1;
  const maxGapH = options.maxGapH ?? 3;
  const visibility = records.visibilityM;
  const timestamps = records.timestampsMs;
  const count = visibility.length;
  if (timestamps && timestamps.length !== count) throw new RangeError('records.timestampsMs: must have one timestamp per visibility record');
  const scale = records.visibilityDefinition === 'mor-5-percent' ? VISIBILITY_2_PERCENT_PER_MOR / 1000 : 1 / 1000;
  const rangeKm = resolved.rangeM / 1000;
  // γ falls monotonically with V for λ ≥ 550 nm, so "down" is "V below V_min": one inverse, then a
  // comparison per record. Otherwise (or when V_min sits on the inverse's clamp) every record's
  // attenuation is evaluated.
  let threshold2PercentKm = Number.NaN;
  if (resolved.fogNumeratorPerKm > 0 || resolved.wavelengthM >= VISIBILITY_REFERENCE_WAVELENGTH_M) {
    if (!(maxAttenuationDbPerKm > 0)) threshold2PercentKm = Infinity;
    else {
      const inverse = visibility2PercentForAttenuationOfDesignKm(resolved, maxAttenuationDbPerKm);
      if (resolved.fogNumeratorPerKm > 0 || (inverse > INVERSE_MIN_KM && inverse < INVERSE_MAX_KM)) threshold2PercentKm = inverse;
    }
  }
  const byThreshold = !Number.isNaN(threshold2PercentKm);
  let usable = 0;
  let coveredHours = 0;
  let downHours = 0;
  let outageCount = 0;
  let longestOutage = 0;
  let currentOutage = 0;
  let worstMargin = Infinity;
  let lowestVisibility2PercentKm = Infinity;
  let previousDown = false;
  for (let i = 0; i < count; i++) {
    let durationH = intervalH;
    let contiguous = true;
    if (timestamps && i + 1 < count) {
      const stepH = (timestamps[i + 1]! - timestamps[i]!) / 3_600_000;
      if (!(stepH > 0)) throw new RangeError(`records.timestampsMs.${i + 1}: timestamps must increase strictly`);
      if (stepH <= maxGapH) durationH = stepH;
      else contiguous = false;
    }
    const v = visibility[i]!;
    if (!(v > 0) || v === Infinity) {
      previousDown = false;
      continue;
    }
    usable++;
    coveredHours += durationH;
    const visibility2PercentKm = v * scale;
    let down: boolean;
    if (byThreshold) {
      down = visibility2PercentKm < threshold2PercentKm;
      if (visibility2PercentKm < lowestVisibility2PercentKm) lowestVisibility2PercentKm = visibility2PercentKm;
    } else {
      const margin = clearAir - specificAttenuationDbPerKm(resolved, visibility2PercentKm) * rangeKm;
      if (margin < worstMargin) worstMargin = margin;
      down = margin < requiredMarginDb;
    }
    if (down) {
      downHours += durationH;
      if (previousDown) currentOutage += durationH;
      else {
        outageCount++;
        currentOutage = durationH;
      }
      if (currentOutage > longestOutage) longestOutage = currentOutage;
      previousDown = contiguous;
      if (!contiguous) currentOutage = 0;
    } else {
      previousDown = false;
    }
  }
  if (byThreshold && usable > 0) worstMargin = clearAir - specificAttenuationDbPerKm(resolved, lowestVisibility2PercentKm) * rangeKm;
  const availability = coveredHours > 0 ? (coveredHours - downHours) / coveredHours : Number.NaN;
  return {
    clearAirMarginDb: clearAir,
    maxSpecificAttenuationDbPerKm: maxAttenuationDbPerKm,
    recordCount: count,
    usableCount: usable,
    missingCount: count - usable,
    coveredHours,
    availableHours: coveredHours - downHours,
    unavailableHours: downHours,
    availability,
    availabilityPercent: 100 * availability,
    outageCount,
    longestOutageH: longestOutage,
    worstMarginDb: usable > 0 ? worstMargin : Number.NaN,
  };
}
