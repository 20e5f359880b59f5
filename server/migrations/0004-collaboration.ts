import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};
const userRef = { type: DataTypes.INTEGER.UNSIGNED, references: { model: 'users', key: 'id' } };

// Working together: invitations and password resets by e-mail (only a hash of each token is kept), a
// person's settings, and the Library: items, their immutable revisions, who they are shared with, the
// hulls that took them in (pins) and the notices of newer revisions.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('invitations', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    hull_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'hulls', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.ENUM('owner', 'builder', 'designer', 'helper'), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    invited_by: { ...userRef, allowNull: false, onDelete: 'CASCADE' },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    accepted_at: { type: DataTypes.DATE(3), allowNull: true },
    accepted_by: { ...userRef, allowNull: true, onDelete: 'SET NULL' },
    revoked_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('invitations', ['hull_id', 'email']);

  await qi.createTable('password_resets', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    user_id: { ...userRef, allowNull: false, onDelete: 'CASCADE' },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    used_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('password_resets', ['user_id']);

  await qi.createTable('account_settings', {
    user_id: { ...userRef, primaryKey: true, onDelete: 'CASCADE' },
    notice_mail: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    ...timestamps,
  });

  await qi.createTable('library_items', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    author_id: { ...userRef, allowNull: false, onDelete: 'CASCADE' },
    kind: { type: DataTypes.ENUM('camber', 'lines'), allowNull: false },
    visibility: { type: DataTypes.ENUM('private', 'shared', 'public'), allowNull: false, defaultValue: 'private' },
    latest_revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('library_items', ['author_id']);
  await qi.addIndex('library_items', ['visibility']);

  await qi.createTable('library_revisions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    item_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'library_items', key: 'id' }, onDelete: 'CASCADE' },
    number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: false },
    rules: { type: DataTypes.TEXT, allowNull: false },
    document_json: { type: DataTypes.TEXT('medium'), allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('library_revisions', ['item_id', 'number'], { unique: true });
  // As with plan revisions, the database itself refuses to change a published revision.
  await qi.sequelize.query(`
    CREATE TRIGGER library_revisions_immutable BEFORE UPDATE ON library_revisions FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'library revisions are immutable'`);

  await qi.createTable('library_shares', {
    item_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'library_items', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: DataTypes.STRING(254), primaryKey: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('library_shares', ['email']);

  await qi.createTable('library_pins', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    hull_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'hulls', key: 'id' }, onDelete: 'CASCADE' },
    kind: { type: DataTypes.ENUM('camber', 'lines'), allowNull: false },
    item_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'library_items', key: 'id' }, onDelete: 'CASCADE' },
    revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'library_revisions', key: 'id' } },
    plan_revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'plan_revisions', key: 'id' }, onDelete: 'SET NULL' },
    pinned_by: { ...userRef, allowNull: false },
    ...timestamps,
  });
  // One camber and one set of lines per hull: taking another replaces the pin.
  await qi.addIndex('library_pins', ['hull_id', 'kind'], { unique: true });
  await qi.addIndex('library_pins', ['item_id']);

  await qi.createTable('library_notices', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    user_id: { ...userRef, allowNull: false, onDelete: 'CASCADE' },
    pin_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'library_pins', key: 'id' }, onDelete: 'CASCADE' },
    revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'library_revisions', key: 'id' } },
    dismissed_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });
  // One notice per person and pin, raised again (with the newest revision) by each publication.
  await qi.addIndex('library_notices', ['user_id', 'pin_id'], { unique: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('library_notices');
  await qi.dropTable('library_pins');
  await qi.dropTable('library_shares');
  await qi.sequelize.query('DROP TRIGGER IF EXISTS library_revisions_immutable');
  await qi.dropTable('library_revisions');
  await qi.dropTable('library_items');
  await qi.dropTable('account_settings');
  await qi.dropTable('password_resets');
  await qi.dropTable('invitations');
};
