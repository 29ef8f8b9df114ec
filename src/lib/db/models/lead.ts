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

export class Lead extends Model<InferAttributes<Lead>, InferCreationAttributes<Lead>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare email: string | null;
  declare phone: string | null;
  declare answers: Record<string, unknown>;
  declare shortlist: unknown | null;
  declare status: CreationOptional<'new' | 'contacted' | 'quoted' | 'closed'>;
  declare publicTokenHash: string | null;
  declare customerId: ForeignKey<number> | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Lead.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: true },
        phone: { type: DataTypes.STRING(40), allowNull: true },
        answers: { type: DataTypes.JSON, allowNull: false },
        shortlist: { type: DataTypes.JSON, allowNull: true },
        status: { type: DataTypes.ENUM('new', 'contacted', 'quoted', 'closed'), allowNull: false, defaultValue: 'new' },
        publicTokenHash: { type: DataTypes.CHAR(64), allowNull: true, unique: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Lead', tableName: 'leads', underscored: true, version: true },
    );
  }
}
