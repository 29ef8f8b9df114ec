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

import { NEED_KIND_LIST } from '@/lib/advisor/needs';
import { VEHICLE_CLASSES, type VehicleClass } from '@/lib/schemas/build-profile';

export const NEED_RULE_KINDS = NEED_KIND_LIST;
export type NeedRuleKind = (typeof NEED_RULE_KINDS)[number];

// A plain rule the manager picks: "when the advisor says a cam needs <kind> (for <vehicle class>) → add
// these parts and labour". The table's threshold column is left over from schema 1 and no longer read.
export class NeedRule extends Model<InferAttributes<NeedRule>, InferCreationAttributes<NeedRule>> {
  declare id: CreationOptional<number>;
  declare kind: NeedRuleKind;
  declare vehicleClass: VehicleClass | null;
  declare label: string;
  declare active: CreationOptional<boolean>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    NeedRule.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        kind: { type: DataTypes.ENUM(...NEED_RULE_KINDS), allowNull: false },
        vehicleClass: { type: DataTypes.ENUM(...VEHICLE_CLASSES), allowNull: true },
        label: { type: DataTypes.STRING(160), allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'NeedRule', tableName: 'need_rules', underscored: true, version: true },
    );
  }
}

export class NeedRuleItem extends Model<InferAttributes<NeedRuleItem>, InferCreationAttributes<NeedRuleItem>> {
  declare id: CreationOptional<number>;
  declare ruleId: ForeignKey<number>;
  declare partId: ForeignKey<number> | null;
  declare laborOperationId: ForeignKey<number> | null;
  declare quantity: CreationOptional<string | number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    NeedRuleItem.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        quantity: { type: DataTypes.DECIMAL(8, 2), allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'NeedRuleItem', tableName: 'need_rule_items', underscored: true },
    );
  }
}
