// The permissions table in DEVELOPERS.md is the policy tables of the server, exactly.
import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { permissionsEnd, permissionsStart, renderPermissionsTable } from '../support/permissions-table.js';

describe('DEVELOPERS.md permissions', () => {
  it('lists every policy action with the roles the server allows (regenerate: node --import tsx tests/support/permissions-table.ts)', () => {
    const doc = readFileSync('DEVELOPERS.md', 'utf8');
    const start = doc.indexOf(permissionsStart);
    const end = doc.indexOf(permissionsEnd);
    expect(start, 'the permissions markers are missing from DEVELOPERS.md').toBeGreaterThan(-1);
    expect(doc.slice(start, end + permissionsEnd.length)).toBe(renderPermissionsTable());
  });
});
