import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** The cut list arranged by hand for one revision of a hull; `layoutJson` is a `sheetLayoutSchema` document. */
export class CutListArrangement extends Model<InferAttributes<CutListArrangement>, InferCreationAttributes<CutListArrangement>> {
  declare id: CreationOptional<number>;
  declare hullId: number;
  declare revisionId: number;
  declare layoutJson: string;
  declare savedBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initCutListArrangement(sequelize: Sequelize) {
  CutListArrangement.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      hullId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      layoutJson: { type: DataTypes.TEXT('medium'), allowNull: false },
      savedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'cut_list_arrangements' },
  );
}
