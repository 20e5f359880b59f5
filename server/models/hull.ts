import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { HullUnits } from '../../shared/api/hulls';

export class Hull extends Model<InferAttributes<Hull>, InferCreationAttributes<Hull>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare units: HullUnits;
  declare notes: string;
  declare archivedAt: CreationOptional<Date | null>;
  declare createdBy: number;
  /** The hull's current plan revision; null until the first save. */
  declare latestRevisionId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initHull(sequelize: Sequelize) {
  Hull.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      units: { type: DataTypes.ENUM('mm', 'ftin'), allowNull: false, defaultValue: 'mm' },
      notes: { type: DataTypes.TEXT, allowNull: false },
      archivedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      latestRevisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'hulls' },
  );
}
