import { DataTypes, type CreationOptional, type Sequelize } from 'sequelize';
import { OperatorRecord, operatorRecordAttributes } from './common-attributes';

/**
 * An operator's Ed25519 key pair. The public key is served to devices as the raw 32 bytes in
 * standard base64; the private key is kept only encrypted (server/revisions/signing.ts).
 */
export class SigningKey extends OperatorRecord<SigningKey> {
  declare publicKey: string;
  declare encryptedPrivateKey: string;
  declare active: CreationOptional<boolean>;

  static initModel(sequelize: Sequelize): typeof SigningKey {
    SigningKey.init(
      {
        ...operatorRecordAttributes(),
        publicKey: { type: DataTypes.STRING(64), allowNull: false },
        encryptedPrivateKey: { type: DataTypes.TEXT, allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      },
      { sequelize, tableName: 'signing_keys' },
    );
    return SigningKey;
  }
}
