import { defaultServerConditions } from 'vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  // Tests read link-core from its TypeScript source, so they never run against a stale build.
  resolve: { conditions: ['@beamwright/source', ...defaultServerConditions] },
  ssr: { resolve: { conditions: ['@beamwright/source', ...defaultServerConditions] } },
  test: {
    include: ['src/**/*.spec.ts', 'test/**/*.e2e-spec.ts'],
    environment: 'node',
    // e2e files share one database and the machine has few cores: run files one after another.
    fileParallelism: false,
    globalSetup: ['test/utils/global-setup.ts'],
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});
