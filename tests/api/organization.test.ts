// Members and invitations: owners invite by e-mail (through the job queue to the mail
// sink), change roles and remove members (whose sessions end at once); every query is
// scoped to the caller's organization.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { io as connect } from 'socket.io-client';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { apiClient, signedInClient } from '../support/api-client.js';
import { buildOrganization, buildUser, defaultTestPassword } from '../support/builders/accounts.js';
import { buildInvitation } from '../support/builders/invitations.js';

const tokenIn = (text: string) => /invitation#token=([A-Za-z0-9_-]+)/.exec(text)?.[1];

describe('/api/organization', () => {
  let t: TestApp;
  let clock = Date.now();
  beforeAll(async () => { t = await startTestApp({ now: () => new Date(clock) }); });
  afterAll(async () => { await t?.stop(); });

  async function farmWithOwner(name = 'Sorrel Flat Orchard') {
    const farm = await buildOrganization({ kind: 'farm', name });
    const owner = await buildUser({ organization: farm, role: 'owner', name: 'Juniper Vale' });
    return { farm, owner, client: await signedInClient(t.app, owner.email) };
  }

  describe('invitations', () => {
    it('e-mails a link; the invitee sets a name and password and is signed in with the role', async () => {
      const { farm, client } = await farmWithOwner();
      const seen = t.sink.messages.length;
      const invite = await client.post('/api/organization/invitations', { email: 'New.Applicator@Example.test', role: 'applicator' });
      expect(invite.status).toBe(201);
      expect(invite.body.invitation).toMatchObject({ email: 'new.applicator@example.test', role: 'applicator', invitedByName: 'Juniper Vale' });

      const message = await eventually(() => t.sink.messages.slice(seen).find((m) => m.to.includes('new.applicator@example.test')));
      expect(message.subject).toBe('Juniper Vale invited you to Sorrel Flat Orchard on Pollenpact');
      expect(message.text).toContain('as Applicator');
      const token = tokenIn(message.text)!;
      expect(token).toBeDefined();

      const invitee = await apiClient(t.app);
      const preview = await invitee.post('/api/organization/invitations/preview', { token });
      expect(preview.status).toBe(200);
      expect(preview.body.invitation).toMatchObject({ email: 'new.applicator@example.test', role: 'applicator', organization: { name: 'Sorrel Flat Orchard', kind: 'farm' } });

      const accepted = await invitee.post('/api/organization/invitations/accept', { token, name: 'Basil Thorne', password: 'a-long-fresh-passphrase' });
      expect(accepted.status).toBe(201);
      expect(accepted.body.user).toMatchObject({ email: 'new.applicator@example.test', name: 'Basil Thorne', role: 'applicator', organization: { id: farm.id } });
      invitee.csrfToken = accepted.body.csrfToken;
      expect((await invitee.get('/api/auth/me')).body.user.role).toBe('applicator');

      const members = await client.get('/api/organization/members');
      expect(members.body.members.map((m: { email: string }) => m.email)).toContain('new.applicator@example.test');
      expect((await client.get('/api/organization/invitations')).body.invitations).toEqual([]);

      // The link works once.
      const second = await (await apiClient(t.app)).post('/api/organization/invitations/accept', { token, name: 'Someone Else', password: 'a-long-fresh-passphrase' });
      expect(second.status).toBe(404);
    });

    it('refuses a role the organization kind does not have, naming the field', async () => {
      const { client } = await farmWithOwner();
      const res = await client.post('/api/organization/invitations', { email: 'crew-on-a-farm@example.test', role: 'crew' });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.role).toBe('must be one of Owner, Manager, Applicator, Viewer');
      const bad = await client.post('/api/organization/invitations', { email: 'not-an-email', role: 'boss' });
      expect(bad.status).toBe(400);
      expect(Object.keys(bad.body.error.fields).sort()).toEqual(['email', 'role']);
      expect(bad.body.error.fields.role).toBe('must be one of Owner, Manager, Applicator, Field crew, Viewer');
    });

    it('answers 409 when the e-mail already belongs to a member or another organization', async () => {
      const { farm, client } = await farmWithOwner();
      const member = await buildUser({ organization: farm, role: 'viewer' });
      const elsewhere = await buildUser({ organization: await buildOrganization({ kind: 'apiary' }), role: 'crew' });
      const own = await client.post('/api/organization/invitations', { email: member.email, role: 'manager' });
      expect(own.status).toBe(409);
      expect(own.body.error.fields).toEqual({ email: 'is already a member' });
      const other = await client.post('/api/organization/invitations', { email: elsewhere.email, role: 'manager' });
      expect(other.status).toBe(409);
      expect(other.body.error.fields).toEqual({ email: 'already belongs to another organization' });
    });

    it('stops working after 7 days, or once withdrawn; inviting again replaces the open invitation', async () => {
      const { farm, owner, client } = await farmWithOwner();
      const late = await buildInvitation({ organization: farm, invitedBy: owner, expiresAt: new Date(clock + 7 * 24 * 3_600_000) });
      const anonymous = await apiClient(t.app);
      expect((await anonymous.post('/api/organization/invitations/preview', { token: late.token })).status).toBe(200);
      clock += 7 * 24 * 3_600_000 + 60_000;
      try {
        expect((await anonymous.post('/api/organization/invitations/preview', { token: late.token })).status).toBe(404);
        expect((await anonymous.post('/api/organization/invitations/accept', { token: late.token, name: 'Late', password: 'a-long-fresh-passphrase' })).status).toBe(404);
      } finally {
        clock = Date.now();
      }

      const first = await client.post('/api/organization/invitations', { email: 'twice@example.test', role: 'viewer' });
      const second = await client.post('/api/organization/invitations', { email: 'twice@example.test', role: 'manager' });
      expect(second.status).toBe(201);
      const open = (await client.get('/api/organization/invitations')).body.invitations.filter((i: { email: string }) => i.email === 'twice@example.test');
      expect(open.map((i: { id: string; role: string }) => [i.id, i.role])).toEqual([[second.body.invitation.id, 'manager']]);
      expect((await client.delete(`/api/organization/invitations/${first.body.invitation.id}`)).status).toBe(404);

      const withdrawn = await buildInvitation({ organization: farm });
      expect((await client.delete(`/api/organization/invitations/${withdrawn.invitation.id}`)).status).toBe(200);
      expect((await anonymous.post('/api/organization/invitations/preview', { token: withdrawn.token })).status).toBe(404);
    });

    it('answers 404 for another organization’s invitation', async () => {
      const { client } = await farmWithOwner();
      const other = await buildInvitation({ organization: await buildOrganization({ kind: 'farm' }) });
      expect((await client.delete(`/api/organization/invitations/${other.invitation.id}`)).status).toBe(404);
      expect((await client.get('/api/organization/invitations')).body.invitations).toEqual([]);
    });
  });

  describe('members', () => {
    it('lists only the own organization’s active members, without secrets', async () => {
      const { farm, client } = await farmWithOwner();
      await buildUser({ organization: farm, role: 'viewer', name: 'Ash Viewer' });
      await buildUser({ organization: await buildOrganization({ kind: 'farm' }), role: 'viewer', name: 'Elsewhere Person' });
      const res = await client.get('/api/organization/members');
      expect(res.status).toBe(200);
      expect(res.body.members.map((m: { name: string }) => m.name)).toEqual(['Ash Viewer', 'Juniper Vale']);
      expect(Object.keys(res.body.members[0]).sort()).toEqual(['email', 'id', 'joinedAt', 'name', 'role']);
    });

    it('changes a role, and the member’s next request has it', async () => {
      const { farm, client } = await farmWithOwner();
      const viewer = await buildUser({ organization: farm, role: 'viewer' });
      const viewerClient = await signedInClient(t.app, viewer.email);
      const res = await client.patch(`/api/organization/members/${viewer.id}`, { role: 'applicator' });
      expect(res.status).toBe(200);
      expect(res.body.member.role).toBe('applicator');
      expect((await viewerClient.get('/api/auth/me')).body.user.role).toBe('applicator');
      const wrongKind = await client.patch(`/api/organization/members/${viewer.id}`, { role: 'crew' });
      expect(wrongKind.status).toBe(400);
      expect(wrongKind.body.error.fields.role).toMatch(/must be one of/);
    });

    it('keeps at least one owner', async () => {
      const { farm, owner, client } = await farmWithOwner();
      const demote = await client.patch(`/api/organization/members/${owner.id}`, { role: 'manager' });
      expect(demote.status).toBe(409);
      expect((await client.delete(`/api/organization/members/${owner.id}`)).status).toBe(409);
      const second = await buildUser({ organization: farm, role: 'manager' });
      expect((await client.patch(`/api/organization/members/${second.id}`, { role: 'owner' })).status).toBe(200);
      expect((await client.patch(`/api/organization/members/${owner.id}`, { role: 'manager' })).status).toBe(200);
    });

    it('removes a member: their sessions end at once and they cannot sign in', async () => {
      const { farm, client } = await farmWithOwner();
      const leaving = await buildUser({ organization: farm, role: 'applicator' });
      const leavingClient = await signedInClient(t.app, leaving.email);
      const secondDevice = await signedInClient(t.app, leaving.email);
      expect((await leavingClient.get('/api/auth/me')).status).toBe(200);
      const sessionsOf = async () =>
        (await t.context.sequelize.query(`SELECT sid FROM user_sessions WHERE sess -> 'passport' ->> 'user' = :id`, { replacements: { id: leaving.id }, type: QueryTypes.SELECT })).length;
      expect(await sessionsOf()).toBe(2);

      const res = await client.delete(`/api/organization/members/${leaving.id}`);
      expect(res.status).toBe(200);
      expect(await sessionsOf()).toBe(0);
      expect((await leavingClient.get('/api/auth/me')).status).toBe(401);
      expect((await secondDevice.get('/api/auth/me')).status).toBe(401);
      expect((await (await apiClient(t.app)).post('/api/auth/login', { email: leaving.email, password: defaultTestPassword })).status).toBe(401);
      expect((await client.get('/api/organization/members')).body.members.map((m: { id: string }) => m.id)).not.toContain(leaving.id);
    });

    it('closes the removed member’s open sockets', async () => {
      const { farm, client } = await farmWithOwner();
      const leaving = await buildUser({ organization: farm, role: 'viewer' });
      const agent = request.agent(t.baseUrl);
      const csrf = (await agent.get('/api/auth/csrf')).body.csrfToken;
      const login = await agent.post('/api/auth/login').set('X-CSRF-Token', csrf).send({ email: leaving.email, password: defaultTestPassword });
      const cookie = ([] as string[]).concat(login.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]).join('; ');
      const socket = connect(t.baseUrl, { transports: ['websocket'], extraHeaders: { Cookie: cookie }, reconnection: false, forceNew: true });
      try {
        await new Promise<void>((resolve, reject) => { socket.once('session:ready', () => resolve()); socket.once('connect_error', reject); });
        const closed = new Promise<string>((resolve) => socket.once('disconnect', resolve));
        expect((await client.delete(`/api/organization/members/${leaving.id}`)).status).toBe(200);
        expect(await closed).toBe('io server disconnect');
      } finally {
        socket.disconnect();
      }
    });

    it('lets a removed person join again through a new invitation', async () => {
      const { farm, owner, client } = await farmWithOwner();
      const person = await buildUser({ organization: farm, role: 'viewer' });
      expect((await client.delete(`/api/organization/members/${person.id}`)).status).toBe(200);
      const apiary = await buildOrganization({ kind: 'apiary', name: 'Second Home Apiary' });
      const { token } = await buildInvitation({ organization: apiary, email: person.email, role: 'crew', invitedBy: owner });
      const res = await (await apiClient(t.app)).post('/api/organization/invitations/accept', { token, name: 'Back Again', password: 'a-long-fresh-passphrase' });
      expect(res.status).toBe(201);
      expect(res.body.user).toMatchObject({ id: person.id, role: 'crew', organization: { name: 'Second Home Apiary' } });
    });

    it('answers 404 for another organization’s member', async () => {
      const { client } = await farmWithOwner();
      const stranger = await buildUser({ organization: await buildOrganization({ kind: 'farm' }), role: 'viewer' });
      expect((await client.patch(`/api/organization/members/${stranger.id}`, { role: 'manager' })).status).toBe(404);
      expect((await client.delete(`/api/organization/members/${stranger.id}`)).status).toBe(404);
      expect((await client.delete('/api/organization/members/not-a-uuid')).status).toBe(400);
    });
  });
});
