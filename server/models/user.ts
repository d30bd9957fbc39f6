import { DataTypes, type CreationOptional, type NonAttribute, type Sequelize } from 'sequelize';
import { ROLES, type Role } from '@shared/auth/roles';
import { OperatorRecord, operatorRecordAttributes } from './common-attributes';
import type { Operator } from './operator';

/**
 * A person who signs in. E-mail addresses are stored lower-case and unique within an operator;
 * across operators at most one person per address has a password (the one who signs in).
 */
export class User extends OperatorRecord<User> {
  declare email: string;
  declare displayName: string;
  declare role: Role;
  declare passwordHash: string | null;
  /** Consecutive failed sign-ins since the last success. */
  declare failedSignIns: CreationOptional<number>;
  /** Set after too many failed sign-ins; sign-in is refused until then. */
  declare lockedUntil: Date | null;
  /** Locked by an administrator until unlocked. */
  declare lockedByAdmin: CreationOptional<boolean>;
  declare lastSignInAt: Date | null;

  declare operator?: NonAttribute<Operator>;

  static initModel(sequelize: Sequelize): typeof User {
    User.init(
      {
        ...operatorRecordAttributes(),
        email: { type: DataTypes.STRING(254), allowNull: false },
        displayName: { type: DataTypes.STRING(200), allowNull: false },
        role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
        passwordHash: { type: DataTypes.STRING(255), allowNull: true },
        failedSignIns: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        lockedUntil: { type: DataTypes.DATE, allowNull: true },
        lockedByAdmin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        lastSignInAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'users' },
    );
    return User;
  }
}
