/// <reference types="vitest/config" />
import { defineConfig, defaultClientConditions } from 'vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

// The api serves the built UI from the same origin; in development the dev server forwards /api.
const apiTarget = process.env.BEAMWRIGHT_API_URL ?? 'http://127.0.0.1:3000';

export default defineConfig({
  plugins: [react()],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      // link-core's special functions come from @stdlib, whose feature probe calls eval: see the shim
      '@stdlib/assert-has-generator-support': fileURLToPath(new URL('./src/lib/shims/has-generator-support.cjs', import.meta.url)),
    },
    // Read link-core from its TypeScript source. Setting conditions replaces Vite's defaults,
    // so spread them back in after ours.
    conditions: ['@beamwright/source', ...defaultClientConditions],
  },
  server: {
    port: Number(process.env.UI_DEV_PORT ?? 5173),
    strictPort: true,
    proxy: { '/api': { target: apiTarget, changeOrigin: false } },
  },
  // The server replaces this placeholder with a fresh nonce per response (its CSP admits it).
  html: { cspNonce: 'BEAMWRIGHT_CSP_NONCE' },
  // the sweep worker imports link-core's shared chunks: module workers, like the app
  worker: { format: 'es' },
  build: {
    outDir: 'dist',
    // No data: URLs for fonts or images: the CSP admits only the app's own origin for them.
    assetsInlineLimit: 0,
    emptyOutDir: true,
    sourcemap: true,
    // The initial-JS budget (250 kB gzip) is checked by scripts/report-bundle.mjs; this only warns.
    chunkSizeWarningLimit: 900,
  },
  test: {
    environment: 'jsdom',
    globals: false,
    setupFiles: ['./vitest.setup.ts'],
    include: ['src/**/*.test.{ts,tsx}'],
    css: false,
    testTimeout: 30_000,
    server: { deps: { inline: [/@fluentui/] } },
  },
});
