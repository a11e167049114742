// Vite builds the client from client/ into dist/client; in development it proxies the API
// and the socket to the server.
import { defineConfig } from 'vite';
import vue from '@vitejs/plugin-vue';
import Components from 'unplugin-vue-components/vite';
import { PrimeVueResolver } from '@primevue/auto-import-resolver';
import { fileURLToPath } from 'node:url';

const serverPort = Number(process.env.PORT ?? 3000);

export default defineConfig({
  root: fileURLToPath(new URL('./client', import.meta.url)),
  plugins: [
    vue(),
    Components({ resolvers: [PrimeVueResolver()], dts: fileURLToPath(new URL('./client/components.d.ts', import.meta.url)) }),
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
