/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';

// The installable app: its manifest, and a service worker of our own (src/features/offline/sw.ts)
// into which Workbox writes the list of built files to keep. Registered by the app itself.
const offlineApp = VitePWA({
  strategies: 'injectManifest',
  srcDir: 'src/features/offline',
  filename: 'sw.ts',
  injectRegister: false,
  manifest: {
    name: 'Swapyard — what fits your car',
    short_name: 'Swapyard',
    description: 'Reviewed records of which brake, wheel and suspension parts fit which car, readable in the garage.',
    lang: 'en-GB',
    start_url: '/',
    scope: '/',
    display: 'standalone',
    theme_color: '#1d4d3a',
    background_color: '#f7f4ec',
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
      { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
      { src: '/icons/icon.svg', sizes: 'any', type: 'image/svg+xml' },
    ],
  },
  injectManifest: {
    // the page shell, the app's code and styles, and the Latin fonts (the other alphabets' files load
    // only where a page needs them, as before)
    globPatterns: ['index.html', 'assets/**/*.{js,css,svg}', 'assets/nunito-sans-latin-*.woff2'],
  },
});

export default defineConfig({
  plugins: [react(), tailwindcss(), offlineApp],
  resolve: { alias: { '@shared': new URL('./shared', import.meta.url).pathname } },
  build: { outDir: 'dist', sourcemap: false },
  worker: { format: 'es' },
  test: {
    projects: [
      {
        extends: true,
        test: { name: 'unit', include: ['tests/unit/**/*.test.{ts,tsx}'], environment: 'node' },
      },
      {
        extends: true,
        test: { name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node', pool: 'forks', testTimeout: 20000, hookTimeout: 30000 },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          pool: 'forks',
          fileParallelism: false,
          testTimeout: 60000,
          hookTimeout: 60000,
        },
      },
    ],
  },
});
