/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// The web app's root is the repository root (index.html loads apps/web/src). In development the API
// runs on API_PORT and Vite proxies /api, /auth and /dev to it so everything stays same-origin.
const apiPort = Number(process.env.API_PORT ?? 3001);
const apiTarget = `http://127.0.0.1:${apiPort}`;

export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: { outDir: 'dist/web', emptyOutDir: true, sourcemap: true },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: {
      '/api': apiTarget,
      '/auth': apiTarget,
      '/dev': apiTarget,
      '/webhooks': apiTarget,
      // The public game-tag pages are served by the API (they work without JavaScript).
      '^/t/': apiTarget,
      '/t-assets': apiTarget,
      '^/status/': apiTarget,
    },
  },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          setupFiles: ['tests/support/fast-check-seed.ts'],
          include: ['packages/**/src/**/*.test.ts', 'apps/**/src/**/*.test.{ts,tsx}', 'fakes/src/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        extends: true,
        test: {
          name: 'integration',
          include: ['tests/api/**/*.test.ts', 'tests/security/**/*.test.ts'],
          globalSetup: ['tests/support/global-setup.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
