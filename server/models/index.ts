import type { Sequelize } from 'sequelize';
import { AircraftType } from './aircraft-type';
import { Attachment } from './attachment';
import { Airframe } from './airframe';
import { AuditEvent } from './audit-event';
import { CardIssue } from './card-issue';
import { Invitation } from './invitation';
import { Operator } from './operator';
import { PasswordResetToken } from './password-reset-token';
import { Revision } from './revision';
import { RevisionContributor } from './revision-contributor';
import { SigningKey } from './signing-key';
import { SpeedBook } from './speed-book';
import { User } from './user';
import { useDatabase } from '../transactions';

export { Attachment, AuditEvent, Invitation, Operator, PasswordResetToken, User };

export { AircraftType, Airframe, Revision, SigningKey, SpeedBook };

export { CardIssue };

export { RevisionContributor };

/** Registers every model and, in one place, every association. */
export function initModels(sequelize: Sequelize): void {
  useDatabase(sequelize);
  Operator.initModel(sequelize);
  User.initModel(sequelize);
  AuditEvent.initModel(sequelize);
  AircraftType.initModel(sequelize);
  Airframe.initModel(sequelize);
  SpeedBook.initModel(sequelize);
  SigningKey.initModel(sequelize);
  Revision.initModel(sequelize);
  Invitation.initModel(sequelize);
  PasswordResetToken.initModel(sequelize);
  Attachment.initModel(sequelize);
  CardIssue.initModel(sequelize);
  RevisionContributor.initModel(sequelize);

  Operator.hasMany(User, { foreignKey: 'operatorId', as: 'users' });
  User.belongsTo(Operator, { foreignKey: 'operatorId', as: 'operator' });
  AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });
  AircraftType.hasMany(Airframe, { foreignKey: 'aircraftTypeId', as: 'airframes' });
  Airframe.belongsTo(AircraftType, { foreignKey: 'aircraftTypeId', as: 'aircraftType' });
  AircraftType.hasOne(SpeedBook, { foreignKey: 'aircraftTypeId', as: 'speedBook' });
  SpeedBook.belongsTo(AircraftType, { foreignKey: 'aircraftTypeId', as: 'aircraftType' });
  SpeedBook.hasMany(Revision, { foreignKey: 'speedBookId', as: 'revisions' });
  Revision.belongsTo(SpeedBook, { foreignKey: 'speedBookId', as: 'speedBook' });
  Revision.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  Revision.belongsTo(User, { foreignKey: 'approverId', as: 'approver' });
  Revision.belongsTo(SigningKey, { foreignKey: 'signingKeyId', as: 'signingKey' });
  Invitation.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Invitation.belongsTo(Operator, { foreignKey: 'operatorId', as: 'operator' });
  Invitation.belongsTo(User, { foreignKey: 'invitedById', as: 'invitedBy' });
  PasswordResetToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Revision.hasMany(Attachment, { foreignKey: 'revisionId', as: 'attachments' });
  Attachment.belongsTo(Revision, { foreignKey: 'revisionId', as: 'revision' });
  Attachment.belongsTo(User, { foreignKey: 'uploadedById', as: 'uploadedBy' });
  CardIssue.belongsTo(Airframe, { foreignKey: 'airframeId', as: 'airframe' });
  CardIssue.belongsTo(Revision, { foreignKey: 'revisionId', as: 'revision' });
  CardIssue.belongsTo(User, { foreignKey: 'issuedById', as: 'issuedBy' });
  RevisionContributor.belongsTo(User, { foreignKey: 'userId', as: 'user' });
}
