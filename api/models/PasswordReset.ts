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
import type { User } from './User';

/** A password reset that was asked for; the e-mailed token names this row, which makes it single-use. */
export class PasswordReset extends Model<InferAttributes<PasswordReset>, InferCreationAttributes<PasswordReset>> {
  declare id: CreationOptional<string>;
  declare userId: ForeignKey<User['id']>;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  declare user?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    PasswordReset.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'password_resets', modelName: 'PasswordReset', underscored: true, updatedAt: false },
    );
  }
}
