import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * Rows of the session store (connect-session-sequelize is given this model rather than defining and
 * syncing its own). `userId` lets every session of an account be ended at once, e.g. after a password reset.
 */
export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
  declare sid: string;
  declare expires: Date | null;
  declare data: string | null;
  declare userId: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initSession(sequelize: Sequelize) {
  Session.init(
    {
      sid: { type: DataTypes.STRING(36), primaryKey: true },
      expires: { type: DataTypes.DATE, allowNull: true },
      data: { type: DataTypes.TEXT('medium'), allowNull: true },
      userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'sessions', modelName: 'Session' },
  );
}
