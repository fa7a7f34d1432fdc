import { registerAs } from '@nestjs/config';
import { EnvSchema } from './env.schema.js';

/** Weather imports: how long an upload waits for its job, when a silent job counts as stopped, and its retries. */
export const weatherConfig = registerAs('weather', () => {
  const env = EnvSchema.parse(process.env);
  return {
    importWaitMs: env.WEATHER_IMPORT_WAIT_SECONDS * 1000,
    importStallMs: env.WEATHER_IMPORT_STALL_SECONDS * 1000,
    importRetries: env.WEATHER_IMPORT_RETRIES,
  };
});
export type WeatherConfig = ReturnType<typeof weatherConfig>;
