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

export class AuditEntry extends Model<InferAttributes<AuditEntry>, InferCreationAttributes<AuditEntry>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<number> | null;
  declare actor: string;
  declare action: string;
  declare entityType: string | null;
  declare entityId: string | null;
  declare before: unknown | null;
  declare after: unknown | null;
  declare ip: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AuditEntry.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        actor: { type: DataTypes.STRING(254), allowNull: false },
        action: { type: DataTypes.STRING(64), allowNull: false },
        entityType: { type: DataTypes.STRING(40), allowNull: true },
        entityId: { type: DataTypes.STRING(40), allowNull: true },
        before: { type: DataTypes.JSON, allowNull: true },
        after: { type: DataTypes.JSON, allowNull: true },
        ip: { type: DataTypes.STRING(64), allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'AuditEntry', tableName: 'audit_log', underscored: true, updatedAt: false },
    );
  }
}
