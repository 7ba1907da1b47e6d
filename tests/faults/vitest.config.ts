import { defineConfig } from 'vitest/config';
import path from 'node:path';

const root = path.resolve(__dirname, '../..');

// The fault scenarios: one file, one stack of their own, long timeouts (npm run test:faults).
export default defineConfig({
  root,
  resolve: { alias: { '@': root, 'server-only': path.join(root, 'tests/support/empty.ts') } },
  test: {
    include: ['tests/faults/**/*.test.ts'],
    environment: 'node',
    fileParallelism: false,
    includeTaskLocation: true,
    testTimeout: 180_000,
    hookTimeout: 300_000,
  },
});
