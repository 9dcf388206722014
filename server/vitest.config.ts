import { defineProject } from 'vitest/config';

export default defineProject({
  test: {
    name: 'server',
    include: ['src/**/*.spec.ts', 'src/**/*.int-spec.ts', 'test/**/*.spec.ts'],
    environment: 'node',
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
  ssr: { resolve: { conditions: ['plummet-source'] } },
  resolve: { conditions: ['plummet-source'] },
});
