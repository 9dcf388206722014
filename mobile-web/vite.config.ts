import { fileURLToPath } from 'node:url';
import { constants as zlibConstants } from 'node:zlib';
import react from '@vitejs/plugin-react';
import { defineConfig, defaultClientConditions, type Plugin } from 'vite';
import { compression, defineAlgorithm } from 'vite-plugin-compression2';
import { VitePWA } from 'vite-plugin-pwa';
import { initialJsSize } from './scripts/initial-js-size.ts';
import { inlineEntryCss } from './scripts/inline-entry-css.ts';
import { preloadChunks } from './scripts/preload-chunks.ts';
import { precompressLateFiles } from './scripts/precompress-late-files.ts';

const apiTarget = process.env.PLUMMET_API_URL ?? 'http://127.0.0.1:3000';
const apiProxy = { '/api': { target: apiTarget, changeOrigin: true } };

/**
 * @ionic/core has no "sideEffects" flag, so every component it ships ends up in the bundle.
 * Its per-component files only define a custom element when their defineCustomElement is
 * called, so we tell the bundler they are side-effect free (TOOLCHAIN pitfall 8). An overlay
 * created by tag name alone (e.g. toastController without useIonToast) must therefore call that
 * component's defineCustomElement itself.
 */
const ionicComponentsHaveNoSideEffects = /[\\/]@ionic[\\/]core[\\/]components[\\/]ion-[^\\/]+\.js$/;

/**
 * shared/ is pure domain code (STYLE: no React, Nest, Dexie), but zod schemas built at module top
 * level look like side effects, so one `import { CAUTION_TEXT }` would pull in every schema.
 * Until shared's package.json says "sideEffects": false, say it here for its source files.
 */
const sharedSourceDir = fileURLToPath(new URL('../shared/src/', import.meta.url));
const escapeRegExp = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const sharedSourceHasNoSideEffects = new RegExp(`^${escapeRegExp(sharedSourceDir)}.*\\.ts$`);

/**
 * Fontsource's CSS lists a .woff fallback after each .woff2; every browser we support reads
 * woff2, so drop the fallback and keep the build (and the precache) to the files that are used.
 */
function woff2Only(): Plugin {
  return {
    name: 'plummet:woff2-only',
    enforce: 'pre',
    transform: {
      filter: { id: /@fontsource[\\/].*\.css$/ },
      handler(code) {
        return { code: code.replace(/,\s*url\([^)]*\.woff\)\s*format\(['"]woff['"]\)/g, ''), map: null };
      },
    },
  };
}

export default defineConfig({
  resolve: {
    // @plummet/shared exports its TypeScript source under this condition; Vite's defaults stay.
    conditions: ['plummet-source', ...defaultClientConditions],
  },
  server: { host: '127.0.0.1', port: 5173, proxy: apiProxy },
  preview: { host: '127.0.0.1', port: 4173, proxy: apiProxy },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    target: 'es2022',
    sourcemap: true,
    // The gzip budget printed by initialJsSize is the size check that matters for phones.
    chunkSizeWarningLimit: 1024,
    modulePreload: {
      // The sync engine and the schemas built before it (src/api/building-schemas.ts) load once the
      // home is up, from the service worker's cache. A <link rel="modulepreload"> for each of their
      // files costs the main thread more there (a few milliseconds each on a phone, in one task)
      // than fetching them as they are imported.
      resolveDependencies: (filename, deps) => (/(^|\/)(SyncRunner|schemas-[a-z]+)-[^/]*\.js$/.test(filename) ? [] : deps),
    },
    rolldownOptions: {
      // Two pages: the app (index.html, every route) and the pre-rendered sign-in of a first visit
      // to /sign-in (sign-in.html; the server sends it for that address).
      input: {
        index: fileURLToPath(new URL('./index.html', import.meta.url)),
        'sign-in': fileURLToPath(new URL('./sign-in.html', import.meta.url)),
      },
      treeshake: {
        moduleSideEffects: [
          { test: ionicComponentsHaveNoSideEffects, sideEffects: false },
          { test: sharedSourceHasNoSideEffects, sideEffects: false },
        ],
      },
    },
  },
  plugins: [
    woff2Only(),
    react(),
    VitePWA({
      strategies: 'generateSW',
      registerType: 'prompt',
      // src/app/service-worker.ts registers the worker, once per page; inject nothing else.
      injectRegister: null,
      // public/ files are precached by globPatterns below; listing them again would duplicate entries.
      includeManifestIcons: false,
      manifest: {
        id: '/',
        name: 'Plummet',
        short_name: 'Plummet',
        description: 'Falling-object inspections of scaffolds, with drop estimates that work offline.',
        lang: 'en-GB',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        orientation: 'portrait',
        theme_color: '#4a1d6b',
        background_color: '#fbf9f6',
        categories: ['business', 'productivity', 'utilities'],
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
          { src: '/icons/maskable-192.png', sizes: '192x192', type: 'image/png', purpose: 'maskable' },
          { src: '/icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
          { src: '/icons/plummet.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
        ],
      },
      workbox: {
        // The app shell: code, styles, the page, icons and the Open Sans woff2 files.
        globPatterns: ['**/*.{js,css,html,svg,png,woff2}'],
        globIgnores: ['**/*.map'],
        navigateFallback: 'index.html',
        navigateFallbackDenylist: [/^\/api\//],
        cleanupOutdatedCaches: true,
        // Take control on the first install so the app works offline from the first visit;
        // later versions wait until the user taps Reload (registerType 'prompt', no skipWaiting).
        clientsClaim: true,
        // Relays Background Sync wake-ups to the open windows (public/sw-background-sync.js).
        importScripts: ['sw-background-sync.js'],
      },
      devOptions: { enabled: false },
    }),
    inlineEntryCss(),
    preloadChunks({
      page: 'index.html',
      modules: [
        new URL('./src/features/auth/session.queries.ts', import.meta.url),
        new URL('./src/features/home/components/HomeScreen.tsx', import.meta.url),
        new URL('./src/features/home/components/SignedInHome.tsx', import.meta.url),
      ],
    }),
    initialJsSize({ budgetKiB: 200 }),
    // Brotli and gzip files beside each text asset, made once at build time at the highest levels;
    // the server picks one by Accept-Encoding (server/src/web/static-web.ts). Maps stay uncompressed.
    compression({
      include: /\.(html|css|js|mjs|json|svg|webmanifest|txt)$/,
      exclude: /\.map$/,
      threshold: 1024,
      algorithms: [defineAlgorithm('brotliCompress', { params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 11 } }), defineAlgorithm('gzip', { level: 9 })],
      logLevel: 'silent',
    }),
    precompressLateFiles({ outDir: fileURLToPath(new URL('./dist/', import.meta.url)), threshold: 1024 }),
  ],
});
