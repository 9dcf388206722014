import { defineProject } from 'vitest/config';

// Unit tests run in Node; a test that needs IndexedDB imports 'fake-indexeddb/auto' first.
export default defineProject({
  test: {
    name: 'mobile-web',
    include: ['src/**/*.test.ts', 'src/**/*.test.tsx'],
    environment: 'node',
  },
  resolve: { conditions: ['plummet-source'] },
  ssr: { resolve: { conditions: ['plummet-source'] } },
});
