import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';

// One root config with projects: node for engine, api and worker; jsdom for the client.
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'engine',
          environment: 'node',
          include: ['tests/engine/**/*.test.ts'],
          testTimeout: 60_000,
        },
      },
      {
        test: {
          name: 'server',
          environment: 'node',
          include: ['tests/api/**/*.test.ts', 'tests/worker/**/*.test.ts', 'tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/setup/global-services.ts'],
          testTimeout: 120_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
      {
        plugins: [react()],
        test: {
          name: 'web',
          environment: 'jsdom',
          include: ['tests/web/**/*.test.tsx'],
        },
      },
    ],
  },
});
