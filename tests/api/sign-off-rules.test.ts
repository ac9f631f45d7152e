import { describe, expect, it } from 'vitest';
import { modelReviewState, reviewStateFromVerdicts, type ReviewFact } from '@api/reviews/sign-off';
import { anchorExists, readAnchor } from '@api/reviews/anchor-path';

const A = 'a'.repeat(64);
const B = 'b'.repeat(64);
const at = (minute: number) => new Date(Date.UTC(2026, 4, 1, 10, minute));

describe('a review’s state from its verdicts', () => {
  it.each([
    ['no verdicts', [], 'open'],
    ['comments only', [{ reviewerId: 'r1', verdict: 'comment', createdAt: at(1) }], 'open'],
    ['one approval', [{ reviewerId: 'r1', verdict: 'approve', createdAt: at(1) }], 'approved'],
    [
      'approval, then changes asked by another',
      [
        { reviewerId: 'r1', verdict: 'approve', createdAt: at(1) },
        { reviewerId: 'r2', verdict: 'request-changes', createdAt: at(2) },
      ],
      'changes-requested',
    ],
    [
      'changes asked, then the same reviewer approves',
      [
        { reviewerId: 'r1', verdict: 'request-changes', createdAt: at(1) },
        { reviewerId: 'r1', verdict: 'approve', createdAt: at(2) },
      ],
      'approved',
    ],
    [
      'changes asked, then a comment',
      [
        { reviewerId: 'r1', verdict: 'request-changes', createdAt: at(1) },
        { reviewerId: 'r1', verdict: 'comment', createdAt: at(2) },
      ],
      'changes-requested',
    ],
  ] as const)('%s → %s', (_label, verdicts, state) => {
    expect(reviewStateFromVerdicts(verdicts).state).toBe(state);
  });
});

describe('a model’s review state', () => {
  const approved = (hash: string, minute: number): ReviewFact => ({
    state: 'approved',
    contentHash: hash,
    decidedAt: at(minute),
  });
  const open = (hash: string): ReviewFact => ({ state: 'open', contentHash: hash, decidedAt: null });
  const changes = (hash: string, minute: number): ReviewFact => ({
    state: 'changes-requested',
    contentHash: hash,
    decidedAt: at(minute),
  });
  const clean = (hash: string) => ({ contentHash: hash, errorCount: 0 });

  it.each([
    ['never reviewed', clean(A), [], 'none'],
    ['asked, not answered', clean(A), [open(A)], 'pending'],
    ['approved, same content', clean(A), [approved(A, 1)], 'approved'],
    ['approved, then asked again on the same content', clean(A), [approved(A, 1), open(A)], 'approved'],
    ['approved earlier content only', clean(B), [approved(A, 1)], 'stale'],
    ['approved earlier content, new content asked', clean(B), [approved(A, 1), open(B)], 'pending'],
    ['changes asked on this content', clean(A), [changes(A, 1)], 'changes-requested'],
    ['changes asked, then approved later', clean(A), [changes(A, 1), approved(A, 2)], 'approved'],
    ['approved, then changes asked later', clean(A), [approved(A, 1), changes(A, 2)], 'changes-requested'],
    ['changes asked on older content', clean(B), [changes(A, 1)], 'none'],
    ['approved content that now has errors', { contentHash: A, errorCount: 1 }, [approved(A, 1)], 'stale'],
  ] as const)('%s → %s', (_label, latest, reviews, state) => {
    expect(modelReviewState(latest, reviews)).toBe(state);
  });
});

describe('comment anchors', () => {
  const document = { receivers: [{ id: 'wing', map: [{ pin: 3, ch: 11, failsafe: 'hold' }] }], 'odd key': { x: 1 } };

  it('reads paths written the way Bindery writes them and refuses others', () => {
    expect(readAnchor('receivers[id=wing].map[pin=3].failsafe')).toHaveLength(5);
    expect(readAnchor('["odd key"].x')).toHaveLength(2);
    expect(readAnchor('receivers[id=wing')).toBeNull();
    expect(readAnchor('receivers..map')).toBeNull();
  });

  it('finds a path by identity keys, indices and plain keys', () => {
    expect(anchorExists(document, 'receivers[id=wing].map[pin=3]')).toBe(true);
    expect(anchorExists(document, 'receivers[0].map[0].failsafe')).toBe(true);
    expect(anchorExists(document, '["odd key"].x')).toBe(true);
    expect(anchorExists(document, 'receivers[id=wing].map[pin=4]')).toBe(false);
    expect(anchorExists(document, 'receivers[id=tail]')).toBe(false);
    expect(anchorExists(document, 'receivers[id=wing].map[pin=3].telemetry')).toBe(false);
    expect(anchorExists(document, 'constructor')).toBe(false);
  });
});
