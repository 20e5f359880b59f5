import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A person is told that a pin of one of their hulls has a newer revision; one row per person and pin. */
export class LibraryNotice extends Model<InferAttributes<LibraryNotice>, InferCreationAttributes<LibraryNotice>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare pinId: number;
  /** The newer revision the notice is about. */
  declare revisionId: number;
  declare dismissedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initLibraryNotice(sequelize: Sequelize) {
  LibraryNotice.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      pinId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      dismissedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'library_notices' },
  );
}
