import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A person (by e-mail, so they need no account yet) a shared Library item is shared with. */
export class LibraryShare extends Model<InferAttributes<LibraryShare>, InferCreationAttributes<LibraryShare>> {
  declare itemId: number;
  declare email: string;
  declare createdAt: CreationOptional<Date>;
}

export function initLibraryShare(sequelize: Sequelize) {
  LibraryShare.init(
    {
      itemId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      email: { type: DataTypes.STRING(254), primaryKey: true },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'library_shares', updatedAt: false },
  );
}
