import { DataTypes, type CreationOptional, type Sequelize } from 'sequelize';
import { OperatorRecord, operatorRecordAttributes } from './common-attributes';

/**
 * An operator's Ed25519 key pair. The public key is served to devices as the raw 32 bytes in
 * standard base64; the private key is kept only encrypted (server/revisions/signing.ts).
 * One key per operator is active (new publications); a rotation retires it (`active` false,
 * `retiredAt` set) and keeps it, so the revisions it signed stay verifiable.
 */
export class SigningKey extends OperatorRecord<SigningKey> {
  declare publicKey: string;
  declare encryptedPrivateKey: string;
  declare active: CreationOptional<boolean>;
  /** When a rotation replaced it; null while it is the active key. */
  declare retiredAt: CreationOptional<Date | null>;

  static initModel(sequelize: Sequelize): typeof SigningKey {
    SigningKey.init(
      {
        ...operatorRecordAttributes(),
        publicKey: { type: DataTypes.STRING(64), allowNull: false },
        encryptedPrivateKey: { type: DataTypes.TEXT, allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        retiredAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
      },
      { sequelize, tableName: 'signing_keys' },
    );
    return SigningKey;
  }
}
