import type { SetupModelView } from './types';

const LATEST_WORDS = {
  none: 'not reviewed',
  stale: 'not reviewed',
  pending: 'waiting for review',
  'changes-requested': 'changes asked for',
  approved: 'approved',
} as const;

/**
 * Which revision is cleared to fly, in one line: "Approved r9, latest r11 waiting for
 * review" when an earlier revision holds the approval the latest does not; "Approved
 * r11" when the latest holds it; null when nothing is approved.
 */
export function clearedWords(model: Pick<SetupModelView, 'approved' | 'latest' | 'review_state'>): string | null {
  const approved = model.approved ?? null;
  if (!approved) return null;
  if (!model.latest || model.review_state === 'approved' || model.latest.number === approved.number)
    return `Approved r${approved.number}`;
  return `Approved r${approved.number}, latest r${model.latest.number} ${LATEST_WORDS[model.review_state]}`;
}
