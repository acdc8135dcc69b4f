import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('../..', import.meta.url));

// End-to-end tests: Debian's Chromium, driven by playwright-core, against a server this run starts. The waits are
// long enough for a machine that is busy with other work: each step waits for the page's own signal for up to a
// minute (pageWait in browser.ts, and expect.poll here), a test may take a few minutes in all.
export default defineConfig({
  root,
  test: {
    include: ['tests/e2e/**/*.e2e.ts'],
    globalSetup: ['tests/e2e/global-setup.ts'],
    expect: { poll: { timeout: 60_000 } },
    testTimeout: 240_000,
    hookTimeout: 120_000,
    fileParallelism: false,
    pool: 'forks',
  },
});
