import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { fileURLToPath } from 'node:url';

// The Express server mounts Vite as middleware in `npm run dev` and serves dist/ otherwise, so there is
// no dev proxy: the client always talks to its own origin.
export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: {
    alias: {
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
      '@': fileURLToPath(new URL('./src', import.meta.url)),
    },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    // Route pages are lazy chunks; this warns if the shell itself grows past the budget (180 kB gzip ≈ 550 kB raw).
    chunkSizeWarningLimit: 550,
  },
});
