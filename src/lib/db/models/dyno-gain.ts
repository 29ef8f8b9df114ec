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

/** One build's measured result for one fitted cam on one kind of dyno, kept by src/lib/db/queries/dyno-gains.ts from its dyno runs. */
export class DynoGain extends Model<InferAttributes<DynoGain>, InferCreationAttributes<DynoGain>> {
  declare id: CreationOptional<number>;
  declare buildId: ForeignKey<number>;
  declare camId: ForeignKey<number>;
  declare dynoType: DynoType;
  declare displacementCi: number;
  declare intakeFlowCfm: number;
  declare headers: 'manifold' | 'shorty' | 'long-tube';
  declare exhaustSystem: 'full' | 'full-with-cats' | 'open-short';
  declare intakeManifold: 'truck' | 'car' | 'single-plane';
  declare gainPctPeakHp: number;
  declare gainPctByRpm: { rpm: number; gainPct: number }[] | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    // Fresh objects per attribute: Sequelize writes the column name into each definition it is given.
    const number = () => ({ type: DataTypes.DOUBLE, allowNull: false });
    const word = () => ({ type: DataTypes.STRING(16), allowNull: false });
    DynoGain.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        dynoType: { type: DataTypes.ENUM(...DYNO_TYPES), allowNull: false },
        displacementCi: number(),
        intakeFlowCfm: number(),
        headers: word(),
        exhaustSystem: word(),
        intakeManifold: word(),
        gainPctPeakHp: number(),
        gainPctByRpm: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'dyno_gains', underscored: true },
    );
  }
}
