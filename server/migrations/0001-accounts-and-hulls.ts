import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    display_name: { type: DataTypes.STRING(80), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    ...timestamps,
  });
  await qi.createTable('hulls', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    units: { type: DataTypes.ENUM('mm', 'ftin'), allowNull: false, defaultValue: 'mm' },
    notes: { type: DataTypes.TEXT, allowNull: false },
    archived_at: { type: DataTypes.DATE(3), allowNull: true },
    created_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    ...timestamps,
  });
  await qi.createTable('hull_members', {
    hull_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'hulls', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    role: { type: DataTypes.ENUM('owner', 'builder', 'designer', 'helper'), allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('hull_members', ['user_id']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('hull_members');
  await qi.dropTable('hulls');
  await qi.dropTable('users');
};
