import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One publication of a Library item; immutable (the database refuses UPDATEs on this table). */
export class LibraryRevision extends Model<InferAttributes<LibraryRevision>, InferCreationAttributes<LibraryRevision>> {
  declare id: CreationOptional<number>;
  declare itemId: number;
  declare number: number;
  declare name: string;
  declare notes: string;
  declare rules: string;
  /** The camber or the lines, as validated JSON. */
  declare documentJson: string;
  declare createdAt: CreationOptional<Date>;
}

export function initLibraryRevision(sequelize: Sequelize) {
  LibraryRevision.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      itemId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: false },
      rules: { type: DataTypes.TEXT, allowNull: false },
      documentJson: { type: DataTypes.TEXT('medium'), allowNull: false },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'library_revisions', updatedAt: false },
  );
}
