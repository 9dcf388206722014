import { defineConfig } from 'vitest/config';

// One vitest run from the root covers every workspace (each has its own project config).
export default defineConfig({
  test: {
    projects: ['shared', 'server', 'mobile-web', 'tests'],
  },
});
