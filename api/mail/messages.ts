import type { Role } from '@shared/contract/roles';
import { composeMail, mailDate } from './compose';
import type { OutgoingMail } from './mail-service';
import type { BetweenRevisions } from '../reviews/between-revisions';

const ROLE_WORDS: Record<Role, string> = {
  owner: 'an owner (members, roles and everything else)',
  editor: 'an editor (models, revisions and receivers)',
  reviewer: 'a reviewer (reads everything and gives verdicts)',
  viewer: 'a viewer (reads everything)',
};

export function invitationMail(input: {
  to: string;
  inviter: string;
  workspace: string;
  role: Role;
  url: string;
  expiresAt: Date;
}): OutgoingMail {
  return composeMail({
    to: input.to,
    subject: `${input.inviter} invites you to ${input.workspace} on Bindery`,
    greeting: 'Hello,',
    body: [
      `${input.inviter} invites you to join the workspace "${input.workspace}" on Bindery as ${ROLE_WORDS[input.role]}.`,
      'Bindery keeps model setups for pilots who bind several receivers to one transmitter: every revision, its checks, and the sign-off before a maiden flight.',
    ],
    action: { label: 'Accept the invitation', url: input.url },
    after: [
      `The link works once and until ${mailDate(input.expiresAt)}.`,
      'If you did not expect this invitation, ignore this message; nothing happens unless the link is opened and accepted.',
    ],
  });
}

export function passwordResetMail(input: { to: string; name: string; url: string; expiresAt: Date }): OutgoingMail {
  return composeMail({
    to: input.to,
    subject: 'Choose a new Bindery password',
    greeting: `Hello ${input.name},`,
    body: [
      'Someone, hopefully you, asked to reset the password of your Bindery account. Choosing a new password signs you out everywhere else.',
    ],
    action: { label: 'Choose a new password', url: input.url },
    after: [
      `The link works once and until ${mailDate(input.expiresAt)}.`,
      'If you did not ask for this, ignore this message: your password stays as it is.',
    ],
  });
}

export interface ReviewMailSubject {
  model: string;
  revision: number;
  workspace: string;
  url: string;
}

// The same words as the review page's base (web/features/reviews/components/review-screen.tsx).
const BASE_WORDS: Record<NonNullable<BetweenRevisions['base']>['kind'], string> = {
  approved: 'the last approved revision',
};

const SEVERITY_WORDS = { error: 'Error', warning: 'Warning', info: 'Note' } as const;
const SEVERITY_ORDER = { error: 0, warning: 1, info: 2 } as const;

/**
 * The review page's "Between these revisions" as plain paragraphs: the reviewer reads
 * in the mail itself what changed meaning between the two revisions (a failsafe number
 * under a reversed channel, say), before opening the page.
 */
function betweenRevisionsParagraphs(between: BetweenRevisions, revision: number): string[] {
  if (!between.base)
    return [
      revision === 1
        ? 'Between these revisions: revision 1 is the first; there is nothing to compare it with.'
        : `Between these revisions: no revision before revision ${revision} is approved, so the review shows the whole setup as new; on the review page you can compare it with the revision before it or any other.`,
    ];
  const against = `${BASE_WORDS[between.base.kind]}, revision ${between.base.number}`;
  if (between.findings === null)
    return [
      `Between these revisions (compared with ${against}): these checks need both revisions to be valid setups, and one is not.`,
    ];
  if (between.findings.length === 0)
    return [`Between these revisions (compared with ${against}): no mistake shows only between the two.`];
  return [
    `Between these revisions (compared with ${against}), ${between.findings.length} finding${between.findings.length === 1 ? '' : 's'}:`,
    ...[...between.findings]
      .sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity])
      .map(
        (finding) =>
          `${SEVERITY_WORDS[finding.severity]} (${finding.rule}${finding.path ? `, at ${finding.path}` : ''}): ${finding.message}${finding.hint ? ` ${finding.hint}` : ''}`,
      ),
  ];
}

export function reviewRequestedMail(
  input: ReviewMailSubject & {
    to: string;
    reviewer: string;
    requester: string;
    note: string;
    errors: number;
    warnings: number;
    between: BetweenRevisions;
  },
): OutgoingMail {
  const checks =
    input.errors + input.warnings === 0
      ? 'The checks found no errors and no warnings.'
      : `The checks found ${input.errors} error${input.errors === 1 ? '' : 's'} and ${input.warnings} warning${input.warnings === 1 ? '' : 's'}.`;
  return composeMail({
    to: input.to,
    subject: `Review requested: ${input.model}, revision ${input.revision}`,
    greeting: `Hello ${input.reviewer},`,
    body: [
      `${input.requester} asks you to review revision ${input.revision} of "${input.model}" in ${input.workspace} before it flies.`,
      ...(input.note ? [`Their note: "${input.note}"`] : []),
      checks,
      ...betweenRevisionsParagraphs(input.between, input.revision),
      'The review page shows the whole compare and holds the pre-maiden checklist.',
    ],
    action: { label: 'Open the review', url: input.url },
    after: [
      'Bindery is a record and a checker, not a certification: the bench and field checks are still yours to make.',
    ],
  });
}

const VERDICT_WORDS = {
  approve: 'approved',
  'request-changes': 'asked for changes to',
  comment: 'commented on',
} as const;

export function verdictMail(
  input: ReviewMailSubject & {
    to: string;
    recipient: string;
    reviewer: string;
    verdict: keyof typeof VERDICT_WORDS;
    body: string;
    ticked: number;
    items: number;
  },
): OutgoingMail {
  return composeMail({
    to: input.to,
    subject: `${input.reviewer} ${VERDICT_WORDS[input.verdict]} ${input.model}, revision ${input.revision}`,
    greeting: `Hello ${input.recipient},`,
    body: [
      `${input.reviewer} ${VERDICT_WORDS[input.verdict]} revision ${input.revision} of "${input.model}" in ${input.workspace}.`,
      ...(input.body ? [`"${input.body}"`] : []),
      `Pre-maiden checklist: ${input.ticked} of ${input.items} items ticked.`,
    ],
    action: { label: 'Open the review', url: input.url },
    after:
      input.verdict === 'approve'
        ? ['The approval holds while the setup stays as approved; a revision that changes it needs a new review.']
        : [],
  });
}
