import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { libraryKinds, type LibraryKind } from '../../shared/api/library';

/** A hull took a Library item in: which revision it follows now, and the plan revision that made it so. */
export class LibraryPin extends Model<InferAttributes<LibraryPin>, InferCreationAttributes<LibraryPin>> {
  declare id: CreationOptional<number>;
  declare hullId: number;
  declare kind: LibraryKind;
  declare itemId: number;
  declare revisionId: number;
  declare planRevisionId: number | null;
  declare pinnedBy: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initLibraryPin(sequelize: Sequelize) {
  LibraryPin.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      hullId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      kind: { type: DataTypes.ENUM(...libraryKinds), allowNull: false },
      itemId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      planRevisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      pinnedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'library_pins' },
  );
}
