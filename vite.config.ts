import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';
import { pathAliases } from './path-aliases.ts';

const apiPort = process.env.API_PORT ?? process.env.PORT ?? '3000';

export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    // The installable app: web manifest and the service worker of web/service-worker/sw.ts
    // (registered by web/service-worker/register.ts in built bundles only, so the dev
    // server's hot reload is never served from a cache).
    VitePWA({
      strategies: 'injectManifest',
      srcDir: 'web/service-worker',
      filename: 'sw.ts',
      injectRegister: false,
      registerType: 'prompt',
      includeAssets: ['favicon.svg', 'icons/apple-touch-icon-180.png'],
      injectManifest: { globPatterns: ['**/*.{js,css,html,svg,png,woff2}'] },
      manifest: {
        name: 'Bindery',
        short_name: 'Bindery',
        description: 'Checked, versioned setups of multi-receiver RC models, at the bench and at the field.',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        background_color: '#f5f0e6',
        theme_color: '#f5f0e6',
        icons: [
          { src: '/icons/app-icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
          { src: '/icons/app-icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
          { src: '/icons/app-icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
    }),
  ],
  resolve: { alias: pathAliases },
  build: { outDir: 'dist/web', emptyOutDir: true, sourcemap: false },
  server: {
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
});
