import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Operator } from './operator';
import type { User } from './user';

/** A link that lets an invited person choose their first password. Only the token's SHA-256 is stored. */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>;
  declare operatorId: ForeignKey<Operator['id']>;
  declare userId: ForeignKey<User['id']>;
  declare invitedById: ForeignKey<User['id']> | null;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: Date | null;
  /** Set when a newer invitation replaced this one. */
  declare revokedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare user?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): typeof Invitation {
    Invitation.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'invitations' },
    );
    return Invitation;
  }
}
