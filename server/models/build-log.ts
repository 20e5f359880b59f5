import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { buildStages, type BuildStage } from '../../shared/api/build-log';

/** One stage marked done or reopened on a part (or one of its layers). Rows are never changed. */
export class BuildEventRow extends Model<InferAttributes<BuildEventRow>, InferCreationAttributes<BuildEventRow>> {
  declare id: CreationOptional<number>;
  declare hullId: number;
  declare partId: string;
  declare layerIndex: number | null;
  declare stage: BuildStage;
  declare action: 'done' | 'reopened';
  declare note: string;
  declare revisionId: number | null;
  declare usedPlySheets: number;
  declare usedEpoxyMl: number;
  declare usedFillerMl: number;
  declare usedTapeM: number;
  declare authorId: number;
  declare createdAt: CreationOptional<Date>;
}

/** A photo of a part; its bytes (re-encoded full size and a thumbnail) are in the photo storage under `storageKey`. */
export class BuildPhotoRow extends Model<InferAttributes<BuildPhotoRow>, InferCreationAttributes<BuildPhotoRow>> {
  declare id: CreationOptional<number>;
  declare hullId: number;
  declare partId: string;
  declare stage: BuildStage | null;
  declare caption: string;
  declare storageKey: string;
  declare width: number;
  declare height: number;
  declare thumbWidth: number;
  declare thumbHeight: number;
  declare uploaderId: number;
  declare createdAt: CreationOptional<Date>;
}

export class BuildSetting extends Model<InferAttributes<BuildSetting>, InferCreationAttributes<BuildSetting>> {
  declare hullId: number;
  declare moveToleranceMm: number;
  declare updatedAt: CreationOptional<Date>;
}

export function initBuildLog(sequelize: Sequelize) {
  // Functions, not shared objects: Sequelize writes into each attribute's definition.
  const id = () => ({ type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true });
  const ref = () => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull: false });
  BuildEventRow.init(
    {
      id: id(),
      hullId: ref(),
      partId: { type: DataTypes.STRING(64), allowNull: false },
      layerIndex: { type: DataTypes.TINYINT.UNSIGNED, allowNull: true },
      stage: { type: DataTypes.ENUM(...buildStages), allowNull: false },
      action: { type: DataTypes.ENUM('done', 'reopened'), allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false },
      revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      usedPlySheets: { type: DataTypes.DOUBLE, allowNull: false },
      usedEpoxyMl: { type: DataTypes.DOUBLE, allowNull: false },
      usedFillerMl: { type: DataTypes.DOUBLE, allowNull: false },
      usedTapeM: { type: DataTypes.DOUBLE, allowNull: false },
      authorId: ref(),
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'build_events', updatedAt: false },
  );
  BuildPhotoRow.init(
    {
      id: id(),
      hullId: ref(),
      partId: { type: DataTypes.STRING(64), allowNull: false },
      stage: { type: DataTypes.ENUM(...buildStages), allowNull: true },
      caption: { type: DataTypes.STRING(500), allowNull: false },
      storageKey: { type: DataTypes.STRING(100), allowNull: false },
      width: ref(),
      height: ref(),
      thumbWidth: ref(),
      thumbHeight: ref(),
      uploaderId: ref(),
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'build_photos', updatedAt: false },
  );
  BuildSetting.init(
    {
      hullId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      moveToleranceMm: { type: DataTypes.DOUBLE, allowNull: false },
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'build_settings', createdAt: false },
  );
}
