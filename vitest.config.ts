import { defineConfig } from 'vitest/config';

// Three projects, one command: pure units, API tests against the built server, and browser tests.
// API and browser tests start `dist/server/entry.mjs`, so `npm test` builds first.
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.{ts,tsx}'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          testTimeout: 30_000,
          // Setting up a team of four over SMTP and a fresh server takes longer on a busy 2-core machine.
          hookTimeout: 120_000,
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
          hookTimeout: 90_000,
        },
      },
    ],
  },
});
