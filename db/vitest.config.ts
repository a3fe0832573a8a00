import { defineConfig, defaultServerConditions } from 'vite';

export default defineConfig({
  resolve: { conditions: ['@sigmatail/source', ...defaultServerConditions] },
  ssr: { resolve: { conditions: ['@sigmatail/source', ...defaultServerConditions] } },
  test: {
    include: ['src/**/*.test.ts', 'e2e/**/*.test.ts'],
    testTimeout: 30_000,
    globalSetup: ['src/testing/globalSetup.ts'],
  },
});
