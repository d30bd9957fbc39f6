import { DataTypes, type Sequelize } from 'sequelize';
import { OperatorRecord, operatorRecordAttributes, referenceAttribute } from './common-attributes';

/** A source page of a revision (PDF, PNG or JPEG), kept on disk under a random name. */
export class Attachment extends OperatorRecord<Attachment> {
  declare revisionId: number;
  /** As the uploader's computer called it; shown, never used as a path. */
  declare originalName: string;
  /** From the file's first bytes, not from its name or the browser's word. */
  declare contentType: string;
  declare sizeBytes: number;
  declare sha256: string;
  /** Random file name inside the operator's folder. */
  declare storageName: string;
  declare uploadedById: number | null;

  static initModel(sequelize: Sequelize): typeof Attachment {
    Attachment.init(
      {
        ...operatorRecordAttributes(),
        revisionId: referenceAttribute(),
        originalName: { type: DataTypes.STRING(255), allowNull: false },
        contentType: { type: DataTypes.STRING(100), allowNull: false },
        sizeBytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        storageName: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        uploadedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      },
      { sequelize, tableName: 'attachments' },
    );
    return Attachment;
  }
}
