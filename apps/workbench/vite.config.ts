import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

/** Where the dev server forwards /api; the api listens on :3000 unless told otherwise. */
const apiOrigin = process.env.GLOAMING_API_ORIGIN ?? 'http://localhost:3000';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  server: {
    port: 5173,
    strictPort: true,
    proxy: { '/api': { target: apiOrigin, changeOrigin: false } },
  },
  preview: {
    port: 4173,
    proxy: { '/api': { target: apiOrigin, changeOrigin: false } },
  },
  build: { sourcemap: true },
});
