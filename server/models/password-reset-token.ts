import type { Sequelize } from 'sequelize';
import { SingleUseToken, singleUseTokenAttributes } from './single-use-token';

/** A single-use link to choose a new password; a change by another link revokes it. */
export class PasswordResetToken extends SingleUseToken<PasswordResetToken> {
  static initModel(sequelize: Sequelize): typeof PasswordResetToken {
    PasswordResetToken.init(singleUseTokenAttributes(), { sequelize, tableName: 'password_reset_tokens' });
    return PasswordResetToken;
  }
}
