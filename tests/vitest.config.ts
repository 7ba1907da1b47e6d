import { defineConfig } from 'vitest/config';
import path from 'node:path';

const root = path.resolve(__dirname, '..');

export default defineConfig({
  root,
  resolve: { alias: { '@': root, 'server-only': path.join(root, 'tests/support/empty.ts') } },
  test: {
    include: ['tests/unit/**/*.test.ts', 'tests/integration/**/*.test.ts'],
    environment: 'node',
    // Integration tests share one MariaDB database: run files one after another.
    fileParallelism: false,
    // Source locations in the JSON report let the summary tell table rows from distinct tests.
    includeTaskLocation: true,
    testTimeout: 20_000,
    hookTimeout: 60_000,
  },
});
