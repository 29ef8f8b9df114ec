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

export class Customer extends Model<InferAttributes<Customer>, InferCreationAttributes<Customer>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare email: string | null;
  declare phone: string | null;
  declare notes: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Customer.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: true },
        phone: { type: DataTypes.STRING(40), allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Customer', tableName: 'customers', underscored: true, version: true },
    );
  }
}

// A vehicle and its engine combination. The profile is the advisor's build profile as JSON,
// stamped with the schema version it was written under so old rows can be migrated in code.
export class Build extends Model<InferAttributes<Build>, InferCreationAttributes<Build>> {
  declare id: CreationOptional<number>;
  declare customerId: ForeignKey<number>;
  declare vehicleLabel: string;
  declare profile: Record<string, unknown>;
  declare profileSchemaVersion: CreationOptional<number>;
  declare baselineCamId: ForeignKey<number> | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Build.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        vehicleLabel: { type: DataTypes.STRING(160), allowNull: false },
        profile: { type: DataTypes.JSON, allowNull: false },
        profileSchemaVersion: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 1 },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Build', tableName: 'builds', underscored: true, version: true },
    );
  }
}

export class Interview extends Model<InferAttributes<Interview>, InferCreationAttributes<Interview>> {
  declare id: CreationOptional<number>;
  declare buildId: ForeignKey<number>;
  declare staffUserId: ForeignKey<number> | null;
  declare status: CreationOptional<'in-progress' | 'complete' | 'abandoned'>;
  declare answers: Record<string, unknown> | null;
  declare rankingSnapshot: unknown | null;
  declare chosenCamId: ForeignKey<number> | null;
  declare completedAt: Date | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Interview.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        status: {
          type: DataTypes.ENUM('in-progress', 'complete', 'abandoned'),
          allowNull: false,
          defaultValue: 'in-progress',
        },
        answers: { type: DataTypes.JSON, allowNull: true },
        rankingSnapshot: { type: DataTypes.JSON, allowNull: true },
        completedAt: { type: DataTypes.DATE, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Interview', tableName: 'interviews', underscored: true, version: true },
    );
  }
}
