import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { idAttribute, timestampAttributes } from './common-attributes';

/** An operator: the company whose people, fleet and speed data Speedwright keeps apart from every other. */
export class Operator extends Model<InferAttributes<Operator>, InferCreationAttributes<Operator>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare name: string;
  /** Demo operators' figures are invented; every screen and card says so. */
  declare isDemo: CreationOptional<boolean>;
  /** How many days a device's synced data may age before it refuses to build cards. */
  declare currencyLimitDays: CreationOptional<number>;
  /** The approach additive policy (shared/card/approach-policy.ts): share of the steady headwind added to VREF. */
  declare approachHeadwindFraction: CreationOptional<number>;
  /** Share of the gust increment added. */
  declare approachGustFraction: CreationOptional<number>;
  /** Least and most additive, kt. */
  declare approachAdditiveMinimumKt: CreationOptional<number>;
  declare approachAdditiveMaximumKt: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof Operator {
    Operator.init(
      {
        id: idAttribute(),
        slug: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(200), allowNull: false },
        isDemo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        currencyLimitDays: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 30 },
        approachHeadwindFraction: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0.5 },
        approachGustFraction: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1 },
        approachAdditiveMinimumKt: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 5 },
        approachAdditiveMaximumKt: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 20 },
        ...timestampAttributes(),
      },
      { sequelize, tableName: 'operators' },
    );
    return Operator;
  }
}
