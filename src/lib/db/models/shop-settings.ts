import 'server-only';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { AirUnits } from '@/lib/dyno/units';

export class ShopSettings extends Model<InferAttributes<ShopSettings>, InferCreationAttributes<ShopSettings>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare address: CreationOptional<string>;
  declare phone: CreationOptional<string>;
  declare email: CreationOptional<string>;
  declare taxRateBp: number;
  declare laborRateCents: number;
  declare depositPercentBp: number;
  declare depositMinCents: number;
  declare depositMaxCents: number;
  declare depositPolicyText: string;
  declare currency: CreationOptional<string>;
  /** The largest discount counter staff may give, as a share of the job before tax (basis points). */
  declare maxCounterDiscountBp: CreationOptional<number>;
  /** A new lead nobody has contacted or noted for this many days is flagged as waiting too long. */
  declare leadStaleDays: CreationOptional<number>;
  /** How the job page asks for and shows a dyno run's air (°F/inHg or °C/kPa); runs are stored in °C and kPa. */
  declare dynoAirUnits: CreationOptional<AirUnits>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ShopSettings.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        address: { type: DataTypes.STRING(255), allowNull: false, defaultValue: '' },
        phone: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
        email: { type: DataTypes.STRING(254), allowNull: false, defaultValue: '' },
        taxRateBp: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        laborRateCents: { type: DataTypes.INTEGER, allowNull: false },
        depositPercentBp: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        depositMinCents: { type: DataTypes.INTEGER, allowNull: false },
        depositMaxCents: { type: DataTypes.INTEGER, allowNull: false },
        depositPolicyText: { type: DataTypes.TEXT, allowNull: false },
        currency: { type: DataTypes.CHAR(3), allowNull: false, defaultValue: 'usd' },
        maxCounterDiscountBp: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 500 },
        leadStaleDays: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 2 },
        dynoAirUnits: { type: DataTypes.ENUM('imperial', 'metric'), allowNull: false, defaultValue: 'imperial' },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'ShopSettings', tableName: 'shop_settings', underscored: true, version: true },
    );
  }
}
