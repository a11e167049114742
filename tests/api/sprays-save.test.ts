// A spray save runs the conflict check once, inside the save's own transaction (one
// connection for the plan, the check and the alerts), and answers from that check. The
// app runs without job workers so that only the save's own queries are counted.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildAlertWorld, type AlertWorld } from '../support/alert-world.js';

describe('saving a spray plan', () => {
  let t: TestApp;
  let world: AlertWorld;
  let grower: ApiClient;
  const statements: Array<{ connection: string; sql: string }> = [];

  beforeAll(async () => {
    t = await startTestApp({ env: { JOBS_ENABLED: 'false' } });
    world = await buildAlertWorld('sprays-save');
    grower = await signedInClient(t.app, world.growerEmail);
    // Sequelize logs "Executing (<connection>): <sql>"; a transaction's queries name its id.
    (t.context.sequelize as unknown as { options: { logging: (line: string) => void } }).options.logging = (line: string) => {
      const m = /^Executing \(([^)]+)\): ([\s\S]*)$/.exec(line);
      if (m) statements.push({ connection: m[1], sql: m[2] });
    };
  });
  afterAll(async () => { await t?.stop(); });

  it('checks once, on the save transaction, and answers from that check', async () => {
    statements.length = 0;
    const res = await grower.post('/api/sprays', world.conflictingSpray(0, 'Quarrystone 70WG')).expect(201);
    expect(res.body.check.conflicts.map((c: { apiaryId: string }) => c.apiaryId)).toEqual([world.apiaryId]);
    expect(res.body.spray.openAlerts).toBe(1);

    const searches = statements.filter((s) => s.sql.includes('near_sites'));
    expect(searches).toHaveLength(1);
    const saveConnection = statements.find((s) => /INSERT INTO "spray_plans"/.test(s.sql))!.connection;
    expect(saveConnection).not.toBe('default');
    expect(searches[0].connection).toBe(saveConnection);
    // The alert rows and their history are written on that same connection.
    const alertWrites = statements.filter((s) => /INSERT INTO "alerts"|INSERT INTO "alert_events"/.test(s.sql));
    expect(alertWrites.length).toBeGreaterThanOrEqual(2);
    expect(new Set(alertWrites.map((s) => s.connection))).toEqual(new Set([saveConnection]));
  });
});
