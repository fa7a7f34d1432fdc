/**
 * The availability analysis around {@link availabilityFromRecords} and {@link availabilityFromClimatology}
 * (METHODS.md §11.4–§11.7): the availability per calendar month, the outages one by one, the
 * distribution of the margin left after the weather, the visibility below which the link fails, and
 * the ranges at which a link reaches a target availability with a site's data.
 *
 * Every routine classifies a record exactly as availabilityFromRecords does (same clear-air margin,
 * same visibility threshold, same record durations and gaps), so the monthly hours add up to its
 * totals and its outages are the ones listed here.
 */
import { VISIBILITY_2_PERCENT_PER_MOR, VISIBILITY_REFERENCE_WAVELENGTH_M } from '../atmosphere/visibility-attenuation.js';
import type { LinkDesignInput, VisibilityDefinition } from '../schemas/link-design.schema.js';
import {
  availabilityFromClimatology,
  availabilityFromRecords,
  type AvailabilityOptions,
  type ClimatologyAvailability,
  type RecordsAvailability,
  type RecordsAvailabilityOptions,
  type VisibilityClimatology,
  type VisibilityRecords,
} from './availability.js';
import { evaluateChain, resolveDesign, specificAttenuationDbPerKm, visibility2PercentForAttenuationOfDesignKm, type ResolvedDesign } from './link-chain.js';
import { maxRange } from './max-range.js';

// Clamp of the atmosphere module's visibility inverse [km] (1 m … 1000 km), as in availability.ts.
const INVERSE_MIN_KM = 1e-3;
const INVERSE_MAX_KM = 1e3;

/** The weather allowance of a design at its range, and how a record is judged up or down. */
interface WeatherLimit {
  resolved: ResolvedDesign;
  clearAirMarginDb: number;
  requiredMarginDb: number;
  rangeKm: number;
  /**
   * 2 % visibility [km] below which a record is down; Infinity when every record is down; NaN when
   * γ is not monotone in V (λ < 550 nm with Kim/Kruse) or V_min sits on the inverse's clamp, so
   * every record's margin is evaluated instead
   */
  threshold2PercentKm: number;
}

function weatherLimitOf(design: LinkDesignInput, requiredMarginDb: number): WeatherLimit {
  const resolved = resolveDesign(design);
  const clearAir = evaluateChain(resolved, resolved.rangeM, 0, false).linkMarginDb;
  const maxAttenuationDbPerKm = (clearAir - requiredMarginDb) / (resolved.rangeM / 1000);
  let threshold2PercentKm = Number.NaN;
  if (resolved.fogNumeratorPerKm > 0 || resolved.wavelengthM >= VISIBILITY_REFERENCE_WAVELENGTH_M) {
    if (!(maxAttenuationDbPerKm > 0)) threshold2PercentKm = Infinity;
    else {
      const inverse = visibility2PercentForAttenuationOfDesignKm(resolved, maxAttenuationDbPerKm);
      if (resolved.fogNumeratorPerKm > 0 || (inverse > INVERSE_MIN_KM && inverse < INVERSE_MAX_KM)) threshold2PercentKm = inverse;
    }
  }
  return { resolved, clearAirMarginDb: clearAir, requiredMarginDb, rangeKm: resolved.rangeM / 1000, threshold2PercentKm };
}

function marginAfterWeatherDb(limit: WeatherLimit, visibility2PercentKm: number): number {
  return limit.clearAirMarginDb - specificAttenuationDbPerKm(limit.resolved, visibility2PercentKm) * limit.rangeKm;
}

function isDown(limit: WeatherLimit, visibility2PercentKm: number): boolean {
  if (!Number.isNaN(limit.threshold2PercentKm)) return visibility2PercentKm < limit.threshold2PercentKm;
  return marginAfterWeatherDb(limit, visibility2PercentKm) < limit.requiredMarginDb;
}

const morScale = (definition: VisibilityDefinition | undefined) => (definition === 'mor-5-percent' ? VISIBILITY_2_PERCENT_PER_MOR : 1);

/** The time each record stands for, and whether the next record follows without a gap. */
export interface RecordDurations {
  /** hours per record; NaN for a record without a usable visibility */
  durationH: Float64Array;
  /** false where the step to the next record exceeded the longest gap (an outage cannot run across it) */
  contiguous: Uint8Array;
}

/**
 * The duration each record stands for, by the rule of availabilityFromRecords: the step to the next
 * timestamp when it is at most `maxGapH`, otherwise (and for the last record, or without timestamps)
 * `recordIntervalH`. Records whose visibility is missing (NaN, ≤ 0, infinite) get NaN.
 *
 * @param records visibility [m] per record, optional timestamps [ms since the epoch], strictly increasing
 * @param options record interval [h] (default 1), longest gap [h] (default 3)
 * @returns durations [h] and the contiguity flags
 * @throws RangeError for mismatched lengths or timestamps that do not increase
 * @see METHODS.md §11.3 (common practice for hourly weather records).
 */
export function recordDurations(records: VisibilityRecords, options: RecordsAvailabilityOptions = {}): RecordDurations {
  const intervalH = options.recordIntervalH ?? 1;
  const maxGapH = options.maxGapH ?? 3;
  const count = records.visibilityM.length;
  const timestamps = records.timestampsMs;
  if (timestamps && timestamps.length !== count) throw new RangeError('records.timestampsMs: must have one timestamp per visibility record');
  const durationH = new Float64Array(count);
  const contiguous = new Uint8Array(count);
  for (let i = 0; i < count; i++) {
    let duration = intervalH;
    let joined = 1;
    if (timestamps && i + 1 < count) {
      const stepH = (timestamps[i + 1]! - timestamps[i]!) / 3_600_000;
      if (!(stepH > 0)) throw new RangeError(`records.timestampsMs.${i + 1}: timestamps must increase strictly`);
      if (stepH <= maxGapH) duration = stepH;
      else joined = 0;
    }
    const v = records.visibilityM[i]!;
    durationH[i] = v > 0 && v !== Infinity ? duration : Number.NaN;
    contiguous[i] = joined;
  }
  return { durationH, contiguous };
}

/**
 * The usable records sorted by visibility (2 % km) with their hours, for time-weighted quantiles
 * and counts below a threshold. Sorting numbers in a Float64Array is several times faster than
 * sorting records: the hours go alongside as "most records last `baseH`, these few differ by …".
 */
interface SortedVisibility {
  sorted: Float64Array;
  baseH: number;
  /** the records whose hours differ from baseH: visibility (sorted) and the running sum of the differences */
  oddVisibility: Float64Array;
  oddCumulativeH: Float64Array;
  coveredHours: number;
}

function lowerBound(values: Float64Array, x: number): number {
  let low = 0;
  let high = values.length;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (values[middle]! < x) low = middle + 1;
    else high = middle;
  }
  return low;
}

function upperBound(values: Float64Array, x: number): number {
  let low = 0;
  let high = values.length;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (values[middle]! <= x) low = middle + 1;
    else high = middle;
  }
  return low;
}

function sortVisibility(records: VisibilityRecords, durationH: Float64Array): SortedVisibility {
  const scale = morScale(records.visibilityDefinition) / 1000;
  let usable = 0;
  let baseH = Number.NaN;
  for (let i = 0; i < durationH.length; i++) {
    if (Number.isNaN(durationH[i]!)) continue;
    if (usable === 0) baseH = durationH[i]!;
    usable++;
  }
  const sorted = new Float64Array(usable);
  const odd: { v: number; delta: number }[] = [];
  let coveredHours = 0;
  for (let i = 0, k = 0; i < durationH.length; i++) {
    const hours = durationH[i]!;
    if (Number.isNaN(hours)) continue;
    const v = records.visibilityM[i]! * scale;
    sorted[k++] = v;
    coveredHours += hours;
    if (hours !== baseH) odd.push({ v, delta: hours - baseH });
  }
  sorted.sort();
  odd.sort((a, b) => a.v - b.v);
  const oddVisibility = Float64Array.from(odd, (entry) => entry.v);
  const oddCumulativeH = new Float64Array(odd.length + 1);
  for (let i = 0; i < odd.length; i++) oddCumulativeH[i + 1] = oddCumulativeH[i]! + odd[i]!.delta;
  return { sorted, baseH, oddVisibility, oddCumulativeH, coveredHours };
}

/** Hours of the records with a visibility below `x` (2 % km); `orEqual` counts those at `x` too. */
function hoursBelow(prepared: SortedVisibility, x: number, orEqual = false): number {
  const bound = orEqual ? upperBound : lowerBound;
  const count = bound(prepared.sorted, x);
  return count === 0 ? 0 : count * prepared.baseH + prepared.oddCumulativeH[bound(prepared.oddVisibility, x)]!;
}

/**
 * The lowest visibility (2 % km) whose records, with every record below it, exceed `hours`: the
 * time quantile from below. The last visibility when none does.
 */
function visibilityQuantile(prepared: SortedVisibility, hours: number): number {
  const { sorted } = prepared;
  let low = 0;
  let high = sorted.length - 1;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (hoursBelow(prepared, sorted[middle]!, true) > hours) high = middle;
    else low = middle + 1;
  }
  return sorted[low]!;
}

/** Availability of one calendar month, over every year of the records. */
export interface MonthAvailability {
  /** calendar month, 1 (January) … 12 (December), of the record's timestamp in UTC */
  month: number;
  /** hours covered by usable records in this month [h] */
  coveredHours: number;
  /** of those, hours with the margin below the requirement [h] */
  unavailableHours: number;
  /** (covered − unavailable) / covered, in [0, 1] */
  availability: number;
}

/**
 * Availability per calendar month (January … December, UTC), pooled over the years of the records;
 * only months with usable records are listed. Each record counts in the month of its timestamp
 * with the duration availabilityFromRecords gives it, so the months add up to its totals.
 *
 * @param design the link design (range, terminals, attenuation model; its own visibility is not used)
 * @param records visibility [m] per record with timestamps [ms since the epoch] (required here)
 * @param options required margin [dB] (default 0), record interval [h] (default 1), longest gap [h] (default 3)
 * @returns the months with records, in calendar order
 * @throws RangeError without timestamps, or for timestamps that do not increase
 * @see METHODS.md §11.4; Kim I.I., Korevaar E., Proc. SPIE 4530, 84–95 (2001) (method).
 */
export function availabilityByMonth(design: LinkDesignInput, records: VisibilityRecords, options: RecordsAvailabilityOptions = {}): MonthAvailability[] {
  const timestamps = records.timestampsMs;
  if (!timestamps) throw new RangeError('records.timestampsMs: the monthly availability needs a timestamp per record');
  const limit = weatherLimitOf(design, options.requiredMarginDb ?? 0);
  const { durationH } = recordDurations(records, options);
  const scale = morScale(records.visibilityDefinition) / 1000;
  const covered = new Float64Array(12);
  const down = new Float64Array(12);
  let month = 0;
  let monthStartMs = Number.NaN;
  let nextMonthMs = Number.NaN;
  for (let i = 0; i < durationH.length; i++) {
    const duration = durationH[i]!;
    if (Number.isNaN(duration)) continue;
    const time = timestamps[i]!;
    // records come in time order: a new Date only when a record leaves the current month
    if (!(time >= monthStartMs && time < nextMonthMs)) {
      const date = new Date(time);
      month = date.getUTCMonth();
      monthStartMs = Date.UTC(date.getUTCFullYear(), month, 1);
      nextMonthMs = Date.UTC(date.getUTCFullYear(), month + 1, 1);
    }
    covered[month] += duration;
    if (isDown(limit, records.visibilityM[i]! * scale)) down[month] += duration;
  }
  const months: MonthAvailability[] = [];
  for (let month = 0; month < 12; month++) {
    if (covered[month]! > 0) {
      months.push({ month: month + 1, coveredHours: covered[month]!, unavailableHours: down[month]!, availability: (covered[month]! - down[month]!) / covered[month]! });
    }
  }
  return months;
}

/** One outage: consecutive down records, not interrupted by a missing record or a gap. */
export interface Outage {
  /** index of its first record */
  firstRecord: number;
  /** timestamp of its first record [ms since the epoch]; null without timestamps */
  startMs: number | null;
  /** its length [h] */
  durationH: number;
  /** lowest visibility during it, in the records' own definition [m] */
  lowestVisibilityM: number;
}

/** Options of {@link outagesFromRecords}. */
export interface OutageListOptions extends RecordsAvailabilityOptions {
  /** how many of the longest outages to return (default 10) */
  longest?: number;
}

/**
 * The outages in a set of records, longest first. The count and the longest agree with
 * availabilityFromRecords' `outageCount` and `longestOutageH`.
 *
 * @param design the link design (its own visibility is not used)
 * @param records visibility [m] per record, optional timestamps [ms]
 * @param options required margin [dB], record interval [h], longest gap [h], how many to return (default 10)
 * @returns the number of outages and the longest ones (start, length [h], lowest visibility [m])
 * @see METHODS.md §11.5.
 */
export function outagesFromRecords(design: LinkDesignInput, records: VisibilityRecords, options: OutageListOptions = {}): { count: number; longest: Outage[] } {
  const limit = weatherLimitOf(design, options.requiredMarginDb ?? 0);
  const { durationH, contiguous } = recordDurations(records, options);
  const scale = morScale(records.visibilityDefinition) / 1000;
  const outages: Outage[] = [];
  let current: Outage | null = null;
  for (let i = 0; i < durationH.length; i++) {
    const duration = durationH[i]!;
    if (Number.isNaN(duration)) {
      current = null;
      continue;
    }
    const visibilityM = records.visibilityM[i]!;
    if (!isDown(limit, visibilityM * scale)) {
      current = null;
      continue;
    }
    if (current) {
      current.durationH += duration;
      if (visibilityM < current.lowestVisibilityM) current.lowestVisibilityM = visibilityM;
    } else {
      current = { firstRecord: i, startMs: records.timestampsMs ? records.timestampsMs[i]! : null, durationH: duration, lowestVisibilityM: visibilityM };
      outages.push(current);
    }
    if (!contiguous[i]) current = null;
  }
  const longest = [...outages].sort((a, b) => b.durationH - a.durationH || a.firstRecord - b.firstRecord).slice(0, options.longest ?? 10);
  return { count: outages.length, longest };
}

/** A bin of the margin distribution. */
export interface MarginBin {
  /** lower edge [dB] (inclusive) */
  lowerDb: number;
  /** upper edge [dB] (exclusive) */
  upperDb: number;
  /** hours with a margin in [lowerDb, upperDb) [h] */
  hours: number;
}

/** Result of {@link marginDistributionFromRecords}. */
export interface MarginDistribution {
  binWidthDb: number;
  /** bins from the floor (or the worst margin, when higher) to the clear-air margin */
  bins: MarginBin[];
  /** hours with a margin below the lowest bin's lower edge [h] */
  belowHours: number;
  /** the lowest bin edge [dB]; margins below it are only counted in belowHours */
  floorDb: number;
  /** time-weighted margins exceeded for the given shares of the covered hours [dB] */
  exceeded: { share: number; marginDb: number }[];
  coveredHours: number;
}

/** Options of {@link marginDistributionFromRecords}. */
export interface MarginDistributionOptions extends RecordsAvailabilityOptions {
  /** bin width [dB], > 0 (default 2) */
  binWidthDb?: number;
  /** lowest margin binned on its own [dB]; lower margins are counted together (default −30) */
  floorDb?: number;
  /** shares of time for which the exceeded margin is reported (default 0.5, 0.9, 0.99, 0.999, 0.9999) */
  shares?: readonly number[];
}

/**
 * Distribution of the margin left after the weather loss, M0 − γ(V)·L_km per record, weighted by the
 * time each record stands for; and the margin exceeded for given shares of the time.
 *
 * @param design the link design (its own visibility is not used)
 * @param records visibility [m] per record, optional timestamps [ms]
 * @param options bin width [dB] (default 2), floor [dB] (default −30), shares (default 0.5 … 0.9999),
 *   record interval [h], longest gap [h]
 * @returns bins [dB, h], hours below the floor, exceeded margins [dB]
 * @see METHODS.md §11.6.
 */
export function marginDistributionFromRecords(design: LinkDesignInput, records: VisibilityRecords, options: MarginDistributionOptions = {}): MarginDistribution {
  const { durationH } = recordDurations(records, options);
  return marginDistributionOf(design, records, durationH, options, monotoneAttenuation(design) ? sortVisibility(records, durationH) : null);
}

function marginDistributionOf(
  design: LinkDesignInput,
  records: VisibilityRecords,
  durationH: Float64Array,
  options: MarginDistributionOptions,
  prepared: SortedVisibility | null,
): MarginDistribution {
  const binWidthDb = options.binWidthDb ?? 2;
  if (!(binWidthDb > 0) || !Number.isFinite(binWidthDb)) throw new RangeError('binWidthDb: must be a finite number greater than 0');
  const limit = weatherLimitOf(design, options.requiredMarginDb ?? 0);
  const scale = morScale(records.visibilityDefinition) / 1000;
  const margins = new Float64Array(durationH.length);
  let covered = 0;
  let worst = Infinity;
  let best = -Infinity;
  for (let i = 0; i < durationH.length; i++) {
    const duration = durationH[i]!;
    if (Number.isNaN(duration)) continue;
    const margin = marginAfterWeatherDb(limit, records.visibilityM[i]! * scale);
    margins[i] = margin;
    covered += duration;
    if (margin < worst) worst = margin;
    if (margin > best) best = margin;
  }
  const shares = options.shares ?? [0.5, 0.9, 0.99, 0.999, 0.9999];
  // the margin exceeded for a share s of the time is the (1 − s) time quantile from below; with γ
  // falling in V the margin rises with V, so it is the margin at that quantile of the visibility
  let marginQuantile: (hours: number) => number;
  if (prepared) {
    marginQuantile = (hours) => marginAfterWeatherDb(limit, visibilityQuantile(prepared, hours));
  } else {
    const order = Array.from({ length: durationH.length }, (_, i) => i)
      .filter((i) => !Number.isNaN(durationH[i]!))
      .sort((a, b) => margins[a]! - margins[b]!);
    marginQuantile = (hours) => {
      let cumulative = 0;
      for (const index of order) {
        cumulative += durationH[index]!;
        if (cumulative > hours) return margins[index]!;
      }
      return margins[order[order.length - 1]!]!;
    };
  }
  const exceeded = shares.map((share) => ({ share, marginDb: covered > 0 ? marginQuantile((1 - share) * covered) : Number.NaN }));
  const floorDb = Math.floor(Math.max(options.floorDb ?? -30, Number.isFinite(worst) ? worst : 0) / binWidthDb) * binWidthDb;
  const top = Number.isFinite(best) ? Math.max(floorDb + binWidthDb, Math.floor(best / binWidthDb) * binWidthDb + binWidthDb) : floorDb + binWidthDb;
  const binCount = Math.round((top - floorDb) / binWidthDb);
  const bins: MarginBin[] = Array.from({ length: binCount }, (_, i) => ({ lowerDb: floorDb + i * binWidthDb, upperDb: floorDb + (i + 1) * binWidthDb, hours: 0 }));
  let belowHours = 0;
  for (let i = 0; i < durationH.length; i++) {
    const hours = durationH[i]!;
    if (Number.isNaN(hours)) continue;
    const margin = margins[i]!;
    if (margin < floorDb) belowHours += hours;
    else bins[Math.min(binCount - 1, Math.floor((margin - floorDb) / binWidthDb))]!.hours += hours;
  }
  return { binWidthDb, bins, belowHours, floorDb, exceeded, coveredHours: covered };
}

/**
 * The visibility below which the link fails: V_min with γ(V_min)·L_km = M0 − M_req, in the given
 * visibility definition.
 *
 * @param design the link design (its own visibility is not used)
 * @param visibilityDefinition definition of the returned figure (default 'contrast-2-percent')
 * @param options required margin [dB] (default 0)
 * @returns V_min [m]; null when the link fails in any weather (M0 ≤ M_req) or when γ is not
 *   monotone in V (λ < 550 nm with Kim/Kruse), where no single visibility decides
 * @see METHODS.md §11.2; Kim I.I., Korevaar E., Proc. SPIE 4530, 84–95 (2001).
 */
export function minimumVisibilityM(design: LinkDesignInput, visibilityDefinition: VisibilityDefinition = 'contrast-2-percent', options: AvailabilityOptions = {}): number | null {
  const limit = weatherLimitOf(design, options.requiredMarginDb ?? 0);
  if (!Number.isFinite(limit.threshold2PercentKm)) return null;
  return (limit.threshold2PercentKm * 1000) / morScale(visibilityDefinition);
}

/** The range at which a target availability is reached. */
export interface RangeForAvailability {
  /** the target, in (0, 1) */
  targetAvailability: number;
  /**
   * `found`: `rangeM` is the longest path with at least the target; `not-achievable`: not even at 50 m;
   * `beyond-search-limit`: still met at 50 km (`rangeM` = 50 000, a lower bound)
   */
  status: 'found' | 'not-achievable' | 'beyond-search-limit';
  /** [m] in [50, 50 000], or null */
  rangeM: number | null;
  /** the visibility that then decides, V_min at `rangeM`, in the data's definition [m] */
  visibilityM: number;
}

function validateTarget(target: number, index: number): void {
  if (!(target > 0 && target < 1)) throw new RangeError(`targets.${index}: must be an availability strictly between 0 and 1`);
}

/** The range at which the margin at visibility v* (in `definition`) falls to the requirement: where V_min = v*. */
function rangeWhereMinimumVisibilityIs(design: LinkDesignInput, visibilityM: number, definition: VisibilityDefinition | undefined, requiredMarginDb: number, target: number): RangeForAvailability {
  const atVisibility: LinkDesignInput = {
    ...design,
    atmosphere: { ...design.atmosphere, visibilityM, visibilityDefinition: definition ?? 'contrast-2-percent' },
    // the availability leaves the fade margin out (fog and strong turbulence rarely coincide)
    scintillation: { ...design.scintillation, include: false },
  };
  const result = maxRange(atVisibility, requiredMarginDb);
  return { targetAvailability: target, status: result.status, rangeM: result.rangeM, visibilityM };
}

/**
 * The longest ranges at which the link still reaches each target availability over the records.
 * Availability falls with range because V_min grows with it, so for a target A the deciding
 * visibility v* is the time quantile of the records with at most (1 − A) of the covered hours below
 * it; the range is then where the margin at v* falls to the requirement (§10.4 on that visibility).
 *
 * @param design the link design (its own range and visibility are not used)
 * @param records visibility [m] per record, optional timestamps [ms], definition
 * @param targets availabilities, each in (0, 1) (e.g. 0.99, 0.999, 0.9999)
 * @param options required margin [dB] (default 0), record interval [h], longest gap [h]
 * @returns per target: status, range [m] or null, the deciding visibility [m]
 * @throws RangeError for a target outside (0, 1), records without a usable visibility, or a Kim/Kruse
 *   design below 550 nm (γ is not monotone in V there)
 * @see METHODS.md §11.7; Kim I.I., Korevaar E., Proc. SPIE 4530, 84–95 (2001).
 */
export function rangesForRecordsAvailability(
  design: LinkDesignInput,
  records: VisibilityRecords,
  targets: readonly number[],
  options: RecordsAvailabilityOptions = {},
): RangeForAvailability[] {
  targets.forEach(validateTarget);
  requireMonotoneAttenuation(design);
  const { durationH } = recordDurations(records, options);
  return rangesOf(design, records, sortVisibility(records, durationH), targets, options.requiredMarginDb ?? 0);
}

function rangesOf(design: LinkDesignInput, records: VisibilityRecords, prepared: SortedVisibility, targets: readonly number[], requiredMarginDb: number): RangeForAvailability[] {
  if (prepared.sorted.length === 0) throw new RangeError('records.visibilityM: needs at least one usable visibility');
  const scale = morScale(records.visibilityDefinition) / 1000;
  return targets.map((target) => {
    // V_min may rise to the deciding visibility and no further: its records (and every one below) exceed the allowed downtime
    const deciding = visibilityQuantile(prepared, (1 - target) * prepared.coveredHours) / scale;
    return rangeWhereMinimumVisibilityIs(design, deciding, records.visibilityDefinition, requiredMarginDb, target);
  });
}

/**
 * The same as {@link rangesForRecordsAvailability} for a cumulative visibility table: v* solves
 * P(V < v*) = 1 − A on the table's log-log interpolation (the first segment extended below the table).
 *
 * @param design the link design (its own range and visibility are not used)
 * @param climatology cumulative visibility distribution (levels [m], P(V < level))
 * @param targets availabilities, each in (0, 1)
 * @param options required margin [dB] (default 0)
 * @returns per target: status, range [m] or null, the deciding visibility [m]; when 1 − A is at or above
 *   the table's last probability the last level is used, and the range is a lower bound
 * @see METHODS.md §11.7.
 */
export function rangesForClimatologyAvailability(
  design: LinkDesignInput,
  climatology: VisibilityClimatology,
  targets: readonly number[],
  options: AvailabilityOptions = {},
): RangeForAvailability[] {
  targets.forEach(validateTarget);
  requireMonotoneAttenuation(design);
  // validates the table with its field paths
  availabilityFromClimatology(design, climatology, options);
  const { visibilityM: levels, probabilityBelow: probabilities } = climatology;
  return targets.map((target) => {
    const p = 1 - target;
    let deciding: number;
    if (p >= probabilities[probabilities.length - 1]!) deciding = levels[levels.length - 1]!;
    else if (p <= probabilities[0]!) {
      const slope = (Math.log10(probabilities[1]!) - Math.log10(probabilities[0]!)) / (Math.log10(levels[1]!) - Math.log10(levels[0]!));
      deciding = slope > 0 ? levels[0]! * Math.pow(p / probabilities[0]!, 1 / slope) : levels[0]!;
    } else {
      let i = 1;
      while (probabilities[i]! < p) i++;
      const y0 = Math.log10(probabilities[i - 1]!);
      const y1 = Math.log10(probabilities[i]!);
      const x0 = Math.log10(levels[i - 1]!);
      const x1 = Math.log10(levels[i]!);
      deciding = y1 === y0 ? levels[i - 1]! : Math.pow(10, x0 + ((Math.log10(p) - y0) * (x1 - x0)) / (y1 - y0));
    }
    return rangeWhereMinimumVisibilityIs(design, deciding, climatology.visibilityDefinition, options.requiredMarginDb ?? 0, target);
  });
}

/** One point of availability against range. */
export interface AvailabilityAtRange {
  rangeM: number;
  /** availability in [0, 1]; NaN when nothing is usable */
  availability: number;
}

/**
 * Availability over the records at each of the given ranges (everything but the range as designed).
 * The records are sorted once by visibility with their hours; each range then costs one clear-air
 * budget, one inverse of γ and a binary search. Classifies records exactly as availabilityFromRecords.
 *
 * @param design the link design (its own range and visibility are not used)
 * @param records visibility [m] per record, optional timestamps [ms], definition
 * @param rangesM path lengths [m], each > 0
 * @param options required margin [dB] (default 0), record interval [h], longest gap [h]
 * @returns availability per range
 * @throws RangeError for a Kim/Kruse design below 550 nm
 * @see METHODS.md §11.7.
 */
export function availabilityAgainstRange(design: LinkDesignInput, records: VisibilityRecords, rangesM: readonly number[], options: RecordsAvailabilityOptions = {}): AvailabilityAtRange[] {
  requireMonotoneAttenuation(design);
  const { durationH } = recordDurations(records, options);
  return sweepOf(design, sortVisibility(records, durationH), rangesM, options.requiredMarginDb ?? 0);
}

function sweepOf(design: LinkDesignInput, prepared: SortedVisibility, rangesM: readonly number[], requiredMarginDb: number): AvailabilityAtRange[] {
  const covered = prepared.coveredHours;
  return rangesM.map((rangeM, index) => {
    if (!(rangeM > 0) || !Number.isFinite(rangeM)) throw new RangeError(`rangesM.${index}: must be a finite number greater than 0`);
    if (covered === 0) return { rangeM, availability: Number.NaN };
    const limit = weatherLimitOf({ ...design, rangeM }, requiredMarginDb);
    let downHours: number;
    if (Number.isNaN(limit.threshold2PercentKm)) {
      // V_min on the inverse's clamp: every record's margin decides
      downHours = 0;
      const { sorted, baseH, oddVisibility, oddCumulativeH } = prepared;
      for (let i = 0; i < sorted.length; i++) if (isDown(limit, sorted[i]!)) downHours += baseH;
      for (let i = 0; i < oddVisibility.length; i++) if (isDown(limit, oddVisibility[i]!)) downHours += oddCumulativeH[i + 1]! - oddCumulativeH[i]!;
    } else {
      // the records strictly below the threshold are down
      downHours = hoursBelow(prepared, limit.threshold2PercentKm);
    }
    return { rangeM, availability: (covered - downHours) / covered };
  });
}

function monotoneAttenuation(design: LinkDesignInput): boolean {
  const resolved = resolveDesign(design);
  return !(resolved.fogNumeratorPerKm === 0 && resolved.wavelengthM < VISIBILITY_REFERENCE_WAVELENGTH_M);
}

function requireMonotoneAttenuation(design: LinkDesignInput): void {
  if (!monotoneAttenuation(design)) throw new RangeError('transmitter.wavelengthM: availability against range needs a wavelength of at least 550 nm');
}

/** The availability targets a link is usually sold at: 99 %, 99.9 % and 99.99 % of the hours. */
export const AVAILABILITY_TARGETS = [0.99, 0.999, 0.9999] as const;

/** Options of {@link analyseRecordsAvailability}. */
export interface RecordsAnalysisOptions extends RecordsAvailabilityOptions {
  /** availabilities whose ranges are sought (default 99 %, 99.9 %, 99.99 %) */
  targets?: readonly number[];
  /** ranges of the availability-against-range sweep [m] (default 40 log-spaced from 100 m to 4× the design range, within 50 m … 50 km) */
  rangesM?: readonly number[];
  /** bin width of the margin distribution [dB] (default 2) */
  marginBinWidthDb?: number;
  /** floor of the margin distribution [dB] (default −30) */
  marginFloorDb?: number;
  /** how many of the longest outages to list (default 10) */
  longestOutages?: number;
}

/** Result of {@link analyseRecordsAvailability}. */
export interface RecordsAnalysis {
  /** availabilityFromRecords itself: hours up and down, availability, outages, worst margin */
  totals: RecordsAvailability;
  /** V_min in the records' definition [m], null when the link fails in any weather or no single visibility decides */
  minimumVisibilityM: number | null;
  /** per calendar month (empty without timestamps) */
  months: MonthAvailability[];
  outages: { count: number; longest: Outage[] };
  marginDistribution: MarginDistribution;
  /** null below 550 nm with Kim/Kruse, where availability is not monotone in range */
  rangesForAvailability: RangeForAvailability[] | null;
  availabilityAgainstRange: AvailabilityAtRange[] | null;
}

/** Log-spaced sweep ranges around a design range, within the maximum-range search interval. */
export function availabilitySweepRangesM(designRangeM: number, points = 40): number[] {
  const lower = 100;
  const upper = Math.min(50_000, Math.max(lower * 2, 4 * designRangeM));
  return Array.from({ length: points }, (_, i) => lower * Math.pow(upper / lower, i / (points - 1)));
}

/**
 * Everything the availability page shows for a set of records, in one call: availabilityFromRecords
 * (the totals), V_min, the months, the outages, the margin distribution, the ranges for the target
 * availabilities and availability against range (METHODS.md §11.3–§11.7).
 *
 * @param design the link design (range, terminals, attenuation model; its own visibility is not used)
 * @param records visibility [m] per record, timestamps [ms since the epoch] (for the months), definition
 * @param options required margin [dB] (default 0), record interval [h], longest gap [h], targets, sweep
 *   ranges [m], margin bins [dB], number of outages listed
 * @returns the analysis; the totals are exactly availabilityFromRecords' result
 * @see METHODS.md §11; Kim I.I., Korevaar E., Proc. SPIE 4530, 84–95 (2001).
 */
export function analyseRecordsAvailability(design: LinkDesignInput, records: VisibilityRecords, options: RecordsAnalysisOptions = {}): RecordsAnalysis {
  const totals = availabilityFromRecords(design, records, options);
  const monotone = monotoneAttenuation(design);
  const { durationH } = recordDurations(records, options);
  // sorted once, shared by the margin quantiles, the ranges and the sweep
  const prepared = monotone ? sortVisibility(records, durationH) : null;
  const requiredMarginDb = options.requiredMarginDb ?? 0;
  return {
    totals,
    minimumVisibilityM: minimumVisibilityM(design, records.visibilityDefinition, options),
    months: records.timestampsMs ? availabilityByMonth(design, records, options) : [],
    outages: outagesFromRecords(design, records, { ...options, longest: options.longestOutages }),
    marginDistribution: marginDistributionOf(design, records, durationH, { ...options, binWidthDb: options.marginBinWidthDb, floorDb: options.marginFloorDb }, prepared),
    rangesForAvailability: prepared && totals.usableCount > 0 ? rangesOf(design, records, prepared, options.targets ?? AVAILABILITY_TARGETS, requiredMarginDb) : null,
    availabilityAgainstRange: prepared ? sweepOf(design, prepared, options.rangesM ?? availabilitySweepRangesM(design.rangeM), requiredMarginDb) : null,
  };
}

/** Options of {@link analyseClimatologyAvailability}. */
export interface ClimatologyAnalysisOptions extends AvailabilityOptions {
  targets?: readonly number[];
  rangesM?: readonly number[];
}

/** Result of {@link analyseClimatologyAvailability}. */
export interface ClimatologyAnalysis {
  /** availabilityFromClimatology itself */
  totals: ClimatologyAvailability;
  rangesForAvailability: RangeForAvailability[];
  availabilityAgainstRange: AvailabilityAtRange[];
}

/**
 * The availability of a design from a cumulative visibility table, with the ranges for the target
 * availabilities and availability against range (METHODS.md §11.2, §11.7).
 *
 * @param design the link design (its own visibility is not used)
 * @param climatology cumulative visibility distribution (levels [m], P(V < level))
 * @param options required margin [dB] (default 0), targets (default 99 %, 99.9 %, 99.99 %), sweep ranges [m]
 * @returns availabilityFromClimatology's result, the ranges and the sweep
 * @throws RangeError for a malformed table or a Kim/Kruse design below 550 nm
 * @see Kim I.I., Korevaar E., Proc. SPIE 4530, 84–95 (2001).
 */
export function analyseClimatologyAvailability(design: LinkDesignInput, climatology: VisibilityClimatology, options: ClimatologyAnalysisOptions = {}): ClimatologyAnalysis {
  const totals = availabilityFromClimatology(design, climatology, options);
  return {
    totals,
    rangesForAvailability: rangesForClimatologyAvailability(design, climatology, options.targets ?? AVAILABILITY_TARGETS, options),
    availabilityAgainstRange: (options.rangesM ?? availabilitySweepRangesM(design.rangeM)).map((rangeM) => ({
      rangeM,
      availability: availabilityFromClimatology({ ...design, rangeM }, climatology, options).availability,
    })),
  };
}
