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
import type { User } from './User';

import { VERDICTS, type LeftOpen, type Verdict } from '@shared/contract/review';

export { VERDICTS, type Verdict };

/** A reviewer's verdict, pinned to the content hash of the revision it was given on. Never updated. */
export class ReviewVerdict extends Model<InferAttributes<ReviewVerdict>, InferCreationAttributes<ReviewVerdict>> {
  declare id: CreationOptional<string>;
  declare reviewId: ForeignKey<Review['id']>;
  declare reviewerId: ForeignKey<User['id']>;
  declare verdict: Verdict;
  declare body: CreationOptional<string>;
  declare contentHash: string;
  /** What an approval was confirmed with, left undone (unticked items, open warnings). */
  declare leftOpen: CreationOptional<LeftOpen | null>;
  declare createdAt: CreationOptional<Date>;

  declare reviewer?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    ReviewVerdict.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        verdict: { type: DataTypes.TEXT, allowNull: false, validate: { isIn: [[...VERDICTS]] } },
        body: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        contentHash: { type: DataTypes.TEXT, allowNull: false },
        leftOpen: { type: DataTypes.JSONB, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'review_verdicts', modelName: 'ReviewVerdict', underscored: true, updatedAt: false },
    );
  }
}
