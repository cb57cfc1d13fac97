/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { fileURLToPath } from 'node:url';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: {
    alias: {
      '@shared': here('./shared'),
      '@': here('./src'),
    },
  },
  server: { proxy: { '/api': 'http://127.0.0.1:3000' } },
  build: { outDir: 'dist/client', emptyOutDir: true, chunkSizeWarningLimit: 1500 },
  test: {
    include: ['shared/**/*.test.ts', 'server/**/*.test.ts', 'tests/unit/**/*.test.ts', 'tests/api/**/*.test.ts'],
    environment: 'node',
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: 'forks',
    // Routes answering with sendView check their bodies against shared/contracts (server/common/respond.ts).
    env: { CHECK_RESPONSES: '1' },
  },
});
