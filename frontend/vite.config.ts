import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

const api = process.env.AMBERLINE_API ?? 'http://127.0.0.1:3000';

export default defineConfig({
  plugins: [react()],
  resolve: {
    // the shared package is CommonJS in dist; the browser takes its TypeScript source
    alias: { '@amberline/common': fileURLToPath(new URL('../common/src/index.ts', import.meta.url)) },
  },
  build: { chunkSizeWarningLimit: 900, manifest: true },
  server: { host: '127.0.0.1', port: 5173, strictPort: true, proxy: { '/api': api } },
  preview: { host: '127.0.0.1', port: 4173, strictPort: true, proxy: { '/api': api } },
});
