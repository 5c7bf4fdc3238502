// The tests mutation testing runs against the trade library (`npm run mutate`):
// the trade library's own tests, which check it against published values.
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/core/**/*.test.ts'],
    // With all of server/core instrumented, the 100,000-iteration history test takes
    // over 20 s in the initial run on two cores.
    testTimeout: 60000,
  },
});
