/// <reference types="vitest/config" />
import { defineConfig, type ProxyOptions } from 'vite'
import vue from '@vitejs/plugin-vue'
import { quasar, transformAssetUrls } from '@quasar/vite-plugin'
import { fileURLToPath } from 'node:url'
import { VitePWA } from 'vite-plugin-pwa'
import { splitIcons } from './scripts/vite/split-icons'
import { precompress } from './scripts/vite/precompress'
import { preloadFonts } from './scripts/vite/preload-fonts'
import { chunkGroups } from './scripts/vite/chunk-groups'
import { routeHtml } from './scripts/vite/route-html'

const apiTarget = `http://127.0.0.1:${process.env.PORT ?? '3000'}`

// The API refuses cookie-authenticated writes from other origins, and this proxy sends them on as
// the API's own host. A request whose Origin is this dev server itself gets the API's origin instead;
// any other Origin passes unchanged and is refused as it would be in production.
const api: ProxyOptions = {
  target: apiTarget,
  changeOrigin: true,
  configure: (proxy) => {
    proxy.on('proxyReq', (proxyReq, req) => {
      if (req.headers.origin && req.headers.origin === `http://${req.headers.host}`)
        proxyReq.setHeader('origin', apiTarget)
    })
  },
}

export default defineConfig({
  plugins: [
    vue({ template: { transformAssetUrls } }),
    quasar({ sassVariables: fileURLToPath(new URL('./src/css/quasar-variables.sass', import.meta.url)) }),
    splitIcons(fileURLToPath(new URL('./src/icons.ts', import.meta.url))),
    // ---- PWA (crew-b): offline app shell + last answers for the run and its strings ----------------
    VitePWA({
      strategies: 'generateSW',
      registerType: 'autoUpdate',
      injectRegister: false, // src/offline/register-sw.ts registers it from main.ts
      includeAssets: ['favicon.svg', 'icons/apple-touch-icon-180.png'],
      manifest: {
        name: 'Lampwright',
        short_name: 'Lampwright',
        description: 'Fault log and night runs for festive-lighting crews.',
        lang: 'en-GB',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        orientation: 'portrait',
        // The night theme's page colour (src/css/app.sass): crews open the app after dark.
        theme_color: '#15110D',
        background_color: '#15110D',
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
      workbox: {
        globPatterns: ['**/*.{js,css,html,svg,png,woff2}'],
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//, /^\/uploads\//],
        cleanupOutdatedCaches: true,
        clientsClaim: true,
        skipWaiting: true,
        // GET only (workbox's default method): writes go through the IndexedDB outbox, never a cache.
        runtimeCaching: [
          {
            urlPattern: ({ url, sameOrigin }) =>
              sameOrigin && /^\/api\/v1\/(runs\/mine$|strings\/.+|config$|basemap)/.test(url.pathname),
            handler: 'NetworkFirst',
            method: 'GET',
            options: {
              cacheName: 'lw-api',
              networkTimeoutSeconds: 6,
              expiration: { maxEntries: 500, maxAgeSeconds: 7 * 24 * 3600 },
              cacheableResponse: { statuses: [200] },
            },
          },
          {
            // The basemap archive (BASEMAP_FILE): kept whole once fetched, then each range the map
            // asks for is cut from the cached copy, so the map draws offline.
            urlPattern: ({ url, sameOrigin }) => sameOrigin && url.pathname === '/basemap.pmtiles',
            handler: 'CacheFirst',
            method: 'GET',
            options: {
              cacheName: 'lw-basemap',
              rangeRequests: true,
              expiration: { maxEntries: 1, maxAgeSeconds: 7 * 24 * 3600 },
              cacheableResponse: { statuses: [200] },
            },
          },
          {
            // Lets the app start offline as the person last signed in; cleared on sign-out.
            // src/stores/auth.ts asks /auth/session at start (/auth/me kept for older clients).
            urlPattern: ({ url, sameOrigin }) =>
              sameOrigin && /^\/api\/v1\/auth\/(session|me)$/.test(url.pathname),
            handler: 'NetworkFirst',
            method: 'GET',
            options: {
              cacheName: 'lw-session',
              networkTimeoutSeconds: 6,
              cacheableResponse: { statuses: [200] },
            },
          },
        ],
      },
    }),
    // ---- end PWA ------------------------------------------------------------------------------------
    // The sign-in page's weights: 400 text, 500 buttons, 600 its heading and the app's name (src/main.ts).
    preloadFonts([400, 500, 600]),
    // The first screens: sign-in and the public report (signed out), the crew's run and map.
    routeHtml(fileURLToPath(new URL('.', import.meta.url)).replace(/\/$/, ''), [
      { path: '/', modules: ['src/layouts/PublicLayout.vue', 'src/pages/auth/SignInPage.vue'] },
      { path: '/report', modules: ['src/layouts/PublicLayout.vue', 'src/pages/report/ReportFaultPage.vue'] },
      { path: '/run', modules: ['src/layouts/MainLayout.vue', 'src/pages/run/RunPage.vue'] },
      { path: '/map', modules: ['src/layouts/MainLayout.vue', 'src/pages/map/MapPage.vue'] },
    ]),
    precompress(),
  ],
  server: { port: 5173, proxy: { '/api': api, '/uploads': apiTarget } },
  build: {
    outDir: 'dist',
    chunkSizeWarningLimit: 900,
    rolldownOptions: { output: { codeSplitting: { groups: chunkGroups } } },
  },
  test: {
    projects: [
      {
        test: {
          name: 'shared',
          include: ['tests/shared/**/*.test.ts', 'tests/client/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'server',
          include: ['tests/server/**/*.test.ts'],
          environment: 'node',
          pool: 'forks',
          fileParallelism: false,
          testTimeout: 20000,
          hookTimeout: 60000,
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          pool: 'forks',
          fileParallelism: false,
          testTimeout: 120000,
          hookTimeout: 120000,
        },
      },
    ],
  },
})
