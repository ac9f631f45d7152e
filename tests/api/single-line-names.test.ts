import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { User, Workspace } from '@api/models';
import { bearer, createUser, tokenFor, uniqueEmail } from './helpers/factories';
import { useTestApp } from './helpers/test-app';

// NUL was stored altered, and CR/LF in a name reached mail subjects (issue 12): every
// single-line name field refuses control characters with the same clear 400.
const t = useTestApp();
let pilot: User;

beforeAll(async () => {
  pilot = await createUser({ email: uniqueEmail('names') });
});

const BAD = ['Nul\u0000Byte', 'Two\r\nLines', 'Bell\u0007', 'Tab\there'];

describe('single-line names', () => {
  it.each(BAD)('refuses %j as a user, workspace or model name, and stores nothing', async (name) => {
    const signUp = await request(t.app)
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail('bad'), name, password: 'a-long-enough-password' })
      .expect(400);
    expect(signUp.body.error.details.fields.name).toMatch(/one line of plain text/);

    const workspaces = await Workspace.count();
    const created = await request(t.app)
      .post('/api/workspaces')
      .set(bearer(tokenFor(pilot, t.config)))
      .send({ name })
      .expect(400);
    expect(created.body.error.details.fields.name).toMatch(/one line of plain text/);
    expect(await Workspace.count()).toBe(workspaces);
    expect(await User.count({ where: { name } })).toBe(0);
  });

  it('still accepts ordinary names with accents and punctuation', async () => {
    await request(t.app)
      .post('/api/workspaces')
      .set(bearer(tokenFor(pilot, t.config)))
      .send({ name: 'Côte-d’Or Flyers (Thursday)' })
      .expect(201);
  });
});
