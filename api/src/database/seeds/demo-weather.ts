/**
 * The demo's weather data sets: INVENTED hourly visibility for two of the fictional sites, generated
 * at seed time by fixtures/demo/weather/synthetic-visibility.mjs (seeded, so every seed writes the
 * same hours) rather than committed as large files. Marked `invented` and said so in their notes.
 */
import { pathToFileURL } from 'node:url';
import { join } from 'node:path';
import type { EntityManager } from 'typeorm';
import { DEMO_FIXTURES_DIR, type WeatherFixture } from './demo-fixtures.js';
import { insertRecords } from '../../weather/weather-records.writer.js';

interface SyntheticVisibilityModule {
  generateHourlyVisibility(options: Pick<WeatherFixture, 'seed' | 'startYear' | 'years' | 'climate'>): { timestampsMs: Float64Array; visibilityM: Float64Array };
}

/** The generator module (plain ESM in fixtures/). */
export async function loadSyntheticVisibility(directory = DEMO_FIXTURES_DIR): Promise<SyntheticVisibilityModule> {
  return (await import(pathToFileURL(join(directory, 'weather', 'synthetic-visibility.mjs')).href)) as SyntheticVisibilityModule;
}

/** Creates each demo data set that is missing (by name); returns how many it created. */
export async function seedDemoWeather(
  manager: EntityManager,
  context: { organisationId: string; siteIds: Map<string, string>; createdById: string | null },
  datasets: readonly WeatherFixture[],
): Promise<number> {
  let created = 0;
  const generator = datasets.length ? await loadSyntheticVisibility() : undefined;
  for (const fixture of datasets) {
    const [existing] = (await manager.query(`SELECT id FROM weather_dataset WHERE organisation_id = $1 AND name = $2`, [context.organisationId, fixture.name])) as { id: string }[];
    if (existing) continue;
    const siteId = context.siteIds.get(fixture.site);
    if (!siteId) throw new Error(`Invalid demo fixture weather.json: site "${fixture.site}" is not in sites.json`);
    const { timestampsMs, visibilityM } = generator!.generateHourlyVisibility(fixture);
    const visibilities = Array.from(visibilityM, (value) => (Number.isNaN(value) ? null : value));
    const [dataset] = (await manager.query(
      `INSERT INTO weather_dataset (organisation_id, site_id, name, notes, visibility_definition, record_count, missing_visibility_count,
                                    first_observed_at, last_observed_at, invented, created_by_id)
       VALUES ($1, $2, $3, $4, 'mor-5-percent', $5, $6, to_timestamp($7::float8 / 1000), to_timestamp($8::float8 / 1000), true, $9) RETURNING id`,
      [
        context.organisationId,
        siteId,
        fixture.name,
        fixture.notes,
        timestampsMs.length,
        visibilities.filter((value) => value === null).length,
        timestampsMs[0],
        timestampsMs[timestampsMs.length - 1],
        context.createdById,
      ],
    )) as { id: string }[];
    const none = () => new Array<null>(timestampsMs.length).fill(null);
    await insertRecords(manager, dataset!.id, {
      observedAtMs: Array.from(timestampsMs),
      visibilityM: visibilities,
      rainRateMmPerH: none(),
      snowRateMmPerH: none(),
      temperatureC: none(),
      cn2: none(),
    });
    created += 1;
  }
  return created;
}
