import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('..', import.meta.url));

// Shared, server and fake tests: everything named *.test.ts outside src/ (Karma runs src/), tests/e2e/ and
// tests/faults/ (which run on their own, one file at a time, so that load does not compete with other tests).
export default defineConfig({
  root,
  resolve: { alias: { '@shared': `${root}shared` } },
  test: {
    include: [
      'shared/**/*.test.ts',
      'server/**/*.test.ts',
      'fakes/**/*.test.ts',
      'scripts/**/*.test.ts',
      'tests/**/*.test.ts',
    ],
    exclude: ['tests/e2e/**', 'tests/faults/**', 'node_modules/**'],
    globalSetup: ['tests/global-setup.ts'],
    setupFiles: ['tests/fast-check-setup.ts'],
    // Generous for a machine that is busy with other work; speed is measured by bench/, never here.
    testTimeout: 60_000,
    hookTimeout: 120_000,
    pool: 'forks',
  },
});
