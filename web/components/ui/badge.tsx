import type { ComponentType, ReactNode, SVGProps } from 'react';
import type { ReviewState } from '@shared/contract/review-state';
import type { Severity } from '@shared/findings';
import { cx } from '../../lib/cx';
import {
  CheckIcon,
  ClockIcon,
  DashedCircleIcon,
  ErrorIcon,
  InfoIcon,
  PencilIcon,
  StaleIcon,
  WarningIcon,
} from './icons';

export type { ReviewState };

type Tone = 'danger' | 'caution' | 'info' | 'moss' | 'accent' | 'neutral';

const tones: Record<Tone, string> = {
  danger: 'bg-danger-100 text-danger-700 border-danger-700/40',
  caution: 'bg-caution-100 text-caution-700 border-caution-700/40',
  info: 'bg-info-100 text-info-700 border-info-700/40',
  moss: 'bg-moss-100 text-moss-700 border-moss-700/40',
  accent: 'bg-accent-100 text-accent-800 border-accent-700/40',
  neutral: 'bg-ply-100 text-ink-700 border-ply-300',
};

export interface BadgeProps {
  tone?: Tone;
  icon?: ComponentType<SVGProps<SVGSVGElement>>;
  children: ReactNode;
  className?: string;
}

/** A state in a word, with an icon and a colour beside it: the word alone carries the meaning. */
export function Badge({ tone = 'neutral', icon: Icon, children, className }: BadgeProps) {
  return (
    <span
      className={cx(
        'inline-flex items-center gap-1 rounded-sm border px-1.5 py-0.5 text-xs font-medium whitespace-nowrap',
        tones[tone],
        className,
      )}
    >
      {Icon && <Icon className="shrink-0" />}
      {children}
    </span>
  );
}

const severityLook: Record<Severity, { tone: Tone; icon: BadgeProps['icon']; word: string }> = {
  error: { tone: 'danger', icon: ErrorIcon, word: 'Error' },
  warning: { tone: 'caution', icon: WarningIcon, word: 'Warning' },
  // The format's severity `info` is shown as a note everywhere, one word for one idea.
  info: { tone: 'info', icon: InfoIcon, word: 'Note' },
};

export function SeverityBadge({ severity, count }: { severity: Severity; count?: number }) {
  const look = severityLook[severity];
  const plural = count === 1 ? look.word.toLowerCase() : `${look.word.toLowerCase()}s`;
  const word = count === undefined ? look.word : `${count} ${plural}`;
  return (
    <Badge tone={look.tone} icon={look.icon}>
      {word}
    </Badge>
  );
}

const reviewLook: Record<ReviewState, { tone: Tone; icon: BadgeProps['icon']; word: string }> = {
  none: { tone: 'neutral', icon: DashedCircleIcon, word: 'Not reviewed' },
  pending: { tone: 'accent', icon: ClockIcon, word: 'Review pending' },
  approved: { tone: 'moss', icon: CheckIcon, word: 'Approved' },
  stale: { tone: 'caution', icon: StaleIcon, word: 'Approval stale' },
  'changes-requested': { tone: 'danger', icon: PencilIcon, word: 'Changes requested' },
};

export function ReviewStateBadge({ state }: { state: ReviewState }) {
  const look = reviewLook[state];
  return (
    <Badge tone={look.tone} icon={look.icon}>
      {look.word}
    </Badge>
  );
}
