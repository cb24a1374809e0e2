import { defineConfig, mergeConfig } from 'vitest/config';
import viteConfig from './vite.config.ts';

export default mergeConfig(
  viteConfig,
  defineConfig({
    test: {
      projects: [
        { extends: true, test: { name: 'engine', environment: 'node', include: ['tests/engine/**/*.test.ts'] } },
        {
          extends: true,
          test: {
            name: 'server',
            environment: 'node',
            include: ['tests/server/**/*.test.ts'],
            testTimeout: 30_000,
            hookTimeout: 30_000,
          },
        },
        // The bounded load test of docs/access.md: alone, so no other test file shares the cores while it
        // measures the longest event-loop stall.
        {
          extends: true,
          test: {
            name: 'load',
            environment: 'node',
            include: ['tests/load/**/*.test.ts'],
            testTimeout: 60_000,
            hookTimeout: 60_000,
            fileParallelism: false,
          },
        },
        // docs/live-protocol.md §Several processes: the same server tests on PostgreSQL and Redis, and the
        // two-process suite; run by scripts/testScale.ts only when TEST_DATABASE_URL and TEST_REDIS_URL are set.
        {
          extends: true,
          test: {
            name: 'server-pg',
            environment: 'node',
            include: ['tests/server/**/*.test.ts'],
            env: { STANCHION_TEST_ON_PG: '1' },
            testTimeout: 30_000,
            hookTimeout: 30_000,
          },
        },
        {
          extends: true,
          test: {
            name: 'scale',
            environment: 'node',
            include: ['tests/scale/**/*.test.ts'],
            testTimeout: 60_000,
            hookTimeout: 60_000,
            fileParallelism: false,
          },
        },
        {
          extends: true,
          test: {
            name: 'client',
            environment: 'happy-dom',
            include: ['tests/client/**/*.test.ts'],
            setupFiles: ['tests/client/setup.ts'],
          },
        },
        {
          extends: true,
          test: {
            name: 'e2e',
            environment: 'node',
            include: ['tests/e2e/**/*.e2e.ts'],
            testTimeout: 60_000,
            hookTimeout: 120_000,
            fileParallelism: false,
          },
        },
      ],
    },
  }),
);
