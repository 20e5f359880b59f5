import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

const hullRef = { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'hulls', key: 'id' }, onDelete: 'CASCADE' };
const userRef = { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' };
const stages = ['patterned', 'cut', 'laminated', 'shaped', 'test-fitted', 'tacked', 'filleted', 'taped', 'glassed'];

// The build log: an append-only list of stage events per part (a reopen is a new row, nothing is
// overwritten), the photos attached to parts (the bytes live behind the photo storage, keyed here), and
// a per-hull setting for how far a later revision may move a cut part before it is flagged.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('build_events', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    hull_id: hullRef,
    part_id: { type: DataTypes.STRING(64), allowNull: false },
    layer_index: { type: DataTypes.TINYINT.UNSIGNED, allowNull: true },
    stage: { type: DataTypes.ENUM(...stages), allowNull: false },
    action: { type: DataTypes.ENUM('done', 'reopened'), allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: false },
    revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'plan_revisions', key: 'id' }, onDelete: 'SET NULL' },
    used_ply_sheets: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    used_epoxy_ml: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    used_filler_ml: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    used_tape_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    author_id: userRef,
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('build_events', ['hull_id', 'part_id', 'id']);

  await qi.createTable('build_photos', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    hull_id: hullRef,
    part_id: { type: DataTypes.STRING(64), allowNull: false },
    stage: { type: DataTypes.ENUM(...stages), allowNull: true },
    caption: { type: DataTypes.STRING(500), allowNull: false },
    storage_key: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    thumb_width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    thumb_height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    uploader_id: userRef,
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('build_photos', ['hull_id', 'part_id']);

  await qi.createTable('build_settings', {
    hull_id: { ...hullRef, primaryKey: true },
    move_tolerance_mm: { type: DataTypes.DOUBLE, allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('build_settings');
  await qi.dropTable('build_photos');
  await qi.dropTable('build_events');
};
