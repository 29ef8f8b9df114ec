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

export const PART_CATEGORIES = [
  'springs',
  'pushrods',
  'lifters',
  'deactivation-delete',
  'timing',
  'gaskets',
  'converter',
  'tune',
  'hardware',
  'other',
] as const;
export type PartCategory = (typeof PART_CATEGORIES)[number];

export class Part extends Model<InferAttributes<Part>, InferCreationAttributes<Part>> {
  declare id: CreationOptional<number>;
  declare sku: string;
  declare name: string;
  declare category: PartCategory;
  declare supplierId: ForeignKey<Supplier['id']> | null;
  declare priceCents: number;
  declare costCents: CreationOptional<number>;
  declare stockOnHand: CreationOptional<number>;
  declare spec: Record<string, unknown> | null;
  declare active: CreationOptional<boolean>;
  declare notes: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Part.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        sku: { type: DataTypes.STRING(40), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        category: { type: DataTypes.ENUM(...PART_CATEGORIES), allowNull: false },
        priceCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        costCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        stockOnHand: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        spec: { type: DataTypes.JSON, allowNull: true },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Part', tableName: 'parts', underscored: true, version: true },
    );
  }
}
