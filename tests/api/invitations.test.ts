import jwt from 'jsonwebtoken';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Invitation, Membership, User, type Workspace } from '@api/models';
import { addMember, bearer, createUser, createWorkspace, tokenFor, uniqueEmail } from './helpers/factories';
import { linkToken, mailTo, TEST_APP_URL, useMailTestApp } from './helpers/mail';

const t = useMailTestApp();
let owner: User;
let editor: User;
let workspace: Workspace;

beforeAll(async () => {
  owner = await createUser({ name: 'Ottilie Sparrowhawk' });
  editor = await createUser({ name: 'Edwin Larkspur' });
  workspace = await createWorkspace({ name: 'Gorse Common Flyers', owner });
  await addMember(workspace, editor, 'editor');
});

const invite = (email: string, role = 'reviewer', as: User = owner) =>
  request(t.app)
    .post(`/api/workspaces/${workspace.id}/invitations`)
    .set(bearer(tokenFor(as, t.config)))
    .send({ email, role });

async function invitedToken(email: string, role = 'reviewer'): Promise<string> {
  await invite(email, role).expect(201);
  const [latest] = await mailTo(email);
  return linkToken(latest, 'invitations');
}

describe('the pending invitations', () => {
  it('come a page at a time, newest first, with how many there are', async () => {
    const own = await createWorkspace({ name: 'Saltmarsh Soaring', owner });
    const emails = [uniqueEmail('first'), uniqueEmail('second'), uniqueEmail('third')];
    for (const email of emails)
      await request(t.app)
        .post(`/api/workspaces/${own.id}/invitations`)
        .set(bearer(tokenFor(owner, t.config)))
        .send({ email, role: 'viewer' })
        .expect(201);
    const list = (query: string) =>
      request(t.app)
        .get(`/api/workspaces/${own.id}/invitations${query}`)
        .set(bearer(tokenFor(owner, t.config)));
    const first = await list('?limit=2').expect(200);
    expect(first.body.data.map((invitation: { email: string }) => invitation.email)).toEqual([emails[2], emails[1]]);
    expect(first.body.pagination).toEqual({ limit: 2, offset: 0, total: 3 });
    const rest = await list('?limit=2&offset=2').expect(200);
    expect(rest.body.data.map((invitation: { email: string }) => invitation.email)).toEqual([emails[0]]);
    expect((await list('?offset=-1').expect(400)).body.error.details.fields.offset).toBe('offset is at least 0.');
  });
});

describe('inviting by e-mail', () => {
  it('mails the invited address a link that shows the workspace and role, and works once', async () => {
    const email = uniqueEmail('newcomer');
    const created = await invite(email.toUpperCase(), 'reviewer').expect(201);
    expect(created.body.data).toMatchObject({
      email,
      role: 'reviewer',
      status: 'pending',
      invited_by: { id: owner.id, name: 'Ottilie Sparrowhawk' },
    });
    expect(JSON.stringify(created.body)).not.toMatch(/eyJ/);

    const mails = await mailTo(email);
    expect(mails).toHaveLength(1);
    const [mail] = mails;
    expect(mail.subject).toBe('Ottilie Sparrowhawk invites you to Gorse Common Flyers on Bindery');
    expect(mail.textBody).toContain('as a reviewer');
    expect(mail.htmlBody).toContain('Accept the invitation');
    const token = linkToken(mail, 'invitations');
    expect(mail.htmlBody).toContain(`${TEST_APP_URL}/invitations/${token}`);

    const shown = await request(t.app).get(`/api/invitations/${token}`).expect(200);
    expect(shown.body.data).toMatchObject({
      workspace: { id: workspace.id, name: 'Gorse Common Flyers' },
      role: 'reviewer',
      email,
      account_exists: false,
    });

    const accepted = await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Nell Whitethroat', password: 'thermal-bubble-77' })
      .expect(201);
    expect(accepted.body.data.workspace).toEqual({ id: workspace.id, name: 'Gorse Common Flyers', role: 'reviewer' });
    expect(String(accepted.headers['set-cookie'])).toMatch(/bindery_session=/);
    const me = await request(t.app).get('/api/me').set(bearer(accepted.body.data.token)).expect(200);
    expect(me.body.data.user).toMatchObject({ email, name: 'Nell Whitethroat' });
    expect(me.body.data.workspaces).toContainEqual({ id: workspace.id, name: 'Gorse Common Flyers', role: 'reviewer' });

    const again = await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Someone Else', password: 'thermal-bubble-78' })
      .expect(410);
    expect(again.body.error.code).toBe('token-used');
    expect((await request(t.app).get(`/api/invitations/${token}`).expect(410)).body.error.code).toBe('token-used');
  });

  it('lets a signed-in user with an account join with the invited role', async () => {
    const pilot = await createUser({ email: uniqueEmail('member') });
    const token = await invitedToken(pilot.email, 'editor');
    expect((await request(t.app).get(`/api/invitations/${token}`).expect(200)).body.data.account_exists).toBe(true);

    const unsigned = await request(t.app).post(`/api/invitations/${token}/accept`).expect(401);
    expect(unsigned.body.error.message).toMatch(/Sign in/);
    const newAccount = await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Twin', password: 'thermal-bubble-77' })
      .expect(409);
    expect(newAccount.body.error.code).toBe('account-exists');

    const joined = await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .set(bearer(tokenFor(pilot, t.config)))
      .expect(200);
    expect(joined.body.data.workspace).toEqual({ id: workspace.id, name: 'Gorse Common Flyers', role: 'editor' });
    const membership = await Membership.findOne({ where: { workspaceId: workspace.id, userId: pilot.id } });
    expect(membership?.role).toBe('editor');
  });

  it('refuses any other signed-in account, the owner included (403 wrong-account), and changes nothing', async () => {
    const invited = uniqueEmail('meant-for');
    const token = await invitedToken(invited, 'editor');
    const stranger = await createUser({ email: uniqueEmail('stranger') });
    for (const caller of [stranger, owner]) {
      const refused = await request(t.app)
        .post(`/api/invitations/${token}/accept`)
        .set(bearer(tokenFor(caller, t.config)))
        .expect(403);
      expect(refused.body.error.code).toBe('wrong-account');
      expect(refused.body.error.message).toContain(`This invitation is for ${invited}`);
      expect(refused.body.error.message).toMatch(/Sign out/);
      expect(refused.body.error.details).toEqual({ invited_email: invited, signed_in_email: caller.email });
    }
    expect(await Membership.count({ where: { workspaceId: workspace.id, userId: stranger.id } })).toBe(0);
    expect(
      await AuditEvent.count({ where: { workspaceId: workspace.id, action: 'member.joined', actorId: stranger.id } }),
    ).toBe(0);
    // The link still works for the invited address, in any letter case.
    const invitee = await createUser({ email: invited.toUpperCase() });
    await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .set(bearer(tokenFor(invitee, t.config)))
      .expect(200);
  });

  it('a new account made from the link has the invited address, whatever else is sent', async () => {
    const invited = uniqueEmail('fixed');
    const token = await invitedToken(invited);
    const refused = await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Sly', password: 'thermal-bubble-77', email: uniqueEmail('other') })
      .expect(400);
    expect(refused.body.error.details.fields.email).toBe('This field is not known here.');
    const created = await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Fixed Address', password: 'thermal-bubble-77' })
      .expect(201);
    expect(created.body.data.user.email).toBe(invited);
  });

  it('refuses a member who is already in the workspace without using up the link', async () => {
    const pilot = await createUser({ email: uniqueEmail('double') });
    const token = await invitedToken(pilot.email);
    await addMember(workspace, pilot, 'viewer');
    const response = await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .set(bearer(tokenFor(pilot, t.config)))
      .expect(409);
    expect(response.body.error.code).toBe('already-member');
    await request(t.app).get(`/api/invitations/${token}`).expect(200);
  });

  it('refuses an expired link: by the token’s own expiry and by the invitation’s', async () => {
    const email = uniqueEmail('late');
    const token = await invitedToken(email);
    const { jti } = jwt.decode(token) as { jti: string };

    const now = Math.floor(Date.now() / 1000);
    const expiredToken = jwt.sign({ exp: now - 60, iat: now - 3600 }, t.config.jwtSecret, {
      algorithm: 'HS256',
      audience: 'bindery:invitation',
      jwtid: jti,
    });
    const byToken = await request(t.app)
      .post(`/api/invitations/${expiredToken}/accept`)
      .send({ name: 'Late', password: 'thermal-bubble-77' })
      .expect(401);
    expect(byToken.body.error.code).toBe('token-expired');

    await Invitation.update({ expiresAt: new Date(Date.now() - 60_000) }, { where: { id: jti } });
    const byRow = await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Late', password: 'thermal-bubble-77' })
      .expect(401);
    expect(byRow.body.error.code).toBe('token-expired');
    expect(await User.count({ where: { email } })).toBe(0);
    expect((await Invitation.findByPk(jti))?.acceptedAt).toBeNull();
  });

  it('refuses a tampered token, a token of another kind and a session token', async () => {
    const token = await invitedToken(uniqueEmail('tamper'));
    const [header, payload, signature] = token.split('.');
    const flipped = `${header}.${payload}.${signature.slice(0, -2)}${signature.endsWith('AA') ? 'BB' : 'AA'}`;
    expect((await request(t.app).get(`/api/invitations/${flipped}`).expect(401)).body.error.code).toBe('invalid-token');

    const { jti } = jwt.decode(token) as { jti: string };
    const resetKind = jwt.sign({}, t.config.jwtSecret, {
      algorithm: 'HS256',
      audience: 'bindery:password-reset',
      jwtid: jti,
      expiresIn: 3600,
    });
    expect((await request(t.app).get(`/api/invitations/${resetKind}`).expect(401)).body.error.code).toBe(
      'invalid-token',
    );
    expect(
      (
        await request(t.app)
          .get(`/api/invitations/${tokenFor(owner, t.config)}`)
          .expect(401)
      ).body.error.code,
    ).toBe('invalid-token');
    expect((await request(t.app).get('/api/invitations/not-a-token').expect(401)).body.error.code).toBe(
      'invalid-token',
    );
  });

  it('inviting an address again replaces the old link; a revoked invitation is refused', async () => {
    const email = uniqueEmail('twice');
    const first = await invitedToken(email);
    const second = await invitedToken(email, 'editor');
    expect((await request(t.app).get(`/api/invitations/${first}`).expect(410)).body.error.code).toBe(
      'invitation-revoked',
    );
    expect((await request(t.app).get(`/api/invitations/${second}`).expect(200)).body.data.role).toBe('editor');

    const list = await request(t.app)
      .get(`/api/workspaces/${workspace.id}/invitations`)
      .set(bearer(tokenFor(owner, t.config)))
      .expect(200);
    const pending = list.body.data.filter((invitation: { email: string }) => invitation.email === email);
    expect(pending).toHaveLength(1);
    expect(pending[0]).toMatchObject({ role: 'editor', status: 'pending' });

    const revoked = await request(t.app)
      .delete(`/api/workspaces/${workspace.id}/invitations/${pending[0].id}`)
      .set(bearer(tokenFor(owner, t.config)))
      .expect(200);
    expect(revoked.body.data.status).toBe('revoked');
    const refused = await request(t.app)
      .post(`/api/invitations/${second}/accept`)
      .send({ name: 'Gone', password: 'thermal-bubble-77' })
      .expect(410);
    expect(refused.body.error.code).toBe('invitation-revoked');
    const after = await request(t.app)
      .get(`/api/workspaces/${workspace.id}/invitations`)
      .set(bearer(tokenFor(owner, t.config)))
      .expect(200);
    expect(after.body.data.map((invitation: { email: string }) => invitation.email)).not.toContain(email);
  });

  it('only owners invite, list and revoke; others get 403 and nothing is sent', async () => {
    const email = uniqueEmail('by-editor');
    const refused = await invite(email, 'viewer', editor).expect(403);
    expect(refused.body.error.code).toBe('role-too-low');
    await request(t.app)
      .get(`/api/workspaces/${workspace.id}/invitations`)
      .set(bearer(tokenFor(editor, t.config)))
      .expect(403);
    expect(await mailTo(email)).toHaveLength(0);
    expect(await Invitation.count({ where: { email } })).toBe(0);
  });

  it('refuses bad input and members already in, storing and sending nothing', async () => {
    const bad = await invite('not an address', 'pilot').expect(400);
    expect(Object.keys(bad.body.error.details.fields).sort()).toEqual(['email', 'role']);
    const member = await invite(editor.email, 'viewer').expect(409);
    expect(member.body.error.code).toBe('already-member');
    expect(await mailTo(editor.email)).toHaveLength(0);
  });

  it('records invitations and joins in the audit trail the owners read', async () => {
    const email = uniqueEmail('audited');
    const token = await invitedToken(email, 'viewer');
    await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Ada Fieldfare', password: 'thermal-bubble-77' })
      .expect(201);
    const events = await AuditEvent.findAll({ where: { workspaceId: workspace.id } });
    expect(events.find((event) => event.action === 'member.invited' && event.details.email === email)).toMatchObject({
      actorId: owner.id,
      details: { role: 'viewer' },
    });
    expect(events.find((event) => event.action === 'member.joined' && event.details.email === email)).toMatchObject({
      details: { name: 'Ada Fieldfare', role: 'viewer', new_account: true },
    });

    const audit = await request(t.app)
      .get(`/api/workspaces/${workspace.id}/audit`)
      .set(bearer(tokenFor(owner, t.config)))
      .expect(200);
    expect(audit.body.data.map((event: { action: string }) => event.action)).toEqual(
      expect.arrayContaining(['member.invited', 'member.joined']),
    );
  });
});
