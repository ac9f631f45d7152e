import { DEFAULT_CLUB_RULES } from '@shared/rules/club-rules';
import { randomBytes } from 'node:crypto';
import request from 'supertest';
import { expect } from 'vitest';
import { signLinkToken } from '@api/auth/link-tokens';
import { Invitation, PasswordReset, Revision, Tag, type User } from '@api/models';
import type { Role } from '@shared/contract/roles';
import { CHECKLIST_IDS } from '@api/reviews/checklist';
import {
  addMember,
  bearer,
  createRoleFixture,
  createUser,
  createWorkspace,
  tokenFor,
  uniqueEmail,
  TEST_PASSWORD,
  type RoleFixture,
} from './helpers/factories';
import type { MailTestApp } from './helpers/mail';
import { TRAINER } from './models-support';

// A request for every route in api/routes/route-table.ts that succeeds for a caller
// allowed to make it, on a workspace with a member of each role, an outsider, and a
// record of each kind. Used by the generated authorization test and the fuzz tests.
// Samples make fresh records where a call uses one up (a member removed, a tag taken off).

export type Caller = Role | 'outsider' | 'anonymous';
export const CALLERS: Caller[] = ['owner', 'editor', 'reviewer', 'viewer', 'outsider', 'anonymous'];

export interface Upload {
  file: Buffer;
  name: string;
  type: string;
  fields?: Record<string, string>;
}

export interface Call {
  url: string;
  body?: object;
  upload?: Upload;
}

export type Sample = (caller: Caller) => Promise<Call>;

export interface SampleWorld {
  roles: RoleFixture;
  modelId: string;
  firstRevisionId: string;
  secondRevisionId: string;
  receiverId: string;
  reviewId: string;
  samples: Record<string, Sample>;
  /** A link token for an invitation to this address, into the given workspace or a new one of a stranger's. */
  invitationToken(email: string, workspaceId?: string): Promise<string>;
  userOf(caller: Caller): User | null;
  /** Bearer headers made from the stored user at each call, so ended sessions do not spoil the next call. */
  headersOf(caller: Caller): Promise<Record<string, string>>;
  send(method: string, call: Call, caller: Caller): Promise<request.Response>;
}

const fresh = (label: string) => `${label}-${randomBytes(3).toString('hex')}`;
const latestNumber = async (modelId: string) =>
  (await Revision.max<number, Revision>('number', { where: { modelId } })) ?? 0;

export function binary(test: request.Test): request.Test {
  return test.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (chunk: Buffer) => chunks.push(chunk));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}

export async function buildSampleWorld(t: MailTestApp): Promise<SampleWorld> {
  const roles = await createRoleFixture();
  const userOf = (caller: Caller): User | null =>
    caller === 'anonymous' ? null : caller === 'outsider' ? roles.outsider : roles.members[caller];
  const headersOf = async (caller: Caller): Promise<Record<string, string>> => {
    const user = userOf(caller);
    if (!user) return {};
    await user.reload();
    return bearer(tokenFor(user, t.config));
  };
  const send = async (method: string, call: Call, caller: Caller): Promise<request.Response> => {
    const verb = method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
    const agent = request(t.app);
    let test = agent[verb](call.url).set(await headersOf(caller));
    if (call.upload) {
      for (const [key, value] of Object.entries(call.upload.fields ?? {})) test = test.field(key, value);
      return test.attach('file', call.upload.file, { filename: call.upload.name, contentType: call.upload.type });
    }
    return call.body === undefined ? test : test.send(call.body);
  };
  const asOwner = async (method: 'get' | 'post', url: string, body?: object): Promise<request.Response> => {
    const response = await send(method, { url, body }, 'owner');
    expect(response.status, `${method} ${url} as owner: ${JSON.stringify(response.body)}`).toBeLessThan(300);
    return response;
  };

  const ws = roles.workspace.id;
  const ownWorkspace = {} as Record<Exclude<Caller, 'anonymous'>, string>;
  for (const role of ['owner', 'editor', 'reviewer', 'viewer'] as const)
    ownWorkspace[role] = (await createWorkspace({ name: `${role}'s own`, owner: roles.members[role] })).id;
  ownWorkspace.outsider = roles.otherWorkspace.id;

  const freshModel = async (): Promise<{ id: string; revisionId: string }> => {
    const { model, revision } = (
      await asOwner('post', `/api/workspaces/${ws}/models`, { name: fresh('Sample'), yaml: TRAINER() })
    ).body.data;
    return { id: model.id, revisionId: revision.id };
  };
  const freshReceiver = async (): Promise<string> =>
    (await asOwner('post', `/api/workspaces/${ws}/receivers`, { label: fresh('Unit'), outputs: 8 })).body.data.id;
  const installedReceiver = async (): Promise<string> => {
    const unit = await freshReceiver();
    await asOwner('post', `/api/receivers/${unit}/install`, { model: (await freshModel()).id, slot: 'cabin' });
    return unit;
  };
  const freshMember = async (): Promise<string> => {
    const user = await createUser({ email: uniqueEmail('member') });
    await addMember(roles.workspace, user, 'viewer');
    return user.id;
  };
  const invitationToken = async (email: string, workspaceId?: string): Promise<string> => {
    const inviter = workspaceId ? roles.members.owner : await createUser();
    const workspace = workspaceId ?? (await createWorkspace({ name: fresh('Inviting'), owner: inviter })).id;
    const invitation = await Invitation.create({
      workspaceId: workspace,
      email,
      role: 'viewer',
      invitedBy: inviter.id,
      expiresAt: new Date(Date.now() + 86_400_000),
    });
    return signLinkToken('invitation', invitation.id, invitation.expiresAt, t.config);
  };
  const resetToken = async (): Promise<string> => {
    const reset = await PasswordReset.create({
      userId: (await createUser()).id,
      expiresAt: new Date(Date.now() + 3_600_000),
    });
    return signLinkToken('password-reset', reset.id, reset.expiresAt, t.config);
  };

  const model = await freshModel();
  const modelId = model.id;
  // A fork whose source gets a new revision before each merge, so every merge has something to take in.
  const forkSource = await freshModel();
  const forkId = (
    await asOwner('post', `/api/models/${forkSource.id}/fork`, { number: 1, workspace: ws, name: fresh('Fork') })
  ).body.data.model.id as string;
  let sourceEdits = 0;
  const firstRevisionId = model.revisionId;
  const secondRevisionId: string = (
    await asOwner('post', `/api/models/${modelId}/revisions`, {
      base: 1,
      yaml: TRAINER().replace('Meadowlark 40', 'Meadowlark 40 mk2'),
      message: 'Second',
    })
  ).body.data.id;
  const receiverId = await freshReceiver();
  const reviewId: string = (
    await asOwner('post', `/api/revisions/${secondRevisionId}/reviews`, { reviewers: [roles.members.reviewer.id] })
  ).body.data.id;
  /** A thread on the second revision, resolved when asked, so resolve and reopen each have one to act on. */
  const freshThread = async (resolved = false): Promise<string> => {
    const id: string = (await asOwner('post', `/api/reviews/${reviewId}/comments`, { body: fresh('A thread') })).body
      .data.id;
    if (resolved) await asOwner('post', `/api/comments/${id}/resolve`, {});
    return id;
  };
  const bundle = (
    await binary(
      request(t.app)
        .get(`/api/models/${modelId}/export.git`)
        .set(await headersOf('owner')),
    ).expect(200)
  ).body as Buffer;
  // Queued only: no import worker runs here, the job routes just read it.
  const importJobId: string = (
    await request(t.app)
      .post(`/api/workspaces/${ws}/import`)
      .set(await headersOf('owner'))
      .attach('file', bundle, { filename: 'history.bundle', contentType: 'application/octet-stream' })
      .expect(202)
  ).body.data.id;

  const samples: Record<string, Sample> = {
    'GET /api/health': async () => ({ url: '/api/health' }),
    'POST /api/check': async () => ({ url: '/api/check', body: { yaml: TRAINER() } }),
    'GET /api/schema/setup-1.json': async () => ({ url: '/api/schema/setup-1.json' }),

    'POST /api/auth/sign-up': async () => ({
      url: '/api/auth/sign-up',
      body: { email: uniqueEmail('new'), name: 'New Pilot', password: TEST_PASSWORD },
    }),
    'POST /api/auth/sign-in': async () => ({
      url: '/api/auth/sign-in',
      body: { email: (await createUser()).email, password: TEST_PASSWORD },
    }),
    'POST /api/auth/sign-out': async () => ({ url: '/api/auth/sign-out' }),
    'POST /api/auth/sign-out-everywhere': async () => ({ url: '/api/auth/sign-out-everywhere' }),
    'POST /api/auth/password': async () => ({
      url: '/api/auth/password',
      body: { current: TEST_PASSWORD, password: TEST_PASSWORD },
    }),
    'POST /api/auth/password-reset': async () => ({
      url: '/api/auth/password-reset',
      body: { email: uniqueEmail('lost') },
    }),
    'GET /api/auth/password-reset/:token': async () => ({ url: `/api/auth/password-reset/${await resetToken()}` }),
    'POST /api/auth/password-reset/:token': async () => ({
      url: `/api/auth/password-reset/${await resetToken()}`,
      body: { password: 'a-brand-new-password' },
    }),
    'GET /api/me': async () => ({ url: '/api/me' }),
    'GET /api/session': async () => ({ url: '/api/session' }),

    'POST /api/workspaces': async () => ({ url: '/api/workspaces', body: { name: fresh('Field') } }),
    'GET /api/workspaces/:ws': async () => ({ url: `/api/workspaces/${ws}` }),
    'PATCH /api/workspaces/:ws': async () => ({ url: `/api/workspaces/${ws}`, body: { name: 'Role matrix field' } }),
    'GET /api/workspaces/:ws/members': async () => ({ url: `/api/workspaces/${ws}/members` }),
    'PATCH /api/workspaces/:ws/members/:userId': async () => ({
      url: `/api/workspaces/${ws}/members/${await freshMember()}`,
      body: { role: 'reviewer' },
    }),
    'DELETE /api/workspaces/:ws/members/:userId': async () => ({
      url: `/api/workspaces/${ws}/members/${await freshMember()}`,
    }),
    'GET /api/workspaces/:ws/invitations': async () => ({ url: `/api/workspaces/${ws}/invitations` }),
    'POST /api/workspaces/:ws/invitations': async () => ({
      url: `/api/workspaces/${ws}/invitations`,
      body: { email: uniqueEmail('invitee'), role: 'viewer' },
    }),
    'DELETE /api/workspaces/:ws/invitations/:id': async () => {
      const invitation = (
        await asOwner('post', `/api/workspaces/${ws}/invitations`, { email: uniqueEmail('revoked'), role: 'viewer' })
      ).body.data;
      return { url: `/api/workspaces/${ws}/invitations/${invitation.id}` };
    },
    'GET /api/invitations/:token': async () => ({
      url: `/api/invitations/${await invitationToken(uniqueEmail('look'))}`,
    }),
    'POST /api/invitations/:token/accept': async (caller) => {
      const user = userOf(caller);
      if (!user)
        return {
          url: `/api/invitations/${await invitationToken(uniqueEmail('joiner'))}/accept`,
          body: { name: 'Joiner', password: TEST_PASSWORD },
        };
      return { url: `/api/invitations/${await invitationToken(user.email)}/accept` };
    },
    'GET /api/workspaces/:ws/audit': async () => ({ url: `/api/workspaces/${ws}/audit` }),
    'GET /api/outbox': async () => ({ url: '/api/outbox' }),

    'GET /api/workspaces/:ws/models': async () => ({ url: `/api/workspaces/${ws}/models` }),
    'POST /api/workspaces/:ws/models': async () => ({
      url: `/api/workspaces/${ws}/models`,
      body: { name: fresh('Created') },
    }),
    'POST /api/workspaces/:ws/models/upload': async () => ({
      url: `/api/workspaces/${ws}/models/upload`,
      upload: { file: Buffer.from(TRAINER()), name: 'trainer.yaml', type: 'application/yaml' },
    }),
    'GET /api/models/:id': async () => ({ url: `/api/models/${modelId}` }),
    'PATCH /api/models/:id': async () => ({ url: `/api/models/${modelId}`, body: { name: 'Matrix trainer' } }),
    'POST /api/models/:id/archive': async () => ({ url: `/api/models/${modelId}/archive` }),
    'POST /api/models/:id/unarchive': async () => ({ url: `/api/models/${modelId}/unarchive` }),
    'POST /api/models/:id/fork': async (caller) => ({
      url: `/api/models/${modelId}/fork`,
      body: { number: 1, workspace: caller === 'anonymous' ? ws : ownWorkspace[caller], name: fresh('Fork') },
    }),
    'POST /api/models/:id/upload': async () => ({
      url: `/api/models/${modelId}/upload`,
      upload: {
        file: Buffer.from(TRAINER()),
        name: 'trainer.yaml',
        type: 'application/yaml',
        fields: { base: String(await latestNumber(modelId)) },
      },
    }),
    'POST /api/models/:id/revisions': async () => ({
      url: `/api/models/${modelId}/revisions`,
      body: { base: await latestNumber(modelId), yaml: TRAINER(), message: 'Matrix save' },
    }),
    'GET /api/models/:id/revisions': async () => ({ url: `/api/models/${modelId}/revisions` }),
    'GET /api/models/:id/provenance': async () => ({ url: `/api/models/${modelId}/provenance` }),
    'GET /api/models/:id/provenance/history': async () => ({
      url: `/api/models/${modelId}/provenance/history?path=${encodeURIComponent('model.name')}`,
    }),
    'GET /api/models/:id/source-updates': async () => ({ url: `/api/models/${forkId}/source-updates` }),
    'POST /api/models/:id/source-updates': async () => {
      sourceEdits += 1;
      await asOwner('post', `/api/models/${forkSource.id}/revisions`, {
        base: await latestNumber(forkSource.id),
        yaml: TRAINER().replace('expo: 30,', `expo: ${30 + sourceEdits},`),
      });
      return { url: `/api/models/${forkId}/source-updates`, body: { base: await latestNumber(forkId) } };
    },
    'GET /api/workspaces/:ws/rules': async () => ({ url: `/api/workspaces/${ws}/rules` }),
    'PUT /api/workspaces/:ws/rules': async () => ({
      url: `/api/workspaces/${ws}/rules`,
      body: { severities: { 'telemetry-none': 'warning' }, approvals: DEFAULT_CLUB_RULES.approvals },
    }),
    'GET /api/models/:id/revisions/:number': async () => ({ url: `/api/models/${modelId}/revisions/1` }),
    'POST /api/models/:id/revert': async () => ({
      url: `/api/models/${modelId}/revert`,
      body: { number: 1, base: await latestNumber(modelId) },
    }),
    'GET /api/revisions/:id': async () => ({ url: `/api/revisions/${firstRevisionId}` }),
    'POST /api/revisions/:id/tags': async () => ({
      url: `/api/revisions/${firstRevisionId}/tags`,
      body: { name: fresh('tag') },
    }),
    'DELETE /api/revisions/:id/tags/:name': async () => {
      const name = fresh('gone');
      await Tag.create({ modelId, revisionId: firstRevisionId, name, createdBy: roles.members.owner.id });
      return { url: `/api/revisions/${firstRevisionId}/tags/${name}` };
    },
    'GET /api/revisions/:id/patch': async () => ({
      url: `/api/revisions/${secondRevisionId}/patch?from=${firstRevisionId}`,
    }),
    'GET /api/compare': async () => ({ url: `/api/compare?from=${firstRevisionId}&to=${secondRevisionId}` }),
    'GET /api/compare/text': async () => ({ url: `/api/compare/text?from=${firstRevisionId}&to=${secondRevisionId}` }),
    'GET /api/revisions/:id/field-sheet': async () => ({ url: `/api/revisions/${secondRevisionId}/field-sheet` }),
    'GET /api/revisions/:id/field-sheet.pdf': async () => ({
      url: `/api/revisions/${secondRevisionId}/field-sheet.pdf`,
    }),
    'GET /api/models/:id/export.git': async () => ({ url: `/api/models/${modelId}/export.git` }),
    'GET /api/workspaces/:ws/export.git': async () => ({ url: `/api/workspaces/${ws}/export.git` }),
    'POST /api/workspaces/:ws/import': async () => ({
      url: `/api/workspaces/${ws}/import`,
      upload: { file: bundle, name: 'history.bundle', type: 'application/octet-stream' },
    }),
    'GET /api/workspaces/:ws/imports': async () => ({ url: `/api/workspaces/${ws}/imports` }),
    'GET /api/workspaces/:ws/imports/:id': async () => ({ url: `/api/workspaces/${ws}/imports/${importJobId}` }),

    'POST /api/revisions/:id/reviews': async () => ({
      url: `/api/revisions/${(await freshModel()).revisionId}/reviews`,
      body: { reviewers: [roles.members.reviewer.id] },
    }),
    'GET /api/workspaces/:ws/reviews': async () => ({ url: `/api/workspaces/${ws}/reviews` }),
    'GET /api/models/:id/reviews': async () => ({ url: `/api/models/${modelId}/reviews` }),
    'GET /api/reviews/:id': async () => ({ url: `/api/reviews/${reviewId}` }),
    'POST /api/reviews/:id/verdicts': async () => ({
      url: `/api/reviews/${reviewId}/verdicts`,
      body: { verdict: 'comment', body: 'Looked at the throws.' },
    }),
    'POST /api/reviews/:id/checklist': async () => ({
      url: `/api/reviews/${reviewId}/checklist`,
      body: { item: CHECKLIST_IDS[0], ticked: true },
    }),
    'POST /api/reviews/:id/comments': async () => ({
      url: `/api/reviews/${reviewId}/comments`,
      body: { body: 'Check the aileron direction.' },
    }),
    'POST /api/revisions/:id/comments': async () => ({
      url: `/api/revisions/${secondRevisionId}/comments`,
      body: { path: 'channels[ch=1]', body: 'Aileron direction checked?' },
    }),
    'GET /api/revisions/:id/comments': async () => ({ url: `/api/revisions/${secondRevisionId}/comments` }),
    'POST /api/comments/:id/replies': async () => ({
      url: `/api/comments/${await freshThread()}/replies`,
      body: { body: 'Checked on the bench.' },
    }),
    'POST /api/comments/:id/resolve': async () => ({ url: `/api/comments/${await freshThread()}/resolve`, body: {} }),
    'POST /api/comments/:id/reopen': async () => ({
      url: `/api/comments/${await freshThread(true)}/reopen`,
      body: {},
    }),

    'GET /api/workspaces/:ws/receivers': async () => ({ url: `/api/workspaces/${ws}/receivers` }),
    'POST /api/workspaces/:ws/receivers': async () => ({
      url: `/api/workspaces/${ws}/receivers`,
      body: { label: fresh('Shelf unit'), outputs: 8 },
    }),
    'GET /api/receivers/:id': async () => ({ url: `/api/receivers/${receiverId}` }),
    'PATCH /api/receivers/:id': async () => ({
      url: `/api/receivers/${receiverId}`,
      body: { notes: 'Checked on the bench.' },
    }),
    'GET /api/receivers/:id/reuse-check': async () => ({
      url: `/api/receivers/${receiverId}/reuse-check?model=${modelId}&slot=cabin`,
    }),
    'POST /api/receivers/:id/install': async () => ({
      url: `/api/receivers/${await freshReceiver()}/install`,
      body: { model: (await freshModel()).id, slot: 'cabin' },
    }),
    'POST /api/receivers/:id/remove': async () => ({ url: `/api/receivers/${await installedReceiver()}/remove` }),
    'POST /api/receivers/:id/apply': async () => ({
      url: `/api/receivers/${await installedReceiver()}/apply`,
      body: {},
    }),
    'GET /api/receivers/:id/history': async () => ({ url: `/api/receivers/${receiverId}/history` }),
  };

  return {
    roles,
    modelId,
    firstRevisionId,
    secondRevisionId,
    receiverId,
    reviewId,
    samples,
    invitationToken,
    userOf,
    headersOf,
    send,
  };
}
