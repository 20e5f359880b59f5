import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Plans are stored as immutable, compressed revisions; the hull points at its latest one. Drafts are
// per person and per hull, overwritten by every autosave.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('plan_revisions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    hull_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'hulls', key: 'id' }, onDelete: 'CASCADE' },
    base_revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    author_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    summary: { type: DataTypes.STRING(500), allowNull: false },
    schema_version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    document_gz: { type: DataTypes.BLOB('medium'), allowNull: false },
    document_bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('plan_revisions', ['hull_id', 'id']);
  // The database itself refuses to change a saved revision: immutability does not rest on the code alone.
  await qi.sequelize.query(`
    CREATE TRIGGER plan_revisions_immutable BEFORE UPDATE ON plan_revisions FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'plan revisions are immutable'`);

  await qi.addColumn('hulls', 'latest_revision_id', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });

  await qi.createTable('plan_drafts', {
    hull_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'hulls', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    base_revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    schema_version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    document_gz: { type: DataTypes.BLOB('medium'), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('plan_drafts');
  await qi.removeColumn('hulls', 'latest_revision_id');
  await qi.sequelize.query('DROP TRIGGER IF EXISTS plan_revisions_immutable');
  await qi.dropTable('plan_revisions');
};
