import { defineProject } from 'vitest/config';

export default defineProject({
  test: {
    name: 'e2e',
    include: ['e2e/**/*.test.ts', 'api/**/*.test.ts', 'sync/**/*.test.ts', 'security/**/*.test.ts'],
    environment: 'node',
    // One browser journey at a time: the CI machine has two cores.
    fileParallelism: false,
    testTimeout: 120_000,
    hookTimeout: 120_000,
  },
  ssr: { resolve: { conditions: ['plummet-source'] } },
  resolve: { conditions: ['plummet-source'] },
});
