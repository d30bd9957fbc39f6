import type { Sequelize } from 'sequelize';
import { Operator } from './operator';
import { User } from './user';

export { Operator, User };

/** Registers every model and, in one place, every association. */
export function initModels(sequelize: Sequelize): void {
  Operator.initModel(sequelize);
  User.initModel(sequelize);

  Operator.hasMany(User, { foreignKey: 'operatorId', as: 'users' });
  User.belongsTo(Operator, { foreignKey: 'operatorId', as: 'operator' });
}
