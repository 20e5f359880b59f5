import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One person's autosaved work in progress on one hull, with the revision it started from. */
export class PlanDraft extends Model<InferAttributes<PlanDraft>, InferCreationAttributes<PlanDraft>> {
  declare hullId: number;
  declare userId: number;
  declare baseRevisionId: number | null;
  declare schemaVersion: number;
  declare documentGz: Buffer;
  declare updatedAt: CreationOptional<Date>;
}

export function initPlanDraft(sequelize: Sequelize) {
  PlanDraft.init(
    {
      hullId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      baseRevisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      schemaVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      documentGz: { type: DataTypes.BLOB('medium'), allowNull: false },
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'plan_drafts', createdAt: false },
  );
}
