import { Forbidden, Unprocessable } from '../errors';
import type { User } from '../models';
import type { ReviewAccess } from '../access/records';
import { contributorsOf } from './contributors';

// Read by the verdict command (to refuse) and by the review view (to say why the
// Approve choice is not offered), so it lives with the sign-off rules, not in either.
/** Why this user may not approve this revision, if they may not. */
export async function approvalRefusal(
  access: Pick<ReviewAccess, 'review'>,
  user: User,
): Promise<Forbidden | Unprocessable | null> {
  const { revision } = access.review;
  if (revision.authorId === user.id) {
    return new Forbidden('Nobody approves their own revision: ask another reviewer to sign it off.', {
      code: 'own-revision',
    });
  }
  if ((await contributorsOf(revision)).has(user.id)) {
    return new Forbidden(
      `You wrote part of what revision ${revision.number} would sign off (a revision since the last approved setup, or one with this same content), so you cannot approve it: ask another reviewer.`,
      { code: 'own-change' },
    );
  }
  if (revision.errorCount > 0) {
    return new Unprocessable(
      `Revision ${revision.number} has ${revision.errorCount} check error${revision.errorCount === 1 ? '' : 's'}; a revision with errors cannot be approved. Ask for changes instead.`,
      { code: 'has-errors', details: { errors: revision.errorCount } },
    );
  }
  return null;
}
