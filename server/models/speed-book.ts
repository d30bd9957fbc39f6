import { DataTypes, type Sequelize } from 'sequelize';
import { OperatorRecord, operatorRecordAttributes } from './common-attributes';

/** The controlled speed data of one aircraft type: a series of numbered revisions. */
export class SpeedBook extends OperatorRecord<SpeedBook> {
  /** One speed book per type. */
  declare aircraftTypeId: number;
  declare title: string;

  static initModel(sequelize: Sequelize): typeof SpeedBook {
    SpeedBook.init(
      {
        ...operatorRecordAttributes(),
        aircraftTypeId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, unique: true },
        title: { type: DataTypes.STRING(200), allowNull: false },
      },
      { sequelize, tableName: 'speed_books' },
    );
    return SpeedBook;
  }
}
