// Test suites: domain (pure shared code), api (supertest + socket.io against createApp and
// a real PostgreSQL copy per file) and e2e (Chromium driving the built client).
import { defineConfig } from 'vitest/config';
import { WaitingFirstSequencer } from './tests/support/waiting-first-sequencer.js';

export default defineConfig({
  test: {
    pool: 'forks',
    sequence: { sequencer: WaitingFirstSequencer },
    // Test files mostly wait on the database, sockets and the browser, so more files than cores run at once.
    maxWorkers: 4,
    // API and browser files share a worker's module cache (isolate: false): the server and
    // its libraries load once per worker, not once per file, which was a third of the run.
    // Each file starts its own app on its own database copy (startTestApp), so no state a
    // test relies on lives in a module between files.
    projects: [
      { test: { name: 'domain', include: ['tests/domain/**/*.test.ts'], environment: 'node' } },
      { test: { name: 'api', include: ['tests/api/**/*.test.ts', 'tests/realtime/**/*.test.ts', 'tests/faults/**/*.test.ts'], environment: 'node', testTimeout: 30_000, hookTimeout: 60_000, isolate: false } },
      { test: { name: 'e2e', include: ['tests/e2e/**/*.test.ts'], environment: 'node', testTimeout: 180_000, hookTimeout: 120_000, isolate: false } },
    ],
  },
});
