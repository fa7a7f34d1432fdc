import { describe, expect, it } from 'vitest';
import { readDemoFixtures } from './demo-fixtures.js';
import { loadSyntheticVisibility } from './demo-weather.js';

/** The invented demo weather: reproducible, hourly, and with the seasons its parameters describe. */
describe('the synthetic demo visibility', () => {
  const fixtures = readDemoFixtures().weather;

  it('gives the same hours for the same seed, and other hours for another', async () => {
    const { generateHourlyVisibility } = await loadSyntheticVisibility();
    const first = generateHourlyVisibility(fixtures[0]!);
    const again = generateHourlyVisibility(fixtures[0]!);
    expect(Array.from(again.visibilityM)).toEqual(Array.from(first.visibilityM));
    const other = generateHourlyVisibility({ ...fixtures[0]!, seed: fixtures[0]!.seed + 1 });
    expect(Array.from(other.visibilityM)).not.toEqual(Array.from(first.visibilityM));
  });

  it('is hourly over whole years, capped at 9999 m like METAR, with a few readings missing', async () => {
    const { generateHourlyVisibility } = await loadSyntheticVisibility();
    for (const fixture of fixtures) {
      const { timestampsMs, visibilityM } = generateHourlyVisibility(fixture);
      expect(timestampsMs[0]).toBe(Date.UTC(fixture.startYear, 0, 1));
      expect(timestampsMs.length).toBe((Date.UTC(fixture.startYear + fixture.years, 0, 1) - Date.UTC(fixture.startYear, 0, 1)) / 3_600_000);
      const readings = Array.from(visibilityM).filter((value) => !Number.isNaN(value));
      expect(Math.max(...readings)).toBe(9999);
      expect(Math.min(...readings)).toBeGreaterThanOrEqual(50);
      const missingShare = 1 - readings.length / visibilityM.length;
      expect(missingShare).toBeGreaterThan(0);
      expect(missingShare).toBeLessThan(3 * fixture.climate.missingShare);
    }
  });

  it('puts the fog in the season its parameters give it: more fog hours in the foggiest months than the clearest', async () => {
    const { generateHourlyVisibility } = await loadSyntheticVisibility();
    for (const fixture of fixtures) {
      const { timestampsMs, visibilityM } = generateHourlyVisibility(fixture);
      const fogShare = Array.from({ length: 12 }, () => ({ fog: 0, hours: 0 }));
      visibilityM.forEach((value, i) => {
        if (Number.isNaN(value)) return;
        const month = fogShare[new Date(timestampsMs[i]!).getUTCMonth()]!;
        month.hours += 1;
        if (value < 1000) month.fog += 1;
      });
      const onset = fixture.climate.fogOnsetPerHour;
      const foggiest = onset.indexOf(Math.max(...onset));
      const clearest = onset.indexOf(Math.min(...onset));
      const share = (month: number) => fogShare[month]!.fog / fogShare[month]!.hours;
      expect(share(foggiest)).toBeGreaterThan(2 * share(clearest));
    }
  });
});
