import { beforeAll, describe, expect, it } from 'vitest';
import { createModel } from '@api/commands/create-model';
import { saveRevision } from '@api/commands/save-revision';
import { tagRevision } from '@api/commands/tag-revision';
import { Workspace } from '@api/models';
import type { Role } from '@shared/contract/roles';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, GLIDER, TRAINER, type Client } from './models-support';

const t = useTestApp();
let roles: RoleFixture;

beforeAll(async () => {
  roles = await createRoleFixture();
});

interface Subject {
  workspaceId: string;
  modelId: string;
  /** revision 1, tagged "maiden" */
  firstId: string;
  /** revision 2, the latest */
  latestId: string;
}

// A fresh model with two revisions for every call, so each write has a valid base.
async function freshSubject(): Promise<Subject> {
  const workspace = (await Workspace.findByPk(roles.workspace.id))!;
  const { model, revision } = await createModel(t.sequelize, {
    workspace,
    author: roles.members.editor,
    name: 'Role matrix model',
    yaml: TRAINER(),
  });
  const latest = await saveRevision(t.sequelize, {
    modelId: model.id,
    author: roles.members.editor,
    base: 1,
    yaml: GLIDER(),
  });
  await tagRevision(t.sequelize, { model, revision, author: roles.members.editor, name: 'maiden' });
  return { workspaceId: workspace.id, modelId: model.id, firstId: revision.id, latestId: latest.id };
}

interface GuardedRoute {
  name: string;
  minimum: Role;
  call: (client: Client, subject: Subject) => ReturnType<Client['get']>;
}

const routes: GuardedRoute[] = [
  {
    name: 'GET /api/workspaces/:ws/models',
    minimum: 'viewer',
    call: (c, s) => c.get(`/api/workspaces/${s.workspaceId}/models`),
  },
  { name: 'GET /api/models/:id', minimum: 'viewer', call: (c, s) => c.get(`/api/models/${s.modelId}`) },
  {
    name: 'GET /api/models/:id/revisions',
    minimum: 'viewer',
    call: (c, s) => c.get(`/api/models/${s.modelId}/revisions`),
  },
  {
    name: 'GET /api/models/:id/revisions/:number',
    minimum: 'viewer',
    call: (c, s) => c.get(`/api/models/${s.modelId}/revisions/1`),
  },
  { name: 'GET /api/revisions/:id', minimum: 'viewer', call: (c, s) => c.get(`/api/revisions/${s.latestId}`) },
  {
    name: 'GET /api/revisions/:id?format=yaml',
    minimum: 'viewer',
    call: (c, s) => c.get(`/api/revisions/${s.latestId}?format=yaml&download=1`),
  },
  {
    name: 'GET /api/revisions/:id/patch',
    minimum: 'viewer',
    call: (c, s) => c.get(`/api/revisions/${s.latestId}/patch?from=${s.firstId}`),
  },
  {
    name: 'GET /api/compare',
    minimum: 'viewer',
    call: (c, s) => c.get(`/api/compare?from=${s.firstId}&to=${s.latestId}`),
  },
  {
    name: 'POST /api/workspaces/:ws/models',
    minimum: 'editor',
    call: (c, s) => c.post(`/api/workspaces/${s.workspaceId}/models`, { name: 'New' }),
  },
  {
    name: 'POST /api/workspaces/:ws/models/upload',
    minimum: 'editor',
    call: (c, s) => c.upload(`/api/workspaces/${s.workspaceId}/models/upload`, TRAINER(), {}),
  },
  {
    name: 'PATCH /api/models/:id',
    minimum: 'editor',
    call: (c, s) => c.patch(`/api/models/${s.modelId}`, { name: 'Renamed' }),
  },
  {
    name: 'POST /api/models/:id/archive',
    minimum: 'editor',
    call: (c, s) => c.post(`/api/models/${s.modelId}/archive`),
  },
  {
    name: 'POST /api/models/:id/unarchive',
    minimum: 'editor',
    call: (c, s) => c.post(`/api/models/${s.modelId}/unarchive`),
  },
  {
    name: 'POST /api/models/:id/revisions',
    minimum: 'editor',
    call: (c, s) => c.post(`/api/models/${s.modelId}/revisions`, { base: 2, yaml: TRAINER() }),
  },
  {
    name: 'POST /api/models/:id/upload',
    minimum: 'editor',
    call: (c, s) => c.upload(`/api/models/${s.modelId}/upload`, TRAINER(), {}, { base: 2 }),
  },
  {
    name: 'POST /api/models/:id/revert',
    minimum: 'editor',
    call: (c, s) => c.post(`/api/models/${s.modelId}/revert`, { number: 1, base: 2 }),
  },
  {
    name: 'POST /api/models/:id/fork',
    minimum: 'editor',
    call: (c, s) => c.post(`/api/models/${s.modelId}/fork`, { number: 1, workspace: s.workspaceId }),
  },
  {
    name: 'POST /api/revisions/:id/tags',
    minimum: 'editor',
    call: (c, s) => c.post(`/api/revisions/${s.latestId}/tags`, { name: 'season-2026' }),
  },
  {
    name: 'DELETE /api/revisions/:id/tags/:name',
    minimum: 'editor',
    call: (c, s) => c.delete(`/api/revisions/${s.firstId}/tags/maiden`),
  },
  {
    name: 'GET /api/workspaces/:ws/audit',
    minimum: 'owner',
    call: (c, s) => c.get(`/api/workspaces/${s.workspaceId}/audit`),
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

describe('the role matrix of models and revisions', () => {
  it.each(matrix)('$route as $role: allowed=$allowed', async ({ role, allowed, call }) => {
    const subject = await freshSubject();
    const response = await call(clientFor(t.app, t.config, roles.members[role]), subject);
    if (allowed) {
      expect([200, 201], JSON.stringify(response.body)).toContain(response.status);
    } else {
      expect(response.status).toBe(403);
      expect(response.body.error).toMatchObject({ code: 'role-too-low', details: { role } });
    }
  });

  it.each(routes)('$name is 404 for a signed-in user of another workspace', async ({ call }) => {
    const subject = await freshSubject();
    const response = await call(clientFor(t.app, t.config, roles.outsider), subject);
    expect(response.status).toBe(404);
    expect(response.body.error.code).toMatch(/^(model|revision|workspace)-not-found$/);
  });

  it.each(routes)('$name is 401 without a session', async ({ call }) => {
    const subject = await freshSubject();
    const anonymous = { ...clientFor(t.app, t.config, roles.members.owner) };
    const response = await call(anonymous, subject).unset('Authorization');
    expect(response.status).toBe(401);
  });
});
