import 'server-only';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// Spec-sheet attachments' metadata (migration 20261202000300); the bytes live in the blob store
// (src/lib/storage/), and src/lib/storage/attachments.ts reads and writes both.

export const ATTACHMENT_ENTITY_TYPES = ['cam', 'part', 'labor'] as const;
export type AttachmentEntityType = (typeof ATTACHMENT_ENTITY_TYPES)[number];
export const ATTACHMENT_CONTENT_TYPES = ['application/pdf', 'image/png', 'image/jpeg'] as const;
export type AttachmentContentType = (typeof ATTACHMENT_CONTENT_TYPES)[number];

export class CatalogueAttachment extends Model<
  InferAttributes<CatalogueAttachment>,
  InferCreationAttributes<CatalogueAttachment>
> {
  declare id: CreationOptional<number>;
  declare entityType: AttachmentEntityType;
  declare entityId: number;
  declare storageKey: string;
  declare fileName: string;
  declare contentType: AttachmentContentType;
  declare byteSize: number;
  declare sha256: string;
  declare uploadedByUserId: number | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CatalogueAttachment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        entityType: { type: DataTypes.ENUM(...ATTACHMENT_ENTITY_TYPES), allowNull: false },
        entityId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        storageKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
        fileName: { type: DataTypes.STRING(160), allowNull: false },
        contentType: { type: DataTypes.ENUM(...ATTACHMENT_CONTENT_TYPES), allowNull: false },
        byteSize: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        uploadedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      {
        sequelize,
        modelName: 'CatalogueAttachment',
        tableName: 'catalogue_attachments',
        underscored: true,
        updatedAt: false,
      },
    );
  }
}
