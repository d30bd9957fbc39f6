import { DataTypes, type Sequelize } from 'sequelize';
import { OperatorRecord, operatorRecordAttributes } from './common-attributes';
import { AIRCRAFT_CATEGORIES, type AircraftCategory } from '@shared/speed-book/revision-content';

/** A type the operator flies; its speed book holds the flight manual's figures. */
export class AircraftType extends OperatorRecord<AircraftType> {
  /** The operator's short code for the type, e.g. ZZP1; unique within the operator. */
  declare designator: string;
  declare name: string;
  declare category: AircraftCategory;
  declare engines: number;
  declare ceilingFt: number;

  static initModel(sequelize: Sequelize): typeof AircraftType {
    AircraftType.init(
      {
        ...operatorRecordAttributes(),
        designator: { type: DataTypes.STRING(8), allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        category: { type: DataTypes.ENUM(...AIRCRAFT_CATEGORIES), allowNull: false },
        engines: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false },
        ceilingFt: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      },
      { sequelize, tableName: 'aircraft_types' },
    );
    return AircraftType;
  }
}
