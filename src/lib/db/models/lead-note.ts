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

/** One entry in a lead's note log: added, never edited. */
export class LeadNote extends Model<InferAttributes<LeadNote>, InferCreationAttributes<LeadNote>> {
  declare id: CreationOptional<number>;
  declare leadId: ForeignKey<number>;
  declare userId: ForeignKey<number> | null;
  declare body: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    LeadNote.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        leadId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        body: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'LeadNote', tableName: 'lead_notes', underscored: true },
    );
  }
}
