import { defineConfig } from 'vitest/config';

// CI asks for a JSON report (counted by .ci/run) through STOVECARD_VITEST_JSON.
const jsonReport = process.env.STOVECARD_VITEST_JSON;

export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    reporters: jsonReport ? ['default', 'json'] : ['default'],
    ...(jsonReport ? { outputFile: { json: jsonReport } } : {}),
  },
});
