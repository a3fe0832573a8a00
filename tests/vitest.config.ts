import { defaultServerConditions } from 'vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  resolve: { conditions: ['@sigmatail/source', ...defaultServerConditions] },
  ssr: { resolve: { conditions: ['@sigmatail/source', ...defaultServerConditions] } },
  test: {
    include: ['src/**/*.test.ts', 'setup/**/*.test.ts', 'e2e/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    // Browser journeys share one server and database; run them one file at a time.
    fileParallelism: false,
  },
});
