import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

// The API runs on its own port in development; proxying keeps cookies and CSRF same-origin.
const apiTarget = `http://127.0.0.1:${process.env.SR_API_PORT ?? 4301}`;

export default defineConfig({
  root: import.meta.dirname,
  plugins: [react(), tailwindcss()],
  server: {
    proxy: {
      '/api': { target: apiTarget, changeOrigin: false },
      '/uploads': { target: apiTarget, changeOrigin: false },
    },
  },
  // The manifest tells the API which files the shelf's route module needs, so a first load can ask for them early.
  build: { outDir: 'dist', emptyOutDir: true, manifest: true },
  test: {
    // Also when the root vitest.config.ts extends this file as its "web" project.
    root: import.meta.dirname,
    environment: 'happy-dom',
    include: ['src/**/*.test.{ts,tsx}'],
  },
});
