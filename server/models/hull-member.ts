import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { roles, type Role } from '../../shared/api/hulls';

export class HullMember extends Model<InferAttributes<HullMember>, InferCreationAttributes<HullMember>> {
  declare hullId: number;
  declare userId: number;
  declare role: Role;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initHullMember(sequelize: Sequelize) {
  HullMember.init(
    {
      hullId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      role: { type: DataTypes.ENUM(...roles), allowNull: false },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'hull_members' },
  );
}
