import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One aircraft of the fleet, known by its registration (unique within the operator). */
export class Airframe extends Model<InferAttributes<Airframe>, InferCreationAttributes<Airframe>> {
  declare id: CreationOptional<number>;
  declare operatorId: number;
  declare aircraftTypeId: number;
  declare registration: string;
  declare serial: string;
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof Airframe {
    Airframe.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        operatorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        aircraftTypeId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        registration: { type: DataTypes.STRING(12), allowNull: false },
        serial: { type: DataTypes.STRING(40), allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'airframes' },
    );
    return Airframe;
  }
}
