import { Badge, ReviewStateBadge } from '../../../components/ui/badge';
import { CheckIcon, InfoIcon, PencilIcon } from '../../../components/ui/icons';
import type { ReviewRequestState, Verdict } from '../types';

const AS_MODEL_STATE = { open: 'pending', approved: 'approved', 'changes-requested': 'changes-requested' } as const;

/** A review request's state, in the same words and marks as a model's review state. */
export function RequestStateBadge({ state }: { state: ReviewRequestState }) {
  return <ReviewStateBadge state={AS_MODEL_STATE[state]} />;
}

const VERDICT_LOOK = {
  approve: { tone: 'moss', icon: CheckIcon, word: 'Approved' },
  'request-changes': { tone: 'danger', icon: PencilIcon, word: 'Asked for changes' },
  comment: { tone: 'neutral', icon: InfoIcon, word: 'Commented' },
} as const;

export function VerdictBadge({ verdict }: { verdict: Verdict }) {
  const look = VERDICT_LOOK[verdict];
  return (
    <Badge tone={look.tone} icon={look.icon}>
      {look.word}
    </Badge>
  );
}
