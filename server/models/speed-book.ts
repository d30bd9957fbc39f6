import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** The controlled speed data of one aircraft type: a series of numbered revisions. */
export class SpeedBook extends Model<InferAttributes<SpeedBook>, InferCreationAttributes<SpeedBook>> {
  declare id: CreationOptional<number>;
  declare operatorId: number;
  /** One speed book per type. */
  declare aircraftTypeId: number;
  declare title: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof SpeedBook {
    SpeedBook.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        operatorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        aircraftTypeId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, unique: true },
        title: { type: DataTypes.STRING(200), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'speed_books' },
    );
    return SpeedBook;
  }
}
