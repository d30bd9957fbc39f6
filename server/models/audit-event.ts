import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { appendOnlyHooks, referenceAttribute } from './common-attributes';
import type { Operator } from './operator';
import type { User } from './user';

/**
 * One line of the audit trail. Append-only: the hooks below refuse updates and deletes, and
 * no route or service offers either; rows are written by `recordAudit` only.
 */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare operatorId: ForeignKey<Operator['id']>;
  /** Null for events without a signed-in person (e.g. a password reset asked for by e-mail). */
  declare actorId: ForeignKey<User['id']> | null;
  declare action: string;
  declare entityType: string;
  declare entityId: string | null;
  /** JSON text; read through `detailsObject()`. */
  declare details: string | null;
  declare ip: string | null;
  declare userAgent: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof AuditEvent {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        operatorId: referenceAttribute(),
        actorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        action: { type: DataTypes.STRING(64), allowNull: false },
        entityType: { type: DataTypes.STRING(64), allowNull: false },
        entityId: { type: DataTypes.STRING(64), allowNull: true },
        details: { type: DataTypes.TEXT('long'), allowNull: true },
        ip: { type: DataTypes.STRING(64), allowNull: true },
        userAgent: { type: DataTypes.STRING(500), allowNull: true },
        createdAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      {
        sequelize,
        tableName: 'audit_events',
        updatedAt: false,
        hooks: appendOnlyHooks('Audit events are'),
      },
    );
    return AuditEvent;
  }

  detailsObject(): Record<string, unknown> | null {
    return this.details === null ? null : (JSON.parse(this.details) as Record<string, unknown>);
  }
}
