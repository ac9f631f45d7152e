import { analyzeSetup } from '@shared/analyze';
import { compareRevisions } from '@shared/diff';
import { reviewPlan } from '@shared/diff/review-plan';
import type { CommentThread, ReviewDetail, ReviewSummary, ThreadCounts } from '@web/features/reviews/types';
import { CLUB, demoUser, type FakeHandler } from '../fake-server';
import { fixtureText } from '../models/model-data';

// A review as the API presents it, its compare and findings computed by the real
// shared code from a fixture pair (the wing receiver's throttle-stop failsafe fixed).

export const MODEL = '11111111-1111-4111-8111-111111111111';
export const REVIEW = '22222222-2222-4222-8222-222222222222';
export const ines = { id: '33333333-3333-4333-8333-333333333333', name: 'Ines Marchbank' };

const revision = (id: string, number: number, text: string) => {
  const analysis = analyzeSetup(text);
  return {
    analysis,
    summary: {
      id,
      model_id: MODEL,
      number,
      parent_id: null,
      author: { id: demoUser.id, name: demoUser.name },
      message: `Revision ${number}`,
      content_hash: String(number).repeat(64).slice(0, 64),
      error_count: analysis.counts.errors,
      warning_count: analysis.counts.warnings,
      info_count: analysis.counts.infos,
      origin: 'save' as const,
      source_revision_id: null,
      tags: [],
      created_at: '2026-04-02T12:00:00.000Z',
    },
  };
};

export const REVIEWED_REVISION = '55555555-5555-4555-8555-555555555555';

/** A thread started in the review of revision 3 and carried to revision 4: its pin still exists. */
export const carriedThread: CommentThread = {
  id: 'c1',
  review_id: 'older',
  path: 'receivers[id=wing].map[pin=1]',
  body: 'Check the tailwheel centres on loss.',
  author: ines,
  revision: { id: '44444444-4444-4444-8444-444444444444', number: 3 },
  carried: true,
  created_at: '2026-04-01T10:00:00.000Z',
  replies: [],
  resolved: null,
};

/** The counts the review answer carries, as the API computes them. */
export function threadCounts(threads: readonly CommentThread[]): ThreadCounts {
  const open = threads.filter((thread) => !thread.resolved);
  return {
    open: open.length,
    resolved: threads.length - open.length,
    open_paths: open.flatMap((thread) => (thread.path ? [thread.path] : [])),
  };
}

/** `GET /api/revisions/:id/comments` over `threads()`, by status, a page at a time, as the API pages it. */
export function threadRoutes(threads: () => readonly CommentThread[], revisionId = REVIEWED_REVISION) {
  return {
    [`GET /api/revisions/${revisionId}/comments`]: ((request) => {
      const status = request.url.searchParams.get('status') ?? 'all';
      const limit = Number(request.url.searchParams.get('limit') ?? 100);
      const offset = Number(request.url.searchParams.get('offset') ?? 0);
      const shown = threads().filter((thread) =>
        status === 'open' ? !thread.resolved : status === 'resolved' ? Boolean(thread.resolved) : true,
      );
      return {
        body: { data: shown.slice(offset, offset + limit), pagination: { limit, offset, total: shown.length } },
      };
    }) satisfies FakeHandler,
  };
}

export function reviewDetail(overrides: Partial<ReviewDetail> = {}): ReviewDetail {
  const beforeText = fixtureText('pairs/failsafe-fix.before.yaml');
  const afterText = fixtureText('pairs/failsafe-fix.after.yaml');
  const before = revision('44444444-4444-4444-8444-444444444444', 3, beforeText);
  const after = revision(REVIEWED_REVISION, 4, afterText);
  return {
    id: REVIEW,
    workspace_id: CLUB,
    model: { id: MODEL, name: 'Kestrel Mk II' },
    revision: after.summary,
    findings: after.analysis.findings,
    requested_by: { id: demoUser.id, name: demoUser.name },
    reviewers: [ines],
    note: 'Maiden on Saturday.',
    state: 'open',
    decided_at: null,
    created_at: '2026-04-02T13:00:00.000Z',
    verdict_count: 0,
    latest: { id: after.summary.id, number: 4, same_content: true },
    base: { kind: 'previous', revision: before.summary },
    base_options: { approved: null, previous: { id: before.summary.id, number: 3 } },
    plan: reviewPlan(after.analysis.data, before.analysis.data),
    compare: compareRevisions(
      { text: beforeText, data: before.analysis.data, findings: before.analysis.findings },
      { text: afterText, data: after.analysis.data, findings: after.analysis.findings },
    ),
    checklist: [
      {
        id: 'failsafe-tested',
        label: 'Failsafe tested',
        detail: 'With the model restrained and the propeller off.',
        source: { label: 'cap-658', title: 'UK CAA CAP 658' },
        basis: null,
        covers: 'the channels and the receivers, their pins and failsafes',
        ticked: false,
        ticked_by: null,
        ticked_at: null,
        carried: null,
      },
      {
        id: 'range-check',
        label: 'Ground range check',
        detail: 'Before the first flight.',
        source: { label: 'ama-safety-code', title: 'AMA safety code' },
        basis: null,
        covers: 'the link and the receivers, their pins and failsafes',
        ticked: true,
        ticked_by: ines,
        ticked_at: '2026-04-02T14:00:00.000Z',
        carried: {
          review_id: 'older',
          revision_number: 3,
          reason: 'Carried from the review of revision 3: revision 4 leaves the link unchanged.',
        },
      },
    ],
    verdicts: [],
    threads: threadCounts([carriedThread]),
    model_state: { review_state: 'pending', cleared_for_maiden: false },
    can: { verdict: true, approve: true, approve_refusal: null, tick: true, comment: true },
    ...overrides,
  };
}

export function summaryOf(detail: ReviewDetail, overrides: Partial<ReviewSummary> = {}): ReviewSummary {
  return {
    id: detail.id,
    workspace_id: detail.workspace_id,
    model: detail.model,
    revision: {
      id: detail.revision.id,
      number: detail.revision.number,
      content_hash: detail.revision.content_hash,
      error_count: detail.revision.error_count,
      warning_count: detail.revision.warning_count,
      author: detail.revision.author,
    },
    requested_by: detail.requested_by,
    reviewers: detail.reviewers,
    note: detail.note,
    state: detail.state,
    decided_at: detail.decided_at,
    created_at: detail.created_at,
    verdict_count: detail.verdict_count,
    latest: detail.latest,
    ...overrides,
  };
}
