import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// The cut list's pieces as the builder arranged them by hand on the sheet view, one row per hull and
// revision (a revision's pieces never change, so an arrangement made for it stays true to it). The
// arrangement itself is JSON checked by the shared zod schema on every write and every read.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('cut_list_arrangements', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    hull_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'hulls', key: 'id' }, onDelete: 'CASCADE' },
    revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'plan_revisions', key: 'id' }, onDelete: 'CASCADE' },
    layout_json: { type: DataTypes.TEXT('medium'), allowNull: false },
    saved_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('cut_list_arrangements', ['hull_id', 'revision_id'], { unique: true, name: 'cut_list_arrangements_hull_revision' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('cut_list_arrangements');
};
