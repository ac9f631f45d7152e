import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { Membership } from './Membership';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  /** Stored lower-case; sign-in compares lower-cased input. */
  declare email: string;
  declare name: string;
  declare passwordHash: string;
  /** Tokens carry it; raising it ends every session the user has. */
  declare sessionVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare memberships?: NonAttribute<Membership[]>;

  static initModel(sequelize: Sequelize): void {
    User.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        email: {
          type: DataTypes.TEXT,
          allowNull: false,
          unique: true,
          set(value: string) {
            this.setDataValue('email', value.trim().toLowerCase());
          },
        },
        name: { type: DataTypes.TEXT, allowNull: false },
        passwordHash: { type: DataTypes.TEXT, allowNull: false },
        sessionVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users', modelName: 'User', underscored: true },
    );
  }
}
