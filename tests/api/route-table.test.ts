import { beforeAll, describe, expect, it } from 'vitest';
import { roleAtLeast } from '@shared/contract/roles';
import { registeredRoutes, ROUTE_TABLE, routeKey, type Access } from '@api/routes/route-table';
import { uniqueEmail } from './helpers/factories';
import { mailTo, useMailTestApp } from './helpers/mail';
import { buildSampleWorld, CALLERS, type Caller, type SampleWorld } from './route-table-samples';

// Generated from api/routes/route-table.ts: every route, called as each role of the
// workspace that owns the record, as a member of another workspace only, and signed
// out. The samples (route-table-samples.ts) build a request for each route that
// succeeds for a caller allowed to make it.

const t = useMailTestApp();
let world: SampleWorld;

beforeAll(async () => {
  world = await buildSampleWorld(t);
});

function expectedFor(access: Access, caller: Caller): 'success' | 401 | 403 | 404 {
  if (access === 'public') return 'success';
  if (caller === 'anonymous') return 401;
  if (access === 'signed-in') return 'success';
  if (caller === 'outsider') return 404;
  return roleAtLeast(caller, access) ? 'success' : 403;
}

describe('the route table', () => {
  it('names every route the app has registered, and no route it has not', () => {
    const registered = registeredRoutes(t.app as never)
      .map(routeKey)
      .sort();
    const listed = ROUTE_TABLE.map(routeKey).sort();
    expect(new Set(listed).size, 'a route is listed twice').toBe(listed.length);
    expect(
      registered.filter((key) => !listed.includes(key)),
      'registered routes missing from api/routes/route-table.ts',
    ).toEqual([]);
    expect(
      listed.filter((key) => !registered.includes(key)),
      'table entries that name no registered route',
    ).toEqual([]);
  });

  it('has a request sample for every entry, so every route is called below', () => {
    expect(ROUTE_TABLE.map(routeKey).filter((key) => !world.samples[key])).toEqual([]);
  });
});

describe.each(ROUTE_TABLE.map((entry) => [routeKey(entry), entry] as const))('%s', (key, entry) => {
  it(`allows ${entry.access} and above, and refuses everyone else`, async () => {
    const sample = world.samples[key];
    expect(sample, `no sample for ${key}`).toBeDefined();
    for (const caller of CALLERS) {
      const response = await world.send(entry.method, await sample(caller), caller);
      const expected = expectedFor(entry.access, caller);
      const what = `${key} as ${caller} answered ${response.status} ${JSON.stringify(response.body?.error ?? '')}`;
      if (expected === 'success') {
        expect(response.status, what).toBeGreaterThanOrEqual(200);
        expect(response.status, what).toBeLessThan(300);
      } else {
        expect(response.status, what).toBe(expected);
      }
    }
  });
});

// Two routes where the role is not the whole answer: the outbox shows each account only
// its own mail, and an invitation is accepted only under the invited address.
const SIGNED_IN = CALLERS.filter((caller) => caller !== 'anonymous');

describe('beyond the role: GET /api/outbox', () => {
  it("shows every signed-in caller only mail to their own address, never another address's", async () => {
    const stranger = uniqueEmail('stranger');
    const invitations = `/api/workspaces/${world.roles.workspace.id}/invitations`;
    const invited = await world.send('POST', { url: invitations, body: { email: stranger, role: 'viewer' } }, 'owner');
    expect(invited.status).toBe(201);
    for (const caller of SIGNED_IN) {
      const body = { email: world.userOf(caller)!.email };
      expect((await world.send('POST', { url: '/api/auth/password-reset', body }, 'anonymous')).status).toBe(202);
    }
    // The stranger's invitation and every reset went through SMTP before anyone looks.
    expect(await mailTo(stranger)).not.toHaveLength(0);

    for (const caller of SIGNED_IN) {
      const email = world.userOf(caller)!.email.toLowerCase();
      const response = await world.send('GET', { url: '/api/outbox?limit=100' }, caller);
      expect(response.status, `outbox as ${caller}`).toBe(200);
      const messages: { to: string[]; subject: string }[] = response.body.data;
      expect(messages.length, `${caller} sees their own reset mail`).toBeGreaterThan(0);
      for (const message of messages) expect(message.to, `${caller} saw "${message.subject}"`).toContain(email);
      expect(messages.flatMap((message) => message.to)).not.toContain(stranger.toLowerCase());
    }
  });
});

describe('beyond the role: POST /api/invitations/:token/accept', () => {
  it('answers 403 wrong-account to a signed-in account with another address, whatever its role', async () => {
    for (const caller of SIGNED_IN) {
      const token = await world.invitationToken(uniqueEmail('someone-else'), world.roles.workspace.id);
      const response = await world.send('POST', { url: `/api/invitations/${token}/accept` }, caller);
      expect(response.status, `accept as ${caller}`).toBe(403);
      expect(response.body.error.code).toBe('wrong-account');
    }
  });
});
