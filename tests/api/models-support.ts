import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Express } from 'express';
import request from 'supertest';
import { expect } from 'vitest';
import type { AppConfig } from '@api/config';
import type { User } from '@api/models';
import { bearer, tokenFor } from './helpers/factories';

// Shared by the models, revisions, compare and uploads tests: fixture texts and a
// small client that calls the API as one user.

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export const fixture = (relative: string): string => readFileSync(path.join(root, 'fixtures', relative), 'utf8');

export const SCALE = () => fixture('valid/scale-16-channel-two-receivers.yaml');
export const TRAINER = () => fixture('valid/trainer-single-receiver.yaml');
export const GLIDER = () => fixture('valid/glider-six-wing-servos.yaml');

// Nine anchors nine deep: a few hundred bytes that expand to 9^5 (59,049) copies.
export const ALIAS_BOMB = [
  'a: &a ["lol","lol","lol","lol","lol","lol","lol","lol","lol"]',
  'b: &b [*a,*a,*a,*a,*a,*a,*a,*a,*a]',
  'c: &c [*b,*b,*b,*b,*b,*b,*b,*b,*b]',
  'd: &d [*c,*c,*c,*c,*c,*c,*c,*c,*c]',
  'e: &e [*d,*d,*d,*d,*d,*d,*d,*d,*d]',
  '',
].join('\n');

export interface Client {
  user: User;
  headers: Record<string, string>;
  get(url: string): request.Test;
  post(url: string, body?: object): request.Test;
  patch(url: string, body?: object): request.Test;
  put(url: string, body?: object): request.Test;
  delete(url: string): request.Test;
  /** A multipart upload of `text` as field `file`, plus form fields. */
  upload(
    url: string,
    text: string | Buffer,
    file: { name?: string; type?: string },
    fields?: Record<string, string | number>,
  ): request.Test;
}

export function clientFor(app: Express, config: AppConfig, user: User): Client {
  const headers = bearer(tokenFor(user, config));
  return {
    user,
    headers,
    get: (url) => request(app).get(url).set(headers),
    post: (url, body) =>
      request(app)
        .post(url)
        .set(headers)
        .send(body ?? {}),
    patch: (url, body) =>
      request(app)
        .patch(url)
        .set(headers)
        .send(body ?? {}),
    put: (url, body) =>
      request(app)
        .put(url)
        .set(headers)
        .send(body ?? {}),
    delete: (url) => request(app).delete(url).set(headers),
    upload: (url, text, file, fields = {}) => {
      let test = request(app).post(url).set(headers);
      for (const [key, value] of Object.entries(fields)) test = test.field(key, String(value));
      const buffer = typeof text === 'string' ? Buffer.from(text, 'utf8') : text;
      return test.attach('file', buffer, {
        filename: file.name ?? 'setup.yaml',
        contentType: file.type ?? 'application/yaml',
      });
    },
  };
}

export interface CreatedModel {
  model: { id: string; name: string; workspace_id: string; [key: string]: unknown };
  revision: { id: string; number: number; content_hash: string; [key: string]: unknown };
}

export async function createModelVia(
  client: Client,
  workspaceId: string,
  body: { name: string; yaml?: string; message?: string },
): Promise<CreatedModel> {
  const response = await client.post(`/api/workspaces/${workspaceId}/models`, body);
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body.data as CreatedModel;
}

export async function saveVia(client: Client, modelId: string, base: number, yaml: string, message = `On ${base}`) {
  const response = await client.post(`/api/models/${modelId}/revisions`, { base, yaml, message });
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body.data as { id: string; number: number; content_hash: string; findings: unknown[] };
}

/** Replaces `from` by `to` in `text` once, failing loudly when the fixture no longer has `from`. */
export function edit(text: string, from: string, to: string): string {
  expect(text.includes(from), `the text should contain ${JSON.stringify(from)}`).toBe(true);
  return text.replace(from, to);
}
