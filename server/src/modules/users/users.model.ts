import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Role } from '../../../shared/case-status';

export class UserModel extends Model<InferAttributes<UserModel>, InferCreationAttributes<UserModel>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare displayName: string;
  declare passwordHash: string;
  declare role: CreationOptional<Role>;
  declare emailVerified: CreationOptional<boolean>;
  declare disabled: CreationOptional<boolean>;
  declare about: string | null;
  declare notifyUrgent: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initUserModel(sequelize: Sequelize): void {
  UserModel.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      email: { type: DataTypes.CITEXT, allowNull: false, unique: true },
      displayName: { type: DataTypes.TEXT, allowNull: false },
      passwordHash: { type: DataTypes.TEXT, allowNull: false },
      role: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'grower' },
      emailVerified: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      about: { type: DataTypes.TEXT, allowNull: true, defaultValue: null },
      notifyUrgent: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdAt: { type: DataTypes.DATE },
      updatedAt: { type: DataTypes.DATE },
    },
    { sequelize, tableName: 'users', modelName: 'User' },
  );
}
