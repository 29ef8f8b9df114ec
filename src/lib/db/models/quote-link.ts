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

export const QUOTE_LINK_PURPOSES = ['balance', 'reminder'] as const;

/**
 * An extra private link to a quote's customer page, e-mailed with the pay-the-balance request or the
 * expiry reminder. Only the token's SHA-256 is kept (as for quotes.public_token_hash).
 */
export class QuoteLink extends Model<InferAttributes<QuoteLink>, InferCreationAttributes<QuoteLink>> {
  declare id: CreationOptional<number>;
  declare quoteId: ForeignKey<number>;
  declare tokenHash: string;
  declare purpose: (typeof QUOTE_LINK_PURPOSES)[number];
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    QuoteLink.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        quoteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        purpose: { type: DataTypes.ENUM(...QUOTE_LINK_PURPOSES), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      // Named: a minified production build may give two model classes the same short name.
      { sequelize, modelName: 'QuoteLink', tableName: 'quote_links', underscored: true },
    );
  }
}
