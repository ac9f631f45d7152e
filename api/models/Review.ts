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
import type { ChecklistTick } from './ChecklistTick';
import type { Revision } from './Revision';
import type { ReviewVerdict } from './ReviewVerdict';
import type { SetupModel } from './SetupModel';
import type { User } from './User';
import type { Workspace } from './Workspace';

import { REVIEW_REQUEST_STATES, type ReviewRequestState } from '@shared/contract/review';

export { REVIEW_REQUEST_STATES, type ReviewRequestState };

/** A request for sign-off of one revision by chosen members; its state follows the verdicts. */
export class Review extends Model<InferAttributes<Review>, InferCreationAttributes<Review>> {
  declare id: CreationOptional<string>;
  declare revisionId: ForeignKey<Revision['id']>;
  declare modelId: ForeignKey<SetupModel['id']>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare requestedBy: ForeignKey<User['id']>;
  declare reviewerIds: string[];
  declare note: CreationOptional<string>;
  declare state: CreationOptional<ReviewRequestState>;
  declare decidedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare revision?: NonAttribute<Revision>;
  declare model?: NonAttribute<SetupModel>;
  declare requester?: NonAttribute<User>;
  declare verdicts?: NonAttribute<ReviewVerdict[]>;
  declare ticks?: NonAttribute<ChecklistTick[]>;

  static initModel(sequelize: Sequelize): void {
    Review.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        reviewerIds: { type: DataTypes.ARRAY(DataTypes.UUID), allowNull: false },
        note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        state: {
          type: DataTypes.TEXT,
          allowNull: false,
          defaultValue: 'open',
          validate: { isIn: [[...REVIEW_REQUEST_STATES]] },
        },
        decidedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'reviews', modelName: 'Review', underscored: true },
    );
  }
}
