import type { Revision } from './models';

export const REVIEW_STATES = ['none', 'pending', 'approved', 'stale', 'changes-requested'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

/**
 * The review state of each given latest revision, keyed by revision id: the one place
 * the hangar and the model page learn it from. Nothing records reviews yet, so every
 * revision is "none"; the reviews feature answers from its own tables here.
 */
export async function reviewStateOf(revisions: readonly Pick<Revision, 'id' | 'modelId' | 'contentHash'>[]): Promise<Map<string, ReviewState>> {
  return new Map(revisions.map((revision) => [revision.id, 'none' as ReviewState]));
}

/** A model is cleared for its maiden when its latest revision is approved (DESIGN.md, capability 8). */
export const clearedForMaiden = (state: ReviewState): boolean => state === 'approved';
