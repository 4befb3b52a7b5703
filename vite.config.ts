import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const rootDir = fileURLToPath(new URL('.', import.meta.url));
const shared = fileURLToPath(new URL('./server/shared', import.meta.url));
const apiTarget = `http://127.0.0.1:${process.env.API_PORT ?? '3000'}`;

export default defineConfig({
  root: 'client',
  plugins: [react(), tailwindcss()],
  resolve: { alias: { '@shared': shared } },
  build: { outDir: '../dist/client', emptyOutDir: true, sourcemap: false },
  server: {
    port: Number(process.env.VITE_PORT ?? 5173),
    host: '127.0.0.1',
    proxy: {
      '/api': { target: apiTarget, changeOrigin: false },
      '/uploads': { target: apiTarget, changeOrigin: false },
      '/socket.io': { target: apiTarget, ws: true, changeOrigin: false },
    },
  },
  test: {
    // Projects: pure computations, the HTTP/socket API against a real PostgreSQL, and Chromium.
    // The test runner (scripts/test.ts) starts the throw-away cluster and sets DATABASE_URL.
    projects: [
      {
        extends: true,
        root: rootDir,
        test: { name: 'unit', root: rootDir, sequence: { groupOrder: 0 }, testTimeout: 30_000, include: ['tests/shared/**/*.test.ts', 'tests/unit/**/*.test.ts'], environment: 'node' },
      },
      {
        extends: true,
        root: rootDir,
        test: {
          name: 'api',
          // Groups run one after another: the API tests restart PostgreSQL in the fault tests.
          sequence: { groupOrder: 1 },
          root: rootDir,
          include: ['tests/server/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/api-global-setup.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        root: rootDir,
        test: {
          name: 'browser',
          sequence: { groupOrder: 2 },
          root: rootDir,
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/e2e-global-setup.ts'],
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
});
