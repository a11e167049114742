// Vite builds the client from client/ into dist/client; in development it proxies the API
// and the socket to the server. The production build is an installable app: a manifest and
// a Workbox service worker (vite-plugin-pwa) that precaches the app shell, fonts and pages
// and keeps the crew's field reads for offline use (off in `npm run dev` unless
// POLLENPACT_DEV_SW=1).
import { defineConfig } from 'vite';
import vue from '@vitejs/plugin-vue';
import Components from 'unplugin-vue-components/vite';
import { PrimeVueResolver } from '@primevue/auto-import-resolver';
import { VitePWA } from 'vite-plugin-pwa';
import { fileURLToPath } from 'node:url';

const serverPort = Number(process.env.PORT ?? 3000);

export default defineConfig({
  root: fileURLToPath(new URL('./client', import.meta.url)),
  plugins: [
    vue(),
    Components({ resolvers: [PrimeVueResolver()], dts: fileURLToPath(new URL('./client/components.d.ts', import.meta.url)) }),
    VitePWA({
      registerType: 'autoUpdate',
      injectRegister: 'script-defer',
      includeAssets: ['icons/favicon-32.png', 'icons/apple-touch-icon-180.png', 'icons/icon.svg'],
      manifest: {
        name: 'Pollenpact',
        short_name: 'Pollenpact',
        description: 'Pollination colonies planned, placed, protected and paid, with field pages that work without signal.',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        orientation: 'any',
        background_color: '#faf8f3',
        theme_color: '#324f27',
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
          { src: '/icons/icon.svg', sizes: 'any', type: 'image/svg+xml' },
        ],
      },
      workbox: {
        // The app shell, every page's code, styles and the Work Sans files (woff2: what browsers use).
        globPatterns: ['**/*.{js,css,html,woff2,svg,png}'],
        maximumFileSizeToCacheInBytes: 3 * 1024 * 1024,
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//, /^\/socket\.io\//],
        cleanupOutdatedCaches: true,
        clientsClaim: true,
        skipWaiting: true,
        importScripts: ['/field-sync-sw.js'],
        runtimeCaching: [
          {
            // What a crew member opens in the field: the session, the drop-site list and each
            // drop site (position, gate notes, minimum strength). Fresh when online, the last
            // answer when not.
            urlPattern: ({ url, request, sameOrigin }) =>
              sameOrigin && request.method === 'GET' && /^\/api\/(auth\/(csrf|me)|meta|placements(\/[0-9a-f-]{36})?)$/.test(url.pathname),
            handler: 'NetworkFirst',
            options: {
              cacheName: 'field-reads',
              networkTimeoutSeconds: 8,
              expiration: { maxEntries: 300, maxAgeSeconds: 8 * 24 * 3600 },
              cacheableResponse: { statuses: [200] },
              plugins: [
                {
                  // A signed-out answer is never kept: offline, the last signed-in session is what opens the crew's pages.
                  cacheWillUpdate: async ({ request, response }) => {
                    if (!new URL(request.url).pathname.endsWith('/auth/csrf')) return response;
                    const body = (await response.clone().json().catch(() => null)) as { signedIn?: boolean } | null;
                    return body?.signedIn ? response : null;
                  },
                },
              ],
            },
          },
          {
            urlPattern: ({ url, request, sameOrigin }) => sameOrigin && request.method === 'GET' && /^\/api\/placements\/[0-9a-f-]{36}\/photos\/[0-9a-f-]{36}$/.test(url.pathname),
            handler: 'CacheFirst',
            options: { cacheName: 'field-photos', expiration: { maxEntries: 200, maxAgeSeconds: 8 * 24 * 3600 }, cacheableResponse: { statuses: [200] } },
          },
        ],
      },
      devOptions: { enabled: process.env.POLLENPACT_DEV_SW === '1', navigateFallback: 'index.html' },
    }),
  ],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./client/src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  build: {
    outDir: fileURLToPath(new URL(`./${process.env.POLLENPACT_CLIENT_DIST ?? 'dist/client'}`, import.meta.url)),
    emptyOutDir: true,
    chunkSizeWarningLimit: 900,
  },
  server: {
    port: 5173,
    proxy: {
      '/api': `http://127.0.0.1:${serverPort}`,
      '/socket.io': { target: `http://127.0.0.1:${serverPort}`, ws: true },
    },
  },
});
