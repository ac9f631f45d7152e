import type { Sequelize } from 'sequelize';
import type { MergeSide } from '@shared/lineage/merge-setups';
import { applyToText } from '@shared/lineage/apply-to-text';
import { Unprocessable } from '../errors';
import type { Revision, SetupModel, User } from '../models';
import { mergeOf, mergeSides } from '../queries/source-updates';
import { appendRevision } from '../revisions/append-revision';
import { requireLatestBase } from '../revisions/check-base';
import { checkSetupText } from '../revisions/check-setup';
import { lockModel } from '../revisions/lock-model';

export interface TakeInInput {
  fork: SetupModel;
  author: User;
  /** The fork's latest revision number the pilot looked at (409 stale-base otherwise). */
  base: number;
  resolutions: Readonly<Record<string, MergeSide>>;
  message?: string;
}

/**
 * Saves a new revision of the fork with the source's changes since the last merge taken
 * in (a three-way merge by identity key), the conflicts settled by `resolutions`. The
 * text is the fork's own with the changes written into it, so its comments and layout
 * stay; the revision names the source revision it took in, where the next merge starts.
 */
export async function takeInSource(sequelize: Sequelize, input: TakeInInput): Promise<Revision> {
  return sequelize.transaction(async (transaction) => {
    const locked = await lockModel(sequelize, input.fork.id, transaction);
    requireLatestBase(locked.latest, input.base);
    const sides = await mergeSides(input.fork, transaction);
    if (sides.theirs.number <= sides.base.number) {
      throw new Unprocessable(
        `The fork already has everything up to revision ${sides.theirs.number} of ${sides.source.name}.`,
        { code: 'up-to-date', details: { source_number: sides.theirs.number } },
      );
    }
    const merged = mergeOf(sides, input.resolutions);
    if (merged.conflicts.length > 0) {
      const paths = merged.conflicts.map((conflict) => conflict.path);
      throw new Unprocessable(
        `Choose a side for ${paths.length === 1 ? 'this setting' : `these ${paths.length} settings`} both the fork and its source changed: ${paths.join(', ')}.`,
        { code: 'unresolved-conflicts', details: { paths, conflicts: merged.conflicts } },
      );
    }
    const setup = checkSetupText(applyToText(sides.ours.yamlText, sides.ours.document, merged.data));
    return appendRevision(
      sequelize,
      locked,
      setup,
      {
        author: input.author,
        message:
          input.message && input.message.length > 0
            ? input.message
            : `Took in ${sides.source.name} up to revision ${sides.theirs.number}`,
        origin: 'merge',
        sourceRevisionId: sides.theirs.id,
        audit: {
          action: 'revision.merged',
          details: {
            source_model_id: sides.source.id,
            source_revision_id: sides.theirs.id,
            source_number: sides.theirs.number,
            resolutions: input.resolutions,
          },
        },
      },
      transaction,
    );
  });
}
