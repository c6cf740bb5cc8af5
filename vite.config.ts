import { fileURLToPath } from 'node:url';
import { constants as zlibConstants } from 'node:zlib';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';
import { compression, defineAlgorithm } from 'vite-plugin-compression2';

const apiPort = process.env.API_PORT ?? '5181';

export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    // Brotli and gzip twins of every asset, made once at build time at the highest
    // settings; the server (express-static-gzip in server/app.ts) sends the one the
    // browser accepts instead of compressing on each request.
    compression({
      algorithms: [defineAlgorithm('brotliCompress', { params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 11 } }), defineAlgorithm('gzip', { level: 9 })],
      include: /\.(js|mjs|css|html|svg|json)$/,
      threshold: 1024,
    }),
  ],
  resolve: {
    alias: {
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
      '@': fileURLToPath(new URL('./src', import.meta.url)),
    },
  },
  server: { proxy: { '/api': `http://127.0.0.1:${apiPort}` } },
  build: { outDir: 'dist', sourcemap: true, chunkSizeWarningLimit: 2000 },
});
