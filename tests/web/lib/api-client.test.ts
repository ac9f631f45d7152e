import { ApiError, apiRequest, api } from '@web/lib/api-client';
import { vi } from 'vitest';

function answer(status: number, body: string | null, contentType = 'application/json') {
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => new Response(body, { status, headers: body ? { 'Content-Type': contentType } : {} })),
  );
}

async function failure(promise: Promise<unknown>): Promise<ApiError> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof ApiError) return error;
    throw error;
  }
  throw new Error('expected the request to fail');
}

describe('api client', () => {
  it('returns the envelope of a success, pagination included', async () => {
    answer(200, JSON.stringify({ data: [1, 2], pagination: { next: 'abc' } }));
    await expect(api.get<number[]>('/api/things')).resolves.toEqual({ data: [1, 2], pagination: { next: 'abc' } });
  });

  it('turns the error envelope into an ApiError with status, code and field messages', async () => {
    answer(
      422,
      JSON.stringify({
        error: {
          code: 'invalid-input',
          message: 'Some fields need attention.',
          details: { fields: { email: 'Required.', name: ['Too long.'] } },
        },
      }),
    );
    const error = await failure(api.post('/api/auth/sign-up', {}));
    expect(error.status).toBe(422);
    expect(error.code).toBe('invalid-input');
    expect(error.message).toBe('Some fields need attention.');
    expect(error.fields).toEqual({ email: 'Required.', name: 'Too long.' });
  });

  it('gives a plain message when the answer is not the API’s (a proxy page)', async () => {
    answer(502, '<html>Bad gateway</html>', 'text/html');
    const error = await failure(api.get('/api/me'));
    expect(error.status).toBe(502);
    expect(error.code).toBe('http-502');
    expect(error.message).toBe('The server could not answer just now. Try again in a moment.');
    expect(error.fields).toEqual({});
  });

  it('refuses a success that is not JSON rather than handing on nothing', async () => {
    answer(200, '<!doctype html><title>Bindery</title>', 'text/html');
    const error = await failure(api.get('/api/me'));
    expect(error.code).toBe('unexpected-response');
  });

  it('reports a connection that failed as a network error', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    const error = await failure(api.get('/api/me'));
    expect(error.status).toBe(0);
    expect(error.code).toBe('network-error');
  });

  it('offline, says a write needs the network and keeps what was typed, and a read was never saved here', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    const onLine = vi.spyOn(navigator, 'onLine', 'get').mockReturnValue(false);
    try {
      const write = await failure(api.patch('/api/receivers/x', { notes: 'typed' }));
      expect(write.code).toBe('offline');
      expect(write.message).toMatch(/^This needs the network.*Nothing you typed is lost/);
      const read = await failure(api.get('/api/models/x'));
      expect(read.code).toBe('offline');
      expect(read.message).toMatch(/no saved copy of this/);
    } finally {
      onLine.mockRestore();
    }
  });

  it('notes an answer the service worker read from this device’s copies, and forgets it once fresh', async () => {
    const { savedCopiesSnapshot } = await import('@web/lib/offline');
    const savedAt = '2026-06-01T09:30:00.000Z';
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response('{"data":1}', { status: 200, headers: { 'X-Bindery-Saved-At': savedAt } })),
    );
    await api.get('/api/models/kept');
    expect(savedCopiesSnapshot().get('/api/models/kept')).toBe(savedAt);
    answer(200, '{"data":2}');
    await api.get('/api/models/kept');
    expect(savedCopiesSnapshot().has('/api/models/kept')).toBe(false);
  });

  it('sends JSON with the session cookie, and raw bodies as given', async () => {
    const fetch = vi.fn(async () => new Response(null, { status: 204 }));
    vi.stubGlobal('fetch', fetch);

    await expect(api.post('/api/auth/sign-out')).resolves.toEqual({ data: undefined });
    await apiRequest('/api/check', { method: 'POST', body: 'version: 1\n', headers: { 'Content-Type': 'text/yaml' } });
    await api.post('/api/auth/sign-in', { email: 'a@b.example', password: 'x' });

    const calls = fetch.mock.calls as unknown as [string, RequestInit][];
    expect(calls[0][1]).toMatchObject({ method: 'POST', credentials: 'same-origin', body: undefined });
    expect(calls[1][1]).toMatchObject({
      method: 'POST',
      body: 'version: 1\n',
      headers: { 'Content-Type': 'text/yaml' },
    });
    expect(calls[2][1]).toMatchObject({
      method: 'POST',
      credentials: 'same-origin',
      body: JSON.stringify({ email: 'a@b.example', password: 'x' }),
      headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
    });
  });
});
