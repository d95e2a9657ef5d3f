import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

// Tests import packages by name; point those names at the sources so the suite
// does not depend on a prior build.
export default defineConfig({
  resolve: {
    alias: [
      {
        find: /^@penumbra\/([a-z-]+)\/internal$/,
        replacement: fileURLToPath(new URL('./packages/$1/src/internal.ts', import.meta.url)),
      },
      { find: /^@penumbra\/([a-z-]+)$/, replacement: fileURLToPath(new URL('./packages/$1/src/index.ts', import.meta.url)) },
    ],
  },
  test: {
    include: ['packages/*/test/**/*.test.ts', 'test/**/*.test.ts'],
    testTimeout: 120_000,
    pool: 'threads',
    setupFiles: ['test/setup/fastCheckSeed.ts'],
  },
});
