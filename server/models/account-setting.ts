import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A person's own settings; no row means the defaults. */
export class AccountSetting extends Model<InferAttributes<AccountSetting>, InferCreationAttributes<AccountSetting>> {
  declare userId: number;
  /** Send an e-mail as well when a notice is raised. */
  declare noticeMail: boolean;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initAccountSetting(sequelize: Sequelize) {
  AccountSetting.init(
    {
      userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      noticeMail: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'account_settings' },
  );
}
