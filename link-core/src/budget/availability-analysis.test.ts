import { describe, expect, it } from 'vitest';
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { workedExampleDesign } from '../examples/worked-example.js';
import { seededUniform } from '../numeric/seeded-random.js';
import { availabilityFromClimatology, availabilityFromRecords, clearAirMarginDb, type VisibilityRecords } from './availability.js';
import {
  analyseClimatologyAvailability,
  analyseRecordsAvailability,
  availabilityAgainstRange,
  availabilityByMonth,
  marginDistributionFromRecords,
  minimumVisibilityM,
  outagesFromRecords,
  rangesForClimatologyAvailability,
  rangesForRecordsAvailability,
  recordDurations,
} from './availability-analysis.js';
import { evaluateLink } from './evaluate-link.js';

const HOUR_MS = 3_600_000;
// The worked example LB-01 at 1 km without the fade margin: a clear-air margin of about 30 dB.
const oneKm: LinkDesignInput = { ...workedExampleDesign(), rangeM: 1000, scintillation: { include: false, probability: 1e-3 } };

/** Hourly records from a start time; NaN marks a missing reading. */
function hourly(startIso: string, visibilityM: number[], definition?: VisibilityRecords['visibilityDefinition']): VisibilityRecords {
  const start = Date.parse(startIso);
  return { visibilityM, timestampsMs: visibilityM.map((_, i) => start + i * HOUR_MS), visibilityDefinition: definition };
}

/** Seeded records with fog spells, missing readings and a few gaps, MOR or 2 %. */
function seededRecords(seed: number, count: number, definition: VisibilityRecords['visibilityDefinition']): VisibilityRecords {
  const random = seededUniform(seed);
  const visibilityM: number[] = [];
  const timestampsMs: number[] = [];
  let time = Date.UTC(2020, 0, 1);
  let fog = 0;
  for (let i = 0; i < count; i++) {
    time += random() < 0.01 ? 6 * HOUR_MS : HOUR_MS;
    if (fog === 0 && random() < 0.02) fog = 1 + Math.floor(random() * 10);
    visibilityM.push(random() < 0.01 ? Number.NaN : fog > 0 ? 40 + random() * 900 : 2000 + random() * 30_000);
    if (fog > 0) fog--;
    timestampsMs.push(time);
  }
  return { visibilityM, timestampsMs, visibilityDefinition: definition };
}

describe('a small record set, counted by hand', () => {
  // 50 m fog takes far more than the 30 dB clear-air margin over 1 km; 20 km takes a fraction of a dB.
  // Hours from 31 January 22:00 UTC: up, up | down, down, up, missing, down, up.
  const fog = 50;
  const clear = 20_000;
  const records = hourly('2021-01-31T22:00:00Z', [clear, clear, fog, fog, clear, Number.NaN, fog, clear]);

  it('gives 7 covered hours, 3 of them down, in two outages (the longest 2 h)', () => {
    const result = availabilityFromRecords(oneKm, records);
    expect(result).toMatchObject({ coveredHours: 7, unavailableHours: 3, outageCount: 2, longestOutageH: 2, missingCount: 1 });
    expect(result.availability).toBeCloseTo(4 / 7, 12);
  });

  it('puts January at 2 h up of 2 and February at 2 h up of 5', () => {
    expect(availabilityByMonth(oneKm, records)).toEqual([
      { month: 1, coveredHours: 2, unavailableHours: 0, availability: 1 },
      { month: 2, coveredHours: 5, unavailableHours: 3, availability: 2 / 5 },
    ]);
  });

  it('lists the two outages, longest first, with their start and lowest visibility', () => {
    const { count, longest } = outagesFromRecords(oneKm, records);
    expect(count).toBe(2);
    expect(longest).toEqual([
      { firstRecord: 2, startMs: Date.parse('2021-02-01T00:00:00Z'), durationH: 2, lowestVisibilityM: fog },
      { firstRecord: 6, startMs: Date.parse('2021-02-01T04:00:00Z'), durationH: 1, lowestVisibilityM: fog },
    ]);
  });

  it('bins the margins: 4 h near the clear-air margin, 3 h below the floor', () => {
    const distribution = marginDistributionFromRecords(oneKm, records, { binWidthDb: 5, floorDb: -30 });
    expect(distribution.belowHours).toBe(3);
    expect(distribution.coveredHours).toBe(7);
    const clearAir = clearAirMarginDb(oneKm);
    // the top bin holds the clear hours, whose margin is a fraction of a dB under the clear-air margin
    const topBin = distribution.bins.at(-1)!;
    expect(topBin.hours).toBe(4);
    expect(topBin.lowerDb).toBeGreaterThan(clearAir - 6);
    expect(distribution.bins.slice(0, -1).every((bin) => bin.hours === 0)).toBe(true);
    // exceeded half the time: the clear-weather margin; exceeded 99 % of the time: the fog's
    expect(distribution.exceeded.find((entry) => entry.share === 0.5)!.marginDb).toBeGreaterThan(clearAir - 1);
    expect(distribution.exceeded.find((entry) => entry.share === 0.99)!.marginDb).toBeLessThan(-200);
  });
});

describe('agreement with availabilityFromRecords over seeded years', () => {
  for (const definition of ['contrast-2-percent', 'mor-5-percent'] as const) {
    const records = seededRecords(definition === 'mor-5-percent' ? 11 : 12, 20_000, definition);
    const options = { requiredMarginDb: 3 };
    const totals = availabilityFromRecords(oneKm, records, options);

    it(`adds the months up to the totals (${definition})`, () => {
      const months = availabilityByMonth(oneKm, records, options);
      expect(months.map((month) => month.month)).toEqual([...new Set(months.map((month) => month.month))].sort((a, b) => a - b));
      expect(months.reduce((sum, month) => sum + month.coveredHours, 0)).toBeCloseTo(totals.coveredHours, 6);
      expect(months.reduce((sum, month) => sum + month.unavailableHours, 0)).toBeCloseTo(totals.unavailableHours, 6);
    });

    it(`finds the same outages (${definition})`, () => {
      const outages = outagesFromRecords(oneKm, records, { ...options, longest: 3 });
      expect(outages.count).toBe(totals.outageCount);
      expect(outages.longest[0]!.durationH).toBeCloseTo(totals.longestOutageH, 9);
      expect(outages.longest.length).toBe(3);
    });

    it(`gives the same covered hours and worst margin to the distribution (${definition})`, () => {
      const distribution = marginDistributionFromRecords(oneKm, records, { ...options, floorDb: -1000 });
      expect(distribution.coveredHours).toBeCloseTo(totals.coveredHours, 6);
      const binned = distribution.bins.reduce((sum, bin) => sum + bin.hours, 0) + distribution.belowHours;
      expect(binned).toBeCloseTo(totals.coveredHours, 6);
      expect(distribution.bins[0]!.lowerDb).toBeLessThanOrEqual(totals.worstMarginDb);
    });

    it(`sweeps availability against range as availabilityFromRecords at each range (${definition})`, () => {
      const ranges = [200, 500, 1000, 1500, 2500, 4000];
      const swept = availabilityAgainstRange(oneKm, records, ranges, options);
      for (const point of swept) {
        expect(point.availability).toBeCloseTo(availabilityFromRecords({ ...oneKm, rangeM: point.rangeM }, records, options).availability, 12);
      }
      for (let i = 1; i < swept.length; i++) expect(swept[i]!.availability).toBeLessThanOrEqual(swept[i - 1]!.availability);
    });

    it(`finds the longest range for 99 %, 99.9 % and 99.99 % (${definition})`, () => {
      const found = rangesForRecordsAvailability(oneKm, records, [0.9, 0.99, 0.999], options);
      expect(found.map((entry) => entry.status)).toEqual(['found', 'found', 'found']);
      for (const entry of found) {
        const at = (rangeM: number) => availabilityFromRecords({ ...oneKm, rangeM }, records, options).availability;
        expect(at(entry.rangeM! * (1 - 1e-6))).toBeGreaterThanOrEqual(entry.targetAvailability);
        expect(at(entry.rangeM! * 1.001)).toBeLessThan(entry.targetAvailability);
      }
      // a higher target is met only over a shorter path
      expect(found[0]!.rangeM!).toBeGreaterThan(found[1]!.rangeM!);
      expect(found[1]!.rangeM!).toBeGreaterThan(found[2]!.rangeM!);
    });
  }

  it('counts durations as availabilityFromRecords: the covered hours agree', () => {
    const records = seededRecords(5, 5000, undefined);
    const { durationH } = recordDurations(records);
    const sum = Array.from(durationH).filter((hours) => !Number.isNaN(hours)).reduce((a, b) => a + b, 0);
    expect(sum).toBeCloseTo(availabilityFromRecords(oneKm, records).coveredHours, 9);
  });

  it('needs timestamps for the months', () => {
    expect(() => availabilityByMonth(oneKm, { visibilityM: [1000, 2000] })).toThrow(/timestampsMs/);
  });
});

describe('the visibility below which the link fails', () => {
  it('leaves exactly the required margin at V_min (2 % and MOR)', () => {
    const twoPercent = minimumVisibilityM(oneKm, 'contrast-2-percent', { requiredMarginDb: 3 })!;
    const atMinimum = evaluateLink({ ...oneKm, atmosphere: { ...oneKm.atmosphere, visibilityM: twoPercent } });
    expect(atMinimum.linkMarginDb).toBeCloseTo(3, 6);
    const mor = minimumVisibilityM(oneKm, 'mor-5-percent', { requiredMarginDb: 3 })!;
    expect(mor * (Math.log(50) / Math.log(20))).toBeCloseTo(twoPercent, 6);
  });

  it('is null for a link that fails in any weather', () => {
    expect(minimumVisibilityM(oneKm, 'contrast-2-percent', { requiredMarginDb: 200 })).toBeNull();
  });
});

describe('ranges for a target availability from a cumulative table', () => {
  // The synthetic climatology of reference case LB-03 (test data, not a real site).
  const climatology = {
    visibilityM: [50, 100, 200, 500, 1000, 2000, 5000, 10000],
    probabilityBelow: [0.0005, 0.001, 0.002, 0.005, 0.01, 0.03, 0.1, 0.3],
  };

  it('gives ranges at which availabilityFromClimatology returns the target', () => {
    const found = rangesForClimatologyAvailability(oneKm, climatology, [0.99, 0.995, 0.999]);
    for (const entry of found) {
      expect(entry.status).toBe('found');
      const availability = availabilityFromClimatology({ ...oneKm, rangeM: entry.rangeM! }, climatology).availability;
      expect(availability).toBeCloseTo(entry.targetAvailability, 7);
    }
    // 99 %: P(V < v*) = 0.01 at the table level 1000 m
    expect(found[0]!.visibilityM).toBeCloseTo(1000, 6);
  });

  it('says when a target is out of reach even at 50 m (99.99 % needs a path through 10 m fog)', () => {
    const [entry] = rangesForClimatologyAvailability(oneKm, climatology, [0.9999]);
    expect(entry).toMatchObject({ status: 'not-achievable', rangeM: null });
    // below the table the first segment's power law is extended: P = 0.0005·(v/50 m)
    expect(entry!.visibilityM).toBeCloseTo(10, 9);
  });

  it('rejects a target outside (0, 1)', () => {
    expect(() => rangesForClimatologyAvailability(oneKm, climatology, [1])).toThrow(/targets\.0/);
  });
});

describe('the analysis in one call', () => {
  const records = seededRecords(21, 9000, 'mor-5-percent');

  it('carries availabilityFromRecords itself as its totals, and the parts agree with them', () => {
    const analysis = analyseRecordsAvailability(oneKm, records, { requiredMarginDb: 2 });
    expect(analysis.totals).toEqual(availabilityFromRecords(oneKm, records, { requiredMarginDb: 2 }));
    expect(analysis.outages.count).toBe(analysis.totals.outageCount);
    expect(analysis.months.reduce((sum, month) => sum + month.unavailableHours, 0)).toBeCloseTo(analysis.totals.unavailableHours, 6);
    expect(analysis.minimumVisibilityM).toBeCloseTo(minimumVisibilityM(oneKm, 'mor-5-percent', { requiredMarginDb: 2 })!, 9);
    expect(analysis.rangesForAvailability!.map((entry) => entry.targetAvailability)).toEqual([0.99, 0.999, 0.9999]);
    expect(analysis.availabilityAgainstRange!.length).toBe(40);
  });

  it('leaves the range analysis out below 550 nm with Kim, where availability is not monotone in range', () => {
    const blue: LinkDesignInput = { ...oneKm, transmitter: { ...oneKm.transmitter, wavelengthM: 450e-9 } };
    const analysis = analyseRecordsAvailability(blue, records);
    expect(analysis.rangesForAvailability).toBeNull();
    expect(analysis.availabilityAgainstRange).toBeNull();
    expect(analysis.totals.coveredHours).toBeGreaterThan(0);
  });

  it('carries availabilityFromClimatology itself for a cumulative table', () => {
    const climatology = { visibilityM: [50, 100, 200, 500, 1000, 2000, 5000, 10000], probabilityBelow: [0.0005, 0.001, 0.002, 0.005, 0.01, 0.03, 0.1, 0.3] };
    const analysis = analyseClimatologyAvailability(oneKm, climatology, { rangesM: [500, 1000] });
    expect(analysis.totals).toEqual(availabilityFromClimatology(oneKm, climatology));
    expect(analysis.availabilityAgainstRange[1]!.availability).toBe(analysis.totals.availability);
  });
});
