import { createHash, randomUUID } from 'node:crypto';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { CatalogueAttachment, db, type AttachmentContentType, type AttachmentEntityType } from '@/lib/db/models';
import { blobStore } from './index';

// Spec-sheet attachments for catalogue records: the metadata row (model CatalogueAttachment) and the
// bytes in the blob store. The content type comes from the file's first bytes, never from its name.

export {
  ATTACHMENT_CONTENT_TYPES,
  ATTACHMENT_ENTITY_TYPES,
  type AttachmentContentType,
  type AttachmentEntityType,
} from '@/lib/db/models';
export const ATTACHMENT_MAX_BYTES = 5 * 1024 * 1024;
// Spec sheets per cam, part or labour operation: enough for every sheet a supplier sends, not a file store.
export const ATTACHMENT_MAX_PER_RECORD = 10;

/** Thrown inside the write when the record already holds ATTACHMENT_MAX_PER_RECORD files. */
export class AttachmentLimitReached extends Error {}

export async function countAttachments(entityType: AttachmentEntityType, entityId: number): Promise<number> {
  return CatalogueAttachment.count({ where: { entityType, entityId } });
}

/** PDF, PNG or JPEG by magic bytes; null for anything else. */
export function sniffAttachmentType(bytes: Uint8Array): AttachmentContentType | null {
  const starts = (sig: number[]) => sig.every((b, i) => bytes[i] === b);
  if (starts([0x25, 0x50, 0x44, 0x46, 0x2d])) return 'application/pdf'; // %PDF-
  if (starts([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'image/png';
  if (starts([0xff, 0xd8, 0xff])) return 'image/jpeg';
  return null;
}

/** A display name safe for a header and a page: no paths, no control characters, at most 160 chars. */
export function safeFileName(name: string, contentType: AttachmentContentType): string {
  const base = (name.split(/[\\/]/).pop() ?? '')
    .replace(/[^\w .()-]+/g, '_')
    .replace(/^[ .]+/, '')
    .slice(0, 150);
  const ext = contentType === 'application/pdf' ? '.pdf' : contentType === 'image/png' ? '.png' : '.jpg';
  const stem = base.replace(/\.[A-Za-z0-9]{1,5}$/, '') || 'spec-sheet';
  return `${stem}${ext}`;
}

export type AttachmentRecord = {
  id: number;
  entityType: AttachmentEntityType;
  entityId: number;
  fileName: string;
  contentType: AttachmentContentType;
  byteSize: number;
  sha256: string;
  createdAt: string;
};

const toRecord = (a: CatalogueAttachment): AttachmentRecord => ({
  id: a.id,
  entityType: a.entityType,
  entityId: a.entityId,
  fileName: a.fileName,
  contentType: a.contentType,
  byteSize: a.byteSize,
  sha256: a.sha256,
  createdAt: new Date(a.createdAt).toISOString(),
});

export async function listAttachments(entityType: AttachmentEntityType, entityId: number): Promise<AttachmentRecord[]> {
  const rows = await CatalogueAttachment.findAll({ where: { entityType, entityId }, order: [['id', 'ASC']] });
  return rows.map(toRecord);
}

export async function getAttachment(
  entityType: AttachmentEntityType,
  entityId: number,
  id: number,
): Promise<(AttachmentRecord & { storageKey: string }) | null> {
  const row = await CatalogueAttachment.findOne({ where: { id, entityType, entityId } });
  return row ? { ...toRecord(row), storageKey: row.storageKey } : null;
}

export async function readAttachmentBytes(storageKey: string): Promise<Buffer | null> {
  return blobStore().get(storageKey);
}

/** Stores the bytes first, then the row (in a transaction with its audit entry); a failed row removes the bytes. */
export async function addAttachment(
  entityType: AttachmentEntityType,
  entityId: number,
  input: { fileName: string; contentType: AttachmentContentType; bytes: Buffer },
  user: SessionUser,
): Promise<AttachmentRecord> {
  const storageKey = `${entityType}/${entityId}/${randomUUID()}`;
  await blobStore().put(storageKey, input.bytes);
  try {
    return await db().transaction(async (t) => {
      // Locking the record's attachment rows (and the index gap after them) makes two uploads at once queue for the cap.
      const existing = await CatalogueAttachment.findAll({
        attributes: ['id'],
        where: { entityType, entityId },
        transaction: t,
        lock: t.LOCK.UPDATE,
      });
      if (existing.length >= ATTACHMENT_MAX_PER_RECORD) throw new AttachmentLimitReached();
      const row = await CatalogueAttachment.create(
        {
          entityType,
          entityId,
          storageKey,
          fileName: safeFileName(input.fileName, input.contentType),
          contentType: input.contentType,
          byteSize: input.bytes.length,
          sha256: createHash('sha256').update(input.bytes).digest('hex'),
          uploadedByUserId: user.id,
        },
        { transaction: t },
      );
      const record = toRecord(row);
      await recordAudit(
        { user, action: 'attachment.added', entityType, entityId: String(entityId), before: null, after: record },
        t,
      );
      return record;
    });
  } catch (error) {
    await blobStore().remove(storageKey);
    throw error;
  }
}

export async function removeAttachment(
  entityType: AttachmentEntityType,
  entityId: number,
  id: number,
  user: SessionUser,
): Promise<(AttachmentRecord & { storageKey: string }) | null> {
  const removed = await db().transaction(async (t) => {
    const row = await CatalogueAttachment.findOne({
      where: { id, entityType, entityId },
      transaction: t,
      lock: t.LOCK.UPDATE,
    });
    if (!row) return null;
    const record = { ...toRecord(row), storageKey: row.storageKey };
    await row.destroy({ transaction: t });
    await recordAudit(
      {
        user,
        action: 'attachment.removed',
        entityType,
        entityId: String(entityId),
        before: toRecord(row),
        after: null,
      },
      t,
    );
    return record;
  });
  if (removed) await blobStore().remove(removed.storageKey);
  return removed;
}
