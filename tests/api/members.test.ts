import request from 'supertest';
import { beforeEach, describe, expect, it } from 'vitest';
import { AuditEvent, Membership, type User, type Workspace } from '@api/models';
import type { Role } from '@shared/contract/roles';
import { addMember, bearer, createUser, createWorkspace, tokenFor } from './helpers/factories';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();
let owner: User;
let workspace: Workspace;
let people: Record<Exclude<Role, 'owner'>, User>;

beforeEach(async () => {
  owner = await createUser({ name: 'Philippa Owlcote' });
  workspace = await createWorkspace({ name: 'Marsh Lane Strip', owner });
  people = {
    editor: await createUser({ name: 'Eli Nettlebed' }),
    reviewer: await createUser({ name: 'Rosa Hawkbit' }),
    viewer: await createUser({ name: 'Vic Teasel' }),
  };
  for (const [role, user] of Object.entries(people)) await addMember(workspace, user, role as Role);
});

const as = (user: User) => bearer(tokenFor(user, t.config));
const changeRole = (target: User, role: string, by: User = owner) =>
  request(t.app).patch(`/api/workspaces/${workspace.id}/members/${target.id}`).set(as(by)).send({ role });
const remove = (target: User, by: User = owner) =>
  request(t.app).delete(`/api/workspaces/${workspace.id}/members/${target.id}`).set(as(by));
const roleOf = async (user: User) =>
  (await Membership.findOne({ where: { workspaceId: workspace.id, userId: user.id } }))?.role ?? null;

describe('changing roles', () => {
  it('an owner changes a member’s role, recorded in the audit trail', async () => {
    const response = await changeRole(people.viewer, 'reviewer').expect(200);
    expect(response.body.data).toMatchObject({ user: { id: people.viewer.id, name: 'Vic Teasel' }, role: 'reviewer' });
    expect(await roleOf(people.viewer)).toBe('reviewer');
    const event = await AuditEvent.findOne({ where: { workspaceId: workspace.id, action: 'member.role-changed' } });
    expect(event).toMatchObject({
      actorId: owner.id,
      subjectId: people.viewer.id,
      details: { name: 'Vic Teasel', from: 'viewer', to: 'reviewer' },
    });
  });

  it('the last owner cannot be demoted (409 last-owner); with a second owner it works', async () => {
    const refused = await changeRole(owner, 'editor').expect(409);
    expect(refused.body.error.code).toBe('last-owner');
    expect(await roleOf(owner)).toBe('owner');

    await changeRole(people.editor, 'owner').expect(200);
    await changeRole(owner, 'editor').expect(200);
    expect(await roleOf(owner)).toBe('editor');
    const back = await changeRole(people.editor, 'viewer', people.editor).expect(409);
    expect(back.body.error.code).toBe('last-owner');
  });

  it('two owners demoting each other at once leave exactly one owner', async () => {
    await changeRole(people.editor, 'owner').expect(200);
    const [a, b] = await Promise.all([
      changeRole(people.editor, 'viewer', owner),
      changeRole(owner, 'viewer', people.editor),
    ]);
    // The loser is refused either by the last-owner rule (409, when both passed the role
    // check before either committed) or by the role check itself (403, when the winner
    // committed first): which one depends on timing, but never both succeed.
    const [won, lost] = [a.status, b.status].sort();
    expect(won).toBe(200);
    expect([403, 409]).toContain(lost);
    expect(await Membership.count({ where: { workspaceId: workspace.id, role: 'owner' } })).toBe(1);
  });

  it.each(['editor', 'reviewer', 'viewer'] as const)('a %s may not change roles (403)', async (role) => {
    const response = await changeRole(people.viewer, 'editor', people[role]).expect(403);
    expect(response.body.error.code).toBe('role-too-low');
    expect(await roleOf(people.viewer)).toBe('viewer');
  });

  it('refuses an unknown role and an unknown member', async () => {
    const bad = await changeRole(people.viewer, 'captain').expect(400);
    expect(bad.body.error.details.fields.role).toMatch(/viewer, reviewer, editor, owner/);
    const stranger = await createUser();
    expect((await changeRole(stranger, 'editor').expect(404)).body.error.code).toBe('member-not-found');
    expect(
      (
        await request(t.app)
          .patch(`/api/workspaces/${workspace.id}/members/not-an-id`)
          .set(as(owner))
          .send({ role: 'editor' })
          .expect(404)
      ).body.error.code,
    ).toBe('member-not-found');
  });
});

describe('removing and leaving', () => {
  it('an owner removes a member, who then no longer sees the workspace', async () => {
    await request(t.app).get(`/api/workspaces/${workspace.id}`).set(as(people.reviewer)).expect(200);
    const response = await remove(people.reviewer).expect(200);
    expect(response.body.data).toMatchObject({ removed: true, left: false });
    await request(t.app).get(`/api/workspaces/${workspace.id}`).set(as(people.reviewer)).expect(404);
    expect(await AuditEvent.findOne({ where: { workspaceId: workspace.id, action: 'member.removed' } })).toMatchObject({
      subjectId: people.reviewer.id,
      details: { role: 'reviewer' },
    });
  });

  it('a member who is not an owner may leave, but may not remove others', async () => {
    expect((await remove(people.editor, people.viewer).expect(403)).body.error.code).toBe('role-too-low');
    const left = await remove(people.viewer, people.viewer).expect(200);
    expect(left.body.data.left).toBe(true);
    expect(await roleOf(people.viewer)).toBeNull();
    expect(await AuditEvent.findOne({ where: { workspaceId: workspace.id, action: 'member.left' } })).toMatchObject({
      actorId: people.viewer.id,
    });
  });

  it('the last owner can neither leave nor be removed', async () => {
    expect((await remove(owner, owner).expect(409)).body.error.code).toBe('last-owner');
    await changeRole(people.editor, 'owner').expect(200);
    await remove(owner, people.editor).expect(200);
    expect((await remove(people.editor, people.editor).expect(409)).body.error.code).toBe('last-owner');
  });

  it('an outsider learns nothing (404)', async () => {
    const outsider = await createUser();
    await remove(people.viewer, outsider).expect(404);
    await changeRole(people.viewer, 'owner', outsider).expect(404);
  });
});
