import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** An immutable saved state of a hull's plan (the database refuses UPDATEs on this table). */
export class PlanRevision extends Model<InferAttributes<PlanRevision>, InferCreationAttributes<PlanRevision>> {
  declare id: CreationOptional<number>;
  declare hullId: number;
  declare baseRevisionId: number | null;
  declare authorId: number;
  declare summary: string;
  declare schemaVersion: number;
  /** The plan document as gzip-compressed JSON. */
  declare documentGz: Buffer;
  declare documentBytes: number;
  declare createdAt: CreationOptional<Date>;
}

export function initPlanRevision(sequelize: Sequelize) {
  PlanRevision.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      hullId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      baseRevisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      summary: { type: DataTypes.STRING(500), allowNull: false },
      schemaVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      documentGz: { type: DataTypes.BLOB('medium'), allowNull: false },
      documentBytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'plan_revisions', updatedAt: false },
  );
}
