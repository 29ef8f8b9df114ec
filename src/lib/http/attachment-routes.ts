import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { errorResponse } from '@/lib/http/responses';
import {
  addAttachment, ATTACHMENT_MAX_BYTES, ATTACHMENT_MAX_PER_RECORD, AttachmentLimitReached, countAttachments, getAttachment, listAttachments, readAttachmentBytes, removeAttachment, sniffAttachmentType,
  type AttachmentEntityType,
} from '@/lib/storage/attachments';
import { idFrom, type IdParams } from './kit';
import { megabytes, readUpload } from './uploads';

// The same attachment routes for cams, parts and labour: list and upload on the collection, download and
// remove on one attachment. Staff read; managers add and remove.

type ItemParams = { params: Promise<{ id: string; attachmentId: string }> };

const LABELS: Record<AttachmentEntityType, string> = { cam: 'cam', part: 'part', labor: 'labour operation' };

export function attachmentCollectionRoutes(entity: AttachmentEntityType, exists: (id: number) => Promise<boolean>) {
  const label = LABELS[entity];
  return {
    async GET(request: Request, context: IdParams) {
      const user = await requireRole(request);
      if (user instanceof Response) return user;
      const id = await idFrom(context, label);
      if (id instanceof Response) return id;
      if (!(await exists(id))) return errorResponse(404, `No ${label} with id ${id}.`);
      const items = await listAttachments(entity, id);
      return NextResponse.json({ items: items.map((a) => ({ ...a, url: `/api/${entity === 'labor' ? 'labor' : `${entity}s`}/${id}/attachments/${a.id}` })) });
    },

    async POST(request: Request, context: IdParams) {
      const user = await requireRole(request, 'manager');
      if (user instanceof Response) return user;
      const id = await idFrom(context, label);
      if (id instanceof Response) return id;
      if (!(await exists(id))) return errorResponse(404, `No ${label} with id ${id}.`);
      const full = () =>
        errorResponse(409, `This ${label} already has ${ATTACHMENT_MAX_PER_RECORD} spec sheets, the most one record keeps. Remove one before adding another.`, {
          errors: [{ field: 'file', message: `at most ${ATTACHMENT_MAX_PER_RECORD} attachments per ${label}` }],
        });
      // Checked before the upload is read, so a full record costs no upload; checked again under lock in the write.
      if ((await countAttachments(entity, id)) >= ATTACHMENT_MAX_PER_RECORD) return full();
      const read = await readUpload(request, ATTACHMENT_MAX_BYTES, 'spec sheet');
      if (!read.ok) return read.response;
      const contentType = sniffAttachmentType(read.upload.bytes);
      if (!contentType) {
        return errorResponse(415, 'A spec sheet must be a PDF, PNG or JPEG file; this file is none of those (judged by its contents, not its name).', {
          errors: [{ field: 'file', message: 'not a PDF, PNG or JPEG' }],
        });
      }
      let record;
      try {
        record = await addAttachment(entity, id, { fileName: read.upload.file.name, contentType, bytes: read.upload.bytes }, user);
      } catch (error) {
        if (error instanceof AttachmentLimitReached) return full();
        throw error;
      }
      return NextResponse.json({ ...record, maxBytes: megabytes(ATTACHMENT_MAX_BYTES) }, { status: 201 });
    },
  };
}

export function attachmentItemRoutes(entity: AttachmentEntityType) {
  const label = LABELS[entity];
  async function ids(context: ItemParams) {
    const { id, attachmentId } = await context.params;
    const parse = (v: string) => (/^\d{1,10}$/.test(v) ? Number(v) : null);
    return { entityId: parse(id), attachmentId: parse(attachmentId) };
  }
  const missing = () => errorResponse(404, `No such attachment on this ${label}.`);
  return {
    /** Serves the file to signed-in staff only, with the type that was sniffed at upload. */
    async GET(request: Request, context: ItemParams) {
      const user = await requireRole(request);
      if (user instanceof Response) return user;
      const { entityId, attachmentId } = await ids(context);
      if (entityId === null || attachmentId === null) return missing();
      const attachment = await getAttachment(entity, entityId, attachmentId);
      if (!attachment) return missing();
      const bytes = await readAttachmentBytes(attachment.storageKey);
      if (!bytes) return errorResponse(410, 'The file for this attachment is missing from storage.');
      return new NextResponse(new Uint8Array(bytes), {
        headers: {
          'Content-Type': attachment.contentType,
          'Content-Length': String(bytes.length),
          'Content-Disposition': `inline; filename="${attachment.fileName.replace(/"/g, '')}"`,
          'Cache-Control': 'private, no-store',
          'Content-Security-Policy': "default-src 'none'; img-src 'self'; object-src 'self'; sandbox",
        },
      });
    },

    async DELETE(request: Request, context: ItemParams) {
      const user = await requireRole(request, 'manager');
      if (user instanceof Response) return user;
      const { entityId, attachmentId } = await ids(context);
      if (entityId === null || attachmentId === null) return missing();
      const removed = await removeAttachment(entity, entityId, attachmentId, user);
      if (!removed) return missing();
      const { storageKey: _key, ...record } = removed;
      void _key;
      return NextResponse.json({ outcome: 'deleted', attachment: record });
    },
  };
}
