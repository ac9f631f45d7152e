import { vi } from 'vitest';

// A small stand-in for the API at the network boundary: the real api client and the
// real components run, and `fetch` answers as the server would, JSON envelopes and
// status codes included. Each test states the routes it needs.

export interface FakeRequest {
  method: string;
  path: string;
  url: URL;
  body: unknown;
  /** A multipart upload as the client built it. */
  form: FormData | undefined;
  credentials: RequestCredentials | undefined;
  headers: Headers;
}

export interface FakeAnswer {
  status?: number;
  body?: unknown;
}

export type FakeHandler = (request: FakeRequest) => FakeAnswer | Promise<FakeAnswer>;

export function fakeServer(routes: Record<string, FakeHandler>) {
  const requests: FakeRequest[] = [];

  const fetch = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(
      typeof input === 'string' ? input : input instanceof URL ? input.href : input.url,
      'http://bindery.test',
    );
    const method = (init.method ?? 'GET').toUpperCase();
    const text = typeof init.body === 'string' ? init.body : undefined;
    const request: FakeRequest = {
      method,
      path: url.pathname,
      url,
      body: text === undefined ? undefined : JSON.parse(text),
      form: init.body instanceof FormData ? init.body : undefined,
      credentials: init.credentials,
      headers: new Headers(init.headers),
    };
    requests.push(request);

    const handler = routes[`${method} ${url.pathname}`];
    const answer: FakeAnswer = handler
      ? await handler(request)
      : {
          status: 404,
          body: { error: { code: 'not-found', message: `No route ${method} ${url.pathname}`, details: null } },
        };
    const status = answer.status ?? 200;
    return new Response(answer.body === undefined ? null : JSON.stringify(answer.body), {
      status,
      headers: answer.body === undefined ? {} : { 'Content-Type': 'application/json; charset=utf-8' },
    });
  });

  vi.stubGlobal('fetch', fetch);
  return {
    requests,
    fetch,
    called: (method: string, path: string) => requests.filter((r) => r.method === method && r.path === path),
  };
}

export const apiError = (status: number, code: string, message: string, details: unknown = null): FakeAnswer => ({
  status,
  body: { error: { code, message, details } },
});

export const CLUB = '5f0c2e7a-4d4c-4591-9e2d-8a3b5c7e0117';
export const BUILDERS = '9b2d4f0e-36c2-44a7-8e32-1d0c8f5a4b29';

export const demoUser = {
  id: 'c41e7b20-9a3f-4d18-b6e5-2f7a0d9c8e11',
  email: 'wren@hollowfield.example',
  name: 'Wren Calloway',
};

export const demoWorkspaces = [
  { id: CLUB, name: 'Hollowfield Aero Club', role: 'owner' },
  { id: BUILDERS, name: 'Tuesday Night Builders', role: 'reviewer' },
];

/**
 * The session part of the API with a cookie jar of one: signed out until a sign-in
 * with the right password (or a sign-up), signed out again by sign-out.
 */
export function sessionRoutes(options: { signedIn?: boolean; password?: string; workspaces?: unknown[] } = {}) {
  const state = { signedIn: options.signedIn ?? false };
  const password = options.password ?? 'bindery-demo-1';
  const workspaces = options.workspaces ?? demoWorkspaces;
  const routes: Record<string, FakeHandler> = {
    'GET /api/session': () => ({ body: { data: state.signedIn ? { user: demoUser, workspaces } : null } }),
    'POST /api/auth/sign-in': (request) => {
      const body = request.body as { email?: string; password?: string };
      if (body.email !== demoUser.email || body.password !== password) {
        return apiError(401, 'wrong-credentials', 'That e-mail and password do not match an account.');
      }
      state.signedIn = true;
      return { body: { data: { user: demoUser, token: 'header.payload.signature' } } };
    },
    'POST /api/auth/sign-out': () => {
      state.signedIn = false;
      return { status: 204 };
    },
  };
  return { state, routes };
}

/**
 * A page of a cursor-paged list as the API answers it (api/routes/models.ts, receivers.ts):
 * `limit` entries after the one `after` names, in the order given, the total of the whole
 * list and `next_after`, the id of the page's last entry when more follow.
 */
export function keysetPage<T extends { id: string }>(entries: readonly T[], url: URL): FakeAnswer {
  const limit = Number(url.searchParams.get('limit') ?? 50);
  const after = url.searchParams.get('after');
  const start = after ? entries.findIndex((entry) => entry.id === after) + 1 : 0;
  const data = entries.slice(start, start + limit);
  const more = start + limit < entries.length;
  return {
    body: {
      data,
      pagination: { limit, offset: 0, total: entries.length, next_after: more ? data[data.length - 1].id : null },
    },
  };
}
