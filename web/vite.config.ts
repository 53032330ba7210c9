import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));

/**
 * `@sagline/common` is compiled from source here (not from common/dist), so the
 * web build never waits for, or drifts from, a separate common build.
 */
export default defineConfig({
  plugins: [react()],
  resolve: {
    alias: [
      { find: /^@sagline\/common\//, replacement: `${here('../common/src')}/` },
      { find: /^@\//, replacement: `${here('./src')}/` },
    ],
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': { target: 'http://127.0.0.1:4100', changeOrigin: false } },
  },
  preview: {
    host: '127.0.0.1',
    port: 4173,
    proxy: { '/api': { target: 'http://127.0.0.1:4100', changeOrigin: false } },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    // Fonts are small enough to inline otherwise; keep them as files so the
    // browser caches them and the build can be checked for them.
    assetsInlineLimit: 0,
    chunkSizeWarningLimit: 1500,
  },
});
