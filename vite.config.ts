/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';
import { mkdirSync, renameSync } from 'node:fs';
import path from 'node:path';
import type { Plugin } from 'vite';

// Source maps are made (hidden: no sourceMappingURL in the served files) for reading error reports, then
// moved out of the served folder, so a production server never hands out the app's source.
function sourceMapsOutsideServedFolder(): Plugin {
  let outDir = '';
  return {
    name: 'source-maps-outside-served-folder',
    apply: 'build',
    configResolved(config) {
      outDir = path.resolve(config.root, config.build.outDir);
    },
    writeBundle(_options, bundle) {
      const target = path.resolve(outDir, '../sourcemaps');
      for (const fileName of Object.keys(bundle).filter((f) => f.endsWith('.map'))) {
        const to = path.join(target, fileName);
        mkdirSync(path.dirname(to), { recursive: true });
        renameSync(path.join(outDir, fileName), to);
      }
    },
  };
}

// The technician's phone keeps working without signal: a service worker (Workbox, generated) precaches the app
// shell and its bundles and answers every navigation with index.html. It never caches /api answers — the data a
// phone needs offline comes from the persisted query cache (apps/web/src/app/offline-store.ts) — and leaves the
// server's own pages (/api, /auth, /dev, the game-tag pages under /t/ and /status/) to the network.
function offlineAppShell() {
  return VitePWA({
    registerType: 'autoUpdate',
    injectRegister: null,
    manifest: {
      name: 'Bumperline',
      short_name: 'Bumperline',
      description: 'Your route day, stops and van stock — also without signal.',
      start_url: '/',
      display: 'standalone',
      background_color: '#f4f6fa',
      theme_color: '#14213d',
    },
    workbox: {
      globPatterns: ['**/*.{js,css,html,woff2,svg}'],
      navigateFallback: 'index.html',
      navigateFallbackDenylist: [/^\/api\//, /^\/auth\//, /^\/dev\//, /^\/t\//, /^\/t-assets\//, /^\/status\//, /^\/webhooks\//],
      runtimeCaching: [],
      cleanupOutdatedCaches: true,
      sourcemap: false,
      // The largest lazy bundle (charts) is a little over 400 KB; keep headroom so no screen is left out.
      maximumFileSizeToCacheInBytes: 3 * 1024 * 1024,
    },
  });
}

// The web app's root is the repository root (index.html loads apps/web/src). In development the API
// runs on API_PORT and Vite proxies /api, /auth and /dev to it so everything stays same-origin.
const apiPort = Number(process.env.API_PORT ?? 3001);
const apiTarget = `http://127.0.0.1:${apiPort}`;

export default defineConfig({
  plugins: [react(), tailwindcss(), sourceMapsOutsideServedFolder(), offlineAppShell()],
  build: { outDir: 'dist/web', emptyOutDir: true, sourcemap: 'hidden' },
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
          include: ['packages/**/src/**/*.test.ts', 'apps/**/src/**/*.test.{ts,tsx}', 'fakes/src/**/*.test.ts', 'tests/lint/**/*.test.ts'],
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
