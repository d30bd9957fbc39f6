import type { Sequelize } from 'sequelize';
import { AuditEvent } from './audit-event';
import { Invitation } from './invitation';
import { Operator } from './operator';
import { PasswordResetToken } from './password-reset-token';
import { User } from './user';

export { AuditEvent, Invitation, Operator, PasswordResetToken, User };

/** Registers every model and, in one place, every association. */
export function initModels(sequelize: Sequelize): void {
  Operator.initModel(sequelize);
  User.initModel(sequelize);
  AuditEvent.initModel(sequelize);
  Invitation.initModel(sequelize);
  PasswordResetToken.initModel(sequelize);

  Operator.hasMany(User, { foreignKey: 'operatorId', as: 'users' });
  User.belongsTo(Operator, { foreignKey: 'operatorId', as: 'operator' });
  AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });
  Invitation.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Invitation.belongsTo(Operator, { foreignKey: 'operatorId', as: 'operator' });
  Invitation.belongsTo(User, { foreignKey: 'invitedById', as: 'invitedBy' });
  PasswordResetToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });
}
