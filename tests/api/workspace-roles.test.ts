import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/contract/roles';
import {
  bearer,
  createRoleFixture,
  createUser,
  createWorkspace,
  tokenFor,
  type RoleFixture,
} from './helpers/factories';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();
let fixture: RoleFixture;

beforeAll(async () => {
  fixture = await createRoleFixture();
});

interface GuardedRoute {
  name: string;
  call: (api: ReturnType<typeof request>, workspaceId: string) => request.Test;
  minimum: Role;
}

// Every route guarded by a workspace role so far, with the lowest role that may use it.
const routes: GuardedRoute[] = [
  { name: 'GET /api/workspaces/:ws', minimum: 'viewer', call: (api, ws) => api.get(`/api/workspaces/${ws}`) },
  {
    name: 'GET /api/workspaces/:ws/members',
    minimum: 'viewer',
    call: (api, ws) => api.get(`/api/workspaces/${ws}/members`),
  },
  {
    name: 'PATCH /api/workspaces/:ws',
    minimum: 'owner',
    call: (api, ws) => api.patch(`/api/workspaces/${ws}`).send({ name: 'Role matrix field' }),
  },
];

const ROLE_ORDER: Role[] = ['viewer', 'reviewer', 'editor', 'owner'];
const matrix = routes.flatMap((route) =>
  ROLE_ORDER.map((role) => ({
    route: route.name,
    role,
    allowed: ROLE_ORDER.indexOf(role) >= ROLE_ORDER.indexOf(route.minimum),
    call: route.call,
  })),
);

describe('the workspace role matrix', () => {
  it.each(matrix)('$route as $role: allowed=$allowed', async ({ role, allowed, call }) => {
    const token = tokenFor(fixture.members[role], t.config);
    const response = await call(request(t.app), fixture.workspace.id).set(bearer(token));
    if (allowed) {
      expect(response.status).toBe(200);
    } else {
      expect(response.status).toBe(403);
      expect(response.body.error).toMatchObject({ code: 'role-too-low', details: { role } });
    }
  });

  it.each(routes)('$name is 404 for a signed-in user who is not a member', async ({ call }) => {
    const response = await call(request(t.app), fixture.workspace.id).set(bearer(tokenFor(fixture.outsider, t.config)));
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('workspace-not-found');
  });

  it.each(routes)('$name is 404 for the owner of this workspace asking about another one', async ({ call }) => {
    const response = await call(request(t.app), fixture.otherWorkspace.id).set(
      bearer(tokenFor(fixture.members.owner, t.config)),
    );
    expect(response.status).toBe(404);
  });

  it.each(routes)(
    '$name is 404, the same answer, for a workspace that does not exist or an id that is not one',
    async ({ call }) => {
      const token = tokenFor(fixture.members.owner, t.config);
      for (const id of [randomUUID(), 'not-a-uuid', '1']) {
        const response = await call(request(t.app), id).set(bearer(token));
        expect(response.status).toBe(404);
        expect(response.body.error.code).toBe('workspace-not-found');
      }
    },
  );

  it.each(routes)('$name is 401 without a session', async ({ call }) => {
    expect((await call(request(t.app), fixture.workspace.id)).status).toBe(401);
  });
});

describe('workspace routes', () => {
  it("GET answers the workspace with the caller's own role", async () => {
    const response = await request(t.app)
      .get(`/api/workspaces/${fixture.workspace.id}`)
      .set(bearer(tokenFor(fixture.members.reviewer, t.config)))
      .expect(200);
    expect(response.body.data).toMatchObject({
      id: fixture.workspace.id,
      name: fixture.workspace.name,
      role: 'reviewer',
    });
  });

  it('members lists each member with their role, paginated', async () => {
    const token = tokenFor(fixture.members.viewer, t.config);
    const all = await request(t.app)
      .get(`/api/workspaces/${fixture.workspace.id}/members`)
      .set(bearer(token))
      .expect(200);
    expect(all.body.pagination).toEqual({ limit: 100, offset: 0, total: 4 });
    const roles = Object.fromEntries(
      all.body.data.map((member: { user: { id: string }; role: Role }) => [member.user.id, member.role]),
    );
    for (const role of ROLE_ORDER) expect(roles[fixture.members[role].id]).toBe(role);

    const page = await request(t.app)
      .get(`/api/workspaces/${fixture.workspace.id}/members?limit=2&offset=2`)
      .set(bearer(token))
      .expect(200);
    expect(page.body.data).toHaveLength(2);
    expect(page.body.data.map((m: { user: { id: string } }) => m.user.id)).toEqual(
      all.body.data.slice(2).map((m: { user: { id: string } }) => m.user.id),
    );
  });

  it('members refuses bad paging with field errors', async () => {
    const token = tokenFor(fixture.members.viewer, t.config);
    const response = await request(t.app)
      .get(`/api/workspaces/${fixture.workspace.id}/members?limit=0&offset=x`)
      .set(bearer(token))
      .expect(400);
    expect(Object.keys(response.body.error.details.fields).sort()).toEqual(['limit', 'offset']);
  });

  it('the owner renames the workspace; the new name shows in /api/me', async () => {
    const user = await createUser();
    const workspace = await createWorkspace({ owner: user, name: 'Old hangar' });
    const token = tokenFor(user, t.config);
    const response = await request(t.app)
      .patch(`/api/workspaces/${workspace.id}`)
      .set(bearer(token))
      .send({ name: '  North strip  ' })
      .expect(200);
    expect(response.body.data).toMatchObject({ name: 'North strip', role: 'owner' });
    const me = await request(t.app).get('/api/me').set(bearer(token)).expect(200);
    expect(me.body.data.workspaces).toEqual([{ id: workspace.id, name: 'North strip', role: 'owner' }]);
  });

  it('/api/me and /api/session answer the workspaces a page at a time, by name, with how many there are', async () => {
    const user = await createUser();
    for (const name of ['Curlew Bank', 'Avocet Flats', 'Bittern Reach']) await createWorkspace({ owner: user, name });
    const token = tokenFor(user, t.config);
    const first = await request(t.app).get('/api/me?limit=2').set(bearer(token)).expect(200);
    expect(first.body.data.workspaces.map((workspace: { name: string }) => workspace.name)).toEqual([
      'Avocet Flats',
      'Bittern Reach',
    ]);
    expect(first.body.pagination).toEqual({ limit: 2, offset: 0, total: 3 });
    const rest = await request(t.app).get('/api/me?limit=2&offset=2').set(bearer(token)).expect(200);
    expect(rest.body.data.workspaces.map((workspace: { name: string }) => workspace.name)).toEqual(['Curlew Bank']);
    const session = await request(t.app).get('/api/session').set(bearer(token)).expect(200);
    expect(session.body.data.workspaces).toHaveLength(3);
    expect(session.body.pagination).toEqual({ limit: 100, offset: 0, total: 3 });
    await request(t.app).get('/api/me?limit=201').set(bearer(token)).expect(400);
  });

  it('a rename with an empty name or an unknown field is refused and changes nothing', async () => {
    const token = tokenFor(fixture.members.owner, t.config);
    const url = `/api/workspaces/${fixture.workspace.id}`;
    const empty = await request(t.app).patch(url).set(bearer(token)).send({ name: ' ' }).expect(400);
    expect(empty.body.error.details.fields.name).toMatch(/name/);
    const unknown = await request(t.app).patch(url).set(bearer(token)).send({ nmae: 'Typo' }).expect(400);
    expect(unknown.body.error.details.fields).toEqual({ nmae: 'This field is not known here.' });
    const after = await request(t.app).get(url).set(bearer(token)).expect(200);
    expect(after.body.data.name).toBe('Role matrix field');
  });

  it('POST /api/workspaces makes the caller owner of a new workspace', async () => {
    const token = tokenFor(fixture.members.viewer, t.config);
    const created = await request(t.app)
      .post('/api/workspaces')
      .set(bearer(token))
      .send({ name: 'Viewer’s own field' })
      .expect(201);
    expect(created.body.data).toMatchObject({ name: 'Viewer’s own field', role: 'owner' });
    const me = await request(t.app).get('/api/me').set(bearer(token)).expect(200);
    expect(me.body.data.workspaces).toContainEqual({
      id: created.body.data.id,
      name: 'Viewer’s own field',
      role: 'owner',
    });
    expect(me.body.data.workspaces).toContainEqual({
      id: fixture.workspace.id,
      name: 'Role matrix field',
      role: 'viewer',
    });
  });

  it('POST /api/workspaces without a name is 400', async () => {
    const token = tokenFor(fixture.members.viewer, t.config);
    const response = await request(t.app).post('/api/workspaces').set(bearer(token)).send({}).expect(400);
    expect(response.body.error.details.fields.name).toBeDefined();
  });
});
