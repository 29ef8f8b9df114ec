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
import { DYNO_TYPES, type DynoType } from '@/lib/dyno/dyno-type';

export const CORRECTION_STANDARDS = ['sae-j1349', 'sae-j607', 'din-70020', 'none'] as const;

export class DynoRun extends Model<InferAttributes<DynoRun>, InferCreationAttributes<DynoRun>> {
  declare id: CreationOptional<number>;
  declare buildId: ForeignKey<number>;
  declare quoteId: ForeignKey<number> | null;
  declare camId: ForeignKey<number> | null;
  declare recordedByUserId: ForeignKey<number> | null;
  declare phase: 'before' | 'after';
  declare dynoType: CreationOptional<DynoType>;
  declare runAt: Date;
  declare correctionStandard: CreationOptional<(typeof CORRECTION_STANDARDS)[number]>;
  declare airTempC: number | null;
  declare baroKpa: number | null;
  declare humidityPct: number | null;
  declare peakHp: number | null;
  declare peakHpRpm: number | null;
  declare peakTorqueLbFt: number | null;
  declare peakTorqueRpm: number | null;
  declare curve: { rpm: number; torqueLbFt: number; hp: number }[] | null;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    // Fresh objects per attribute: Sequelize writes the column name into each definition it is given.
    const optional = () => ({ type: DataTypes.DOUBLE, allowNull: true });
    const optionalRpm = () => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
    DynoRun.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        phase: { type: DataTypes.ENUM('before', 'after'), allowNull: false },
        dynoType: { type: DataTypes.ENUM(...DYNO_TYPES), allowNull: false, defaultValue: 'chassis' },
        runAt: { type: DataTypes.DATE, allowNull: false },
        correctionStandard: {
          type: DataTypes.ENUM(...CORRECTION_STANDARDS),
          allowNull: false,
          defaultValue: 'sae-j1349',
        },
        airTempC: optional(),
        baroKpa: optional(),
        humidityPct: optional(),
        peakHp: optional(),
        peakHpRpm: optionalRpm(),
        peakTorqueLbFt: optional(),
        peakTorqueRpm: optionalRpm(),
        curve: { type: DataTypes.JSON, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'DynoRun', tableName: 'dyno_runs', underscored: true },
    );
  }
}
