import { defineConfig } from 'vite';
import preact from '@preact/preset-vite';
import { VitePWA } from 'vite-plugin-pwa';
import { readFileSync } from 'node:fs';
import { lazyUplotIntl } from './scripts/lazyUplotIntl.mjs';
import { compileHints } from './scripts/compileHints.mjs';

const pkg = JSON.parse(readFileSync(new URL('./package.json', import.meta.url), 'utf8')) as { version: string };
// RODSIDE_BUILD_LABEL lets a test build a second, distinguishable version of the same source.
const appVersion = process.env.RODSIDE_BUILD_LABEL ? `${pkg.version}+${process.env.RODSIDE_BUILD_LABEL}` : pkg.version;

export default defineConfig({
  define: {
    __APP_VERSION__: JSON.stringify(appVersion),
  },
  plugins: [
    preact(),
    lazyUplotIntl(),
    // The chart library's functions compiled off the main thread when it loads, not inside the first chart's
    // drawing (measured in Lighthouse traces of /peak: that task 65–106 ms before, 34–66 ms after). See the plugin.
    compileHints(/^uPlot/),
    VitePWA({
      // The user may be half-way through a reading: updates are offered, never forced.
      registerType: 'prompt',
      injectRegister: false,
      strategies: 'generateSW',
      includeAssets: ['icons/*.png', 'icons/*.svg'],
      manifest: {
        name: 'Rodside — quadrupole field companion',
        short_name: 'Rodside',
        description:
          'Expected RF and DC, stability, resolution, peak simulation, guided diagnosis and a visit log for quadrupole mass spectrometer service. Works offline.',
        theme_color: '#1d3b3a',
        background_color: '#f4f1ea',
        display: 'standalone',
        start_url: '/',
        scope: '/',
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
      workbox: {
        globPatterns: ['**/*.{js,css,html,svg,woff2}'],
        navigateFallback: 'index.html',
        clientsClaim: true,
        cleanupOutdatedCaches: true,
      },
    }),
  ],
  build: {
    target: 'es2022',
    sourcemap: false,
  },
  worker: {
    format: 'es',
  },
  preview: {
    port: 4173,
    strictPort: true,
  },
});
