import { readFile } from 'node:fs/promises';
import type { Readable } from 'node:stream';
import type { Transaction } from 'sequelize';
import {
  ACCEPTS,
  ALLOWED_CONTENT_TYPES,
  MAX_BYTES,
  MEBIBYTE,
  type Attachment,
  type AttachmentKind,
  type AttachmentListQuery,
  type AttachmentOwnerType,
  type AttachmentUpdate,
  type AttachmentUploadFields,
} from '@/shared/schemas/attachment';
import { attachmentsRepository, type StoredAttachment } from '@/server/data/repositories/attachments-repository';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { AppError } from '@/server/domain/app-error';
import type { FileStore } from '@/server/domain/ports/file-store';
import type { Actor } from '../actor';
import { checkImage, ImageCheckError, type ImageContentType } from './check-image';
import { cleanFileName } from './clean-file-name';
import { sniffContentType } from './sniff-content-type';
import { typeOfExtension } from './type-of-extension';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';
import { staleMessage, writeVersioned } from '@/server/domain/audit/versioned-write';
import { isEditablePlanStatus } from '@/shared/plans/editable-plan-statuses';

export interface AttachmentDeps extends UseCaseDeps {
  files: FileStore;
}

/** A file multer has written to a temporary path; the caller removes `path` afterwards. */
export interface ReceivedFile {
  path: string;
  originalName: string;
  size: number;
}

const STALE = staleMessage('this attachment');
const OWNER: Record<AttachmentOwnerType, string> = { post: 'That post', site: 'That site', plan: 'That plan' };
const KIND: Record<AttachmentKind, string> = { photo: 'Photos', document: 'Documents' };
const TYPE_NAME: Record<string, string> = {
  'image/jpeg': 'a JPEG image',
  'image/png': 'a PNG image',
  'image/webp': 'a WebP image',
  'application/pdf': 'a PDF',
  'text/plain': 'plain text',
  'text/csv': 'CSV text',
};
const megabytes = (bytes: number) => `${(bytes / MEBIBYTE).toFixed(1)} MB`;

export const fileTooLarge = (kind: AttachmentKind | null, bytes?: number) =>
  new AppError(
    413,
    'file_too_large',
    kind
      ? `${KIND[kind]} can be at most ${megabytes(MAX_BYTES[kind])}${bytes ? `; this file is ${megabytes(bytes)}` : ''}. ${KIND[kind]} accepted: ${ACCEPTS[kind]}.`
      : `Files can be at most ${megabytes(MAX_BYTES.document)} (photos ${megabytes(MAX_BYTES.photo)}).`,
    { file: 'This file is too large.' },
  );

const unsupported = (kind: AttachmentKind, why: string) =>
  new AppError(415, 'unsupported_type', `${why} ${KIND[kind]} accepted: ${ACCEPTS[kind]}.`, { file: why });

/**
 * The owner must exist in the actor's organisation, and an observer sees a
 * plan's attachments only once the plan is approved; otherwise "not found".
 */
async function requireReadableOwner(actor: Actor, ownerType: AttachmentOwnerType, ownerId: string, t?: Transaction) {
  const owner = await attachmentsRepository.findOwner(actor.organizationId, ownerType, ownerId, t);
  if (!owner || (ownerType === 'plan' && actor.role === 'observer' && owner.planStatus !== 'approved')) {
    throw AppError.notFound(OWNER[ownerType]);
  }
}

/** A plan's attachments are part of its record once it is submitted: only a draft or returned plan takes changes. */
async function requireWritableOwner(actor: Actor, ownerType: AttachmentOwnerType, ownerId: string, t?: Transaction) {
  const owner = await attachmentsRepository.findOwner(actor.organizationId, ownerType, ownerId, t);
  if (!owner) throw AppError.notFound(OWNER[ownerType]);
  if (ownerType === 'plan' && !(owner.planStatus && isEditablePlanStatus(owner.planStatus))) {
    throw AppError.conflict(
      `The files of a ${owner.planStatus} plan are part of its record and cannot change. Start a new version to change them.`,
      'plan_frozen',
    );
  }
}

async function findReadable(actor: Actor, id: string, t?: Transaction): Promise<StoredAttachment> {
  const found = await attachmentsRepository.find(actor.organizationId, id, t);
  if (!found) throw AppError.notFound('That attachment');
  try {
    await requireReadableOwner(actor, found.ownerType, found.ownerId, t);
  } catch (e) {
    throw e instanceof AppError && e.status === 404 ? AppError.notFound('That attachment') : e;
  }
  return found;
}

export async function listAttachments(actor: Actor, query: AttachmentListQuery) {
  await requireReadableOwner(actor, query.ownerType, query.ownerId);
  const { ownerType, ownerId, kind, page, pageSize } = query;
  return attachmentsRepository.page(actor.organizationId, { ownerType, ownerId, kind }, page, pageSize);
}

export async function getAttachment(actor: Actor, id: string): Promise<Attachment> {
  return attachmentsRepository.withoutKey(await findReadable(actor, id));
}

/** The attachment and a stream of its bytes. */
export async function openAttachment(
  { files }: AttachmentDeps,
  actor: Actor,
  id: string,
): Promise<{ attachment: Attachment; stream: Readable }> {
  const found = await findReadable(actor, id);
  const stream = await files.open(found.storeKey);
  return { attachment: attachmentsRepository.withoutKey(found), stream };
}

/**
 * Keeps an uploaded file: checks the owner, the size for its kind and the
 * real type from its bytes (images must be whole), then moves the file into
 * the store and writes the row and its audit event in one transaction. If
 * anything fails after the move, the stored file is removed again.
 */
export async function uploadAttachment(
  { db, files }: AttachmentDeps,
  actor: Actor,
  fields: AttachmentUploadFields,
  file: ReceivedFile,
): Promise<Attachment> {
  const { kind } = fields;
  await requireWritableOwner(actor, fields.ownerType, fields.ownerId);
  if (file.size > MAX_BYTES[kind]) throw fileTooLarge(kind, file.size);

  const originalName = cleanFileName(file.originalName);
  const bytes = await readFile(file.path);
  const contentType = sniffContentType(bytes, originalName);
  if (!contentType || !ALLOWED_CONTENT_TYPES[kind].includes(contentType)) {
    const what = contentType ? `This file is ${TYPE_NAME[contentType]}.` : 'This file is not a type Kenning accepts.';
    throw unsupported(kind, what);
  }
  const named = typeOfExtension(originalName);
  if (named && named !== contentType) {
    throw unsupported(kind, `The name says ${TYPE_NAME[named]}, but the file is ${TYPE_NAME[contentType]}.`);
  }
  let size: { widthPx: number; heightPx: number } | null = null;
  if (contentType.startsWith('image/')) {
    try {
      size = checkImage(bytes, contentType as ImageContentType);
    } catch (e) {
      if (e instanceof ImageCheckError) throw unsupported(kind, e.message);
      throw e;
    }
  }

  const stored = await files.adopt(file.path);
  try {
    return await db.transaction(async (t) => {
      await requireWritableOwner(actor, fields.ownerType, fields.ownerId, t);
      const attachment = await attachmentsRepository.create(
        actor.organizationId,
        actor.userId,
        {
          ownerType: fields.ownerType,
          ownerId: fields.ownerId,
          kind,
          originalName,
          contentType,
          bytes: stored.bytes,
          sha256: stored.sha256,
          storeKey: stored.key,
          widthPx: size?.widthPx ?? null,
          heightPx: size?.heightPx ?? null,
          bearingDeg: kind === 'photo' ? fields.bearingDeg : null,
          caption: fields.caption,
        },
        t,
      );
      await auditRepository.record(
        actor,
        { action: 'create', entityType: 'attachment', entityId: attachment.id, after: attachment },
        t,
      );
      return attachment;
    });
  } catch (e) {
    await files.remove(stored.key);
    throw e;
  }
}

export function updateAttachment({ db }: AttachmentDeps, actor: Actor, id: string, input: AttachmentUpdate): Promise<Attachment> {
  return db.transaction(async (t) => {
    const before = attachmentsRepository.withoutKey(await findReadable(actor, id, t));
    await requireWritableOwner(actor, before.ownerType, before.ownerId, t);
    const { version, ...changes } = input;
    if (changes.bearingDeg != null && before.kind !== 'photo') {
      throw AppError.badRequest('The attachment has invalid fields.', { bearingDeg: 'Only photos have a bearing.' });
    }
    return writeVersioned(actor, t, { entityType: 'attachment', entityId: id, before, stale: STALE }, () =>
      attachmentsRepository.updateIfVersion(actor.organizationId, id, version, changes, t),
    );
  });
}

/** Soft delete: gone from lists and reads; the row and the bytes stay for plan revisions that refer to them. */
export function deleteAttachment({ db }: AttachmentDeps, actor: Actor, id: string): Promise<void> {
  return db.transaction(async (t) => {
    const before = attachmentsRepository.withoutKey(await findReadable(actor, id, t));
    await requireWritableOwner(actor, before.ownerType, before.ownerId, t);
    await attachmentsRepository.softDelete(actor.organizationId, id, t);
    await auditRepository.record(actor, { action: 'delete', entityType: 'attachment', entityId: id, before }, t);
  });
}
