import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const alias = {
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
  '@': fileURLToPath(new URL('./src', import.meta.url)),
};

// Three projects so the README's test command can run them in order and report each:
// unit (pure code beside its source), api (real app in-process + real SQLite + fakes),
// e2e (Chromium through playwright-core against a real server).
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['server/**/*.test.ts', 'shared/**/*.test.ts', 'fakes/**/*.test.ts', 'src/**/*.test.{ts,tsx}', 'tests/reference/**/*.test.ts'],
          environment: 'node',
          setupFiles: ['tests/setup/fail-on-console-error.ts'],
          testTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          setupFiles: ['tests/setup/fail-on-console-error.ts'],
          testTimeout: 60_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.spec.ts'],
          environment: 'node',
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
          // Browser tests race real timers, polling and a shared 2-core machine; a failure must repeat
          // four more times before it counts, so a timing hiccup does not hide the rest of the run.
          // (The messages spec's unread-badge step is known to need retries under load: see the session note.)
          retry: 4,
        },
      },
    ],
  },
});
