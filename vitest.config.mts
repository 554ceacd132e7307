import { defineConfig } from 'vitest/config';
import path from 'node:path';

// Tests run outside a React server: `server-only` (which throws there) becomes its empty module.
const alias = {
  '@': path.resolve(import.meta.dirname),
  'server-only': path.resolve(import.meta.dirname, 'node_modules/server-only/empty.js'),
};

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          // Tests of the engine's internals live beside it, in lib/sim/**/__tests__.
          include: ['tests/unit/**/*.test.ts', 'lib/**/__tests__/**/*.test.ts'],
          environment: 'node',
          // The threaded runs load the engine's bundled worker: build it from the current sources.
          globalSetup: ['scripts/build-worker.mjs'],
          testTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
          hookTimeout: 60_000,
          // One MariaDB and one app server: files run one after another.
          fileParallelism: false,
          setupFiles: ['tests/integration/setup.ts'],
        },
      },
    ],
  },
});
