import { defineConfig } from 'vitest/config';

export default defineConfig({
  resolve: { conditions: ['@beamwright/source'] },
  test: {
    include: ['src/**/*.test.ts', 'test/**/*.test.ts'],
    environment: 'node',
  },
});
