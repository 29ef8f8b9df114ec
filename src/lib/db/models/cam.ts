import 'server-only';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { Supplier } from './supplier';

// A cam in the shop's catalogue: the supplier's cam card plus what the shop needs to sell it.
export class Cam extends Model<InferAttributes<Cam>, InferCreationAttributes<Cam>> {
  declare id: CreationOptional<number>;
  declare sku: string;
  declare name: string;
  declare supplierId: ForeignKey<Supplier['id']> | null;
  declare intakeDuration050: number;
  declare exhaustDuration050: number;
  declare intakeAdvertised: number | null;
  declare exhaustAdvertised: number | null;
  declare intakeLiftIn: number;
  declare exhaustLiftIn: number;
  declare lsa: number;
  declare intakeCenterline: number;
  declare rockerRatio: CreationOptional<number>;
  declare deactivationCompatible: CreationOptional<boolean>;
  declare emissionsCertified: CreationOptional<boolean>;
  declare springMaxLiftIn: number | null;
  declare isFactoryBaseline: CreationOptional<boolean>;
  declare baselineForLiters: string | null;
  declare priceCents: number;
  declare costCents: CreationOptional<number>;
  declare stockOnHand: CreationOptional<number>;
  declare active: CreationOptional<boolean>;
  declare archivedAt: Date | null;
  declare notes: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    // Fresh objects per attribute: Sequelize writes each attribute's column name into its definition,
    // so one shared object would map several attributes to the same column.
    const degrees = () => ({ type: DataTypes.DOUBLE, allowNull: false });
    const optionalDegrees = () => ({ type: DataTypes.DOUBLE, allowNull: true });
    Cam.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        sku: { type: DataTypes.STRING(40), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        intakeDuration050: { ...degrees(), field: 'intake_duration_050' },
        exhaustDuration050: { ...degrees(), field: 'exhaust_duration_050' },
        intakeAdvertised: optionalDegrees(),
        exhaustAdvertised: optionalDegrees(),
        intakeLiftIn: degrees(),
        exhaustLiftIn: degrees(),
        lsa: degrees(),
        intakeCenterline: degrees(),
        rockerRatio: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1.7 },
        deactivationCompatible: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        emissionsCertified: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        springMaxLiftIn: optionalDegrees(),
        isFactoryBaseline: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        baselineForLiters: { type: DataTypes.DECIMAL(3, 1), allowNull: true },
        priceCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        costCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        stockOnHand: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        archivedAt: { type: DataTypes.DATE, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Cam', tableName: 'cams', underscored: true, version: true },
    );
  }
}
