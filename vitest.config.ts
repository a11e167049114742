// Test suites: domain (pure shared code), api (supertest + socket.io against createApp and
// a real PostgreSQL copy per file) and e2e (Chromium driving the built client).
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    pool: 'forks',
    // Test files mostly wait on the database, sockets and the browser, so more files than cores run at once.
    maxWorkers: 4,
    projects: [
      { test: { name: 'domain', include: ['tests/domain/**/*.test.ts'], environment: 'node' } },
      { test: { name: 'api', include: ['tests/api/**/*.test.ts', 'tests/realtime/**/*.test.ts', 'tests/faults/**/*.test.ts'], environment: 'node', testTimeout: 30_000, hookTimeout: 60_000 } },
      { test: { name: 'e2e', include: ['tests/e2e/**/*.test.ts'], environment: 'node', testTimeout: 180_000, hookTimeout: 120_000 } },
    ],
  },
});
