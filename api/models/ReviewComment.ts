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
 * A comment on a revision, made in a review or on its own. An anchored comment names
 * a semantic path and is shown on the model's later revisions while that path exists.
 */
export class ReviewComment extends Model<InferAttributes<ReviewComment>, InferCreationAttributes<ReviewComment>> {
  declare id: CreationOptional<string>;
  declare reviewId: ForeignKey<Review['id']> | null;
  declare revisionId: ForeignKey<Revision['id']>;
  declare modelId: ForeignKey<SetupModel['id']>;
  declare path: string | null;
  declare body: string;
  declare authorId: ForeignKey<User['id']>;
  declare createdAt: CreationOptional<Date>;

  declare author?: NonAttribute<User>;
  declare revision?: NonAttribute<Revision>;

  static initModel(sequelize: Sequelize): void {
    ReviewComment.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        path: { type: DataTypes.TEXT, allowNull: true },
        body: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'review_comments', modelName: 'ReviewComment', underscored: true, updatedAt: false },
    );
  }
}
