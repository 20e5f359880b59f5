import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// The session store's table, made here rather than by the store's own sync(): the schema changes only
// through migrations.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(36), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT('medium'), allowNull: true },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('sessions', ['user_id']);
  await qi.addIndex('sessions', ['expires']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('sessions');
};
