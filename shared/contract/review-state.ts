// A model's review state as the API answers it and the screens show it.
export const REVIEW_STATES = ['none', 'pending', 'approved', 'stale', 'changes-requested'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

/** A model is cleared for its maiden when its latest revision is approved; approval needs a revision without errors. */
export const clearedForMaiden = (state: ReviewState): boolean => state === 'approved';
