import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { MAX_NESTING_DEPTH, MAX_TEXT_BYTES } from '@shared/parse/limits';
import { MAX_BUNDLE_BYTES } from '@api/portability/import-limits';
import { useMailTestApp } from './helpers/mail';
import { ALIAS_BOMB, TRAINER } from './models-support';
import { buildSampleWorld, type SampleWorld } from './route-table-samples';

// The limits that keep hostile input cheap: every page size, search text, name,
// message and document has a ceiling, and going past it is a 4xx that says which
// limit it was.

const t = useMailTestApp();
let world: SampleWorld;
let headers: Record<string, string>;

beforeAll(async () => {
  world = await buildSampleWorld(t);
  headers = await world.headersOf('owner');
});

const get = (url: string) => request(t.app).get(url).set(headers);
const post = (url: string, body: object) => request(t.app).post(url).set(headers).send(body);

function expectClear(response: request.Response, status: number, field?: string): void {
  expect(response.status, JSON.stringify(response.body)).toBe(status);
  expect(response.body.error.message.length).toBeGreaterThan(10);
  if (field) expect(response.body.error.details.fields, JSON.stringify(response.body.error)).toHaveProperty(field);
}

describe('page sizes and paging of every list', () => {
  const lists = () => [
    `/api/workspaces/${world.roles.workspace.id}/models`,
    `/api/workspaces/${world.roles.workspace.id}/members`,
    `/api/workspaces/${world.roles.workspace.id}/audit`,
    `/api/workspaces/${world.roles.workspace.id}/reviews`,
    `/api/workspaces/${world.roles.workspace.id}/receivers`,
    `/api/models/${world.modelId}/revisions`,
    `/api/models/${world.modelId}/reviews`,
    '/api/outbox',
  ];

  it.each([
    ['a page size past the ceiling', 'limit=100000', 'limit'],
    ['a page size of nothing', 'limit=0', 'limit'],
    ['a page size that is not a number', 'limit=all', 'limit'],
    ['a page size given twice', 'limit=5&limit=6', 'limit'],
  ])('refuses %s on every list', async (_label, query, field) => {
    for (const url of lists()) expectClear(await get(`${url}?${query}`), 400, field);
  });

  it('refuses a negative offset on every list that pages by offset, and a bad cursor on the history', async () => {
    for (const url of lists().filter((url) => !url.endsWith('/revisions')))
      expectClear(await get(`${url}?offset=-1`), 400, 'offset');
    expectClear(await get(`/api/models/${world.modelId}/revisions?before=0`), 400, 'before');
  });

  it('answers the largest page each list allows', async () => {
    for (const url of lists()) {
      const response = await get(`${url}?limit=100`).expect(200);
      expect(response.body.pagination.limit).toBe(100);
    }
  });

  it('refuses search texts past 100 characters', async () => {
    expectClear(await get(`/api/workspaces/${world.roles.workspace.id}/models?q=${'x'.repeat(101)}`), 400, 'q');
    expectClear(await get(`/api/workspaces/${world.roles.workspace.id}/receivers?q=${'x'.repeat(101)}`), 400, 'q');
  });
});

describe('string lengths', () => {
  const long = (n: number) => 'x'.repeat(n);
  it.each([
    ['a model name', () => `/api/workspaces/${world.roles.workspace.id}/models`, () => ({ name: long(81) }), 'name'],
    [
      'a revision message',
      () => `/api/models/${world.modelId}/revisions`,
      () => ({ base: 1, yaml: TRAINER(), message: long(2001) }),
      'message',
    ],
    ['a workspace name', () => '/api/workspaces', () => ({ name: long(101) }), 'name'],
    ['a tag name', () => `/api/revisions/${world.firstRevisionId}/tags`, () => ({ name: long(41) }), 'name'],
    [
      'a receiver label',
      () => `/api/workspaces/${world.roles.workspace.id}/receivers`,
      () => ({ label: long(81), outputs: 8 }),
      'label',
    ],
    [
      'receiver notes',
      () => `/api/workspaces/${world.roles.workspace.id}/receivers`,
      () => ({ label: 'Unit', outputs: 8, notes: long(2001) }),
      'notes',
    ],
    [
      'a review note',
      () => `/api/revisions/${world.secondRevisionId}/reviews`,
      () => ({ reviewers: [world.roles.members.reviewer.id], note: long(2001) }),
      'note',
    ],
    [
      'the reviewers asked at once',
      () => `/api/revisions/${world.secondRevisionId}/reviews`,
      () => ({
        reviewers: Array.from({ length: 21 }, (_, i) => `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`),
      }),
      'reviewers',
    ],
    [
      'a verdict',
      () => `/api/reviews/${world.reviewId}/verdicts`,
      () => ({ verdict: 'comment', body: long(4001) }),
      'body',
    ],
    ['a comment', () => `/api/reviews/${world.reviewId}/comments`, () => ({ body: long(4001) }), 'body'],
    ['a comment path', () => `/api/reviews/${world.reviewId}/comments`, () => ({ body: 'x', path: long(301) }), 'path'],
    [
      'an e-mail address',
      () => '/api/auth/sign-up',
      () => ({ email: `${long(250)}@a.example`, name: 'A', password: 'long-enough-password' }),
      'email',
    ],
    [
      'a password past bcrypt’s 72 bytes',
      () => '/api/auth/sign-up',
      () => ({ email: 'limits@test.example', name: 'A', password: long(73) }),
      'password',
    ],
    [
      'a person’s name',
      () => '/api/auth/sign-up',
      () => ({ email: 'limits@test.example', name: long(101), password: 'long-enough-password' }),
      'name',
    ],
  ])('refuses %s past its limit', async (_label, url, body, field) => {
    expectClear(await post(url(), body()), 400, field);
  });
});

describe('document sizes', () => {
  const bigYaml = () => `${TRAINER()}\n# ${'x'.repeat(MAX_TEXT_BYTES)}\n`;

  it('refuses a setup over 512 KB whether saved as JSON, sent to check, uploaded or used to start a model', async () => {
    expectClear(await post(`/api/models/${world.modelId}/revisions`, { base: 1, yaml: bigYaml() }), 413);
    expectClear(
      await post(`/api/workspaces/${world.roles.workspace.id}/models`, { name: 'Big', yaml: bigYaml() }),
      413,
    );
    expectClear(await request(t.app).post('/api/check').set('Content-Type', 'application/yaml').send(bigYaml()), 413);
    const upload = await request(t.app)
      .post(`/api/models/${world.modelId}/upload`)
      .set(headers)
      .field('base', '1')
      .attach('file', Buffer.from(bigYaml()), { filename: 'big.yaml', contentType: 'application/yaml' });
    expectClear(upload, 413);
  });

  it('refuses a JSON body past the body limit before reading it', async () => {
    expectClear(
      await post(`/api/workspaces/${world.roles.workspace.id}/models`, { name: 'Huge', yaml: 'x'.repeat(700 * 1024) }),
      413,
    );
  });

  it('refuses setups nested too deeply and alias bombs as unreadable, with the reason', async () => {
    const deep = `${Array.from({ length: MAX_NESTING_DEPTH + 2 }, (_, depth) => `${'  '.repeat(depth)}k${depth}:`).join('\n')} 1\n`;
    for (const yaml of [
      deep,
      ALIAS_BOMB,
      `${'['.repeat(MAX_NESTING_DEPTH + 5)}${']'.repeat(MAX_NESTING_DEPTH + 5)}\n`,
    ]) {
      const response = await post(`/api/workspaces/${world.roles.workspace.id}/models`, { name: 'Deep', yaml });
      expectClear(response, 422);
      expect(response.body.error.code).toBe('unreadable-setup');
    }
  });

  it('refuses a JSON body nested thousands deep', async () => {
    const nested = `${'{"name":'.repeat(20_000)}"x"${'}'.repeat(20_000)}`;
    const response = await request(t.app)
      .post('/api/workspaces')
      .set(headers)
      .set('Content-Type', 'application/json')
      .send(nested);
    expect(response.status).toBeGreaterThanOrEqual(400);
    expect(response.status).toBeLessThan(500);
  });

  it('refuses a history upload past its limit', async () => {
    const response = await request(t.app)
      .post(`/api/workspaces/${world.roles.workspace.id}/import`)
      .set(headers)
      .attach('file', Buffer.alloc(MAX_BUNDLE_BYTES + 1, 0x41), {
        filename: 'huge.bundle',
        contentType: 'application/octet-stream',
      });
    expectClear(response, 413);
  });
});
