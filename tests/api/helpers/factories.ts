import { randomBytes } from 'node:crypto';
import type { Express } from 'express';
import request from 'supertest';
import { hashPassword } from '@api/auth/passwords';
import { signSession } from '@api/auth/tokens';
import type { AppConfig } from '@api/config';
import { Membership, User, Workspace } from '@api/models';
import type { Role } from '@shared/contract/roles';

export const TEST_PASSWORD = 'runway-lights-4021';

// bcrypt at cost 12 takes a noticeable moment; users made with the default password
// share one hash so a file can make dozens of them.
let defaultHash: Promise<string> | null = null;
const hashFor = (password: string) =>
  password === TEST_PASSWORD ? (defaultHash ??= hashPassword(TEST_PASSWORD)) : hashPassword(password);

export const uniqueEmail = (label = 'pilot') => `${label}-${randomBytes(5).toString('hex')}@test.example`;

export async function createUser(fields: { email?: string; name?: string; password?: string } = {}): Promise<User> {
  return User.create({
    email: fields.email ?? uniqueEmail(),
    name: fields.name ?? 'Test Pilot',
    passwordHash: await hashFor(fields.password ?? TEST_PASSWORD),
  });
}

export async function createWorkspace(fields: { name?: string; owner?: User } = {}): Promise<Workspace> {
  const workspace = await Workspace.create({ name: fields.name ?? `Field ${randomBytes(3).toString('hex')}` });
  if (fields.owner) await addMember(workspace, fields.owner, 'owner');
  return workspace;
}

export function addMember(workspace: Workspace, user: User, role: Role): Promise<Membership> {
  return Membership.create({ workspaceId: workspace.id, userId: user.id, role });
}

/** A valid session token without going through sign-in (no bcrypt, no rate limit). */
export function tokenFor(user: User, config: AppConfig): string {
  return signSession(user, config);
}

export const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

/** Signs in over HTTP; answers the token and the session cookie as sent by the server. */
export async function signIn(
  app: Express,
  email: string,
  password = TEST_PASSWORD,
): Promise<{ token: string; cookie: string }> {
  const response = await request(app).post('/api/auth/sign-in').send({ email, password }).expect(200);
  const setCookie = ([] as string[]).concat(response.headers['set-cookie'] ?? []);
  return { token: response.body.data.token, cookie: setCookie[0].split(';')[0] };
}

export interface RoleFixture {
  workspace: Workspace;
  /** one member per role */
  members: Record<Role, User>;
  /** a user who is a member only of `otherWorkspace` */
  outsider: User;
  otherWorkspace: Workspace;
}

/** A workspace with a member of each role, and an outsider with a workspace of their own. */
export async function createRoleFixture(): Promise<RoleFixture> {
  const workspace = await createWorkspace({ name: 'Role matrix field' });
  const roles: Role[] = ['owner', 'editor', 'reviewer', 'viewer'];
  const members = {} as Record<Role, User>;
  for (const role of roles) {
    members[role] = await createUser({ email: uniqueEmail(role), name: `The ${role}` });
    await addMember(workspace, members[role], role);
  }
  const outsider = await createUser({ email: uniqueEmail('outsider'), name: 'Outsider' });
  const otherWorkspace = await createWorkspace({ name: 'Elsewhere', owner: outsider });
  return { workspace, members, outsider, otherWorkspace };
}
