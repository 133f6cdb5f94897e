import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

/** Where the dev server forwards /api; the api listens on :3000 unless told otherwise. */
const apiOrigin = process.env.GLOAMING_API_ORIGIN ?? 'http://localhost:3000';

export default defineConfig({
  // The api serves this build under /portal/ in production.
  base: '/portal/',
  plugins: [react(), tailwindcss()],
  server: {
    port: 5174,
    strictPort: true,
    proxy: { '/api': { target: apiOrigin, changeOrigin: false } },
  },
  preview: {
    port: 4174,
    proxy: { '/api': { target: apiOrigin, changeOrigin: false } },
  },
});
