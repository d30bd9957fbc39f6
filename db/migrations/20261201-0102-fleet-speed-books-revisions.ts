import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

const CATEGORIES = ['piston-single', 'piston-twin', 'turboprop', 'jet'];
const STATUSES = ['draft', 'in_review', 'published', 'superseded', 'withdrawn'];

const operatorId = {
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull: false,
  references: { model: 'operators', key: 'id' },
  onDelete: 'RESTRICT',
} as const;
const userRef = (allowNull: boolean) =>
  ({ type: DataTypes.INTEGER.UNSIGNED, allowNull, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' }) as const;
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

/**
 * The fleet (aircraft types, airframes), speed books (one per type), their revisions and the
 * operators' signing keys. Every table carries operator_id so every query can be scoped by it.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.createTable('aircraft_types', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    operator_id: operatorId,
    designator: { type: DataTypes.STRING(8), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    category: { type: DataTypes.ENUM(...CATEGORIES), allowNull: false },
    engines: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false },
    ceiling_ft: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    ...timestamps,
  });
  await queryInterface.addIndex('aircraft_types', ['operator_id', 'designator'], { unique: true, name: 'aircraft_types_operator_designator' });

  await queryInterface.createTable('airframes', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    operator_id: operatorId,
    aircraft_type_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'aircraft_types', key: 'id' }, onDelete: 'RESTRICT' },
    registration: { type: DataTypes.STRING(12), allowNull: false },
    serial: { type: DataTypes.STRING(40), allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...timestamps,
  });
  await queryInterface.addIndex('airframes', ['operator_id', 'registration'], { unique: true, name: 'airframes_operator_registration' });

  await queryInterface.createTable('speed_books', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    operator_id: operatorId,
    aircraft_type_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, unique: true, references: { model: 'aircraft_types', key: 'id' }, onDelete: 'RESTRICT' },
    title: { type: DataTypes.STRING(200), allowNull: false },
    ...timestamps,
  });
  await queryInterface.addIndex('speed_books', ['operator_id']);

  await queryInterface.createTable('signing_keys', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    operator_id: operatorId,
    /** Raw 32-byte Ed25519 public key, standard base64 (44 characters). */
    public_key: { type: DataTypes.STRING(64), allowNull: false },
    /** `v1.<salt>.<iv>.<tag>.<ciphertext>`: the PKCS#8 private key under AES-256-GCM. */
    encrypted_private_key: { type: DataTypes.TEXT, allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...timestamps,
  });
  await queryInterface.addIndex('signing_keys', ['operator_id', 'active']);

  await queryInterface.createTable('revisions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    operator_id: operatorId,
    speed_book_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'speed_books', key: 'id' }, onDelete: 'RESTRICT' },
    number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    status: { type: DataTypes.ENUM(...STATUSES), allowNull: false },
    /** Canonical JSON (RFC 8785) of the content. */
    content: { type: DataTypes.TEXT('long'), allowNull: false },
    change_summary: { type: DataTypes.STRING(2000), allowNull: false },
    author_id: userRef(false),
    submitted_at: { type: DataTypes.DATE, allowNull: true },
    returned_at: { type: DataTypes.DATE, allowNull: true },
    return_reason: { type: DataTypes.STRING(2000), allowNull: true },
    approver_id: userRef(true),
    published_at: { type: DataTypes.DATE, allowNull: true },
    superseded_at: { type: DataTypes.DATE, allowNull: true },
    withdrawn_at: { type: DataTypes.DATE, allowNull: true },
    withdrawn_by_id: userRef(true),
    withdraw_reason: { type: DataTypes.STRING(2000), allowNull: true },
    content_sha256: { type: DataTypes.CHAR(64), allowNull: true },
    signature: { type: DataTypes.STRING(128), allowNull: true },
    signing_key_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'signing_keys', key: 'id' }, onDelete: 'RESTRICT' },
    ...timestamps,
  });
  await queryInterface.addIndex('revisions', ['speed_book_id', 'number'], { unique: true, name: 'revisions_book_number' });
  await queryInterface.addIndex('revisions', ['operator_id', 'status']);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('revisions');
  await queryInterface.dropTable('signing_keys');
  await queryInterface.dropTable('speed_books');
  await queryInterface.dropTable('airframes');
  await queryInterface.dropTable('aircraft_types');
};
