import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { pathAliases } from './path-aliases.ts';

const apiPort = process.env.API_PORT ?? process.env.PORT ?? '3000';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: { alias: pathAliases },
  build: { outDir: 'dist/web', emptyOutDir: true, sourcemap: false },
  server: {
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
});
