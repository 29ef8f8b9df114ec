import 'server-only';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class LaborOperation extends Model<InferAttributes<LaborOperation>, InferCreationAttributes<LaborOperation>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare name: string;
  /** DECIMAL(5,2) comes back from the driver as a string; use laborHours() to read it. */
  declare hours: string | number;
  declare engines: CreationOptional<string>;
  declare active: CreationOptional<boolean>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    LaborOperation.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        code: { type: DataTypes.STRING(40), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        hours: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
        engines: { type: DataTypes.STRING(255), allowNull: false, defaultValue: 'all' },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'LaborOperation', tableName: 'labor_operations', underscored: true, version: true },
    );
  }
}
