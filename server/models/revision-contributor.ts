import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { idAttribute, referenceAttribute } from './common-attributes';
import { CONTRIBUTION_KINDS, type ContributionKind } from '@shared/speed-book/four-eyes';

/** One person's one kind of contribution to a revision (created, edited, attachments, submitted); kept once. */
export class RevisionContributor extends Model<InferAttributes<RevisionContributor>, InferCreationAttributes<RevisionContributor>> {
  declare id: CreationOptional<number>;
  declare operatorId: number;
  declare revisionId: number;
  declare userId: number;
  declare kind: ContributionKind;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof RevisionContributor {
    RevisionContributor.init(
      {
        id: idAttribute(),
        operatorId: referenceAttribute(),
        revisionId: referenceAttribute(),
        userId: referenceAttribute(),
        kind: { type: DataTypes.ENUM(...CONTRIBUTION_KINDS), allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'revision_contributors', updatedAt: false },
    );
    return RevisionContributor;
  }
}
