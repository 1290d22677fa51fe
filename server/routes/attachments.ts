import { rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { create as contentDisposition } from 'content-disposition';
import { Router, type NextFunction, type Request, type Response } from 'express';
import multer from 'multer';
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
import { AppError, type FieldErrors } from '@/server/http/app-error';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { fieldErrors, parseOrThrow } from '@/server/http/validate';
import type { FileStore } from '@/server/storage/file-store';

const Params = z.object({ id: z.uuid({ error: 'Not an attachment id.' }) });

/** Text fields allowed beside the file, and their longest value in bytes. */
const FIELD_LIMITS = { fields: 8, fieldSize: 4096, files: 1, parts: 10 };

/** Multer's refusals as API errors; the partial temp file is already removed by multer. */
function uploadError(err: unknown): unknown {
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') return fileTooLarge(null);
    if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
      return AppError.badRequest('Send one file, in the form field "file".', {
        file: 'Send one file, in the form field "file".',
      });
    }
    return AppError.badRequest(`The upload form is not acceptable (${err.message.toLowerCase()}).`, {
      ...(err.field && { [err.field]: err.message }),
    });
  }
  // busboy: a body that is not well-formed multipart.
  if (err instanceof Error && !(err instanceof AppError)) {
    return new AppError(400, 'malformed_upload', 'The upload was cut off or is not a well-formed multipart form.', undefined, {
      cause: err,
    });
  }
  return err;
}

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
export function attachmentRoutes(db: Sequelize, files: FileStore, uploadTempDir = path.join(os.tmpdir(), 'kenning-uploads')) {
  const router = Router();
  const deps = { db, files };
  const write = [requireUser, requireRole('planner')];
  const receive = multer({
    storage: multer.diskStorage({ destination: uploadTempDir }),
    limits: { ...FIELD_LIMITS, fileSize: DOCUMENT_MAX_BYTES },
    // Browsers send UTF-8 file names; busboy would read them as Latin-1.
    defParamCharset: 'utf8',
  }).single('file');

  router.get('/attachments', requireUser, async (req, res) => {
    const query = parseOrThrow(AttachmentListQuerySchema, req.query, 'query');
    res.json(await listAttachments(actorOf(req), query));
  });

  router.post(
    '/attachments',
    ...write,
    (req: Request, res: Response, next: NextFunction) =>
      receive(req, res, (err?: unknown) => next(err ? uploadError(err) : undefined)),
    async (req, res) => {
      const file = req.file;
      try {
        const parsed = AttachmentUploadFieldsSchema.safeParse(req.body ?? {});
        const fields: FieldErrors = parsed.success ? {} : fieldErrors(parsed.error);
        if (!file) fields.file = 'Choose a file to upload.';
        else if (file.size === 0) fields.file = 'The file is empty.';
        if (!parsed.success || !file || Object.keys(fields).length) {
          throw AppError.badRequest('The upload has invalid fields.', fields);
        }
        const attachment = await uploadAttachment(deps, actorOf(req), parsed.data, {
          path: file.path,
          originalName: file.originalname,
          size: file.size,
        });
        res.status(201).json({ attachment });
      } finally {
        // Adopted files have moved into the store; anything still here is a refusal's leftover.
        if (file) await rm(file.path, { force: true });
      }
    },
  );

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
