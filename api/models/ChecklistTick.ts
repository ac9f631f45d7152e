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

/** One pre-maiden checklist item ticked in a review (or carried from an earlier one); unticking removes the row. */
export class ChecklistTick extends Model<InferAttributes<ChecklistTick>, InferCreationAttributes<ChecklistTick>> {
  declare id: CreationOptional<string>;
  declare reviewId: ForeignKey<Review['id']>;
  declare item: string;
  declare tickedBy: ForeignKey<User['id']>;
  declare tickedAt: CreationOptional<Date>;
  /** The earlier review the tick was carried from, with the reason it still holds. */
  declare carriedFromReviewId: CreationOptional<ForeignKey<Review['id']> | null>;
  declare carriedReason: CreationOptional<string | null>;

  declare ticker?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    ChecklistTick.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        item: { type: DataTypes.TEXT, allowNull: false },
        tickedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        carriedReason: { type: DataTypes.TEXT, allowNull: true },
      },
      { sequelize, tableName: 'checklist_ticks', modelName: 'ChecklistTick', underscored: true, timestamps: false },
    );
  }
}
