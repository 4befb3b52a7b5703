import fs from 'node:fs/promises';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import zlib from 'node:zlib';
import { defineConfig } from 'vitest/config';
import type { Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const rootDir = fileURLToPath(new URL('.', import.meta.url));
const shared = fileURLToPath(new URL('./server/shared', import.meta.url));
// The case page's shared pieces, kept in one chunk (build.rolldownOptions below).
const CASE_VIEW = new RegExp(
  [
    'client/src/features/cases/(api/get-similar-cases|components/similar-cases-list|components/photo-picker|hooks/use-photo-drafts|api/upload-case-photos)\\.tsx?$',
    'client/src/features/batch-check/components/(ratio-text|risk-badge|water-activity-scale)\\.tsx?$',
    'client/src/features/closing/api/(get-closing|closing-keys|refresh-after-closing)\\.ts$',
    'server/shared/(case-status|units|batch-check-model|cautions|photo-limits)\\.ts$',
    // The photo picker's address of the image library (the library itself comes on first use).
    'browser-image-compression\\.js\\?url$',
  ].join('|'),
);
/**
 * Marks every JS chunk with V8's explicit compile hint, so Chromium compiles its functions while
 * the file streams in, on a background thread, rather than one by one on the main thread the
 * first time each runs (v8.dev/blog/explicit-compile-hints). The chunks are split by page, so
 * nearly all of a chunk that loads runs at once.
 */
function compileHints(): Plugin {
  return {
    name: 'sporewell:compile-hints',
    apply: 'build',
    generateBundle: {
      // After Vite's own, which puts its preload map at the top of the entry: the hint must be first.
      order: 'post',
      handler(_options, bundle) {
        for (const file of Object.values(bundle)) {
          if (file.type === 'chunk') file.code = `//# allFunctionsCalledOnLoad\n${file.code}`;
        }
      },
    },
  };
}

/**
 * Writes a brotli (`.br`, quality 11) and a gzip (`.gz`, level 9) copy beside every built script,
 * stylesheet and SVG of 1 KB or more; the server sends them as they are (server/src/app.ts) to
 * whoever accepts them. Smaller than the on-the-fly gzip at its default level, and no compressing
 * per request on the server's cores. Fonts (woff2) and images are compressed already.
 * Measured on the entry chunk: 381 kB raw, 118.8 kB gzip -9, 102.9 kB brotli 11.
 */
function precompress(): Plugin {
  const brotli = promisify(zlib.brotliCompress);
  const gzip = promisify(zlib.gzip);
  let outDir = '';
  return {
    name: 'sporewell:precompress',
    apply: 'build',
    configResolved(config) {
      outDir = path.resolve(config.root, config.build.outDir);
    },
    async writeBundle(_options, bundle) {
      const files = Object.keys(bundle).filter((name) => /\.(js|css|svg)$/.test(name));
      await Promise.all(
        files.map(async (name) => {
          const file = path.join(outDir, name);
          const data = await fs.readFile(file);
          if (data.length < 1024) return;
          const [br, gz] = await Promise.all([
            brotli(data, { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 11, [zlib.constants.BROTLI_PARAM_SIZE_HINT]: data.length } }),
            gzip(data, { level: 9 }),
          ]);
          await Promise.all([fs.writeFile(`${file}.br`, br), fs.writeFile(`${file}.gz`, gz)]);
        }),
      );
      // A running server lists the copies again when index.html changes: touched last, once they are all there.
      const now = new Date();
      await fs.utimes(path.join(outDir, 'index.html'), now, now).catch(() => undefined);
    },
  };
}

const apiTarget = `http://127.0.0.1:${process.env.API_PORT ?? '3000'}`;

// React Router 7's package.json sends every import condition to its development build (its dev
// warnings and checks on); the production build ships beside it in the same package
// (dist/production, the same modules with those turned off). A client build takes that one; the
// dev server and the tests keep the warnings.
const routerBuilds = path.join(path.dirname(createRequire(import.meta.url).resolve('react-router')), '..');
const productionRouter = [
  { find: /^react-router$/, replacement: path.join(routerBuilds, 'production/index.mjs') },
  { find: /^react-router\/dom$/, replacement: path.join(routerBuilds, 'production/dom-export.mjs') },
];

export default defineConfig(({ command }) => ({
  root: 'client',
  plugins: [react(), tailwindcss(), compileHints(), precompress()],
  resolve: { alias: [{ find: '@shared', replacement: shared }, ...(command === 'build' ? productionRouter : [])] },
  build: {
    outDir: '../dist/client',
    emptyOutDir: true,
    sourcemap: false,
    rolldownOptions: {
      output: {
        codeSplitting: {
          groups: [
            {
              // What the entry loads before the first paint stays in the entry's chunk: without
              // this group, rolldown splits the entry's modules that the group below uses into a
              // dozen chunks of their own once any group exists. (Rolldown's small runtime still
              // becomes a chunk of its own, which the built index.html modulepreloads.)
              name: 'app',
              tags: ['$initial'],
              priority: 2,
            },
            {
              // socket.io-client and its parts under a name of their own, so a browser test can
              // tell when the live connection's code is fetched (after the first paint).
              name: 'socket-io',
              test: /[\\/]node_modules[\\/](socket\.io-client|socket\.io-parser|engine\.io-client|engine\.io-parser|@socket\.io[\\/]component-emitter)[\\/]/,
              priority: 1,
            },
            {
              priority: 1,
              // What the case page shows above the thread and shares with other pages (batch
              // page, rounds, open a case's form): one chunk instead of nine of 1-6 KB each, so a
              // slow connection fetches the case page in two requests and one wave rather than in
              // two waves of six (the browser's limit per server). batch-format and
              // english-dates stay apart: open a case needs them before its first paint, and
              // should not wait for the rest.
              name: 'case-view',
              test: CASE_VIEW,
              // Only the modules named; their dependencies (React, the query client…) stay where
              // they are.
              includeDependenciesRecursively: false,
            },
          ],
        },
      },
    },
  },
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
}));
