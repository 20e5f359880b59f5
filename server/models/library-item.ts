import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { libraryKinds, visibilities, type LibraryKind, type Visibility } from '../../shared/api/library';

/** A published camber curve or set of lines: its author, who may see it, and its newest revision. */
export class LibraryItem extends Model<InferAttributes<LibraryItem>, InferCreationAttributes<LibraryItem>> {
  declare id: CreationOptional<number>;
  declare authorId: number;
  declare kind: LibraryKind;
  declare visibility: Visibility;
  declare latestRevisionId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initLibraryItem(sequelize: Sequelize) {
  LibraryItem.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      kind: { type: DataTypes.ENUM(...libraryKinds), allowNull: false },
      visibility: { type: DataTypes.ENUM(...visibilities), allowNull: false },
      latestRevisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'library_items' },
  );
}
