// The tests mutation testing runs against the trade library (`npm run mutate`):
// the trade library's own tests, which check it against published values.
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/core/**/*.test.ts'],
    testTimeout: 20000,
  },
});
