import type { Sequelize } from 'sequelize';
import { Membership } from './Membership';
import { User } from './User';
import { Workspace } from './Workspace';
import { SetupModel } from './SetupModel';
import { Revision } from './Revision';
import { Tag } from './Tag';
import { AuditEvent } from './AuditEvent';
import { OutboxMessage } from './OutboxMessage';
import { Invitation } from './Invitation';
import { PasswordReset } from './PasswordReset';
import { Review } from './Review';
import { ReviewVerdict } from './ReviewVerdict';
import { ReviewComment } from './ReviewComment';
import { ChecklistTick } from './ChecklistTick';
import { Receiver } from './Receiver';
import { ReceiverInstall } from './ReceiverInstall';
import { ClubRules } from './ClubRules';
import { followClubRules } from './follow-club-rules';

export { Membership, User, Workspace };
export { SetupModel, Revision, Tag, AuditEvent };
export { OutboxMessage, Invitation, PasswordReset };
export { Review, ReviewVerdict, ReviewComment, ChecklistTick };
export { Receiver, ReceiverInstall };
export { ClubRules };
export { rulesOf, rulesByModel } from './ClubRules';
export { followClubRules } from './follow-club-rules';

let boundTo: Sequelize | null = null;

// Model classes are module-wide, so a process binds them to one Sequelize instance
// (one per test file, since vitest isolates files).
export function initModels(sequelize: Sequelize): void {
  if (boundTo === sequelize) return;
  if (boundTo) throw new Error('The models are already bound to another Sequelize instance in this process.');
  User.initModel(sequelize);
  Workspace.initModel(sequelize);
  Membership.initModel(sequelize);

  User.hasMany(Membership, { as: 'memberships', foreignKey: 'userId' });
  Workspace.hasMany(Membership, { as: 'memberships', foreignKey: 'workspaceId' });
  Membership.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Membership.belongsTo(Workspace, { as: 'workspace', foreignKey: 'workspaceId' });

  SetupModel.initModel(sequelize);
  Revision.initModel(sequelize);
  ClubRules.initModel(sequelize);
  // Every revision read follows its club's rules in force now (see follow-club-rules).
  Revision.addHook('afterFind', 'followClubRules', async (found: Revision | Revision[] | null, options) => {
    const list = Array.isArray(found) ? found : found ? [found] : [];
    await followClubRules(list, options.transaction);
  });
  Tag.initModel(sequelize);
  AuditEvent.initModel(sequelize);
  SetupModel.belongsTo(Workspace, { as: 'workspace', foreignKey: 'workspaceId' });
  SetupModel.belongsTo(User, { as: 'creator', foreignKey: 'createdBy' });
  SetupModel.belongsTo(Revision, { as: 'forkedFrom', foreignKey: 'forkedFromRevisionId', constraints: false });
  SetupModel.hasMany(Revision, { as: 'revisions', foreignKey: 'modelId' });
  Revision.belongsTo(SetupModel, { as: 'model', foreignKey: 'modelId' });
  Revision.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  Revision.hasMany(Tag, { as: 'tags', foreignKey: 'revisionId' });
  Tag.belongsTo(Revision, { as: 'revision', foreignKey: 'revisionId' });
  Tag.belongsTo(SetupModel, { as: 'model', foreignKey: 'modelId' });
  Tag.belongsTo(User, { as: 'creator', foreignKey: 'createdBy' });
  AuditEvent.belongsTo(Workspace, { as: 'workspace', foreignKey: 'workspaceId' });
  AuditEvent.belongsTo(User, { as: 'actor', foreignKey: 'actorId' });
  OutboxMessage.initModel(sequelize);
  Invitation.initModel(sequelize);
  PasswordReset.initModel(sequelize);
  Invitation.belongsTo(Workspace, { as: 'workspace', foreignKey: 'workspaceId' });
  Invitation.belongsTo(User, { as: 'inviter', foreignKey: 'invitedBy' });
  PasswordReset.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Receiver.initModel(sequelize);
  ReceiverInstall.initModel(sequelize);
  Receiver.belongsTo(Workspace, { as: 'workspace', foreignKey: 'workspaceId' });
  Receiver.belongsTo(User, { as: 'creator', foreignKey: 'createdBy' });
  Receiver.hasMany(ReceiverInstall, { as: 'installs', foreignKey: 'receiverId' });
  ReceiverInstall.belongsTo(Receiver, { as: 'receiver', foreignKey: 'receiverId' });
  ReceiverInstall.belongsTo(SetupModel, { as: 'model', foreignKey: 'modelId' });
  ReceiverInstall.belongsTo(User, { as: 'installer', foreignKey: 'installedBy' });
  ReceiverInstall.belongsTo(User, { as: 'remover', foreignKey: 'removedBy' });
  Review.initModel(sequelize);
  // A review's revision is read as an include, which the Revision hook does not see.
  Review.addHook('afterFind', 'followClubRules', async (found: Review | Review[] | null, options) => {
    const list = Array.isArray(found) ? found : found ? [found] : [];
    const revisions = list.flatMap((review) => (review.revision ? [review.revision] : []));
    await followClubRules(revisions, options.transaction);
  });
  ReviewVerdict.initModel(sequelize);
  ReviewComment.initModel(sequelize);
  ChecklistTick.initModel(sequelize);
  Review.belongsTo(Revision, { as: 'revision', foreignKey: 'revisionId' });
  Review.belongsTo(SetupModel, { as: 'model', foreignKey: 'modelId' });
  Review.belongsTo(Workspace, { as: 'workspace', foreignKey: 'workspaceId' });
  Review.belongsTo(User, { as: 'requester', foreignKey: 'requestedBy' });
  Review.hasMany(ReviewVerdict, { as: 'verdicts', foreignKey: 'reviewId' });
  Review.hasMany(ChecklistTick, { as: 'ticks', foreignKey: 'reviewId' });
  ReviewVerdict.belongsTo(Review, { as: 'review', foreignKey: 'reviewId' });
  ReviewVerdict.belongsTo(User, { as: 'reviewer', foreignKey: 'reviewerId' });
  ReviewComment.belongsTo(Review, { as: 'review', foreignKey: 'reviewId' });
  ReviewComment.belongsTo(Revision, { as: 'revision', foreignKey: 'revisionId' });
  ReviewComment.belongsTo(SetupModel, { as: 'model', foreignKey: 'modelId' });
  ReviewComment.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  ReviewComment.belongsTo(User, { as: 'resolver', foreignKey: 'resolvedBy' });
  ReviewComment.belongsTo(ReviewComment, { as: 'thread', foreignKey: 'parentId' });
  ReviewComment.hasMany(ReviewComment, { as: 'replies', foreignKey: 'parentId' });
  ChecklistTick.belongsTo(Review, { as: 'review', foreignKey: 'reviewId' });
  ChecklistTick.belongsTo(User, { as: 'ticker', foreignKey: 'tickedBy' });
  ChecklistTick.belongsTo(Review, { as: 'carriedFrom', foreignKey: 'carriedFromReviewId' });
  boundTo = sequelize;
}
