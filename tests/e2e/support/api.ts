import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { baseUrl, DEMO_PASSWORD, DEMO_WORKSPACE_NAME, type DemoAccount } from './demo';

// Arrangements a journey needs before its browser part (a model of its own, the ids of
// demo records) go through the public API with a bearer token, as a script would.

export interface ApiClient {
  get<T>(path: string): Promise<T>;
  post<T>(path: string, body: unknown): Promise<T>;
  put<T>(path: string, body: unknown): Promise<T>;
}

async function call<T>(method: string, path: string, token: string | null, body?: unknown): Promise<T> {
  const response = await fetch(`${baseUrl}/api${path}`, {
    method,
    headers: {
      accept: 'application/json',
      ...(token ? { authorization: `Bearer ${token}` } : {}),
      ...(body === undefined ? {} : { 'content-type': 'application/json' }),
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await response.text();
  if (!response.ok) throw new Error(`${method} /api${path} answered ${response.status}: ${text}`);
  return (JSON.parse(text) as { data: T }).data;
}

export async function apiAs(account: DemoAccount): Promise<ApiClient> {
  const { token } = await call<{ token: string }>('POST', '/auth/sign-in', null, {
    email: account.email,
    password: DEMO_PASSWORD,
  });
  return {
    get: (path) => call('GET', path, token),
    post: (path, body) => call('POST', path, token, body),
    put: (path, body) => call('PUT', path, token, body),
  };
}

export interface HangarModel {
  id: string;
  name: string;
  latest: { id: string; number: number } | null;
}

export async function demoWorkspaceId(api: ApiClient): Promise<string> {
  const me = await api.get<{ workspaces: { id: string; name: string }[] }>('/me');
  const workspace = me.workspaces.find((candidate) => candidate.name === DEMO_WORKSPACE_NAME);
  if (!workspace) throw new Error(`The signed-in account is not in ${DEMO_WORKSPACE_NAME}.`);
  return workspace.id;
}

/** A model of the demo hangar by its name. */
export async function demoModel(api: ApiClient, name: string): Promise<HangarModel> {
  const workspaceId = await demoWorkspaceId(api);
  const models = await api.get<HangarModel[]>(`/workspaces/${workspaceId}/models?q=${encodeURIComponent(name)}`);
  const model = models.find((candidate) => candidate.name === name);
  if (!model) throw new Error(`The demo hangar has no model named ${name}.`);
  return model;
}

export const fixtureText = (relative: string): string =>
  readFileSync(fileURLToPath(new URL(`../../../fixtures/${relative}`, import.meta.url)), 'utf8');

/** A new model in the demo workspace, so a journey that saves does not change the demo's own models. */
export async function createModel(
  api: ApiClient,
  name: string,
  yaml: string,
): Promise<{ model: { id: string; name: string }; revision: { id: string; number: number } }> {
  const workspaceId = await demoWorkspaceId(api);
  return api.post(`/workspaces/${workspaceId}/models`, { name, yaml, message: 'Arranged by a browser test' });
}
