import { CLUB, demoUser, type FakeHandler } from '../fake-server';

// A model with its revisions as the API answers them (api/presenters), for the Edit
// and Bench screens. Each revision keeps the exact text; `document` is left to the
// test, as the server stores the parsed value.

export const MODEL_ID = '3c5e8a1f-7b2d-4e90-a6c3-91d0f4b7e218';

export interface StoredRevision {
  id: string;
  number: number;
  yaml: string;
  document: unknown;
  message: string;
}

export function revisionId(number: number): string {
  return `7a0d2c4e-1f3b-4a5c-8e6d-${String(number).padStart(12, '0')}`;
}

export function modelView(latest: StoredRevision, role = 'owner') {
  return {
    id: MODEL_ID,
    workspace_id: CLUB,
    name: 'Kestrel Mk II',
    airframe: 'airplane',
    forked_from_revision_id: null,
    forked_from: null,
    created_by: demoUser.id,
    created_at: '2026-03-01T10:00:00.000Z',
    updated_at: '2026-03-08T10:00:00.000Z',
    latest: {
      id: latest.id,
      number: latest.number,
      content_hash: 'a'.repeat(64),
      error_count: 0,
      warning_count: 0,
      info_count: 0,
      message: latest.message,
      created_at: '2026-03-08T10:00:00.000Z',
      author: { id: demoUser.id, name: demoUser.name },
    },
    review_state: 'none',
    cleared_for_maiden: false,
    role,
  };
}

export function revisionView(revision: StoredRevision) {
  return {
    id: revision.id,
    model_id: MODEL_ID,
    number: revision.number,
    parent_id: revision.number > 1 ? revisionId(revision.number - 1) : null,
    author: { id: demoUser.id, name: demoUser.name },
    message: revision.message,
    content_hash: 'a'.repeat(64),
    error_count: 0,
    warning_count: 0,
    info_count: 0,
    origin: 'save',
    source_revision_id: null,
    tags: [],
    created_at: '2026-03-08T10:00:00.000Z',
    yaml: revision.yaml,
    document: revision.document,
    findings: [],
  };
}

/** GET each of these revisions in full. */
export function revisionRoutes(revisions: readonly StoredRevision[]): Record<string, FakeHandler> {
  return Object.fromEntries(
    revisions.map((revision) => [
      `GET /api/revisions/${revision.id}`,
      () => ({ body: { data: revisionView(revision) } }),
    ]),
  );
}

/** GET the model (its latest is the last of `revisions`, read at each request) and each revision. */
export function modelRoutes(revisions: StoredRevision[], options: { role?: string } = {}): Record<string, FakeHandler> {
  return {
    [`GET /api/models/${MODEL_ID}`]: () => ({
      body: { data: modelView(revisions[revisions.length - 1], options.role) },
    }),
    ...revisionRoutes(revisions),
  };
}
