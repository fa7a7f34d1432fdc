// zod/mini: the same validation with a fraction of the weight on the first screen.
import * as z from 'zod/mini';

// Vite exposes only VITE_* variables to the browser; parse them once so a typo fails at start-up.
const EnvSchema = z.object({
  // The api serves the UI from the same origin, so a relative base is the default.
  API_URL: z._default(z.string().check(z.minLength(1)), '/api'),
});

function readEnv() {
  const raw = Object.fromEntries(
    Object.entries(import.meta.env)
      .filter(([key]) => key.startsWith('VITE_APP_'))
      .map(([key, value]) => [key.replace('VITE_APP_', ''), value]),
  );
  const parsed = EnvSchema.safeParse(raw);
  if (!parsed.success) {
    throw new Error(`Invalid VITE_APP_* settings: ${parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`).join('; ')}`);
  }
  return parsed.data;
}

export const env = readEnv();
