import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Revision, SetupModel, type User } from '@api/models';
import { safeDownloadName } from '@api/security/content-disposition';
import { parseCorsOrigins } from '@api/security/cors';
import { addMember, bearer, createUser, createWorkspace, signIn, TEST_PASSWORD, tokenFor } from './helpers/factories';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();
const HOST = 'bindery.test';
const OWN_ORIGIN = `http://${HOST}`;
const FOREIGN_ORIGIN = 'http://evil.example';

let workspaceId: string;
let editor: User;
let cookie: string;

beforeAll(async () => {
  editor = await createUser({ name: 'Form Poster' });
  const workspace = await createWorkspace({ name: 'CSRF field' });
  await addMember(workspace, editor, 'editor');
  workspaceId = workspace.id;
  cookie = (await signIn(t.app, editor.email)).cookie;
});

const modelCount = () => SetupModel.count({ where: { workspaceId } });

describe('cross-site request forgery', () => {
  it('refuses a cross-site form post that carries the session cookie, and stores nothing', async () => {
    const before = await modelCount();
    const response = await request(t.app)
      .post(`/api/workspaces/${workspaceId}/models`)
      .set('Host', HOST)
      .set('Cookie', cookie)
      .set('Origin', FOREIGN_ORIGIN)
      .type('form')
      .send('name=Planted+model')
      .expect(403);
    expect(response.body.error).toMatchObject({ code: 'csrf-refused', details: { origin: FOREIGN_ORIGIN } });
    expect(await modelCount()).toBe(before);
  });

  it('refuses a multipart form from another site, told by Sec-Fetch-Site, even with the app’s own Origin', async () => {
    const before = await modelCount();
    const response = await request(t.app)
      .post(`/api/workspaces/${workspaceId}/models/upload`)
      .set('Host', HOST)
      .set('Cookie', cookie)
      .set('Sec-Fetch-Site', 'cross-site')
      .attach('file', Buffer.from('model: {name: x}\n'), { filename: 'x.yaml', contentType: 'application/yaml' })
      .expect(403);
    expect(response.body.error.code).toBe('csrf-refused');
    expect(await modelCount()).toBe(before);
  });

  it('refuses a sign-in posted from another site (signing the victim into an attacker’s account)', async () => {
    const response = await request(t.app)
      .post('/api/auth/sign-in')
      .set('Host', HOST)
      .set('Origin', FOREIGN_ORIGIN)
      .send({ email: editor.email, password: TEST_PASSWORD })
      .expect(403);
    expect(response.body.error.code).toBe('csrf-refused');
    expect(response.headers['set-cookie']).toBeUndefined();
  });

  it('lets the app’s own requests through: same-origin by Sec-Fetch-Site, or by Origin when that header is missing', async () => {
    const before = await modelCount();
    await request(t.app)
      .post(`/api/workspaces/${workspaceId}/models`)
      .set('Host', HOST)
      .set('Cookie', cookie)
      .set('Origin', OWN_ORIGIN)
      .set('Sec-Fetch-Site', 'same-origin')
      .send({ name: 'Own page, modern browser' })
      .expect(201);
    await request(t.app)
      .post(`/api/workspaces/${workspaceId}/models`)
      .set('Host', HOST)
      .set('Cookie', cookie)
      .set('Origin', OWN_ORIGIN)
      .send({ name: 'Own page, older browser' })
      .expect(201);
    expect(await modelCount()).toBe(before + 2);
  });

  it('leaves safe methods, Bearer-token callers and callers that are not browsers alone', async () => {
    await request(t.app)
      .get('/api/me')
      .set('Host', HOST)
      .set('Cookie', cookie)
      .set('Origin', FOREIGN_ORIGIN)
      .set('Sec-Fetch-Site', 'cross-site')
      .expect(200);
    const user = await createUser();
    await addMember(await createWorkspace({ name: 'Script field' }), user, 'owner');
    await request(t.app)
      .post('/api/workspaces')
      .set(bearer(tokenFor(user, t.config)))
      .set('Origin', FOREIGN_ORIGIN)
      .send({ name: 'From a script' })
      .expect(201);
    // A command-line client holding a cookie sends neither Origin nor Sec-Fetch-Site.
    await request(t.app)
      .post(`/api/workspaces/${workspaceId}/models`)
      .set('Cookie', cookie)
      .send({ name: 'From curl' })
      .expect(201);
  });
});

describe('CORS', () => {
  it('grants no other origin anything unless CORS_ORIGINS is configured', async () => {
    const simple = await request(t.app).get('/api/health').set('Origin', FOREIGN_ORIGIN);
    expect(simple.headers['access-control-allow-origin']).toBeUndefined();
    const preflight = await request(t.app)
      .options(`/api/workspaces/${workspaceId}/models`)
      .set('Origin', FOREIGN_ORIGIN)
      .set('Access-Control-Request-Method', 'POST');
    expect(preflight.headers['access-control-allow-origin']).toBeUndefined();
    expect(preflight.headers['access-control-allow-methods']).toBeUndefined();
  });

  it('answers the listed origins only, with credentials, and lets their changes through', async () => {
    const listed = 'https://club-client.example';
    const { app, config } = t.appWith({ corsOrigins: [listed] });
    // That app signs with its own key, so the session is made for it.
    const cookie = `${config.cookieName}=${tokenFor(editor, config)}`;
    const preflight = await request(app)
      .options(`/api/workspaces/${workspaceId}/models`)
      .set('Origin', listed)
      .set('Access-Control-Request-Method', 'POST')
      .expect(204);
    expect(preflight.headers).toMatchObject({
      'access-control-allow-origin': listed,
      'access-control-allow-credentials': 'true',
    });
    expect(preflight.headers['access-control-allow-methods']).toContain('POST');
    const other = await request(app)
      .options('/api/health')
      .set('Origin', FOREIGN_ORIGIN)
      .set('Access-Control-Request-Method', 'GET');
    expect(other.headers['access-control-allow-origin']).toBeUndefined();

    const created = await request(app)
      .post(`/api/workspaces/${workspaceId}/models`)
      .set('Cookie', cookie)
      .set('Origin', listed)
      .set('Sec-Fetch-Site', 'cross-site')
      .send({ name: 'From the club client' })
      .expect(201);
    expect(created.headers['access-control-allow-origin']).toBe(listed);
    await request(app)
      .post(`/api/workspaces/${workspaceId}/models`)
      .set('Cookie', cookie)
      .set('Origin', FOREIGN_ORIGIN)
      .send({ name: 'Not listed' })
      .expect(403);
  });

  it('reads CORS_ORIGINS as bare http(s) origins and refuses anything else', () => {
    expect(parseCorsOrigins(undefined)).toEqual([]);
    expect(parseCorsOrigins(' https://a.example , http://127.0.0.1:5173 ')).toEqual([
      'https://a.example',
      'http://127.0.0.1:5173',
    ]);
    expect(() => parseCorsOrigins('https://a.example/path')).toThrow(/no path/);
    expect(() => parseCorsOrigins('ftp://a.example')).toThrow(/http/);
    expect(() => parseCorsOrigins('not an origin')).toThrow(/CORS_ORIGINS/);
  });
});

describe('Content-Security-Policy on the served app', () => {
  let webDir: string;
  beforeAll(() => {
    webDir = mkdtempSync(path.join(os.tmpdir(), 'bindery-csp-'));
    mkdirSync(path.join(webDir, 'assets'));
    writeFileSync(
      path.join(webDir, 'index.html'),
      '<!doctype html><title>Bindery</title><div id="root"></div><script type="module" src="/assets/main.js"></script>',
    );
    writeFileSync(path.join(webDir, 'assets', 'main.js'), 'export {}');
  });
  afterAll(() => rmSync(webDir, { recursive: true, force: true }));

  it('sends the page a policy that allows scripts from the app’s own origin only', async () => {
    const { app } = t.appWith({ webDir });
    const page = await request(app).get('/w/any/hangar').expect(200);
    const directives = Object.fromEntries(
      String(page.headers['content-security-policy'])
        .split(';')
        .map((part) => part.trim().split(/\s+/))
        .map(([name, ...values]) => [name, values]),
    );
    expect(directives['script-src']).toEqual(["'self'"]);
    expect(directives['script-src-attr']).toEqual(["'none'"]);
    expect(directives['default-src']).toEqual(["'self'"]);
    expect(directives['object-src']).toEqual(["'none'"]);
    expect(directives['frame-ancestors']).toEqual(["'none'"]);
    expect(directives['connect-src']).toEqual(["'self'"]);
  });

  it('the client’s page itself has no inline script for that policy to block', () => {
    const html = readFileSync(path.resolve('index.html'), 'utf8');
    const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attributes, body] of scripts) {
      expect(attributes).toMatch(/\bsrc=/);
      expect(body.trim()).toBe('');
    }
    expect(html).not.toMatch(/\son[a-z]+=/i);
  });
});

describe('download file names', () => {
  it.each([
    ['folder parts', '../../etc/passwd', 'passwd'],
    ['Windows folder parts', 'C:\\Users\\pilot\\setup.yaml', 'setup.yaml'],
    ['quotes and header syntax', 'a"; filename="evil.exe', 'a-- filename=-evil.exe'],
    ['line breaks (header injection)', 'tern.yaml\r\nSet-Cookie: x=1', 'tern.yamlSet-Cookie- x=1'],
    ['a right-to-left override', 'setup\u202Elmay.exe', 'setuplmay.exe'],
    ['reserved characters', 'a<b>c|d?e*f.yaml', 'a-b-c-d-e-f.yaml'],
    ['leading dots', '...hidden.yaml', 'hidden.yaml'],
    ['nothing usable', '\u0000\u0007 ../', 'download'],
  ])('removes %s', (_label, name, expected) => {
    expect(safeDownloadName(name)).toBe(expected);
  });

  it('keeps letters of any script and shortens long names but keeps the extension', () => {
    expect(safeDownloadName('Škoda Flügel r3.yaml')).toBe('Škoda Flügel r3.yaml');
    const long = safeDownloadName(`${'x'.repeat(300)}.tar.gz`);
    expect(long.length).toBeLessThanOrEqual(120);
    expect(long.endsWith('.gz')).toBe(true);
  });

  it('every download answers a sanitised attachment name', async () => {
    const user = await createUser();
    const workspace = await createWorkspace({ name: 'Names', owner: user });
    const headers = bearer(tokenFor(user, t.config));
    const name = '../"Mustang" <P-51>; r=1';
    const { revision } = (
      await request(t.app).post(`/api/workspaces/${workspace.id}/models`).set(headers).send({ name }).expect(201)
    ).body.data;
    const urls = [
      `/api/revisions/${revision.id}?download=1`,
      `/api/revisions/${revision.id}/patch?from=${revision.id}&download=1`,
      `/api/revisions/${revision.id}/field-sheet.pdf`,
    ];
    for (const url of urls) {
      const disposition = String(
        (await request(t.app).get(url).set(headers).expect(200)).headers['content-disposition'],
      );
      expect(disposition).toMatch(/^attachment; filename="?[A-Za-z0-9._ -]+"?$/);
      expect(disposition).toContain('mustang-p-51-r-1');
    }
  });
});

describe('HTML in names and messages', () => {
  it('is stored and answered as the very text that was sent, in JSON, never as markup', async () => {
    const user = await createUser({ name: '<b>Bold</b> pilot' });
    const workspace = await createWorkspace({ name: '<i>Club</i>', owner: user });
    const headers = bearer(tokenFor(user, t.config));
    const name = '<img src=x onerror="alert(1)">';
    const message = '<script>alert("saved")</script> & more';
    const created = await request(t.app)
      .post(`/api/workspaces/${workspace.id}/models`)
      .set(headers)
      .send({ name, message })
      .expect(201);
    expect(created.headers['content-type']).toMatch(/^application\/json/);
    expect(created.headers['x-content-type-options']).toBe('nosniff');
    const { model, revision } = created.body.data;
    expect(model.name).toBe(name);
    expect((await SetupModel.findByPk(model.id))!.name).toBe(name);
    expect((await Revision.findByPk(revision.id))!.message).toBe(message);

    const history = await request(t.app).get(`/api/models/${model.id}/revisions`).set(headers).expect(200);
    expect(history.body.data[0]).toMatchObject({ message, author: { name: '<b>Bold</b> pilot' } });
    const hangar = await request(t.app).get(`/api/workspaces/${workspace.id}/models`).set(headers).expect(200);
    expect(hangar.body.data.map((entry: { name: string }) => entry.name)).toEqual([name]);
    // The YAML itself goes out as YAML text, which a browser does not render as a page.
    const yaml = await request(t.app).get(`/api/revisions/${revision.id}?format=yaml`).set(headers).expect(200);
    expect(yaml.headers['content-type']).toMatch(/^application\/yaml/);
  });
});

describe('password change and sign-out everywhere end sessions', () => {
  const NEW_PASSWORD = 'crosswind-final-2207';

  it('a wrong current password changes nothing', async () => {
    const user = await createUser();
    const token = tokenFor(user, t.config);
    const response = await request(t.app)
      .post('/api/auth/password')
      .set(bearer(token))
      .send({ current: 'not-my-password', password: NEW_PASSWORD })
      .expect(403);
    expect(response.body.error).toMatchObject({
      code: 'wrong-password',
      details: { fields: { current: expect.any(String) } },
    });
    await request(t.app).get('/api/me').set(bearer(token)).expect(200);
    await signIn(t.app, user.email);
  });

  it('refuses a new password that is too short, and unknown fields', async () => {
    const user = await createUser();
    const headers = bearer(tokenFor(user, t.config));
    const short = await request(t.app)
      .post('/api/auth/password')
      .set(headers)
      .send({ current: TEST_PASSWORD, password: 'short' })
      .expect(400);
    expect(short.body.error.details.fields).toHaveProperty('password');
    const unknown = await request(t.app)
      .post('/api/auth/password')
      .set(headers)
      .send({ current: TEST_PASSWORD, password: NEW_PASSWORD, user_id: 'x' })
      .expect(400);
    expect(unknown.body.error.details.fields).toHaveProperty('user_id');
    await request(t.app)
      .post('/api/auth/password')
      .send({ current: TEST_PASSWORD, password: NEW_PASSWORD })
      .expect(401);
  });

  it('ends every session of the account and signs the asking device in again with a new cookie', async () => {
    const user = await createUser();
    const laptop = await signIn(t.app, user.email);
    const phone = await signIn(t.app, user.email);
    const response = await request(t.app)
      .post('/api/auth/password')
      .set('Cookie', laptop.cookie)
      .set('Host', HOST)
      .set('Origin', OWN_ORIGIN)
      .send({ current: TEST_PASSWORD, password: NEW_PASSWORD })
      .expect(200);
    const newCookie = ([] as string[]).concat(response.headers['set-cookie'] ?? [])[0];
    expect(newCookie).toMatch(/^bindery_session=[^;]+;.*HttpOnly/);
    expect(newCookie).toMatch(/SameSite=Lax/);

    for (const old of [laptop.cookie])
      expect((await request(t.app).get('/api/me').set('Cookie', old).expect(401)).body.error.code).toBe(
        'session-ended',
      );
    expect((await request(t.app).get('/api/me').set(bearer(phone.token)).expect(401)).body.error.code).toBe(
      'session-ended',
    );
    await request(t.app).get('/api/me').set('Cookie', newCookie.split(';')[0]).expect(200);
    await request(t.app).get('/api/me').set(bearer(response.body.data.token)).expect(200);

    await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD }).expect(401);
    await signIn(t.app, user.email, NEW_PASSWORD);
  });

  it('sign-out everywhere ends the sessions on every device', async () => {
    const user = await createUser();
    const one = await signIn(t.app, user.email);
    const two = await signIn(t.app, user.email);
    await request(t.app).post('/api/auth/sign-out-everywhere').set(bearer(one.token)).expect(200);
    expect((await request(t.app).get('/api/me').set('Cookie', two.cookie).expect(401)).body.error.code).toBe(
      'session-ended',
    );
    expect((await request(t.app).get('/api/me').set(bearer(one.token)).expect(401)).body.error.code).toBe(
      'session-ended',
    );
    await signIn(t.app, user.email);
  });

  it('counts wrong current passwords against a limit, like failed sign-ins', async () => {
    const { app, config } = t.appWith({
      signInLimits: { windowMs: 60_000, perAccount: 2, perAccountAnyAddress: 100, perAddress: 100 },
    });
    const user = await createUser();
    const headers = bearer(tokenFor(user, config));
    for (let attempt = 0; attempt < 2; attempt++)
      await request(app)
        .post('/api/auth/password')
        .set(headers)
        .send({ current: `guess-${attempt}`, password: NEW_PASSWORD })
        .expect(403);
    const limited = await request(app)
      .post('/api/auth/password')
      .set(headers)
      .send({ current: TEST_PASSWORD, password: NEW_PASSWORD })
      .expect(429);
    expect(limited.body.error.code).toBe('rate-limited');
  });
});
