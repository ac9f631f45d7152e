import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { Review } from './Review';
import type { Revision } from './Revision';
import type { SetupModel } from './SetupModel';
import type { User } from './User';

/**
 * A comment on a revision, made in a review or on its own. A thread's first comment may
 * name a semantic path and is shown on the model's later revisions while that path
 * exists; replies name the first comment and are resolved or reopened with it.
 */
export class ReviewComment extends Model<InferAttributes<ReviewComment>, InferCreationAttributes<ReviewComment>> {
  declare id: CreationOptional<string>;
  declare reviewId: ForeignKey<Review['id']> | null;
  declare revisionId: ForeignKey<Revision['id']>;
  declare modelId: ForeignKey<SetupModel['id']>;
  declare path: string | null;
  declare body: string;
  declare authorId: ForeignKey<User['id']>;
  /** A reply names the thread's first comment; a first comment has none. */
  declare parentId: CreationOptional<ForeignKey<ReviewComment['id']> | null>;
  /** Set on a thread's first comment while the thread is resolved. */
  declare resolvedAt: CreationOptional<Date | null>;
  declare resolvedBy: CreationOptional<ForeignKey<User['id']> | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare author?: NonAttribute<User>;
  declare revision?: NonAttribute<Revision>;
  declare model?: NonAttribute<SetupModel>;
  declare replies?: NonAttribute<ReviewComment[]>;

  static initModel(sequelize: Sequelize): void {
    ReviewComment.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        path: { type: DataTypes.TEXT, allowNull: true },
        body: { type: DataTypes.TEXT, allowNull: false },
        resolvedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'review_comments', modelName: 'ReviewComment', underscored: true },
    );
  }
}
