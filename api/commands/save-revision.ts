import type { Sequelize, Transaction } from 'sequelize';
import type { AuditAction } from '../audit/record-audit-event';
import { inTransaction } from '../db/transaction';
import type { Revision, User } from '../models';
import type { RevisionOrigin } from '../models/Revision';
import { appendRevision } from '../revisions/append-revision';
import { requireLatestBase } from '../revisions/check-base';
import { checkSetupDocument, checkSetupText } from '../revisions/check-setup';
import { lockModel } from '../revisions/lock-model';

export interface SaveRevisionInput {
  modelId: string;
  author: User;
  base: number;
  yaml: string;
  message?: string;
  origin?: Extract<RevisionOrigin, 'save' | 'upload'>;
  createdAt?: Date;
  transaction?: Transaction;
}

const AUDIT_FOR: Record<'save' | 'upload', AuditAction> = { save: 'revision.saved', upload: 'revision.uploaded' };

/**
 * Saves a new revision on `base`, in four steps each in its own module of
 * api/revisions/: the text is read and checked before any lock is taken; in one
 * transaction the model row is locked, the base is compared with the latest number
 * (409 stale-base unless it still is the latest), and the revision is appended with its
 * audit entry in one statement.
 */
export async function saveRevision(sequelize: Sequelize, input: SaveRevisionInput): Promise<Revision> {
  const origin = input.origin ?? 'save';
  const setup = origin === 'upload' ? checkSetupDocument(input.yaml) : checkSetupText(input.yaml);
  return inTransaction(sequelize, input.transaction, async (transaction) => {
    const locked = await lockModel(sequelize, input.modelId, transaction);
    requireLatestBase(locked.latest, input.base);
    return appendRevision(
      sequelize,
      locked,
      setup,
      {
        author: input.author,
        message: input.message ?? '',
        origin,
        createdAt: input.createdAt,
        audit: { action: AUDIT_FOR[origin], details: {} },
        followName: true,
      },
      transaction,
    );
  });
}
