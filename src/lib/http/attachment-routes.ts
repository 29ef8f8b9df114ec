import { NextResponse } from 'next/server';
import {
  addAttachment,
  ATTACHMENT_MAX_BYTES,
  ATTACHMENT_MAX_PER_RECORD,
  AttachmentLimitReached,
  countAttachments,
  getAttachment,
  listAttachments,
  readAttachmentBytes,
  removeAttachment,
  sniffAttachmentType,
  type AttachmentEntityType,
} from '@/lib/storage/attachments';
import { HttpError, notFound } from './errors';
import { route } from './route';
import { megabytes, readUpload } from './uploads';

// The same attachment routes for cams, parts and labour: list and upload on the collection, download and
// remove on one attachment. Staff read; managers add and remove.

const LABELS: Record<AttachmentEntityType, string> = { cam: 'cam', part: 'part', labor: 'labour operation' };

function collectionPath(entity: AttachmentEntityType): string {
  return entity === 'labor' ? 'labor' : `${entity}s`;
}

export function attachmentCollectionRoutes(entity: AttachmentEntityType, exists: (id: number) => Promise<boolean>) {
  const label = LABELS[entity];
  const full = () =>
    new HttpError(
      409,
      `This ${label} already has ${ATTACHMENT_MAX_PER_RECORD} spec sheets, the most one record keeps. Remove one before adding another.`,
      {
        errors: [{ field: 'file', message: `at most ${ATTACHMENT_MAX_PER_RECORD} attachments per ${label}` }],
      },
    );
  return {
    GET: route({ permission: 'catalogue.read', ids: { id: label } }, async ({ ids }) => {
      if (!(await exists(ids.id))) throw notFound(label, ids.id);
      const items = await listAttachments(entity, ids.id);
      return NextResponse.json({
        items: items.map((a) => ({ ...a, url: `/api/${collectionPath(entity)}/${ids.id}/attachments/${a.id}` })),
      });
    }),

    POST: route({ permission: 'catalogue.write', ids: { id: label } }, async ({ request, user, ids }) => {
      if (!(await exists(ids.id))) throw notFound(label, ids.id);
      // Checked before the upload is read, so a full record costs no upload; checked again under lock in the write.
      if ((await countAttachments(entity, ids.id)) >= ATTACHMENT_MAX_PER_RECORD) throw full();
      const upload = await readUpload(request, ATTACHMENT_MAX_BYTES, 'spec sheet');
      const contentType = sniffAttachmentType(upload.bytes);
      if (!contentType) {
        throw new HttpError(
          415,
          'A spec sheet must be a PDF, PNG or JPEG file; this file is none of those (judged by its contents, not its name).',
          {
            errors: [{ field: 'file', message: 'not a PDF, PNG or JPEG' }],
          },
        );
      }
      try {
        const record = await addAttachment(
          entity,
          ids.id,
          { fileName: upload.file.name, contentType, bytes: upload.bytes },
          user,
        );
        return NextResponse.json({ ...record, maxBytes: megabytes(ATTACHMENT_MAX_BYTES) }, { status: 201 });
      } catch (error) {
        if (error instanceof AttachmentLimitReached) throw full();
        throw error;
      }
    }),
  };
}

export function attachmentItemRoutes(entity: AttachmentEntityType) {
  const label = LABELS[entity];
  const missing = () => new HttpError(404, `No such attachment on this ${label}.`);
  // Not the kit's `ids`: any id here that names no attachment (malformed ones too) answers the same
  // "no such attachment" 404, so the answer never says which half of the path was wrong.
  const attachmentIds = (params: Record<string, string>) => {
    const parse = (v: string | undefined) => (v !== undefined && /^\d{1,10}$/.test(v) ? Number(v) : null);
    const entityId = parse(params.id);
    const attachmentId = parse(params.attachmentId);
    if (entityId === null || attachmentId === null) throw missing();
    return { entityId, attachmentId };
  };
  return {
    /** Serves the file to signed-in staff only, with the type that was sniffed at upload. */
    GET: route({ permission: 'catalogue.read' }, async ({ params }) => {
      const { entityId, attachmentId } = attachmentIds(params);
      const attachment = await getAttachment(entity, entityId, attachmentId);
      if (!attachment) throw missing();
      const bytes = await readAttachmentBytes(attachment.storageKey);
      if (!bytes) throw new HttpError(410, 'The file for this attachment is missing from storage.');
      return new NextResponse(new Uint8Array(bytes), {
        headers: {
          'Content-Type': attachment.contentType,
          'Content-Length': String(bytes.length),
          'Content-Disposition': `inline; filename="${attachment.fileName.replace(/"/g, '')}"`,
          'Cache-Control': 'private, no-store',
          'Content-Security-Policy': "default-src 'none'; img-src 'self'; object-src 'self'; sandbox",
        },
      });
    }),

    DELETE: route({ permission: 'catalogue.write' }, async ({ user, params }) => {
      const { entityId, attachmentId } = attachmentIds(params);
      const removed = await removeAttachment(entity, entityId, attachmentId, user);
      if (!removed) throw missing();
      const { storageKey: _key, ...record } = removed;
      void _key;
      return NextResponse.json({ outcome: 'deleted', attachment: record });
    }),
  };
}
