import type { ForeignKey, Sequelize } from 'sequelize';
import type { Operator } from './operator';
import { SingleUseToken, singleUseTokenAttributes } from './single-use-token';
import type { User } from './user';

/** A link that lets an invited person choose their first password. */
export class Invitation extends SingleUseToken<Invitation> {
  declare operatorId: ForeignKey<Operator['id']>;
  declare invitedById: ForeignKey<User['id']> | null;

  static initModel(sequelize: Sequelize): typeof Invitation {
    Invitation.init(singleUseTokenAttributes(), { sequelize, tableName: 'invitations' });
    return Invitation;
  }
}
