import { DataTypes, type CreationOptional, type Sequelize } from 'sequelize';
import { OperatorRecord, operatorRecordAttributes, referenceAttribute } from './common-attributes';

/** One aircraft of the fleet, known by its registration (unique within the operator). */
export class Airframe extends OperatorRecord<Airframe> {
  declare aircraftTypeId: number;
  declare registration: string;
  declare serial: string;
  declare active: CreationOptional<boolean>;

  static initModel(sequelize: Sequelize): typeof Airframe {
    Airframe.init(
      {
        ...operatorRecordAttributes(),
        aircraftTypeId: referenceAttribute(),
        registration: { type: DataTypes.STRING(12), allowNull: false },
        serial: { type: DataTypes.STRING(40), allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      },
      { sequelize, tableName: 'airframes' },
    );
    return Airframe;
  }
}
