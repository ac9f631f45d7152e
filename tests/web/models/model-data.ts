import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { analyzeSetup } from '@shared/analyze';
import type { Revision } from '@shared/contract/model';
import { compareRevisions, textDiff } from '@shared/diff';
import { CLUB, demoUser, type FakeHandler } from '../fake-server';

// Models and revisions as the API presents them, built from the repository's fixture
// setups through the real shared analysis, so a screen under test sees true findings,
// diffs and deltas rather than numbers typed into the test.

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
export const fixtureText = (name: string) => readFileSync(path.join(root, 'fixtures', name), 'utf8');

let counter = 0;
/** A fresh UUID-shaped id, readable in a failure message. */
export const uuid = (prefix: number) =>
  `00000000-0000-4000-8000-${String(prefix).padStart(4, '0')}${String(++counter).padStart(8, '0')}`;

/** A revision in full as the API answers it (shared/contract), held by the fake. */
export type RevisionRecord = Revision;

export function revisionOf(
  modelId: string,
  number: number,
  yaml: string,
  extra: Partial<RevisionRecord> = {},
): RevisionRecord {
  const analysis = analyzeSetup(yaml);
  return {
    id: uuid(number),
    model_id: modelId,
    number,
    parent_id: null,
    author: { id: demoUser.id, name: demoUser.name },
    message: `Revision ${number}`,
    content_hash: `hash-${number}`,
    error_count: analysis.counts.errors,
    warning_count: analysis.counts.warnings,
    info_count: analysis.counts.infos,
    origin: number === 1 ? 'create' : 'save',
    source_revision_id: null,
    tags: [],
    created_at: new Date(Date.UTC(2026, 3, number, 12)).toISOString(),
    yaml,
    document: analysis.data,
    findings: analysis.findings,
    ...extra,
  };
}

export const summaryOf = ({ yaml: _yaml, document: _document, findings: _findings, ...summary }: RevisionRecord) =>
  summary;

export interface ModelRecord {
  id: string;
  workspace_id: string;
  name: string;
  airframe: string | null;
  review_state: string;
  role: string;
  forked_from: unknown;
  revisions: RevisionRecord[];
}

export function modelView(model: ModelRecord) {
  const latest = model.revisions.reduce<RevisionRecord | null>((a, b) => (!a || b.number > a.number ? b : a), null);
  return {
    id: model.id,
    workspace_id: model.workspace_id,
    name: model.name,
    airframe: model.airframe,
    forked_from_revision_id: null,
    forked_from: model.forked_from,
    created_by: demoUser.id,
    created_at: '2026-04-01T12:00:00.000Z',
    updated_at: latest?.created_at ?? '2026-04-01T12:00:00.000Z',
    latest: latest && {
      id: latest.id,
      number: latest.number,
      content_hash: latest.content_hash,
      error_count: latest.error_count,
      warning_count: latest.warning_count,
      info_count: latest.info_count,
      message: latest.message,
      created_at: latest.created_at,
      author: latest.author,
    },
    review_state: model.review_state,
    cleared_for_maiden: model.review_state === 'approved',
    approved: null,
    role: model.role,
  };
}

export function modelRecord(name: string, yamls: string[], extra: Partial<ModelRecord> = {}): ModelRecord {
  const id = uuid(9000);
  return {
    id,
    workspace_id: CLUB,
    name,
    airframe: 'airplane',
    review_state: 'none',
    role: 'owner',
    forked_from: null,
    revisions: yamls.map((yaml, index) => revisionOf(id, index + 1, yaml)),
    ...extra,
  };
}

/**
 * The model and revision routes of the API over the given models: model, history
 * (newest first, paged by `before`), one revision, and the compare computed by the
 * shared compare code as the server does.
 */
export function modelRoutes(models: ModelRecord[]): Record<string, FakeHandler> {
  const routes: Record<string, FakeHandler> = {};
  const all = () => models.flatMap((model) => model.revisions.map((revision) => ({ model, revision })));
  for (const model of models) {
    routes[`GET /api/models/${model.id}`] = () => ({ body: { data: modelView(model) } });
    routes[`GET /api/models/${model.id}/revisions`] = ({ url }) => {
      const limit = Number(url.searchParams.get('limit') ?? 50);
      const before = url.searchParams.get('before');
      const older = [...model.revisions]
        .sort((a, b) => b.number - a.number)
        .filter((revision) => before === null || revision.number < Number(before));
      const page = older.slice(0, limit);
      return {
        body: {
          data: page.map(summaryOf),
          pagination: {
            limit,
            before: before === null ? null : Number(before),
            next_before: older.length > limit ? page[page.length - 1].number : null,
          },
        },
      };
    };
  }
  for (const { model, revision } of all()) {
    routes[`GET /api/revisions/${revision.id}`] = () => ({
      body: { data: { ...revision, model: { id: model.id, name: model.name, workspace_id: model.workspace_id } } },
    });
  }
  routes['GET /api/compare'] = ({ url }) => {
    const side = (id: string | null) => all().find(({ revision }) => revision.id === id);
    const from = side(url.searchParams.get('from'));
    const to = side(url.searchParams.get('to'));
    if (!from || !to)
      return {
        status: 404,
        body: { error: { code: 'not-found', message: 'That revision was not found.', details: null } },
      };
    const present = ({ model, revision }: { model: ModelRecord; revision: RevisionRecord }) => ({
      ...summaryOf(revision),
      model: { id: model.id, name: model.name, workspace_id: model.workspace_id },
    });
    const comparison = compareRevisions(
      { text: from.revision.yaml, data: from.revision.document, findings: from.revision.findings },
      { text: to.revision.yaml, data: to.revision.document, findings: to.revision.findings },
    );
    const { text: _text, ...withoutText } = comparison;
    return { body: { data: { from: present(from), to: present(to), ...withoutText } } };
  };
  routes['GET /api/compare/text'] = ({ url }) => {
    const side = (id: string | null) => all().find(({ revision }) => revision.id === id);
    const from = side(url.searchParams.get('from'));
    const to = side(url.searchParams.get('to'));
    if (!from || !to)
      return {
        status: 404,
        body: { error: { code: 'not-found', message: 'That revision was not found.', details: null } },
      };
    return { body: { data: textDiff(from.revision.yaml, to.revision.yaml) } };
  };
  return routes;
}
