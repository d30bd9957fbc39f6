import { DataTypes, type Sequelize } from 'sequelize';
import { OperatorRecord, operatorRecordAttributes, referenceAttribute } from './common-attributes';
import { REVISION_STATUSES, type RevisionStatus } from '@shared/api/revisions';

const FROZEN_AFTER_PUBLISHING = [
  'speedBookId',
  'number',
  'content',
  'changeSummary',
  'authorId',
  'approverId',
  'publishedAt',
  'contentSha256',
  'signature',
  'signingKeyId',
] as const;

/**
 * One numbered revision of a speed book. Content is stored as canonical JSON text; once
 * published, no route changes content, hash or signature (only the status moves on, to
 * superseded or withdrawn).
 */
export class Revision extends OperatorRecord<Revision> {
  declare speedBookId: number;
  declare number: number;
  declare status: RevisionStatus;
  declare content: string;
  declare changeSummary: string;
  declare authorId: number;
  declare submittedAt: Date | null;
  declare returnedAt: Date | null;
  declare returnReason: string | null;
  declare approverId: number | null;
  declare publishedAt: Date | null;
  declare supersededAt: Date | null;
  declare withdrawnAt: Date | null;
  declare withdrawnById: number | null;
  declare withdrawReason: string | null;
  declare contentSha256: string | null;
  declare signature: string | null;
  declare signingKeyId: number | null;

  static initModel(sequelize: Sequelize): typeof Revision {
    // Fresh objects each time: Sequelize writes the column name into an attribute's definition.
    const nullableDate = () => ({ type: DataTypes.DATE, allowNull: true });
    const nullableUser = () => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
    Revision.init(
      {
        ...operatorRecordAttributes(),
        speedBookId: referenceAttribute(),
        number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        status: { type: DataTypes.ENUM(...REVISION_STATUSES), allowNull: false },
        content: { type: DataTypes.TEXT('long'), allowNull: false },
        changeSummary: { type: DataTypes.STRING(2000), allowNull: false },
        authorId: referenceAttribute(),
        submittedAt: nullableDate(),
        returnedAt: nullableDate(),
        returnReason: { type: DataTypes.STRING(2000), allowNull: true },
        approverId: nullableUser(),
        publishedAt: nullableDate(),
        supersededAt: nullableDate(),
        withdrawnAt: nullableDate(),
        withdrawnById: nullableUser(),
        withdrawReason: { type: DataTypes.STRING(2000), allowNull: true },
        contentSha256: { type: DataTypes.CHAR(64), allowNull: true },
        signature: { type: DataTypes.STRING(128), allowNull: true },
        signingKeyId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      },
      {
        sequelize,
        tableName: 'revisions',
        hooks: {
          // A second lock behind the services: once published, what was signed stays as signed.
          beforeUpdate: (revision) => {
            const wasPublished = revision.previous('publishedAt') != null || ['published', 'superseded', 'withdrawn'].includes(String(revision.previous('status')));
            if (!wasPublished) return;
            const frozen = FROZEN_AFTER_PUBLISHING.filter((field) => revision.changed(field));
            if (frozen.length) throw new Error(`A published revision cannot change: ${frozen.join(', ')}.`);
          },
          beforeBulkUpdate: () => {
            throw new Error('Revisions change one at a time, through their service.');
          },
          // Only a draft may go (discarded by its engineers); the audit trail keeps its history.
          beforeDestroy: (revision) => {
            if (revision.status !== 'draft' || revision.publishedAt != null) throw new Error('Only a draft is ever deleted.');
          },
          beforeBulkDestroy: () => {
            throw new Error('Revisions are deleted one at a time, through their service.');
          },
        },
      },
    );
    return Revision;
  }
}
