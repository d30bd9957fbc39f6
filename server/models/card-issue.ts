import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { appendOnlyHooks, referenceAttribute } from './common-attributes';

/**
 * One issued speed card in the card log, as the pilot's device reported it. Append-only: the
 * server re-derived the card from `inputs` and the revision and found the same `digest`.
 */
export class CardIssue extends Model<InferAttributes<CardIssue>, InferCreationAttributes<CardIssue>> {
  /** The device's random UUID for the entry. */
  declare id: string;
  /** The card code printed on the card (shared/card-check/card-code.ts), given by the server on first report. */
  declare code: string;
  declare operatorId: number;
  declare issuedById: number;
  declare airframeId: number;
  declare revisionId: number;
  /** Canonical JSON of the card's inputs. */
  declare inputs: string;
  declare digest: string;
  /** SHA-256 of the canonical JSON of the reported entry and its reporter: replays match it. */
  declare entrySha256: string;
  declare issuedAt: Date;
  declare receivedAt: Date;

  static initModel(sequelize: Sequelize): typeof CardIssue {
    CardIssue.init(
      {
        id: { type: DataTypes.CHAR(36), allowNull: false, primaryKey: true },
        code: { type: DataTypes.CHAR(9), allowNull: false, unique: 'card_issues_code' },
        operatorId: referenceAttribute(),
        issuedById: referenceAttribute(),
        airframeId: referenceAttribute(),
        revisionId: referenceAttribute(),
        inputs: { type: DataTypes.TEXT, allowNull: false },
        digest: { type: DataTypes.CHAR(64), allowNull: false },
        entrySha256: { type: DataTypes.CHAR(64), allowNull: false },
        issuedAt: { type: DataTypes.DATE(3), allowNull: false },
        receivedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      {
        sequelize,
        tableName: 'card_issues',
        timestamps: false,
        hooks: appendOnlyHooks('The card log is'),
      },
    );
    return CardIssue;
  }
}
