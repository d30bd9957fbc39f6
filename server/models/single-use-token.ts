import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute } from 'sequelize';
import { idAttribute, timestampAttributes } from './common-attributes';
import type { User } from './user';

/**
 * A link sent by e-mail that works once, for one person, until it expires (an invitation, a
 * password reset). Only the token's SHA-256 is stored; `M` is the model class itself.
 */
export abstract class SingleUseToken<M extends SingleUseToken<M>> extends Model<InferAttributes<M>, InferCreationAttributes<M>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<User['id']>;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: Date | null;
  /** Set when a newer link replaced this one, or the password changed by another link. */
  declare revokedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare user?: NonAttribute<User>;
}

/** The columns of a single-use token's table (the migration creates them alike for both). */
export function singleUseTokenAttributes() {
  return {
    id: idAttribute(),
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestampAttributes(),
  };
}
