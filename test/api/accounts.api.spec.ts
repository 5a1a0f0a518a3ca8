import request from 'supertest';
import { API } from '@shared/api/routes';
import type { InvitationSummary, PeopleChange } from '@shared/api/people';
import { createPerson, TEST_PASSWORD, type TestPerson } from '../helpers/factories';
import { linkToken, mailsTo, waitForMailsTo } from '../helpers/mail';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

const NEW_PASSWORD = 'stylus-on-the-drum-7';
// argon2id is slow on purpose, and these flows hash and verify several passwords each.
jest.setTimeout(30_000);

let sequence = 0;
const address = (name: string) => `${name}-${Date.now()}-${++sequence}@isallo.test`;

describe('accounts: invitations, roles, disabling, passwords and sessions', () => {
  let context: TestContext;
  let admin: TestPerson;

  const asAdmin = (call: request.Test) => call.set('Authorization', `Bearer ${admin.token}`);

  async function invite(email: string, roles: string[] = ['volunteer']): Promise<{ invitation: InvitationSummary; token: string }> {
    const response = await asAdmin(request(context.app).post(API.invitations)).send({ email, roles });
    expect(response.status).toBe(201);
    const [mail] = await waitForMailsTo(email);
    return { invitation: response.body, token: linkToken(mail!, '/invitation/') };
  }

  async function versionOf(personId: string): Promise<number> {
    return (await context.db.selectFrom('person').select('version').where('id', '=', personId).executeTakeFirstOrThrow()).version;
  }

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    admin = await createPerson(context.db, ['admin']);
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  describe('invitations', () => {
    it('when an admin invites an address, then a plain mail with text and HTML parts carries the link on PUBLIC_URL and its expiry, and the list shows it pending', async () => {
      const email = address('invitee');
      const startedMs = Date.now();

      const { invitation } = await invite(email, ['archivist', 'volunteer']);
      const [mail] = await mailsTo(email);
      const list = await asAdmin(request(context.app).get(API.invitations));

      expect(invitation).toMatchObject({ email, roles: ['archivist', 'volunteer'], state: 'pending' });
      const expiresMs = Date.parse(invitation.expiresAt);
      expect(expiresMs - startedMs).toBeGreaterThan(7 * 24 * 3600_000 - 60_000);
      expect(expiresMs - startedMs).toBeLessThanOrEqual(7 * 24 * 3600_000 + 5_000);
      expect(mail!.subject).toBe('You are invited to Isallo');
      expect(mail!.text).toMatch(/http:\/\/isallo\.test\/invitation\/[A-Za-z0-9_-]{43}/);
      expect(mail!.text).toContain('archivist, volunteer');
      expect(mail!.text).toContain('UTC');
      expect(mail!.html).toContain('<a href="http://isallo.test/invitation/');
      expect(list.body.items.map((item: InvitationSummary) => item.email)).toContain(email);
    });

    it('when the invitee opens and accepts the link, then they are signed in with the roles given and the link stops working', async () => {
      const email = address('accepter');
      const { token } = await invite(email, ['teacher']);

      const preview = await request(context.app).get(API.invitationByToken(token));
      const accepted = await request(context.app).post(API.invitationAccept(token)).send({ displayName: 'Mary Accepter', password: NEW_PASSWORD });
      const me = await request(context.app).get(API.me).set('Authorization', `Bearer ${accepted.body.token}`);
      const again = await request(context.app).post(API.invitationAccept(token)).send({ displayName: 'Someone Else', password: NEW_PASSWORD });
      const signIn = await request(context.app).post(API.signIn).send({ email, password: NEW_PASSWORD });

      expect(preview.status).toBe(200);
      expect(preview.body).toMatchObject({ email, roles: ['teacher'] });
      expect(accepted.status).toBe(201);
      expect(me.body).toMatchObject({ email, displayName: 'Mary Accepter', roles: ['teacher'] });
      expect(again.status).toBe(404);
      expect(again.body.error.code).toBe('invitation_link_not_found');
      expect(signIn.status).toBe(200);
      expect(signIn.body.person.roles).toEqual(['teacher']);
    });

    it('when the invitee picks a short or common password, then it answers 400 naming the password and makes no account', async () => {
      const email = address('weak');
      const { token } = await invite(email);

      const short = await request(context.app).post(API.invitationAccept(token)).send({ displayName: 'Weak', password: 'short-pw' });
      const common = await request(context.app).post(API.invitationAccept(token)).send({ displayName: 'Weak', password: 'qwerty123456' });
      const people = await context.db.selectFrom('person').select('id').where('email', '=', email).execute();

      expect(short.status).toBe(400);
      expect(short.body.error.details.password).toMatch(/at least 12 characters/);
      expect(common.status).toBe(400);
      expect(common.body.error.details.password).toMatch(/most common passwords/);
      expect(people).toHaveLength(0);
    });

    it('when an invitation is resent, then a new mail goes, the old link stops and the new one works', async () => {
      const email = address('resend');
      const { invitation, token: oldToken } = await invite(email);

      const resent = await asAdmin(request(context.app).post(API.invitationResend(invitation.id)));
      const mails = await waitForMailsTo(email, 2);
      const newToken = linkToken(mails[0]!, '/invitation/');
      const oldPreview = await request(context.app).get(API.invitationByToken(oldToken));
      const newPreview = await request(context.app).get(API.invitationByToken(newToken));

      expect(resent.status).toBe(200);
      expect(newToken).not.toBe(oldToken);
      expect(oldPreview.status).toBe(404);
      expect(newPreview.status).toBe(200);
    });

    it('when an invitation is withdrawn, then its link stops, it leaves the open list, and it cannot be resent', async () => {
      const email = address('withdrawn');
      const { invitation, token } = await invite(email);

      const withdrawn = await asAdmin(request(context.app).delete(API.invitation(invitation.id)));
      const preview = await request(context.app).get(API.invitationByToken(token));
      const open = await asAdmin(request(context.app).get(API.invitations));
      const resend = await asAdmin(request(context.app).post(API.invitationResend(invitation.id)));

      expect(withdrawn.status).toBe(204);
      expect(preview.status).toBe(404);
      expect(open.body.items.map((item: InvitationSummary) => item.id)).not.toContain(invitation.id);
      expect(resend.status).toBe(409);
      expect(resend.body.error.code).toBe('invitation_closed');
    });

    it('when an invitation has expired, then its link answers 404 and the list shows it expired', async () => {
      const email = address('expired');
      const { invitation, token } = await invite(email);
      await context.db.updateTable('invitation').set({ expires_at: new Date(Date.now() - 1000) }).where('id', '=', invitation.id).execute();

      const accept = await request(context.app).post(API.invitationAccept(token)).send({ displayName: 'Late', password: NEW_PASSWORD });
      const list = await asAdmin(request(context.app).get(API.invitations).query({ state: 'expired' }));

      expect(accept.status).toBe(404);
      expect(list.body.items.find((item: InvitationSummary) => item.id === invitation.id)?.state).toBe('expired');
    });

    it('when the address already has an account or an open invitation, then it answers 409 with its own code and sends nothing', async () => {
      const email = address('twice');
      await invite(email);

      const taken = await asAdmin(request(context.app).post(API.invitations)).send({ email: admin.email.toUpperCase(), roles: ['volunteer'] });
      const again = await asAdmin(request(context.app).post(API.invitations)).send({ email, roles: ['volunteer'] });

      expect(taken.status).toBe(409);
      expect(taken.body.error.code).toBe('email_taken');
      expect(again.status).toBe(409);
      expect(again.body.error.code).toBe('invitation_open');
      expect(await mailsTo(email)).toHaveLength(1);
      expect(await mailsTo(admin.email)).toHaveLength(0);
    });

    it('when the invitation body has a bad address, an unknown role or an unknown field, then it answers 400 naming each', async () => {
      const response = await asAdmin(request(context.app).post(API.invitations)).send({ email: 'not-an-address', roles: ['owner'], isAdmin: true });

      expect(response.status).toBe(400);
      expect(Object.keys(response.body.error.details).sort()).toEqual(['email', 'isAdmin', 'roles']);
    });
  });

  describe('roles and disabling', () => {
    it('when an admin changes a person’s roles, then their token loses the old roles at once and the change is logged', async () => {
      const person = await createPerson(context.db, ['archivist']);
      const before = await request(context.app).get(API.intakeBatches).set('Authorization', `Bearer ${person.token}`);

      const patched = await asAdmin(request(context.app).patch(API.person(person.id))).send({ version: await versionOf(person.id), roles: ['volunteer'] });
      const after = await request(context.app).get(API.intakeBatches).set('Authorization', `Bearer ${person.token}`);
      const signIn = await request(context.app).post(API.signIn).send({ email: person.email, password: TEST_PASSWORD });
      const log = await asAdmin(request(context.app).get(API.peopleChanges));

      expect(before.status).toBe(200);
      expect(patched.status).toBe(200);
      expect(patched.body.roles).toEqual(['volunteer']);
      expect(after.status).toBe(401);
      expect(signIn.body.person.roles).toEqual(['volunteer']);
      const entry = log.body.items.find((item: PeopleChange) => item.email === person.email && item.action === 'change_roles');
      expect(entry.changes).toEqual({ roles: { before: ['archivist'], after: ['volunteer'] } });
      expect(entry.actorName).toEqual(expect.any(String));
    });

    it('when an admin disables an account, then its sessions stop at once and it cannot sign in until re-enabled', async () => {
      const person = await createPerson(context.db, ['volunteer']);

      const disabled = await asAdmin(request(context.app).patch(API.person(person.id))).send({ version: await versionOf(person.id), isDisabled: true });
      const me = await request(context.app).get(API.me).set('Authorization', `Bearer ${person.token}`);
      const refused = await request(context.app).post(API.signIn).send({ email: person.email, password: TEST_PASSWORD });
      const enabled = await asAdmin(request(context.app).patch(API.person(person.id))).send({ version: await versionOf(person.id), isDisabled: false });
      const signIn = await request(context.app).post(API.signIn).send({ email: person.email, password: TEST_PASSWORD });

      expect(disabled.body.isDisabled).toBe(true);
      expect(me.status).toBe(401);
      expect(refused.status).toBe(403);
      expect(refused.body.error.code).toBe('account_disabled');
      expect(enabled.body.isDisabled).toBe(false);
      expect(signIn.status).toBe(200);
    });

    it('when the change is made at an old version, then it answers 409 version_conflict and changes nothing', async () => {
      const person = await createPerson(context.db, ['volunteer']);
      const version = await versionOf(person.id);
      await asAdmin(request(context.app).patch(API.person(person.id))).send({ version, roles: ['teacher'] });

      const stale = await asAdmin(request(context.app).patch(API.person(person.id))).send({ version, roles: ['archivist'] });
      const roles = await context.db.selectFrom('person_role').select('role').where('person_id', '=', person.id).execute();

      expect(stale.status).toBe(409);
      expect(stale.body.error.code).toBe('version_conflict');
      expect(roles.map((row) => row.role)).toEqual(['teacher']);
    });

    it('when the only enabled admin would lose the role or be disabled, then it answers 409 last_admin', async () => {
      await context.db.deleteFrom('person_role').where('role', '=', 'admin').where('person_id', '<>', admin.id).execute();

      const demote = await asAdmin(request(context.app).patch(API.person(admin.id))).send({ version: await versionOf(admin.id), roles: ['archivist'] });
      const disable = await asAdmin(request(context.app).patch(API.person(admin.id))).send({ version: await versionOf(admin.id), isDisabled: true });

      expect(demote.status).toBe(409);
      expect(demote.body.error.code).toBe('last_admin');
      expect(disable.body.error.code).toBe('last_admin');
    });

    it('when the person id is unknown or malformed, then it answers 404 person_not_found', async () => {
      const unknown = await asAdmin(request(context.app).patch(API.person('00000000-0000-4000-8000-000000000000'))).send({ version: 1, roles: [] });
      const malformed = await asAdmin(request(context.app).patch(API.person('nobody'))).send({ version: 1, roles: [] });

      expect(unknown.status).toBe(404);
      expect(unknown.body.error.code).toBe('person_not_found');
      expect(malformed.status).toBe(404);
    });
  });

  describe('own account', () => {
    it('when a person changes their name, then me shows it and the log has it', async () => {
      const person = await createPerson(context.db, ['teacher']);

      const patched = await request(context.app).patch(API.me).set('Authorization', `Bearer ${person.token}`).send({ displayName: 'Renamed Teacher' });
      const me = await request(context.app).get(API.me).set('Authorization', `Bearer ${person.token}`);

      expect(patched.status).toBe(200);
      expect(me.body.displayName).toBe('Renamed Teacher');
    });

    it('when a person changes their password, then other sessions end, the new token and password work and the old password does not', async () => {
      const person = await createPerson(context.db, ['teacher']);
      const other = await request(context.app).post(API.signIn).send({ email: person.email, password: TEST_PASSWORD });

      const wrong = await request(context.app).post(API.myPassword).set('Authorization', `Bearer ${person.token}`).send({ currentPassword: 'not-it-at-all', newPassword: NEW_PASSWORD });
      const changed = await request(context.app).post(API.myPassword).set('Authorization', `Bearer ${person.token}`).send({ currentPassword: TEST_PASSWORD, newPassword: NEW_PASSWORD });
      const otherAfter = await request(context.app).get(API.me).set('Authorization', `Bearer ${other.body.token}`);
      const newAfter = await request(context.app).get(API.me).set('Authorization', `Bearer ${changed.body.token}`);
      const oldPassword = await request(context.app).post(API.signIn).send({ email: person.email, password: TEST_PASSWORD });
      const newPassword = await request(context.app).post(API.signIn).send({ email: person.email, password: NEW_PASSWORD });

      expect(wrong.status).toBe(400);
      expect(Object.keys(wrong.body.error.details)).toEqual(['currentPassword']);
      expect(changed.status).toBe(200);
      expect(otherAfter.status).toBe(401);
      expect(newAfter.status).toBe(200);
      expect(oldPassword.status).toBe(401);
      expect(newPassword.status).toBe(200);
    });

    it('when a person signs out everywhere, then every token of theirs stops', async () => {
      const person = await createPerson(context.db, ['volunteer']);
      const other = await request(context.app).post(API.signIn).send({ email: person.email, password: TEST_PASSWORD });

      const out = await request(context.app).post(API.signOutEverywhere).set('Authorization', `Bearer ${person.token}`);
      const first = await request(context.app).get(API.me).set('Authorization', `Bearer ${person.token}`);
      const second = await request(context.app).get(API.me).set('Authorization', `Bearer ${other.body.token}`);

      expect(out.status).toBe(204);
      expect(first.status).toBe(401);
      expect(second.status).toBe(401);
      expect(second.body.error.code).toBe('session_ended');
    });
  });

  describe('forgotten password', () => {
    it('when a reset is asked for a known and an unknown address, then both get the same answer and only the known one a mail', async () => {
      const person = await createPerson(context.db, ['volunteer'], address('forgetful'));
      const unknown = address('nobody');

      const known = await request(context.app).post(API.passwordResetRequests).send({ email: person.email });
      const stranger = await request(context.app).post(API.passwordResetRequests).send({ email: unknown });
      const [mail] = await waitForMailsTo(person.email);

      expect(known.status).toBe(202);
      expect(stranger.status).toBe(202);
      expect(stranger.body).toEqual(known.body);
      expect(mail!.subject).toBe('Set a new Isallo password');
      expect(mail!.text).toMatch(/http:\/\/isallo\.test\/reset-password\/[A-Za-z0-9_-]{43}/);
      expect(mail!.html).toContain('reset-password/');
      expect(await mailsTo(unknown)).toHaveLength(0);
    });

    it('when the reset link is used, then the password changes, other sessions end, the person is signed in and the link works only once', async () => {
      const person = await createPerson(context.db, ['volunteer'], address('resetter'));
      await request(context.app).post(API.passwordResetRequests).send({ email: person.email });
      const token = linkToken((await waitForMailsTo(person.email))[0]!, '/reset-password/');

      const reset = await request(context.app).post(API.passwordResets).send({ token, newPassword: NEW_PASSWORD });
      const oldSession = await request(context.app).get(API.me).set('Authorization', `Bearer ${person.token}`);
      const newSession = await request(context.app).get(API.me).set('Authorization', `Bearer ${reset.body.token}`);
      const again = await request(context.app).post(API.passwordResets).send({ token, newPassword: 'another-long-phrase-9' });
      const signIn = await request(context.app).post(API.signIn).send({ email: person.email, password: NEW_PASSWORD });

      expect(reset.status).toBe(200);
      expect(oldSession.status).toBe(401);
      expect(newSession.status).toBe(200);
      expect(again.status).toBe(404);
      expect(again.body.error.code).toBe('reset_link_not_found');
      expect(signIn.status).toBe(200);
    });

    it('when the reset link is over an hour old, then it answers 404 and the password stays', async () => {
      const person = await createPerson(context.db, ['volunteer'], address('slow'));
      await request(context.app).post(API.passwordResetRequests).send({ email: person.email });
      const token = linkToken((await waitForMailsTo(person.email))[0]!, '/reset-password/');
      const { expires_at: expiresAt, created_at: createdAt } = await context.db
        .selectFrom('password_reset')
        .innerJoin('person', 'person.id', 'password_reset.person_id')
        .select(['password_reset.expires_at', 'password_reset.created_at'])
        .where('person.email', '=', person.email)
        .executeTakeFirstOrThrow();
      await context.db.updateTable('password_reset').set({ expires_at: new Date(Date.now() - 1000) }).where('person_id', '=', person.id).execute();

      const reset = await request(context.app).post(API.passwordResets).send({ token, newPassword: NEW_PASSWORD });
      const signIn = await request(context.app).post(API.signIn).send({ email: person.email, password: TEST_PASSWORD });

      // The expiry is set by the server's clock, the creation time by the database's: an hour apart, within a few seconds.
      expect(Math.abs(expiresAt.getTime() - createdAt.getTime() - 3600_000)).toBeLessThan(5_000);
      expect(reset.status).toBe(404);
      expect(signIn.status).toBe(200);
    });
  });

  describe('change log and captured mails', () => {
    it('when the admin reads the change log, then it lists invitations and account changes newest first, paged, without passwords', async () => {
      const response = await asAdmin(request(context.app).get(API.peopleChanges).query({ pageSize: 200 }));

      expect(response.status).toBe(200);
      const actions = new Set(response.body.items.map((item: PeopleChange) => item.action));
      for (const action of ['invite', 'resend_invitation', 'withdraw_invitation', 'accept_invitation', 'change_roles', 'disable', 'enable', 'change_name', 'change_password', 'reset_password', 'sign_out_everywhere']) {
        expect(actions).toContain(action);
      }
      const times = response.body.items.map((item: PeopleChange) => Date.parse(item.at));
      expect([...times].sort((a, b) => b - a)).toEqual(times);
      expect(JSON.stringify(response.body)).not.toMatch(/argon2|stylus-on-the-drum/);
    });

    it('when the admin opens the captured mails, then they are listed newest first; others get 403', async () => {
      const admins = await asAdmin(request(context.app).get(API.capturedMails).query({ pageSize: 5 }));
      const volunteer = await createPerson(context.db, ['volunteer']);
      const refused = await request(context.app).get(API.capturedMails).set('Authorization', `Bearer ${volunteer.token}`);

      expect(admins.status).toBe(200);
      expect(admins.body.items.length).toBeGreaterThan(0);
      expect(admins.body.items[0]).toEqual(expect.objectContaining({ subject: expect.any(String), text: expect.any(String), html: expect.any(String) }));
      expect(refused.status).toBe(403);
    });
  });
});
