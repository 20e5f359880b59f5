import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { roles, type Role } from '../../shared/api/hulls';

/** An invitation by e-mail to a hull's crew. Only the SHA-256 of the link's token is stored. */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>;
  declare hullId: number;
  declare email: string;
  declare role: Role;
  declare tokenHash: string;
  declare invitedBy: number;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedBy: CreationOptional<number | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initInvitation(sequelize: Sequelize) {
  Invitation.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      hullId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false },
      role: { type: DataTypes.ENUM(...roles), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false },
      invitedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      expiresAt: { type: DataTypes.DATE(3), allowNull: false },
      acceptedAt: { type: DataTypes.DATE(3), allowNull: true },
      acceptedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      revokedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'invitations' },
  );
}
