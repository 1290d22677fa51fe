import os from 'node:os';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { create as contentDisposition } from 'content-disposition';
import { Router, type Response } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import {
  AttachmentListQuerySchema,
  AttachmentUpdateSchema,
  AttachmentUploadFieldsSchema,
  DOCUMENT_MAX_BYTES,
} from '@/shared/schemas/attachment';
import {
  deleteAttachment,
  fileTooLarge,
  getAttachment,
  listAttachments,
  openAttachment,
  updateAttachment,
  uploadAttachment,
} from '@/server/domain/attachments/manage-attachments';
import { AppError, type FieldErrors } from '@/server/domain/app-error';
import { receiveUpload } from '@/server/http/multipart';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { fieldErrors, parseOrThrow } from '@/server/http/validate';
import type { FileStore } from '@/server/domain/ports/file-store';

const Params = z.object({ id: z.uuid({ error: 'Not an attachment id.' }) });

/** Sends a stored file; a failure after the headers went out can only cut the connection. */
async function sendStream(res: Response, stream: NodeJS.ReadableStream) {
  try {
    await pipeline(stream, res);
  } catch (e) {
    if (!res.headersSent) throw e;
    res.destroy(e instanceof Error ? e : undefined);
  }
}

/**
 * Photos and documents of posts, sites and plans. Planners upload, edit and
 * delete; every role of the organisation reads (observers: plans once approved).
 */
/** Where attachment uploads are received unless the app is given another folder. */
export const DEFAULT_ATTACHMENT_UPLOAD_DIR = path.join(os.tmpdir(), 'kenning-uploads');

export function attachmentRoutes(db: Sequelize, files: FileStore, uploadTempDir = DEFAULT_ATTACHMENT_UPLOAD_DIR) {
  const router = Router();
  const deps = { db, files };
  const write = [requireUser, requireRole('planner')];
  router.get('/attachments', requireUser, async (req, res) => {
    const query = parseOrThrow(AttachmentListQuerySchema, req.query, 'query');
    res.json(await listAttachments(actorOf(req), query));
  });

  router.post('/attachments', ...write, async (req, res) => {
    const upload = await receiveUpload(req, res, {
      tmpRoot: uploadTempDir,
      maxBytes: DOCUMENT_MAX_BYTES,
      fileFields: ['file'],
      tooLarge: () => fileTooLarge(null),
    });
    try {
      const file = upload.files.file;
      const parsed = AttachmentUploadFieldsSchema.safeParse(upload.fields);
      const fields: FieldErrors = parsed.success ? {} : fieldErrors(parsed.error);
      if (!file) fields.file = 'Choose a file to upload.';
      else if (file.bytes === 0) fields.file = 'The file is empty.';
      if (!parsed.success || !file || Object.keys(fields).length) {
        throw AppError.badRequest('The upload has invalid fields.', fields);
      }
      const attachment = await uploadAttachment(deps, actorOf(req), parsed.data, {
        path: file.path,
        originalName: file.originalName,
        size: file.bytes,
      });
      res.status(201).json({ attachment });
    } finally {
      // Adopted files have moved into the store; anything still here is a refusal's leftover.
      await upload.cleanup();
    }
  });

  router.get('/attachments/:id', requireUser, async (req, res) => {
    const { id } = parseOrThrow(Params, req.params, 'address');
    res.json({ attachment: await getAttachment(actorOf(req), id) });
  });

  router.get('/attachments/:id/content', requireUser, async (req, res) => {
    const { id } = parseOrThrow(Params, req.params, 'address');
    const { attachment, stream } = await openAttachment(deps, actorOf(req), id);
    const isImage = attachment.contentType.startsWith('image/');
    res.setHeader(
      'Content-Type',
      attachment.contentType.startsWith('text/') ? `${attachment.contentType}; charset=utf-8` : attachment.contentType,
    );
    res.setHeader('Content-Length', String(attachment.bytes));
    res.setHeader(
      'Content-Disposition',
      contentDisposition(attachment.originalName, { type: isImage ? 'inline' : 'attachment' }),
    );
    // The bytes of an id never change; only this user's browser may keep them.
    res.setHeader('Cache-Control', 'private, max-age=3600');
    res.setHeader('ETag', `"${attachment.sha256}"`);
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    if (req.fresh) {
      stream.destroy();
      res.status(304).end();
      return;
    }
    await sendStream(res, stream);
  });

  router.patch('/attachments/:id', ...write, async (req, res) => {
    const { id } = parseOrThrow(Params, req.params, 'address');
    const input = parseOrThrow(AttachmentUpdateSchema, req.body, 'attachment');
    res.json({ attachment: await updateAttachment(deps, actorOf(req), id, input) });
  });

  router.delete('/attachments/:id', ...write, async (req, res) => {
    const { id } = parseOrThrow(Params, req.params, 'address');
    await deleteAttachment(deps, actorOf(req), id);
    res.status(204).end();
  });

  return router;
}
