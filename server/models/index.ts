import type { Sequelize } from 'sequelize';
import { AuditEvent } from './audit-event';
import { Operator } from './operator';
import { User } from './user';

export { AuditEvent, Operator, User };

/** Registers every model and, in one place, every association. */
export function initModels(sequelize: Sequelize): void {
  Operator.initModel(sequelize);
  User.initModel(sequelize);
  AuditEvent.initModel(sequelize);

  Operator.hasMany(User, { foreignKey: 'operatorId', as: 'users' });
  User.belongsTo(Operator, { foreignKey: 'operatorId', as: 'operator' });
  AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });
}
